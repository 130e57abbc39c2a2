/**
 * Reads a print request's query string: the medium, the output's own options and whether to
 * record the print. One zod parse, so every bad value comes back together with its field path.
 */
import { z } from 'zod';
import { mediaIdSchema, printOptionSchemas, type MediaId, type PrintOptions, type PrintOutput } from '../../shared/schemas/print.js';
import { defaultMedia, printOutputParamSchema } from '../../shared/schemas/print-records.js';
import { dpiSchema, profileParamSchema } from '../../shared/schemas/printer-profile.js';

export { defaultMedia };

export interface PrintQuery<O extends PrintOutput = PrintOutput> {
  output: O;
  media: MediaId;
  options: PrintOptions[O];
  /**
   * Record this print in the history. The live preview renders on every change and leaves it off;
   * downloads, the print dialog and the pack record.
   */
  record: boolean;
}

const common = {
  media: mediaIdSchema.optional(),
  record: z.enum(['0', '1'], { error: 'record is 0 or 1' }).optional(),
};

/** Parses `:output` and the query; a bad value is a ZodError (400 with fields) before any work starts. */
export function parsePrintQuery(params: Record<string, unknown>, query: unknown): PrintQuery {
  const { output } = printOutputParamSchema.parse({ output: params.output });
  const schema = printOptionSchemas[output].extend(common);
  const { media, record, ...options } = schema.parse(query ?? {}) as Record<string, unknown> & { media?: MediaId; record?: '0' | '1' };
  return { output, media: media ?? defaultMedia[output], options: options as PrintOptions[typeof output], record: record === '1' };
}

/** An images request: the print's query, the resolution and the printer profile (each optional). */
export interface ImageQuery extends PrintQuery {
  dpi?: number;
  profileId?: number;
}

const imageExtras = {
  dpi: dpiSchema.optional(),
  profile: profileParamSchema.optional(),
};

/** Parses an images request as `parsePrintQuery` does, with `dpi` and `profile` beside the output's options. */
export function parseImageQuery(params: Record<string, unknown>, query: unknown): ImageQuery {
  const { output } = printOutputParamSchema.parse({ output: params.output });
  const schema = printOptionSchemas[output].extend({ ...common, ...imageExtras });
  const parsed = schema.parse(query ?? {}) as Record<string, unknown> & { media?: MediaId; record?: '0' | '1'; dpi?: number; profile?: number };
  const { media, record, dpi, profile, ...options } = parsed;
  return { output, media: media ?? defaultMedia[output], options: options as PrintOptions[typeof output], record: record === '1', dpi, profileId: profile };
}

/** `sheet-12` → 12; other media → null. */
export function sheetLayoutId(media: MediaId): number | null {
  const m = /^sheet-(\d+)$/.exec(media);
  return m ? Number(m[1]) : null;
}
