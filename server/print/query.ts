/**
 * Reads a print request's query string: the medium, the output's own options and whether to
 * record the print. One zod parse, so every bad value comes back together with its field path.
 */
import { z } from 'zod';
import { mediaIdSchema, printOptionSchemas, type MediaId, type PrintOptions, type PrintOutput } from '../../shared/schemas/print.js';
import { defaultMedia, printOutputParamSchema } from '../../shared/schemas/print-records.js';

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

/** `sheet-12` → 12; other media → null. */
export function sheetLayoutId(media: MediaId): number | null {
  const m = /^sheet-(\d+)$/.exec(media);
  return m ? Number(m[1]) : null;
}
