/**
 * Print contracts shared by the print page and the print API: which outputs exist,
 * which media they go on, and each output's options.
 */
import { z } from 'zod';
import { baseRevision } from './fields.js';

export const printOutputs = ['flags', 'way-labels', 'chart', 'notices', 'tag', 'calibration', 'changeover'] as const;
export type PrintOutput = (typeof printOutputs)[number];

/** Continuous tape widths in mm (common practice). */
export const tapeWidths = [6, 9, 12, 18, 24, 36] as const;
export type TapeWidth = (typeof tapeWidths)[number];

/**
 * A medium as it appears in `?media=`: `tape-12`, `a4`, `a5`, `a4-landscape`, `a5-landscape`,
 * `custom-<w>x<h>` (mm, e.g. `custom-250x180`, for a chart sized to a board door) or
 * `sheet-<id>` (a stored sheet label layout).
 */
export const mediaIdSchema = z
  .string()
  .regex(
    /^(tape-(6|9|12|18|24|36)|a4|a5|a4-landscape|a5-landscape|custom-\d{2,4}x\d{2,4}|sheet-\d{1,9})$/,
    'Unknown medium: use tape-6…tape-36, a4, a5, a4-landscape, a5-landscape, custom-<w>x<h> or sheet-<id>',
  );
export type MediaId = z.infer<typeof mediaIdSchema>;

const flagOptions = z.strictObject({
  /** Print a set for each end of the cable (board end and far end). */
  bothEnds: z.stringbool().default(false),
  /** Override of legs per circuit, else from the schedule (ring final = 2). */
  legs: z.coerce.number().int().min(1).max(8).optional(),
  /** On tape: one page per flag, or one strip with cut marks. */
  layout: z.enum(['page-per-flag', 'strip']).default('page-per-flag'),
  /** Extra wrap length for the overlap (mm). */
  overlapMm: z.coerce.number().min(0).max(30).default(4),
  /** Only the ways whose label content changed since this revision. */
  changedSince: z.coerce.number().int().min(1).optional(),
  ways: z
    .string()
    .regex(/^\d+(,\d+)*$/, 'Comma-separated way numbers')
    .optional(),
  /**
   * Where the flags go: at the board (each leg of each circuit), or at the junction boxes of a
   * changeover (one flag per planned leg through a box, naming the old way and the new way).
   */
  at: z.enum(['board', 'junction-boxes']).default('board'),
});

const wayLabelOptions = z.strictObject({
  /** Module pitch in mm; 17.5 per DIN 43880, some makers differ. */
  pitchMm: z.coerce.number().min(9).max(27).default(17.5),
  changedSince: z.coerce.number().int().min(1).optional(),
  /** Longest strip the medium takes before it is split with alignment marks (mm). */
  maxLengthMm: z.coerce.number().min(50).max(2000).optional(),
  /** Strip height when tiled on a plain sheet (mm); on tape the printable band, on labels the label. */
  heightMm: z.coerce.number().min(5).max(40).optional(),
});

const chartOptions = z.strictObject({
  /** The door chart carries the schedule; the rule findings stay in the app unless asked for. */
  showFindings: z.stringbool().default(false),
});

const noticeKinds = ['inspection', 'rcd-test', 'earthing', 'mixed-colours', 'alternative-supply', 'voltage'] as const;
const noticeOptions = z.strictObject({
  /** Which notices; default: every notice the board calls for. */
  kinds: z
    .string()
    .regex(new RegExp(`^(${noticeKinds.join('|')})(,(${noticeKinds.join('|')}))*$`), `Comma-separated: ${noticeKinds.join(', ')}`)
    .optional(),
  /** How many earthing and bonding connection labels. */
  earthingCount: z.coerce.number().int().min(0).max(50).default(3),
});

const tagOptions = z.strictObject({ copies: z.coerce.number().int().min(1).max(20).default(1) });
const calibrationOptions = z.strictObject({});

const changeoverOptions = z.strictObject({
  /** The old ways' readings in short form; off, the table has room for longer descriptions. */
  showReadings: z.stringbool().default(true),
});

export const printOptionSchemas = {
  flags: flagOptions,
  'way-labels': wayLabelOptions,
  chart: chartOptions,
  notices: noticeOptions,
  tag: tagOptions,
  calibration: calibrationOptions,
  changeover: changeoverOptions,
} as const;
export type PrintOptions = { [K in PrintOutput]: z.infer<(typeof printOptionSchemas)[K]> };
export const noticeKindList = noticeKinds;
export type NoticeKind = (typeof noticeKinds)[number];

/** One warning from a render, e.g. a label cut with an ellipsis. */
export interface PrintWarning {
  code: string;
  message: string;
  label?: string;
}

/** Sheet label layout (per organisation), in millimetres. */
export const sheetLayoutSchema = z
  .strictObject({
    name: z.string().trim().min(1, 'Required').max(80, 'At most 80 characters'),
    pageWidthMm: z.number().min(50, 'At least 50 mm').max(500, 'At most 500 mm'),
    pageHeightMm: z.number().min(50, 'At least 50 mm').max(500, 'At most 500 mm'),
    labelWidthMm: z.number().min(5, 'At least 5 mm').max(500, 'At most 500 mm'),
    labelHeightMm: z.number().min(5, 'At least 5 mm').max(500, 'At most 500 mm'),
    columns: z.number().int().min(1).max(20),
    rows: z.number().int().min(1).max(50),
    marginTopMm: z.number().min(0).max(100),
    marginLeftMm: z.number().min(0).max(100),
    gapXMm: z.number().min(0).max(50).default(0),
    gapYMm: z.number().min(0).max(50).default(0),
    cornerRadiusMm: z.number().min(0).max(20).default(0),
  })
  .refine((s) => s.marginLeftMm + s.columns * s.labelWidthMm + (s.columns - 1) * s.gapXMm <= s.pageWidthMm + 0.01, {
    message: 'The labels do not fit across the page',
    path: ['columns'],
  })
  .refine((s) => s.marginTopMm + s.rows * s.labelHeightMm + (s.rows - 1) * s.gapYMm <= s.pageHeightMm + 0.01, {
    message: 'The labels do not fit down the page',
    path: ['rows'],
  });
export type SheetLayout = z.infer<typeof sheetLayoutSchema>;

/** `PUT /api/sheet-layouts/:id`: the layout (with its fit checks) and the revision it was loaded at (a stale one is 409). */
export const sheetLayoutUpdateSchema = sheetLayoutSchema.extend({ baseRevision });
export type SheetLayoutUpdate = z.infer<typeof sheetLayoutUpdateSchema>;
