/**
 * The text inside one way-label cell: the way number(s) in bold and the device (e.g. "B32") on a
 * top line, the circuit's short label below. Cells taller than wide (half-module devices on a
 * deep strip) are set turned a quarter so the label gets the long side.
 */
import { placeFrame, mapItems } from '../geometry.js';
import type { Box, Item } from '../model.js';
import type { LayoutContext } from './context.js';
import { blockHeight, fitText, runsForLines, type FitStyle } from './fit.js';

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

/** Runs for a cell's text in a local `w × h` frame, and the sizes its way number and main label got. */
function frameItems(
  t: CellText,
  w: number,
  h: number,
  minPt: number,
  ctx: LayoutContext<'way-labels'>,
  name: string | null,
  caps?: CellCaps,
): { items: Item[]; sizes: CellSizes } {
  const inner: Box = { x: PAD_MM, y: PAD_MM * 0.6, w: w - 2 * PAD_MM, h: h - 1.2 * PAD_MM };
  const cap = (pt: number, c: number | undefined) => Math.max(minPt, Math.min(pt, c ?? pt));
  const bold: FitStyle = { face: 'bold', maxPt: cap(12, caps?.ways), minPt, maxLines: 1, align: 'left' };
  const regular: FitStyle = { face: 'regular', maxPt: 9, minPt, maxLines: 1, align: 'right' };
  const main: FitStyle = { face: 'bold', maxPt: cap(11, caps?.main), minPt, wrapBelowPt: Math.min(7, cap(11, caps?.main)), align: 'centre', lineSpacing: 1.18 };
  const parts: Array<[string, Box, FitStyle, 'ways' | 'device' | 'main']> = [];
  const extra: Item[] = [];
  if (inner.h < 5) {
    parts.push(
      [t.ways, { ...inner, w: inner.w * 0.3 }, bold, 'ways'],
      [t.main, { ...inner, x: inner.x + inner.w * 0.32, w: inner.w * 0.68 }, { ...main, align: 'left', maxLines: 1 }, 'main'],
    );
  } else {
    let top = Math.max(2.2, inner.h * 0.38);
    // Share the top line by how wide each text is, so "9" next to "C32 30 mA" leaves the device room.
    // The way number always gets room for at least 7 pt; the device text goes when what is left cannot hold it.
    const wayW = ctx.tm.measure(t.ways, 'bold', 1);
    const deviceW = ctx.tm.measure(t.device, 'regular', 1);
    const wayMin = Math.min(1, (ctx.tm.measure(t.ways, 'bold', 7) + 0.3) / inner.w);
    let wayShare = t.device ? Math.min(0.7, Math.max(0.25, wayMin, wayW / (wayW + deviceW + 1e-9))) : 1;
    // A device text too long for one line beside the way number ("B20 30 mA") takes two ("B20" over "30 mA");
    // if even that cannot be set at the minimum, it goes with the usual cut warning, never silently.
    let deviceLines: { lines: string[]; sizePt: number } | null = null;
    if (t.device && inner.w * (1 - wayShare) < deviceW * minPt) {
      deviceLines = twoLines(t.device, inner.w * (1 - wayShare), inner.h * 0.5, minPt, regular, ctx);
      if (deviceLines) top = Math.max(top, blockHeight(2, deviceLines.sizePt, regular, ctx.tm));
      else {
        if (name) ctx.warnings.cut(name, t.device);
        wayShare = 1;
        t = { ...t, device: '' };
      }
    }
    const ways: Box = { x: inner.x, y: inner.y, w: inner.w * wayShare, h: top };
    parts.push([t.ways, ways, t.device ? bold : { ...bold, align: 'centre' }, 'ways']);
    const deviceBox: Box = { x: inner.x + inner.w * wayShare, y: inner.y, w: inner.w * (1 - wayShare), h: top };
    if (deviceLines)
      extra.push(
        ...runsForLines(deviceLines.lines, deviceBox, { ...regular, maxPt: deviceLines.sizePt, minPt: deviceLines.sizePt }, deviceLines.sizePt, ctx.tm),
      );
    else if (t.device) parts.push([t.device, deviceBox, regular, 'device']);
    parts.push([t.main, { x: inner.x, y: inner.y + top, w: inner.w, h: inner.h - top }, main, 'main']);
  }
  const items: Item[] = [...extra];
  const sizes: CellSizes = { ways: Infinity, main: Infinity };
  for (const [text, cell, style, role] of parts) {
    const fit = fitText(text, cell, style, ctx.tm);
    if (fit.cut && name) ctx.warnings.cut(name, text);
    if (text && role !== 'device') sizes[role] = fit.sizePt;
    items.push(...fit.runs);
  }
  return { items, sizes };
}

/** `text` split at its first space into two lines, at the largest size up to the style's that fits `w × h`; null below `minPt`. */
function twoLines(
  text: string,
  w: number,
  h: number,
  minPt: number,
  style: FitStyle,
  ctx: LayoutContext<'way-labels'>,
): { lines: string[]; sizePt: number } | null {
  const at = text.indexOf(' ');
  if (at <= 0) return null;
  const lines = [text.slice(0, at), text.slice(at + 1)];
  const widest = Math.max(...lines.map((l) => ctx.tm.measure(l, style.face, 1)));
  const byHeight = h / blockHeight(2, 1, style, ctx.tm);
  const sizePt = Math.floor(Math.min(style.maxPt, w / widest, byHeight) * 4) / 4;
  return sizePt >= minPt ? { lines, sizePt } : null;
}

function cellFrame(box: Box, ctx: LayoutContext<'way-labels'>) {
  const minPt = ctx.req.medium.kind === 'tape' ? 5 : 5.5;
  const turned = box.h > box.w * 1.15;
  return { minPt, turned, w: turned ? box.h : box.w, h: turned ? box.w : box.h };
}

/** Text items for a cell box; turned 90° when the cell stands taller than wide; `caps` limit the sizes. */
export function cellItems(t: CellText, box: Box, ctx: LayoutContext<'way-labels'>, name: string, caps?: RowCaps): Item[] {
  if (box.w <= 0 || box.h <= 0) return [];
  const f = cellFrame(box, ctx);
  const local = frameItems(t, f.w, f.h, f.minPt, ctx, name, caps?.[f.turned ? 'turned' : 'upright']).items;
  return mapItems(local, placeFrame(f.w, f.h, box, f.turned ? 90 : 0));
}

/** The sizes a cell's way number and main label fit at on their own, and whether the cell is set turned. */
export function cellSizes(t: CellText, box: Box, ctx: LayoutContext<'way-labels'>): { turned: boolean; sizes: CellSizes } {
  if (box.w <= 0 || box.h <= 0) return { turned: false, sizes: { ways: Infinity, main: Infinity } };
  const f = cellFrame(box, ctx);
  return { turned: f.turned, sizes: frameItems(t, f.w, f.h, f.minPt, ctx, null).sizes };
}
