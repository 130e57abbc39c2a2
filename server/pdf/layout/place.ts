/**
 * Putting pieces (flags, strips, notices, tags) on the medium. A piece is laid out in its own
 * frame with its length along x and its height across; this file decides the page it lands on:
 * one tape page per piece (page width = tape width), one tape strip with cut marks, tiles on a
 * sheet with cut lines, or one die-cut label each.
 */
import { mapItems, placeFrame, type Placement } from '../geometry.js';
import { BLACK, GREY, type Box, type Item, type LayoutPage, type TypeMetrics } from '../model.js';
import { fitText } from './fit.js';
import { isLabelPage, TAPE_MAX_LENGTH_MM } from '../media.js';
import { LayoutError, type Medium } from '../types.js';

/** One thing to print, in its own frame (length `widthMm` along x, `heightMm` across). */
export interface Piece {
  name: string;
  widthMm: number;
  heightMm: number;
  items: Item[];
  caption?: string;
}

/**
 * The room a piece gets. `free`: the piece picks its length up to `maxLengthMm` (tape, tiles on a page);
 * `fixed`: the piece is exactly the label. `endMarginMm` is what the printer may not reach at each end.
 */
export type Slot =
  { kind: 'free'; heightMm: number; maxLengthMm: number; endMarginMm: number } | { kind: 'fixed'; widthMm: number; heightMm: number; endMarginMm: number };

/** Margin around tiles on a plain page, and the gap between them (mm). // common practice */
export const PAGE_MARGIN_MM = 10;
const TILE_GAP_MM = 3;
const CAPTION_MM = 4;
/** Gap between pieces on a tape strip, with the cut line in its middle (mm). */
export const STRIP_GAP_MM = 4;
const LABEL_END_MARGIN_MM = 1.5;
const CUT_LINE = { lineMm: 0.15, color: GREY, dashMm: [1.5, 1] } as const;

/** A sheet's die-cut labels, or a small custom page taken as one label. */
function labelGrid(medium: Medium) {
  if (medium.kind === 'sheet') return medium.layout;
  if (medium.kind === 'page' && isLabelPage(medium)) {
    return {
      pageWidthMm: medium.widthMm,
      pageHeightMm: medium.heightMm,
      labelWidthMm: medium.widthMm,
      labelHeightMm: medium.heightMm,
      columns: 1,
      rows: 1,
      marginTopMm: 0,
      marginLeftMm: 0,
      gapXMm: 0,
      gapYMm: 0,
    };
  }
  return null;
}

/** The slot an output's pieces get on this medium; `pageHeightMm` is the output's own height for tiles. */
export function slotFor(medium: Medium, pageHeightMm: number): Slot {
  if (medium.kind === 'tape') return { kind: 'free', heightMm: medium.printableMm, maxLengthMm: Infinity, endMarginMm: medium.marginMm };
  const grid = labelGrid(medium);
  if (grid) {
    const long = Math.max(grid.labelWidthMm, grid.labelHeightMm);
    const short = Math.min(grid.labelWidthMm, grid.labelHeightMm);
    return { kind: 'fixed', widthMm: long, heightMm: short, endMarginMm: LABEL_END_MARGIN_MM };
  }
  const page = medium as Extract<Medium, { kind: 'page' }>;
  const usableH = page.heightMm - 2 * PAGE_MARGIN_MM - CAPTION_MM;
  return { kind: 'free', heightMm: Math.min(pageHeightMm, usableH), maxLengthMm: page.widthMm - 2 * PAGE_MARGIN_MM, endMarginMm: 1 };
}

/** Longest piece the slot takes (mm). */
export function slotMaxLength(slot: Slot): number {
  return slot.kind === 'fixed' ? slot.widthMm : slot.maxLengthMm;
}

function tapePages(pieces: Piece[], medium: Extract<Medium, { kind: 'tape' }>): LayoutPage[] {
  return pieces.map((p) => {
    const target: Box = { x: (medium.widthMm - p.heightMm) / 2, y: 0, w: p.heightMm, h: p.widthMm };
    return { widthMm: medium.widthMm, heightMm: p.widthMm, items: mapItems(p.items, placeFrame(p.widthMm, p.heightMm, target, 90)) };
  });
}

/** Half of a ▼▲ join mark at both edges of the band across the tape at `y`, pointing along `dir`. */
function joinMarks(y: number, dir: 1 | -1, band: { x: number; w: number }): Item[] {
  const mark = Math.min(2, band.w / 4);
  const left = band.x;
  const right = band.x + band.w;
  return [
    {
      kind: 'polygon',
      points: [
        { x: left, y },
        { x: left + mark, y },
        { x: left, y: y + dir * mark },
      ],
      fill: BLACK,
    },
    {
      kind: 'polygon',
      points: [
        { x: right, y },
        { x: right - mark, y },
        { x: right, y: y + dir * mark },
      ],
      fill: BLACK,
    },
  ];
}

/**
 * Pieces one after another on tape, a dashed cut line across the tape between them. A strip that
 * would run past `maxMm` (the longest label the printer takes in one piece, as for way-label strips)
 * goes on over further pages, split between pieces, with ▼▲ half-marks where the parts meet.
 */
