/**
 * The way table: column widths, rows measured (wrapped paragraphs, each cell its own box), rows
 * turned into items. Measuring is linear in the text: word widths come from cached metrics.
 */
import { BLACK, GREY, LIGHT_GREY, MM_PER_PT, type Box, type Color, type FontFace, type Item, type TextRun, type TypeMetrics } from '../../model.js';
import { blockHeight, wrapText, type FitStyle } from '../fit.js';
import type { Paragraph } from './columns.js';

export interface TableStyle {
  sizePt: number;
  padMm: number;
  wayWidthMm: number;
  tm: TypeMetrics;
}

export interface CellLines {
  face: FontFace;
  color?: Color;
  lines: string[];
}
export interface MeasuredRow {
  cells: CellLines[][];
  heightMm: number;
  cut: boolean;
}

const LINE_SPACING = 1.2;
const ROW_SHADE: Color = [0.955, 0.955, 0.955];
const HEADER_FILL: Color = [0.88, 0.88, 0.88];

function fitStyle(s: TableStyle, face: FontFace): FitStyle {
  return { face, maxPt: s.sizePt, minPt: s.sizePt, lineSpacing: LINE_SPACING };
}

/** Widths of the columns across `totalMm`: the way column fixed, the rest by weight. */
export function columnWidths(totalMm: number, weights: number[], wayWidthMm: number): number[] {
  const sum = weights.reduce((a, b) => a + b, 0);
  const rest = totalMm - wayWidthMm;
  return weights.map((w) => (w === 0 ? wayWidthMm : (rest * w) / sum));
}

/** Wrap each cell's paragraphs to its width, at most `maxLines[i]` lines a cell (the last cut with …). */
export function measureRow(cells: Paragraph[][], widths: number[], maxLines: number[], s: TableStyle): MeasuredRow {
  let lines = 1;
  let cut = false;
  const measured = cells.map((paragraphs, i) => {
    let left = maxLines[i];
    const out: CellLines[] = [];
    for (const p of paragraphs) {
      if (left <= 0) {
        cut = true;
        break;
      }
      const wrapped = wrapText(p.text, widths[i] - 2 * s.padMm, p.face, s.sizePt, s.tm, left);
      cut ||= wrapped.cut;
      left -= wrapped.lines.length;
      out.push({ face: p.face, color: p.color, lines: wrapped.lines });
    }
    lines = Math.max(lines, maxLines[i] - left);
    return out;
  });
  const heightMm = blockHeight(lines, s.sizePt, fitStyle(s, 'regular'), s.tm) + 2 * s.padMm;
  return { cells: measured, heightMm, cut };
}

/** Runs for one cell's paragraphs, stacked from the top inside its padding. */
function cellRuns(cell: CellLines[], box: Box, s: TableStyle): TextRun[] {
  const em = s.sizePt * MM_PER_PT;
  const runs: TextRun[] = [];
  let n = 0;
  for (const p of cell) {
    for (const text of p.lines) {
      runs.push({
        kind: 'text',
        text,
        face: p.face,
        sizePt: s.sizePt,
        x: box.x + s.padMm,
        y: box.y + s.padMm + s.tm.ascent * em + n * LINE_SPACING * em,
        rotation: 0,
        color: p.color ?? BLACK,
        cell: box,
        widthMm: s.tm.measure(text, p.face, s.sizePt),
        ascentMm: s.tm.ascent * em,
        descentMm: s.tm.descent * em,
      });
      n++;
    }
  }
  return runs;
}

/** A measured row at `y`, its cells side by side from `x`; shaded rows help the eye along. */
export function rowItems(row: MeasuredRow, x: number, y: number, widths: number[], s: TableStyle, shade: boolean, header = false): Item[] {
  const total = widths.reduce((a, b) => a + b, 0);
  const items: Item[] = [];
  if (shade || header) items.push({ kind: 'rect', box: { x, y, w: total, h: row.heightMm }, fill: header ? HEADER_FILL : ROW_SHADE });
  let cx = x;
  row.cells.forEach((cell, i) => {
    items.push(...cellRuns(cell, { x: cx, y, w: widths[i], h: row.heightMm }, s));
    cx += widths[i];
  });
  items.push({
    kind: 'line',
    from: { x, y: y + row.heightMm },
    to: { x: x + total, y: y + row.heightMm },
    lineMm: header ? 0.3 : 0.1,
    color: header ? BLACK : LIGHT_GREY,
  });
  return items;
}

/** Thin vertical rules between columns over a run of rows from `top` to `bottom`. */
export function columnRules(x: number, top: number, bottom: number, widths: number[]): Item[] {
  const items: Item[] = [];
  let cx = x;
  for (const w of widths.slice(0, -1)) {
    cx += w;
    items.push({ kind: 'line', from: { x: cx, y: top }, to: { x: cx, y: bottom }, lineMm: 0.1, color: GREY });
  }
  return items;
}
