/**
 * Fitting text into a cell: shrink from the preferred size to the output's minimum, then wrap to
 * the lines the cell allows, then cut with an ellipsis (and tell the caller, who names the label
 * in a warning). Every run carries its cell; no glyph box ever leaves it.
 */
import { placeFrame, mapItem } from '../geometry.js';
import { BLACK, MM_PER_PT, insetBox, type Box, type Color, type FontFace, type Rotation, type TextRun, type TypeMetrics } from '../model.js';
import { cleanText, codePoints } from './text.js';

export interface FitStyle {
  face: FontFace;
  /** Preferred size; the fit never goes above it. */
  maxPt: number;
  /** Smallest size this output allows (e.g. 5 pt on tape). */
  minPt: number;
  /**
   * Below this size a one-line fit gives way to wrapping at a larger size (default: the minimum,
   * i.e. shrink all the way before wrapping). Titles set it high to wrap at once.
   */
  wrapBelowPt?: number;
  maxLines?: number;
  align?: 'left' | 'centre' | 'right';
  valign?: 'top' | 'middle' | 'bottom';
  /** Baseline to baseline, in ems; never less than the font's ascender + descender. */
  lineSpacing?: number;
  padMm?: number;
  color?: Color;
}

export interface FitResult {
  runs: TextRun[];
  sizePt: number;
  lines: string[];
  cut: boolean;
}

const STEP_PT = 0.25;
const ELLIPSIS = '…';

function floorStep(pt: number): number {
  return Math.floor(pt / STEP_PT + 1e-9) * STEP_PT;
}

function spacingOf(style: FitStyle, tm: TypeMetrics): number {
  return Math.max(style.lineSpacing ?? 1.2, tm.ascent + tm.descent);
}

/** How many lines of `sizePt` text fit a height of `heightMm`. */
export function linesThatFit(heightMm: number, sizePt: number, style: FitStyle, tm: TypeMetrics): number {
  const em = sizePt * MM_PER_PT;
  const extent = tm.ascent + tm.descent;
  if (heightMm + 1e-9 < extent * em) return 0;
  const n = Math.floor((heightMm / em - extent) / spacingOf(style, tm) + 1e-9) + 1;
  return Math.min(n, style.maxLines ?? Infinity);
}

/** Height of a block of `lines` lines (mm). */
export function blockHeight(lines: number, sizePt: number, style: FitStyle, tm: TypeMetrics): number {
  if (lines <= 0) return 0;
  return sizePt * MM_PER_PT * (tm.ascent + tm.descent + (lines - 1) * spacingOf(style, tm));
}

/** Longest prefix of `text` that, followed by an ellipsis, fits `widthMm` ('' if none does). */
export function cutToWidth(text: string, widthMm: number, face: FontFace, sizePt: number, tm: TypeMetrics): string {
  const chars = codePoints(text);
  let lo = 0;
  let hi = chars.length;
  while (lo < hi) {
    const mid = Math.ceil((lo + hi) / 2);
    const candidate = chars.slice(0, mid).join('').trimEnd() + ELLIPSIS;
    if (tm.measure(candidate, face, sizePt) <= widthMm) lo = mid;
    else hi = mid - 1;
  }
  const best = chars.slice(0, lo).join('').trimEnd() + ELLIPSIS;
  return tm.measure(best, face, sizePt) <= widthMm ? best : '';
}

/** Break one word wider than a line into pieces that each fit (by code point). */
function breakWord(word: string, widthMm: number, face: FontFace, sizePt: number, tm: TypeMetrics): string[] {
  const pieces: string[] = [];
  let current = '';
  for (const ch of codePoints(word)) {
    const next = current + ch;
    if (current && tm.measure(next, face, sizePt) > widthMm) {
      pieces.push(current);
      current = ch;
    } else current = next;
  }
  if (current) pieces.push(current);
  return pieces;
}

/**
 * Greedy wrap of clean text at one size. Word widths scale with size, so they are measured once
 * at 1 pt (`wordWidths1`) and the whole search over sizes stays linear in the words.
 */
function wrapAt(
  words: string[],
  wordWidths1: number[],
  space1: number,
  widthMm: number,
  face: FontFace,
  sizePt: number,
  tm: TypeMetrics,
): string[] & { broke?: boolean } {
  const lines: string[] & { broke?: boolean } = [];
  let line = '';
  let lineW = 0;
  const spaceW = space1 * sizePt;
  for (let i = 0; i < words.length; i++) {
    const w = wordWidths1[i] * sizePt;
    if (w > widthMm) {
      lines.broke = true;
      if (line) {
        lines.push(line);
        line = '';
        lineW = 0;
      }
      const pieces = breakWord(words[i], widthMm, face, sizePt, tm);
      lines.push(...pieces.slice(0, -1));
      line = pieces[pieces.length - 1] ?? '';
      lineW = tm.measure(line, face, sizePt);
      continue;
    }
    if (!line) {
      line = words[i];
      lineW = w;
      continue;
    }
    if (lineW + spaceW + w <= widthMm) {
      line += ` ${words[i]}`;
      lineW += spaceW + w;
    } else {
      lines.push(line);
      line = words[i];
      lineW = w;
    }
  }
  if (line) lines.push(line);
  return lines;
}

/** Wrap `text` to `widthMm` at one size, keeping at most `maxLines` (the last cut with an ellipsis). */
export function wrapText(
  raw: string,
  widthMm: number,
  face: FontFace,
  sizePt: number,
  tm: TypeMetrics,
  maxLines = Infinity,
): { lines: string[]; cut: boolean } {
  const text = tm.printable(cleanText(raw), face);
  if (!text) return { lines: [], cut: false };
  const words = text.split(' ');
  const widths = words.map((w) => tm.measure(w, face, 1));
  const lines = wrapAt(words, widths, tm.measure(' ', face, 1), widthMm, face, sizePt, tm);
  return limitLines(lines, widthMm, face, sizePt, tm, maxLines);
}

