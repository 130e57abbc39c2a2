/**
 * The text inside one way-label cell: the way number(s) in bold and the device (e.g. "B32") on a
 * top line, the circuit's short label below. The device text comes already fitted for the whole
 * strip (`way-device-text.ts`), so every cell of a row sets it the same way. Cells taller than wide (half-module devices on a
 * deep strip) are set turned a quarter so the label gets the long side.
 */
import { placeFrame, mapItems } from '../geometry.js';
import type { Box, Item } from '../model.js';
import type { LayoutContext } from './context.js';
import { blockHeight, fitText, runsForLines, type FitStyle } from './fit.js';
import type { DeviceCell, DeviceFitLimits } from './way-device-text.js';

export interface CellText {
  ways: string;
  device: string;
  main: string;
}

/** Largest sizes (pt) for a cell's way number and main label: one pair per strip keeps the row even. */
export interface CellCaps {
  ways: number;
  main: number;
}
/** Sizes a cell's text was set at, for working out the strip's caps. */
export type CellSizes = CellCaps;
/** A row's caps: one pair for its upright cells, one for its turned (half-module) cells, so each kind reads evenly. */
export interface RowCaps {
  upright: CellCaps;
  turned: CellCaps;
}

const PAD_MM = 0.6;

/** A cell's device text as the strip's fit decided it: its lines and the strip's one size. */
export interface DeviceLines {
  lines: string[];
  sizePt: number;
}

/** Smallest size the way number is ever given room for (pt): the device text never takes that room. */
const WAY_MIN_PT = 7;
/** Between the way number and the device text (mm). */
export const DEVICE_GAP_MM = 0.4;
/** The regular face the device text is set in, two lines one above the other. */
const DEVICE_STYLE: FitStyle = { face: 'regular', maxPt: 9, minPt: 5, maxLines: 2, align: 'right', lineSpacing: 1.2 };

function innerOf(w: number, h: number): Box {
  return { x: PAD_MM, y: PAD_MM * 0.6, w: w - 2 * PAD_MM, h: h - 1.2 * PAD_MM };
}
/** Below this inner height (mm) a cell has one line: way number and label, no device text. */
const TWO_ROWS_MIN_MM = 5;
const topLineHeight = (inner: Box) => Math.max(2.2, inner.h * 0.38);

/** Runs for a cell's text in a local `w × h` frame, and the sizes its way number and main label got. */
function frameItems(
  t: CellText,
  w: number,
  h: number,
  minPt: number,
  ctx: LayoutContext<'way-labels'>,
  name: string | null,
  caps?: CellCaps,
  device?: DeviceLines,
): { items: Item[]; sizes: CellSizes } {
  const inner = innerOf(w, h);
  const cap = (pt: number, c: number | undefined) => Math.max(minPt, Math.min(pt, c ?? pt));
  const bold: FitStyle = { face: 'bold', maxPt: cap(12, caps?.ways), minPt, maxLines: 1, align: 'left' };
  const main: FitStyle = { face: 'bold', maxPt: cap(11, caps?.main), minPt, wrapBelowPt: Math.min(7, cap(11, caps?.main)), align: 'centre', lineSpacing: 1.18 };
  const parts: Array<[string, Box, FitStyle, 'ways' | 'main']> = [];
  const extra: Item[] = [];
  if (inner.h < TWO_ROWS_MIN_MM) {
    parts.push(
      [t.ways, { ...inner, w: inner.w * 0.3 }, bold, 'ways'],
      [t.main, { ...inner, x: inner.x + inner.w * 0.32, w: inner.w * 0.68 }, { ...main, align: 'left', maxLines: 1 }, 'main'],
    );
  } else {
    // The device text was fitted for the whole strip (way-device-text.ts): it takes the width its lines
    // need at the right of the top line, and the way number the rest.
    const lines = device?.lines ?? [];
    const size = device?.sizePt ?? DEVICE_STYLE.maxPt;
    const style: FitStyle = { ...DEVICE_STYLE, maxPt: size, minPt: size };
    const top = Math.max(topLineHeight(inner), lines.length ? blockHeight(lines.length, size, style, ctx.tm) : 0);
    const deviceW = lines.length ? Math.max(...lines.map((l) => ctx.tm.measure(l, 'regular', size))) + 0.01 : 0;
    const waysW = inner.w - (deviceW ? deviceW + DEVICE_GAP_MM : 0);
    parts.push([t.ways, { x: inner.x, y: inner.y, w: waysW, h: top }, lines.length ? bold : { ...bold, align: 'centre' }, 'ways']);
    if (lines.length) extra.push(...runsForLines(lines, { x: inner.x + inner.w - deviceW, y: inner.y, w: deviceW, h: top }, style, size, ctx.tm));
    parts.push([t.main, { x: inner.x, y: inner.y + top, w: inner.w, h: inner.h - top }, main, 'main']);
  }
  const items: Item[] = [...extra];
  const sizes: CellSizes = { ways: Infinity, main: Infinity };
  for (const [text, cell, style, role] of parts) {
    const fit = fitText(text, cell, style, ctx.tm);
    if (fit.cut && name) ctx.warnings.cut(name, text);
    if (text) sizes[role] = fit.sizePt;
    items.push(...fit.runs);
  }
  return { items, sizes };
}

