/**
 * Contracts of the print API around the engine: print history, stored sheet layouts,
 * printer offsets and the warnings companion call. The print page parses every response
 * with these, so a drift between server and client fails loudly.
 */
import { z } from 'zod';
import { baseRevision } from './fields.js';
import { printOutputs, type MediaId, type PrintOutput } from './print.js';

/**
 * The medium each output goes on when a request names none, and in the print pack: the sizes
 * a contractor most often has to hand (common practice). The tag's QR needs the wider tape;
 * a chart and notices go on A4.
 */
export const defaultMedia: Record<PrintOutput, MediaId> = {
  flags: 'tape-12',
  'way-labels': 'tape-12',
  chart: 'a4',
  notices: 'a4',
  tag: 'tape-24',
  calibration: 'a4',
  changeover: 'a4',
};

/** One recorded print: who printed which output on which medium, from which revision. */
export const printRecordSchema = z.object({
  id: z.number(),
  output: z.string(),
  media: z.string(),
  revision: z.number().int(),
  userName: z.string(),
  createdAt: z.string(),
});
export type PrintRecord = z.infer<typeof printRecordSchema>;

/** `GET /api/boards/:id/prints`, newest first. */
export const printHistorySchema = z.object({ items: z.array(printRecordSchema) });
export type PrintHistory = z.infer<typeof printHistorySchema>;

export const printWarningSchema = z.object({ code: z.string(), message: z.string(), label: z.string().optional() });

/** `GET /api/boards/:id/pdf/:output/warnings`: what the PDF would warn about, without the bytes. */
export const printCheckSchema = z.object({ warnings: z.array(printWarningSchema), pageCount: z.number().int() });
export type PrintCheck = z.infer<typeof printCheckSchema>;

/** The output path parameter; anything else is a 400 naming `output`. */
export const printOutputParamSchema = z.object({
  output: z.enum(printOutputs, { error: `Output must be one of ${printOutputs.join(', ')}` }),
});

/** A stored sheet layout as the API returns it: the layout plus its id (used as `media=sheet-<id>`). */
export const sheetLayoutRecordSchema = z.object({
  id: z.number(),
  name: z.string(),
  pageWidthMm: z.number(),
  pageHeightMm: z.number(),
  labelWidthMm: z.number(),
  labelHeightMm: z.number(),
  columns: z.number().int(),
  rows: z.number().int(),
  marginTopMm: z.number(),
  marginLeftMm: z.number(),
  gapXMm: z.number(),
  gapYMm: z.number(),
  cornerRadiusMm: z.number(),
  /** Bumped by every save; send it back as `baseRevision`. */
  revision: z.number().int(),
});
export type SheetLayoutRecord = z.infer<typeof sheetLayoutRecordSchema>;
export const sheetLayoutListSchema = z.object({ items: z.array(sheetLayoutRecordSchema) });

/**
 * Printer feed correction in mm, added to every drawn position. ±10 mm matches the
 * organisation settings' range: a printer further out than that needs servicing, not an offset.
 */
export const printOffsetSchema = z.strictObject({
  xMm: z.number({ error: 'Must be a number' }).min(-10, 'At least −10 mm').max(10, 'At most 10 mm'),
  yMm: z.number({ error: 'Must be a number' }).min(-10, 'At least −10 mm').max(10, 'At most 10 mm'),
});
export type PrintOffset = z.infer<typeof printOffsetSchema>;

/**
 * `PUT /api/print-settings/offset`: the offset and the organisation's revision it was loaded at. The offset is a
 * column of the organisation's row, so it is guarded (and bumps the revision) like any other write of that row.
 */
export const printOffsetSaveSchema = printOffsetSchema.extend({ baseRevision });
export type PrintOffsetSave = z.infer<typeof printOffsetSaveSchema>;

/** `GET`/`PUT /api/print-settings/offset`: the offset and the organisation's current revision. */
export const printOffsetStateSchema = printOffsetSchema.extend({ revision: z.number().int() });
export type PrintOffsetState = z.infer<typeof printOffsetStateSchema>;
