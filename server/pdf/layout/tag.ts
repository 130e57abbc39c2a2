/**
 * The board tag: a small sticker for the board front or door with the board-page QR code, the
 * board's short code in large type and the same code as a Code 128 barcode.
 */
import { GREY, type Box, type Item, type LayoutDoc } from '../model.js';
import { narrowestTapeFor } from '../media.js';
import { barcodeItems, code128Pattern, code128WidthMm, CODE128_MIN_X_MM } from '../barcode.js';
import { qrItems, qrMinSideMm } from '../qr.js';
import type { LayoutContext } from './context.js';
import { fitText } from './fit.js';
import { placePieces, slotFor, type Piece, type Slot } from './place.js';

/** Tag height when tiled on a plain sheet (mm). // common practice for asset stickers */
const PAGE_TAG_HEIGHT_MM = 30;
/** Narrow-bar width used when there is room (mm). */
const ROOMY_X_MM = 0.33;
const GAP_MM = 1.5;

function qrHint(ctx: LayoutContext<'tag'>, needMm: number): string {
  if (ctx.req.medium.kind !== 'tape') return `choose a label or page at least ${Math.ceil(needMm + 2)} mm high`;
  const tape = narrowestTapeFor(needMm + 1);
  return tape ? `use tape-${tape} or wider` : 'use a sheet or page instead of tape';
}

/** Code and barcode in the box to the right of the QR code. */
function textSide(box: Box, xMm: number | null, ctx: LayoutContext<'tag'>): Item[] {
  const code = ctx.req.board.code;
  const items: Item[] = [];
  const codeH = xMm ? box.h * 0.36 : box.h;
  const fit = fitText(code, { x: box.x, y: box.y, w: box.w, h: codeH }, { face: 'bold', maxPt: 28, minPt: 5, maxLines: 1, align: 'centre' }, ctx.tm);
  if (fit.cut) ctx.warnings.cut('Board tag', code);
  items.push(...fit.runs);
  if (xMm) items.push(...barcodeItems(code, { x: box.x, y: box.y + codeH + 0.5, w: box.w, h: box.h - codeH - 1 }, xMm));
  return items;
}

const CAPTION = 'Scan for the board page';
const CAPTION_STYLE = { face: 'regular', maxPt: 7, minPt: 5, maxLines: 2, align: 'centre', color: GREY, lineSpacing: 1.1 } as const;

/** Width of the caption set up the QR code's side (two lines of 5–7 pt, mm). */
const BESIDE_MM = 5;

function captionBeside(qrSide: number, ctx: LayoutContext<'tag'>): boolean {
  return !fitText(CAPTION, { x: 0, y: 0, w: BESIDE_MM - 0.3, h: qrSide }, CAPTION_STYLE, ctx.tm, 270).cut;
}

/**
 * Room under the QR code for its caption: the code gives up that height only while it stays at its
 * readable minimum; otherwise the caption is left off (the code alone still works).
 */
function captionRoom(qrSide: number, h: number, pad: number, url: string, ctx: LayoutContext<'tag'>): number {
  if (!qrSide || h < 14) return 0;
  const room = Math.max(2.4, h * 0.16);
  const fits = fitText(CAPTION, { x: 0, y: 0, w: qrSide - room, h: room }, CAPTION_STYLE, ctx.tm);
  return !fits.cut && qrSide - room >= qrMinSideMm(url) - 1e-9 && h - 2 * pad >= qrSide ? room : 0;
}

/** One tag as a piece for the slot. */
export function tagPiece(slot: Slot, ctx: LayoutContext<'tag'>): Piece {
  const { board } = ctx.req;
  const h = slot.heightMm;
  const pad = Math.min(1, h / 20);
  let qrSide = board.publicEnabled ? h - 2 * pad : 0;
  if (slot.kind === 'fixed' && qrSide) {
    // On a label of fixed length the QR code gives up size (never below readable) so the bars still fit.
    const roomForBars = slot.widthMm - 2 * slot.endMarginMm - GAP_MM - 0.5 - code128WidthMm(board.code, CODE128_MIN_X_MM);
    qrSide = Math.min(qrSide, slot.widthMm * 0.6, Math.max(qrMinSideMm(board.publicUrl), roomForBars));
  }
  const captionH = captionRoom(qrSide, h, pad, board.publicUrl, ctx);
  qrSide -= captionH;
  // No room under the code (tape, where the code already has the whole height): the caption runs up its side.
  const besideW = !captionH && qrSide && h >= 14 && slot.kind === 'free' && captionBeside(qrSide, ctx) ? BESIDE_MM : 0;
  const barsNatural = code128WidthMm(board.code, ROOMY_X_MM);
  const length = slot.kind === 'fixed' ? slot.widthMm : slot.endMarginMm * 2 + qrSide + besideW + GAP_MM + Math.max(barsNatural, h * 1.4) + 0.5;
  const sideX = slot.endMarginMm + qrSide + besideW + (qrSide ? GAP_MM : 0);
  const side: Box = { x: sideX, y: pad, w: length - sideX - slot.endMarginMm - 0.5, h: h - 2 * pad };
  const x = Math.min(ROOMY_X_MM, side.w / (barsNatural / ROOMY_X_MM));
  const items: Item[] = [];
  if (qrSide) items.push(...qrItems(board.publicUrl, { x: slot.endMarginMm, y: pad, w: qrSide, h: qrSide }, qrHint(ctx, qrMinSideMm(board.publicUrl))));
  // The caption sits under the code it explains, not under the barcode.
  if (captionH) items.push(...fitText(CAPTION, { x: slot.endMarginMm, y: pad + qrSide, w: qrSide, h: captionH }, CAPTION_STYLE, ctx.tm).runs);
  if (besideW) items.push(...fitText(CAPTION, { x: slot.endMarginMm + qrSide + 0.3, y: pad, w: besideW - 0.3, h: qrSide }, CAPTION_STYLE, ctx.tm, 270).runs);
  const encodable = code128Pattern(board.code) !== '';
  const bars = encodable && x >= CODE128_MIN_X_MM - 1e-9;
  if (!encodable)
    ctx.warnings.add({
      code: 'barcode-left-off',
      label: 'Board tag',
      message: `Code 128 cannot carry the board code "${board.code}"; the barcode was left off`,
    });
  else if (!bars)
    ctx.warnings.add({
      code: 'barcode-left-off',
      label: 'Board tag',
      message: `The barcode needs ${code128WidthMm(board.code, CODE128_MIN_X_MM).toFixed(0)} mm beside the QR code; it was left off this size`,
    });
  items.push(...textSide(side, bars ? x : null, ctx));
  return { name: 'Board tag', widthMm: length, heightMm: h, items };
}

export function layoutTag(ctx: LayoutContext<'tag'>): LayoutDoc {
  if (!ctx.req.board.publicEnabled)
    ctx.warnings.add({
      code: 'qr-left-off',
      label: 'Board tag',
      message: 'The board page is switched off, so the tag has no QR code: switch the page on under Sharing first if the tag should open it',
    });
  const slot = slotFor(ctx.req.medium, PAGE_TAG_HEIGHT_MM);
  const piece = tagPiece(slot, ctx);
  const pieces = Array.from({ length: ctx.options.copies }, () => piece);
  return { title: `${ctx.req.board.code} board tag`, pages: placePieces(pieces, ctx.req.medium, ctx.tm), warnings: ctx.warnings.list };
}
