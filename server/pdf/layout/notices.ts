/**
 * Statutory notices as pieces: a framed label with the warning triangle (or earth sign) on the left
 * and title, wording, dates and the regulation number on the right. Sized per kind on sheets, to the
 * label on die-cut media, and to the shortest length that fits the wording on tape.
 */
import type { NoticeKind } from '../../../shared/schemas/print.js';
import { BLACK, WHITE, type Box, type Item, type LayoutDoc } from '../model.js';
import { TAPE_MAX_LENGTH_MM } from '../media.js';
import { WarningList, type LayoutContext } from './context.js';
import { fitText, type FitStyle } from './fit.js';
import { noticeContent, noticesCalledFor, type NoticeContent } from './notice-content.js';
import { placePieces, slotFor, type Piece, type Slot } from './place.js';
import { earthSymbol, warningTriangle } from './symbols.js';

/** Notice sizes when tiled on a plain sheet (mm): ours, chosen to read from a metre away. */
const PAGE_SIZES: Record<'notice' | 'earthing', { w: number; h: number }> = { notice: { w: 120, h: 58 }, earthing: { w: 80, h: 20 } };
const TAPE_STEP_MM = 10;

interface Rows { title: Box; body: Box | null; details: Box | null; regulation: Box }

/** Rows of the text area: stacked on a roomy label, two lines on narrow tape. */
function rows(area: Box, c: NoticeContent): Rows {
  const at = (from: number, share: number): Box => ({ x: area.x, y: area.y + area.h * from, w: area.w, h: area.h * share });
  if (!c.body) return area.h < 14 ? { title: at(0, 0.6), body: null, details: null, regulation: at(0.6, 0.4) } : { title: at(0, 0.72), body: null, details: null, regulation: at(0.74, 0.26) };
  if (area.h < 14) return { title: at(0, 0.5), body: at(0.5, 0.5), details: null, regulation: { ...at(0.5, 0.5), w: 0 } };
  const d = c.details.length ? Math.min(0.26, 0.12 * c.details.length + 0.04) : 0;
  return { title: at(0, 0.2), body: at(0.21, 0.67 - d), details: d ? at(0.89 - d, d) : null, regulation: at(0.89, 0.11) };
}

/** A notice in a `w × h` frame; reports whether any text had to be cut. */
function noticeItems(c: NoticeContent, w: number, h: number, minPt: number, ctx: LayoutContext<'notices'>, warnings: WarningList): Item[] {
  const border = Math.min(0.6, h / 30);
  const pad = Math.min(2.5, h / 12);
  const items: Item[] = [{ kind: 'rect', box: { x: border / 2, y: border / 2, w: w - border, h: h - border }, fill: WHITE, stroke: BLACK, lineMm: border }];
  let textX = border + pad;
  if (c.symbol) {
    const side = Math.min(h - 2 * (border + pad), w * 0.28);
    const box: Box = { x: textX, y: (h - side) / 2, w: side, h: side };
    items.push(...(c.symbol === 'warning' ? warningTriangle(box) : earthSymbol(box)));
    textX += side + pad;
  }
  const area: Box = { x: textX, y: border + pad * 0.6, w: w - textX - border - pad, h: h - 2 * border - 1.2 * pad };
  const r = rows(area, c);
  const narrow = area.h < 14;
  const style = (face: FitStyle['face'], maxPt: number, extra: Partial<FitStyle> = {}): FitStyle => ({ face, maxPt, minPt, align: 'left', lineSpacing: 1.2, ...extra });
  const parts: Array<[string, Box, FitStyle]> = [
    [narrow && c.details.length ? `${c.title} · ${c.details.join(' · ')}` : c.title, r.title, style('bold', 20, { maxLines: c.body ? 2 : 3, wrapBelowPt: 20 })],
  ];
  if (r.body) parts.push([narrow ? `${c.body} (${c.regulation})` : c.body, r.body, style('regular', 12, { wrapBelowPt: 12 })]);
  if (r.details) parts.push([c.details.join('\n'), r.details, style('bold', 11, { maxLines: c.details.length })]);
  if (r.regulation.w > 0) parts.push([c.regulation, r.regulation, style('regular', 8, { align: 'right', maxLines: 1 })]);
  const name = `${c.title} notice`;
  for (const [text, box, s] of parts) {
    const lines = text.split('\n');
    const lineH = box.h / lines.length;
    lines.forEach((line, i) => {
      const fit = fitText(line, { ...box, y: box.y + i * lineH, h: lineH }, { ...s, maxLines: lines.length > 1 ? 1 : s.maxLines }, ctx.tm);
      if (fit.cut) warnings.cut(name, line);
      items.push(...fit.runs);
    });
  }
  return items;
}

/** The notice as a piece for the slot; on tape, the shortest length whose wording fits. */
function noticePiece(c: NoticeContent, slot: Slot, ctx: LayoutContext<'notices'>): Piece {
  const name = `${c.title} notice`;
  const minPt = ctx.req.medium.kind === 'tape' ? 5 : 6;
  if (slot.kind === 'fixed') return { name, widthMm: slot.widthMm, heightMm: slot.heightMm, items: noticeItems(c, slot.widthMm, slot.heightMm, minPt, ctx, ctx.warnings) };
  if (ctx.req.medium.kind !== 'tape') {
    const size = PAGE_SIZES[c.kind === 'earthing' ? 'earthing' : 'notice'];
    const w = Math.min(size.w, slot.maxLengthMm);
    const h = Math.min(size.h, slot.heightMm);
    return { name, widthMm: w, heightMm: h, items: noticeItems(c, w, h, minPt, ctx, ctx.warnings) };
  }
  const max = Math.min(TAPE_MAX_LENGTH_MM, slot.maxLengthMm);
  for (let w = slot.heightMm * 3; w < max; w += TAPE_STEP_MM) {
    const trial = new WarningList();
    const items = noticeItems(c, w, slot.heightMm, minPt, ctx, trial);
    if (trial.list.length === 0) return { name, widthMm: w, heightMm: slot.heightMm, items };
  }
  return { name, widthMm: max, heightMm: slot.heightMm, items: noticeItems(c, max, slot.heightMm, minPt, ctx, ctx.warnings) };
}

/** The kinds to print: the option's list, else what the board calls for. */
function kindsFor(ctx: LayoutContext<'notices'>): NoticeKind[] {
  if (ctx.options.kinds) return [...new Set(ctx.options.kinds.split(','))] as NoticeKind[];
  return noticesCalledFor(ctx.req.schedule, ctx.options.earthingCount);
}

export function layoutNotices(ctx: LayoutContext<'notices'>): LayoutDoc {
  const slot = slotFor(ctx.req.medium, PAGE_SIZES.notice.h);
  const pieces: Piece[] = [];
  for (const kind of kindsFor(ctx)) {
    const content = noticeContent(kind, ctx.req.schedule, ctx.req.board);
    const copies = kind === 'earthing' ? ctx.options.earthingCount : 1;
    const piece = copies > 0 ? noticePiece(content, slot, ctx) : null;
    for (let i = 0; i < copies && piece; i++) pieces.push(piece);
  }
  if (pieces.length === 0) ctx.warnings.add({ code: 'nothing-to-print', message: 'No notices chosen' });
  return { title: `${ctx.req.board.code} notices`, pages: placePieces(pieces, ctx.req.medium, ctx.tm), warnings: ctx.warnings.list };
}
