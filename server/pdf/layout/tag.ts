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

/** Code, barcode and caption in the box to the right of the QR code. */
function textSide(box: Box, xMm: number | null, ctx: LayoutContext<'tag'>, showCaption: boolean): Item[] {
  const code = ctx.req.board.code;
  const items: Item[] = [];
  const codeH = xMm ? box.h * 0.36 : box.h * (showCaption ? 0.8 : 1);
  const fit = fitText(code, { x: box.x, y: box.y, w: box.w, h: codeH }, { face: 'bold', maxPt: 28, minPt: 5, maxLines: 1, align: 'centre' }, ctx.tm);
  if (fit.cut) ctx.warnings.cut('Board tag', code);
  items.push(...fit.runs);
  const captionH = showCaption ? Math.max(2.2, box.h * 0.14) : 0;
  if (xMm) items.push(...barcodeItems(code, { x: box.x, y: box.y + codeH + 0.5, w: box.w, h: box.h - codeH - captionH - 1 }, xMm));
  if (showCaption) {
    const caption = fitText('Scan for the board page', { x: box.x, y: box.y + box.h - captionH, w: box.w, h: captionH }, { face: 'regular', maxPt: 7, minPt: 5, maxLines: 1, align: 'centre', color: GREY }, ctx.tm);
    items.push(...caption.runs);
  }
  return items;
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
  const barsNatural = code128WidthMm(board.code, ROOMY_X_MM);
  const length = slot.kind === 'fixed' ? slot.widthMm : slot.endMarginMm * 2 + qrSide + GAP_MM + Math.max(barsNatural, h * 1.4) + 0.5;
  const sideX = slot.endMarginMm + qrSide + (qrSide ? GAP_MM : 0);
  const side: Box = { x: sideX, y: pad, w: length - sideX - slot.endMarginMm - 0.5, h: h - 2 * pad };
  const x = Math.min(ROOMY_X_MM, side.w / (barsNatural / ROOMY_X_MM));
  const items: Item[] = [];
  if (qrSide) items.push(...qrItems(board.publicUrl, { x: slot.endMarginMm, y: pad, w: qrSide, h: qrSide }, qrHint(ctx, qrMinSideMm(board.publicUrl))));
  const encodable = code128Pattern(board.code) !== '';
  const bars = encodable && x >= CODE128_MIN_X_MM - 1e-9;
  if (!encodable) ctx.warnings.add({ code: 'barcode-left-off', label: 'Board tag', message: `Code 128 cannot carry the board code "${board.code}"; the barcode was left off` });
  else if (!bars) ctx.warnings.add({ code: 'barcode-left-off', label: 'Board tag', message: `The barcode needs ${code128WidthMm(board.code, CODE128_MIN_X_MM).toFixed(0)} mm beside the QR code; it was left off this size` });
  items.push(...textSide(side, bars ? x : null, ctx, qrSide > 0 && h >= 14));
  return { name: 'Board tag', widthMm: length, heightMm: h, items };
}

export function layoutTag(ctx: LayoutContext<'tag'>): LayoutDoc {
  if (!ctx.req.board.publicEnabled) ctx.warnings.add({ code: 'qr-left-off', label: 'Board tag', message: 'The board page is switched off, so the tag has no QR code' });
  const slot = slotFor(ctx.req.medium, PAGE_TAG_HEIGHT_MM);
  const piece = tagPiece(slot, ctx);
  const pieces = Array.from({ length: ctx.options.copies }, () => piece);
  return { title: `${ctx.req.board.code} board tag`, pages: placePieces(pieces, ctx.req.medium, ctx.tm), warnings: ctx.warnings.list };
}