function limitLines(lines: string[], widthMm: number, face: FontFace, sizePt: number, tm: TypeMetrics, maxLines: number): { lines: string[]; cut: boolean } {
  let cut = false;
  let kept = lines;
  if (lines.length > maxLines) {
    cut = true;
    kept = lines.slice(0, maxLines);
    if (maxLines > 0) kept[maxLines - 1] = cutToWidth(`${lines[maxLines - 1]} ${lines[maxLines]}`, widthMm, face, sizePt, tm);
  }
  // Shaped scripts can measure wider whole than in pieces: check every line as drawn.
  kept = kept
    .map((l) => {
      if (tm.measure(l, face, sizePt) <= widthMm) return l;
      cut = true;
      return cutToWidth(l, widthMm, face, sizePt, tm);
    })
    .filter((l) => l !== '');
  return { lines: kept, cut };
}

/** The largest size (≤ max, ≥ min) at which clean text fits, and its lines; null if none does. */
function bestSize(text: string, w: number, h: number, style: FitStyle, tm: TypeMetrics): { sizePt: number; lines: string[] } | null {
  const extentMm1 = (tm.ascent + tm.descent) * MM_PER_PT;
  const single = Math.min(style.maxPt, w / tm.measure(text, style.face, 1), h / extentMm1);
  if (single >= Math.max(style.minPt, style.wrapBelowPt ?? 0) && (style.maxLines ?? 1) >= 1)
    return { sizePt: Math.max(style.minPt, floorStep(single)), lines: [text] };
  const words = text.split(' ');
  const widths = words.map((word) => tm.measure(word, style.face, 1));
  const space1 = tm.measure(' ', style.face, 1);
  // Prefer the largest size that wraps between words; break inside a word only at the smallest size.
  for (let s = floorStep(style.maxPt); s >= style.minPt - 1e-9; s -= STEP_PT) {
    const allowed = linesThatFit(h, s, style, tm);
    if (allowed < 1) continue;
    const lines = wrapAt(words, widths, space1, w, style.face, s, tm);
    if (lines.length <= allowed && (!lines.broke || s - STEP_PT < style.minPt - 1e-9)) return { sizePt: s, lines };
  }
  return null;
}

/** Lines placed in a `w × h` frame at the origin. */
function placeLines(lines: string[], sizePt: number, w: number, h: number, style: FitStyle, tm: TypeMetrics): TextRun[] {
  const em = sizePt * MM_PER_PT;
  const total = blockHeight(lines.length, sizePt, style, tm);
  const valign = style.valign ?? 'middle';
  const top = valign === 'top' ? 0 : valign === 'bottom' ? h - total : (h - total) / 2;
  const frame: Box = { x: 0, y: 0, w, h };
  return lines.map((text, i) => {
    const widthMm = tm.measure(text, style.face, sizePt);
    const align = style.align ?? 'left';
    const x = align === 'left' ? 0 : align === 'right' ? w - widthMm : (w - widthMm) / 2;
    return {
      kind: 'text',
      text,
      face: style.face,
      sizePt,
      x: Math.max(0, x),
      y: top + tm.ascent * em + i * spacingOf(style, tm) * em,
      rotation: 0,
      color: style.color ?? BLACK,
      cell: frame,
      widthMm,
      ascentMm: tm.ascent * em,
      descentMm: tm.descent * em,
    };
  });
}

/**
 * Fit `raw` into `cell`, optionally turned (90: reads top to bottom). `cut` is true when text had
 * to be cut with an ellipsis (or left out because nothing fits): the caller warns, naming the label.
 */
export function fitText(raw: string, cell: Box, style: FitStyle, tm: TypeMetrics, rotation: Rotation = 0): FitResult {
  const text = tm.printable(cleanText(raw), style.face);
  const inner = insetBox(cell, style.padMm ?? 0);
  const turned = rotation === 90 || rotation === 270;
  const w = turned ? inner.h : inner.w;
  const h = turned ? inner.w : inner.h;
  if (!text) return { runs: [], sizePt: style.maxPt, lines: [], cut: false };
  let fit = bestSize(text, w, h, style, tm);
  let cut = false;
  if (!fit) {
    const s = style.minPt;
    const limited = wrapText(text, w, style.face, s, tm, linesThatFit(h, s, style, tm));
    fit = { sizePt: s, lines: limited.lines };
    cut = true;
  } else {
    const checked = limitLines(fit.lines, w, style.face, fit.sizePt, tm, Infinity);
    fit = { sizePt: fit.sizePt, lines: checked.lines };
    cut = checked.cut;
  }
  const at = placeFrame(w, h, inner, rotation);
  const runs = placeLines(fit.lines, fit.sizePt, w, h, style, tm).map((r) => ({ ...(mapItem(r, at) as TextRun), cell }));
  return { runs, sizePt: fit.sizePt, lines: fit.lines, cut };
}

/** Runs for lines already wrapped (tables), stacked from the top of `cell` inside its padding. */
export function runsForLines(lines: string[], cell: Box, style: FitStyle, sizePt: number, tm: TypeMetrics): TextRun[] {
  const inner = insetBox(cell, style.padMm ?? 0);
  return placeLines(lines, sizePt, inner.w, inner.h, style, tm).map((r) => ({ ...r, x: r.x + inner.x, y: r.y + inner.y, cell }));
}