function cellFrame(box: Box, ctx: LayoutContext<'way-labels'>) {
  const minPt = ctx.req.medium.kind === 'tape' ? 5 : 5.5;
  const turned = box.h > box.w * 1.15;
  return { minPt, turned, w: turned ? box.h : box.w, h: turned ? box.w : box.h };
}

/** Text items for a cell box; turned 90° when the cell stands taller than wide; `caps` limit the sizes. */
export function cellItems(t: CellText, box: Box, ctx: LayoutContext<'way-labels'>, name: string, caps?: RowCaps, device?: DeviceLines): Item[] {
  if (box.w <= 0 || box.h <= 0) return [];
  const f = cellFrame(box, ctx);
  const local = frameItems(t, f.w, f.h, f.minPt, ctx, name, caps?.[f.turned ? 'turned' : 'upright'], device).items;
  return mapItems(local, placeFrame(f.w, f.h, box, f.turned ? 90 : 0));
}

/** The sizes a cell's way number and main label fit at on their own, and whether the cell is set turned. */
export function cellSizes(t: CellText, box: Box, ctx: LayoutContext<'way-labels'>, device?: DeviceLines): { turned: boolean; sizes: CellSizes } {
  if (box.w <= 0 || box.h <= 0) return { turned: false, sizes: { ways: Infinity, main: Infinity } };
  const f = cellFrame(box, ctx);
  return { turned: f.turned, sizes: frameItems(t, f.w, f.h, f.minPt, ctx, null, undefined, device).sizes };
}

/**
 * The room a cell offers its device text, for the strip's one fit; null when the cell has none or is
 * too low for a second line (then the strip leaves device text off, and says so).
 */
export function deviceRoom(t: CellText, box: Box, ctx: LayoutContext<'way-labels'>): Omit<DeviceCell, 'name' | 'device'> | 'too-low' | null {
  if (!t.device || box.w <= 0 || box.h <= 0) return null;
  const f = cellFrame(box, ctx);
  const inner = innerOf(f.w, f.h);
  if (inner.h < TWO_ROWS_MIN_MM) return 'too-low';
  return {
    lineWidthMm: inner.w,
    wayWidthMm: Math.min(inner.w, ctx.tm.measure(t.ways, 'bold', WAY_MIN_PT)),
    oneLineHeightMm: topLineHeight(inner),
    twoLineHeightMm: inner.h * 0.5,
  };
}

/** Limits of the strip's device-text fit on this output. */
export function deviceLimits(ctx: LayoutContext<'way-labels'>): DeviceFitLimits {
  return { maxPt: DEVICE_STYLE.maxPt, minPt: cellFrame({ x: 0, y: 0, w: 1, h: 1 }, ctx).minPt, gapMm: DEVICE_GAP_MM, lineSpacing: DEVICE_STYLE.lineSpacing! };
}
