/**
 * Media by id: tapes with their printable band, ISO 216 sheets, custom sizes and stored die-cut
 * sheet layouts. The print API resolves `?media=` here and hands the result to `renderOutput`.
 */
import { mediaIdSchema, tapeWidths, type PrintOutput, type SheetLayout, type TapeWidth } from '../../shared/schemas/print.js';
import { LayoutError, type Medium } from './types.js';

/**
 * Printable band across each tape width and the unprinted margin a tape printer leaves at each
 * end of a label (mm). Roughly the width minus 2–3 mm. // common practice (makers vary)
 */
export const TAPE_BANDS: Record<TapeWidth, { printableMm: number; marginMm: number }> = {
  6: { printableMm: 4, marginMm: 2 },
  9: { printableMm: 6.5, marginMm: 2 },
  12: { printableMm: 9, marginMm: 2 },
  18: { printableMm: 15, marginMm: 2 },
  24: { printableMm: 21, marginMm: 2 },
  36: { printableMm: 33, marginMm: 2 },
};

/** Longest label most tape printers take in one piece (mm). // common practice */
export const TAPE_MAX_LENGTH_MM = 1000;

/** ISO 216 sizes, portrait (mm). // ISO 216 */
export const ISO_216 = { a4: { widthMm: 210, heightMm: 297 }, a5: { widthMm: 148, heightMm: 210 } } as const;

/** A stored sheet layout by id: a Map, a record, or a list of layouts carrying their ids. */
export type SheetLayouts = ReadonlyMap<number, SheetLayout> | Record<string, SheetLayout> | ReadonlyArray<SheetLayout & { id: number }>;

function findSheet(id: number, layouts: SheetLayouts | undefined): SheetLayout | undefined {
  if (!layouts) return undefined;
  if (layouts instanceof Map) return layouts.get(id);
  if (Array.isArray(layouts)) return layouts.find((l) => l.id === id);
  return (layouts as Record<string, SheetLayout>)[String(id)];
}

/** Per-width overrides of the printable band (e.g. from a printer's settings). */
export type TapeSettings = Partial<Record<TapeWidth, { printableMm?: number; marginMm?: number }>>;

/**
 * Turn a media id (`tape-12`, `a4`, `a5-landscape`, `custom-62x29`, `sheet-3`) into sizes.
 * Throws a LayoutError (field `media`) for an unknown id or a sheet layout not passed in.
 */
export function resolveMedium(mediaId: string, sheetLayouts?: SheetLayouts, tapeSettings: TapeSettings = {}): Medium {
  if (!mediaIdSchema.safeParse(mediaId).success)
    throw new LayoutError(`Unknown medium "${mediaId}": use tape-6…tape-36, a4, a5, a4-landscape, a5-landscape, custom-<w>x<h> or sheet-<id>`, 'media');
  const [kind, rest] = [mediaId.split('-')[0], mediaId.slice(mediaId.indexOf('-') + 1)];
  if (kind === 'tape') {
    const widthMm = Number(rest) as TapeWidth;
    const band = { ...TAPE_BANDS[widthMm], ...tapeSettings[widthMm] };
    return { kind: 'tape', id: mediaId, widthMm, printableMm: Math.min(band.printableMm, widthMm), marginMm: band.marginMm };
  }
  if (kind === 'a4' || kind === 'a5') {
    const size = ISO_216[kind];
    const landscape = mediaId.endsWith('-landscape');
    return { kind: 'page', id: mediaId, widthMm: landscape ? size.heightMm : size.widthMm, heightMm: landscape ? size.widthMm : size.heightMm };
  }
  if (kind === 'custom') {
    const [w, h] = rest.split('x').map(Number);
    if (w < 10 || h < 10 || w > 2000 || h > 2000) throw new LayoutError('A custom size is 10–2000 mm each way', 'media');
    return { kind: 'page', id: mediaId, widthMm: w, heightMm: h };
  }
  const layout = findSheet(Number(rest), sheetLayouts);
  if (!layout) throw new LayoutError(`No sheet layout ${rest} was found`, 'media');
  return { kind: 'sheet', id: mediaId, layout };
}

/** The medium each output goes on unless the user picks another. */
export function defaultMediumFor(output: PrintOutput): string {
  const defaults: Record<PrintOutput, string> = {
    flags: 'tape-12',
    'way-labels': 'tape-12',
    chart: 'a4',
    notices: 'a4',
    tag: 'tape-24',
    calibration: 'a4',
    changeover: 'a4',
  };
  return defaults[output];
}

/** The media ids the print page can offer before any sheet layouts are added. */
export const builtInMediaIds: readonly string[] = [...tapeWidths.map((w) => `tape-${w}`), 'a4', 'a5', 'a4-landscape', 'a5-landscape'];

/**
 * A custom page no bigger than 150 mm either way is taken as one label per page (a roll of
 * single labels): pieces fill it instead of being tiled.
 */
export function isLabelPage(medium: Medium): boolean {
  return medium.kind === 'page' && medium.id.startsWith('custom-') && medium.widthMm <= 150 && medium.heightMm <= 150;
}

/** Narrowest tape whose printable band is at least `bandMm`, or null if none is. */
export function narrowestTapeFor(bandMm: number): TapeWidth | null {
  return tapeWidths.find((w) => TAPE_BANDS[w].printableMm >= bandMm) ?? null;
}