function tapeStrip(pieces: Piece[], medium: Extract<Medium, { kind: 'tape' }>, maxMm: number): LayoutPage[] {
  const pages: LayoutPage[] = [];
  let items: Item[] = [];
  let y = 0;
  const close = () => {
    pages.push({ widthMm: medium.widthMm, heightMm: Math.max(y, 1), items });
    items = [];
    y = 0;
  };
  pieces.forEach((p, i) => {
    const band = { x: (medium.widthMm - p.heightMm) / 2, w: p.heightMm };
    if (i > 0 && y + STRIP_GAP_MM + p.widthMm > maxMm + 1e-6) {
      y += STRIP_GAP_MM / 2;
      items.push(...joinMarks(y, -1, band));
      close();
      items.push(...joinMarks(0, 1, band));
      y = STRIP_GAP_MM / 2;
    } else if (i > 0) {
      const cutAt = y + STRIP_GAP_MM / 2;
      items.push({ kind: 'line', from: { x: 0, y: cutAt }, to: { x: medium.widthMm, y: cutAt }, ...CUT_LINE });
      y += STRIP_GAP_MM;
    }
    const target: Box = { x: band.x, y, w: p.heightMm, h: p.widthMm };
    items.push(...mapItems(p.items, placeFrame(p.widthMm, p.heightMm, target, 90)));
    y += p.widthMm;
  });
  close();
  return pages;
}

/** Tiles in rows on a plain page, each outlined with a dashed cut line and captioned if it has one. */
function pageTiles(pieces: Piece[], medium: Extract<Medium, { kind: 'page' }>, tm: TypeMetrics): LayoutPage[] {
  const pages: LayoutPage[] = [];
  const right = medium.widthMm - PAGE_MARGIN_MM;
  const bottom = medium.heightMm - PAGE_MARGIN_MM;
  let page: LayoutPage | null = null;
  let x = PAGE_MARGIN_MM;
  let y = PAGE_MARGIN_MM;
  let rowH = 0;
  for (const p of pieces) {
    const h = p.heightMm + (p.caption ? CAPTION_MM : 0);
    if (p.widthMm > right - PAGE_MARGIN_MM + 1e-6 || h > bottom - PAGE_MARGIN_MM + 1e-6) {
      throw new LayoutError(
        `${p.name} (${p.widthMm.toFixed(1)} × ${p.heightMm.toFixed(1)} mm) does not fit on ${medium.id}: choose a larger page or tape`,
        'media',
      );
    }
    if (x + p.widthMm > right + 1e-6) {
      x = PAGE_MARGIN_MM;
      y += rowH + TILE_GAP_MM;
      rowH = 0;
    }
    if (!page || y + h > bottom + 1e-6) {
      page = { widthMm: medium.widthMm, heightMm: medium.heightMm, items: [] };
      pages.push(page);
      x = PAGE_MARGIN_MM;
      y = PAGE_MARGIN_MM;
      rowH = 0;
    }
    const top = y + (p.caption ? CAPTION_MM : 0);
    if (p.caption) page.items.push(...captionItems(p.caption, { x, y, w: p.widthMm, h: CAPTION_MM }, tm));
    page.items.push({
      kind: 'rect',
      box: { x, y: top, w: p.widthMm, h: p.heightMm },
      stroke: CUT_LINE.color,
      lineMm: CUT_LINE.lineMm,
      dashMm: CUT_LINE.dashMm,
    });
    page.items.push(...mapItems(p.items, { x, y: top, rotation: 0 }));
    x += p.widthMm + TILE_GAP_MM;
    rowH = Math.max(rowH, h);
  }
  return pages;
}

function captionItems(caption: string, box: Box, tm: TypeMetrics): Item[] {
  return fitText(caption, box, { face: 'regular', maxPt: 7, minPt: 5, maxLines: 1, valign: 'middle', color: GREY }, tm).runs;
}

/** One piece per die-cut label, turned a quarter when the labels stand taller than wide. */
function sheetLabels(pieces: Piece[], medium: Medium): LayoutPage[] {
  const grid = labelGrid(medium)!;
  const perPage = grid.columns * grid.rows;
  const tall = grid.labelHeightMm > grid.labelWidthMm;
  const pages: LayoutPage[] = [];
  pieces.forEach((p, i) => {
    if (i % perPage === 0) pages.push({ widthMm: grid.pageWidthMm, heightMm: grid.pageHeightMm, items: [] });
    const n = i % perPage;
    const col = n % grid.columns;
    const row = Math.floor(n / grid.columns);
    const label: Box = {
      x: grid.marginLeftMm + col * (grid.labelWidthMm + grid.gapXMm),
      y: grid.marginTopMm + row * (grid.labelHeightMm + grid.gapYMm),
      w: grid.labelWidthMm,
      h: grid.labelHeightMm,
    };
    const at: Placement = tall ? placeFrame(p.widthMm, p.heightMm, label, 90) : placeFrame(p.widthMm, p.heightMm, label, 0);
    pages[pages.length - 1].items.push(...mapItems(p.items, at));
  });
  return pages;
}

/**
 * Pages for pieces on any medium; `strip` joins tape pieces into strips with cut marks, each no
 * longer than `maxStripMm` (by default the longest label a tape printer takes, TAPE_MAX_LENGTH_MM).
 */
export function placePieces(pieces: Piece[], medium: Medium, tm: TypeMetrics, strip = false, maxStripMm = TAPE_MAX_LENGTH_MM): LayoutPage[] {
  if (pieces.length === 0) return [];
  if (medium.kind === 'tape') return strip ? tapeStrip(pieces, medium, maxStripMm) : tapePages(pieces, medium);
  if (labelGrid(medium)) return sheetLabels(pieces, medium);
  return pageTiles(pieces, medium as Extract<Medium, { kind: 'page' }>, tm);
}
