/**
 * Statutory notices as pieces: a framed label with the warning triangle (or earth sign) on the left
 * and title, wording, details and the regulation number stacked on the right. On tape the notice is
 * as long as its wording needs (never a fixed length); on plain sheets it starts at the tile size and
 * takes more room when the wording needs it; on die-cut labels it is the label. Text never goes below
 * NOTICE_MIN_PT: a notice that cannot carry its wording at that size is cut with a warning naming it,
 * and the alternative-supply notice, whose isolation wording must never be cut, is refused instead.
 */
import type { NoticeKind } from '../../../shared/schemas/print.js';
import { BLACK, WHITE, type Box, type FontFace, type Item, type LayoutDoc, type TypeMetrics } from '../model.js';
import { narrowestTapeFor, TAPE_MAX_LENGTH_MM } from '../media.js';
import { LayoutError } from '../types.js';
import type { LayoutContext } from './context.js';
import { overdueInspection } from './dates.js';
import { blockHeight, fitText, runsForLines, wrapText, type FitStyle } from './fit.js';
import { noticeContent, noticesCalledFor, type NoticeContent } from './notice-content.js';
import { placePieces, slotFor, type Piece, type Slot } from './place.js';
import { earthSymbol, warningTriangle } from './symbols.js';

/** Notice sizes when tiled on a plain sheet (mm): ours, chosen to read from a metre away. */
const PAGE_SIZES: Record<'notice' | 'earthing', { w: number; h: number }> = { notice: { w: 120, h: 58 }, earthing: { w: 80, h: 20 } };

/**
 * Smallest type on any notice, tape or sheet (pt). Safety wording is read standing at the board,
 * often in a dim cupboard: a rule of thumb for sign lettering is capitals about 1/250 of the reading
 * distance, i.e. 1.6 mm at 0.4 m, and DejaVu's capitals are 0.73 em, so 6 pt (1.55 mm). The tape
 * and sheet minimum of 5 pt used for way labels is too small for a warning. // from memory (rule of thumb)
 */
export const NOTICE_MIN_PT = 6;

/** Preferred sizes at full scale (pt): title above body above the regulation reference. */
const PREFERRED = { title: 16, body: 11, regulation: 8 } as const;
/** Narrow (two-line) notices on thin tape: both lines one size, at most this (pt). */
const NARROW_MAX_PT = 14;
/** On tape, take the shortest length whose text is within this share of the largest the tape allows. */
const TAPE_SCALE_SHARE = 0.9;
/** Smallest scale sheets accept before a notice takes more room (body ≈ 8 pt). */
const SHEET_SCALE_MIN = 0.72;
const LENGTH_STEP_MM = 5;
const GROW_STEP_MM = 8;
const LINE_SPACING = 1.2;

interface Block {
  lines: string[];
  face: FontFace;
  sizePt: number;
  align: FitStyle['align'];
  heightMm: number;
}
/** `regulationInline`: the reference sits at the right end of the last line instead of a line of its own. */
interface Stack {
  title: Block;
  middle: Block[];
  regulation: Block;
  regulationInline: boolean;
  gapMm: number;
  heightMm: number;
}

const styleOf = (face: FontFace, sizePt: number, align: FitStyle['align'] = 'left'): FitStyle => ({
  face,
  maxPt: sizePt,
  minPt: sizePt,
  lineSpacing: LINE_SPACING,
  align,
});

/** The sizes at scale `s`, none below the minimum and the title never smaller than the body. */
function sizesAt(s: number) {
  const body = Math.max(NOTICE_MIN_PT, PREFERRED.body * s);
  return { title: Math.max(body, PREFERRED.title * s), body, regulation: Math.max(NOTICE_MIN_PT, PREFERRED.regulation * s) };
}

function block(text: string, face: FontFace, sizePt: number, w: number, tm: TypeMetrics, maxLines: number, align: FitStyle['align'] = 'left'): Block | null {
  const wrapped = wrapText(text, w, face, sizePt, tm);
  if (wrapped.cut || wrapped.lines.length > maxLines) return null;
  return { lines: wrapped.lines, face, sizePt, align, heightMm: blockHeight(wrapped.lines.length, sizePt, styleOf(face, sizePt), tm) };
}

/**
 * The stacked text at scale `s` in a text area `w` wide, or null if a part cannot be set whole.
 * `joinDetails` runs the details on as one paragraph (on tape, where length is cheap and height is not).
 */
function stackAt(c: NoticeContent, w: number, s: number, tm: TypeMetrics, joinDetails: boolean): Stack | null {
  const size = sizesAt(s);
  const title = block(c.title, 'bold', size.title, w, tm, c.body ? 2 : 3);
  const regulation = block(c.regulation, 'regular', size.regulation, w, tm, 1, 'right');
  if (!title || !regulation) return null;
  const middle: Block[] = [];
  const details = joinDetails && c.details.length ? [c.details.join(' · ')] : c.details;
  for (const [text, face] of [[c.body, 'regular'], ...details.map((d) => [d, 'bold'])] as Array<[string, FontFace]>) {
    if (!text) continue;
    const b = block(text, face, size.body, w, tm, Infinity);
    if (!b) return null;
    if (b.lines.length) middle.push(b);
  }
  const gapMm = size.body * 0.3 * (25.4 / 72);
  const last = middle[middle.length - 1] ?? title;
  const lastW = tm.measure(last.lines[last.lines.length - 1], last.face, last.sizePt);
  const regW = tm.measure(c.regulation, 'regular', size.regulation);
  const regulationInline = lastW + regW + 2 * gapMm <= w && regulation.heightMm <= last.heightMm / last.lines.length + 1e-6;
  const parts = regulationInline ? [title, ...middle] : [title, ...middle, regulation];
  const heightMm = parts.reduce((sum, b) => sum + b.heightMm, 0) + gapMm * (parts.length - 1);
  return { title, middle, regulation, regulationInline, gapMm, heightMm };
}

const SCALES = Array.from({ length: 41 }, (_, i) => 1 - i * 0.02); // 1 … 0.2: below ~0.55 every size is at its minimum

/** The largest scale at which the stack fits `w × h`, or null if it does not fit even at the minimum sizes. */
function bestStack(c: NoticeContent, w: number, h: number, tm: TypeMetrics, joinDetails: boolean, floor = 0): (Stack & { scale: number }) | null {
  for (const s of SCALES) {
    if (s < floor - 1e-9) break;
    const st = stackAt(c, w, s, tm, joinDetails);
    if (st && st.heightMm <= h + 1e-6) return { ...st, scale: s };
    if (sizesAt(s).title === NOTICE_MIN_PT && sizesAt(s).regulation === NOTICE_MIN_PT) break;
  }
  return null;
}

/** Frame, symbol and the text area of a `w × h` notice. */
function frame(c: NoticeContent, w: number, h: number): { items: Item[]; area: Box; textX: number; tail: number } {
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
  const tail = border + pad;
  return { items, area: { x: textX, y: border + pad * 0.6, w: w - textX - tail, h: h - 2 * border - 1.2 * pad }, textX, tail };
}

/** Room left of and right of the text area along the notice (mm), for a notice of height `h`. */
function sideRoom(c: NoticeContent, h: number): number {
  const f = frame(c, 1000, h);
  return f.textX + f.tail;
}

/** Items of a stacked notice: title at the top, regulation at the bottom right, the rest centred between. */
function stackItems(st: Stack, area: Box, tm: TypeMetrics): Item[] {
  const items: Item[] = [];
  const put = (b: Block, y: number) =>
    items.push(...runsForLines(b.lines, { x: area.x, y, w: area.w, h: b.heightMm }, styleOf(b.face, b.sizePt, b.align), b.sizePt, tm));
  // Title and wording kept together, centred in the room above the regulation line.
  const middleH = st.middle.reduce((sum, b) => sum + b.heightMm, 0) + st.gapMm * Math.max(0, st.middle.length - 1);
  const room = area.h - (st.regulationInline ? 0 : st.regulation.heightMm + st.gapMm);
  const groupH = st.title.heightMm + (st.middle.length ? st.gapMm + middleH : 0);
  const titleY = area.y + Math.max(0, (room - groupH) / 2);
  put(st.title, titleY);
  let y = titleY + st.title.heightMm + st.gapMm;
  for (const b of st.middle) {
    put(b, y);
    y += b.heightMm + st.gapMm;
  }
  if (!st.regulationInline) put(st.regulation, area.y + area.h - st.regulation.heightMm);
  else {
    // At the right end of the last line, sharing its bottom edge.
    const bottom = st.middle.length ? y - st.gapMm : titleY + st.title.heightMm;
    put(st.regulation, bottom - st.regulation.heightMm);
  }
  return items;
}

/** The two lines of a notice on thin tape: title and details in bold, wording and regulation below. */
function narrowLines(c: NoticeContent): [string, string] {
  return [[c.title, ...c.details].join(' · '), c.body ? `${c.body} (${c.regulation})` : c.regulation];
}

/** Size (pt) at which one line fills half the text area's height. */
function narrowSize(area: Box, tm: TypeMetrics): number {
  return Math.min(NARROW_MAX_PT, Math.floor((area.h / 2 / ((tm.ascent + tm.descent) * (25.4 / 72))) * 4) / 4);
}

/** Items of a two-line notice; `cut` names any line that had to be cut to fit. */
function narrowItems(c: NoticeContent, area: Box, tm: TypeMetrics): { items: Item[]; cut: string[] } {
  const size = narrowSize(area, tm);
  const items: Item[] = [];
  const cut: string[] = [];
  narrowLines(c).forEach((line, i) => {
    const box: Box = { x: area.x, y: area.y + (i * area.h) / 2, w: area.w, h: area.h / 2 };
    const fit = fitText(line, box, { face: i === 0 ? 'bold' : 'regular', maxPt: size, minPt: Math.min(size, NOTICE_MIN_PT), maxLines: 1, align: 'left' }, tm);
    if (fit.cut) cut.push(line);
    items.push(...fit.runs);
  });
  return { items, cut };
}

/** What would make room, for the refusal message. */
function roomHint(ctx: LayoutContext<'notices'>): string {
  const m = ctx.req.medium;
  if (m.kind === 'tape') {
    const wider = narrowestTapeFor(m.printableMm + 0.1);
    return wider ? `use tape-${wider} or wider, or a sheet` : 'use a sheet or page';
  }
  return m.kind === 'sheet' || m.id.startsWith('custom-') ? 'choose larger labels or a plain A4 or A5 page' : 'choose a larger page';
}

/**
 * The wording could not be set whole at NOTICE_MIN_PT. The isolation wording of the alternative-supply
 * notice (514.15.1) is refused rather than cut; other notices print cut, with the usual warning.
 */
function cannotFit(c: NoticeContent, lines: string[], ctx: LayoutContext<'notices'>): void {
  const name = c.name;
  if (c.kind === 'alternative-supply') {
    throw new LayoutError(
      `The alternative-supply notice (${c.regulation}) cannot show where to isolate every source in type of at least ${NOTICE_MIN_PT} pt on ${ctx.req.medium.id}, and it is never printed cut: ${roomHint(ctx)}`,
      'media',
    );
  }
  for (const line of lines) ctx.warnings.cut(name, line);
}

/** A notice exactly `w × h` (die-cut label): stacked if it fits, else two lines, else cut or refused. */
function fixedNotice(c: NoticeContent, w: number, h: number, ctx: LayoutContext<'notices'>): Item[] {
  const f = frame(c, w, h);
  const st = bestStack(c, f.area.w, f.area.h, ctx.tm, false);
  if (st) return [...f.items, ...stackItems(st, f.area, ctx.tm)];
  const narrow = narrowItems(c, f.area, ctx.tm);
  if (narrow.cut.length || narrowSize(f.area, ctx.tm) < NOTICE_MIN_PT) cannotFit(c, narrow.cut.length ? narrow.cut : narrowLines(c), ctx);
  return [...f.items, ...narrow.items];
}

/**
 * A stack squeezed to the minimum wording size reads worse than the two-line form when that sets
 * larger and fits the tape's length, so thin tape keeps every notice's wording at one size.
 */
function twoLinesReadLarger(c: NoticeContent, scale: number, area: Box, maxTextW: number, tm: TypeMetrics): boolean {
  if (sizesAt(scale).body > NOTICE_MIN_PT + 1e-9) return false;
  const size = narrowSize(area, tm);
  if (size <= NOTICE_MIN_PT) return false;
  const [a, b] = narrowLines(c);
  return Math.max(tm.measure(a, 'bold', size), tm.measure(b, 'regular', size)) <= maxTextW;
}

/** On tape: the shortest length whose wording reads near the largest size the tape allows. */
function tapeNotice(c: NoticeContent, h: number, maxLength: number, ctx: LayoutContext<'notices'>): { w: number; items: Item[] } {
  const room = sideRoom(c, h);
  const area = frame(c, 1000, h).area;
  const longest = bestStack(c, maxLength - room, area.h, ctx.tm, true);
  if (longest && !twoLinesReadLarger(c, longest.scale * TAPE_SCALE_SHARE, area, maxLength - room, ctx.tm)) {
    const target = longest.scale * TAPE_SCALE_SHARE;
    for (let textW = Math.max(20, area.h); textW + room <= maxLength + 1e-6; textW += LENGTH_STEP_MM) {
      const st = bestStack(c, textW, area.h, ctx.tm, true, target);
      if (!st) continue;
      // Trim the length to the longest line actually set.
      const widths = [st.title, ...st.middle, st.regulation].flatMap((b) => b.lines.map((l) => ctx.tm.measure(l, b.face, b.sizePt)));
      if (st.regulationInline) {
        const last = st.middle[st.middle.length - 1] ?? st.title;
        widths.push(
          ctx.tm.measure(last.lines[last.lines.length - 1], last.face, last.sizePt) +
            2 * st.gapMm +
            ctx.tm.measure(c.regulation, 'regular', st.regulation.sizePt),
        );
      }
      const used = Math.max(...widths);
      const w = Math.ceil(used + room + 0.5);
      const f = frame(c, w, h);
      return { w, items: [...f.items, ...stackItems(st, f.area, ctx.tm)] };
    }
  }
  // Too thin to stack: two lines, as long as the longer needs.
  const size = narrowSize(area, ctx.tm);
  if (size < NOTICE_MIN_PT) {
    throw new LayoutError(`${c.name} cannot set its wording in at least ${NOTICE_MIN_PT} pt on ${ctx.req.medium.id}: ${roomHint(ctx)}`, 'media');
  }
  const [a, b] = narrowLines(c);
  const w = Math.min(maxLength, Math.ceil(Math.max(ctx.tm.measure(a, 'bold', size), ctx.tm.measure(b, 'regular', size)) + room + 0.5));
  const f = frame(c, w, h);
  const narrow = narrowItems(c, f.area, ctx.tm);
  if (narrow.cut.length) cannotFit(c, narrow.cut, ctx);
  return { w, items: [...f.items, ...narrow.items] };
}

/** On a plain sheet: the tile size, taller then wider when the wording needs more room to stay legible. */
function sheetNotice(c: NoticeContent, slot: Extract<Slot, { kind: 'free' }>, ctx: LayoutContext<'notices'>): { w: number; h: number; items: Item[] } {
  const size = PAGE_SIZES[c.kind === 'earthing' ? 'earthing' : 'notice'];
  const w0 = Math.min(size.w, slot.maxLengthMm);
  const h0 = Math.min(size.h, slot.heightMm);
  const tries: Array<[number, number]> = [];
  for (let h = h0; h <= slot.heightMm + 1e-6; h += GROW_STEP_MM) tries.push([w0, h]);
  for (let w = w0 + GROW_STEP_MM * 2; w <= slot.maxLengthMm + 1e-6; w += GROW_STEP_MM * 2)
    tries.push([w, Math.min(slot.heightMm, Math.max(h0, tries[tries.length - 1][1]))]);
  let fallback: { w: number; h: number; items: Item[] } | null = null;
  for (const [w, h] of tries) {
    const f = frame(c, w, h);
    const st = bestStack(c, f.area.w, f.area.h, ctx.tm, false);
    if (!st) continue;
    const laid = { w, h, items: [...f.items, ...stackItems(st, f.area, ctx.tm)] };
    if (st.scale >= SHEET_SCALE_MIN - 1e-9) return laid;
    fallback ??= laid;
  }
  if (fallback) return fallback;
  return { w: w0, h: h0, items: fixedNotice(c, w0, h0, ctx) };
}

/** The notice as a piece for the slot. */
function noticePiece(c: NoticeContent, slot: Slot, ctx: LayoutContext<'notices'>): Piece {
  const name = c.name;
  if (slot.kind === 'fixed') return { name, widthMm: slot.widthMm, heightMm: slot.heightMm, items: fixedNotice(c, slot.widthMm, slot.heightMm, ctx) };
  if (ctx.req.medium.kind === 'tape') {
    const t = tapeNotice(c, slot.heightMm, Math.min(TAPE_MAX_LENGTH_MM, slot.maxLengthMm), ctx);
    return { name, widthMm: t.w, heightMm: slot.heightMm, items: t.items };
  }
  const s = sheetNotice(c, slot, ctx);
  return { name, widthMm: s.w, heightMm: s.h, items: s.items };
}

/** The kinds to print: the option's list, else what the board calls for. */
function kindsFor(ctx: LayoutContext<'notices'>): NoticeKind[] {
  if (ctx.options.kinds) return [...new Set(ctx.options.kinds.split(','))] as NoticeKind[];
  return noticesCalledFor(ctx.req.schedule, ctx.options.earthingCount);
}

/** A periodic-inspection notice whose next date has already passed would send the reader to a past date. */
function warnIfOverdue(c: NoticeContent, ctx: LayoutContext<'notices'>): void {
  const due = overdueInspection(ctx.req.board.nextInspectionOn, ctx.req.today);
  if (c.kind !== 'inspection' || !due) return;
  const name = c.name;
  ctx.warnings.add({
    code: 'inspection-overdue',
    label: name,
    message: `${name}: the next inspection was due on ${due}, which has passed. Have the installation inspected and print the notice with the new dates.`,
  });
}

export function layoutNotices(ctx: LayoutContext<'notices'>): LayoutDoc {
  // On a plain sheet the slot is the whole usable page height: a notice starts at its tile size and may grow.
  const slot = slotFor(ctx.req.medium, Infinity);
  const pieces: Piece[] = [];
  for (const kind of kindsFor(ctx)) {
    const content = noticeContent(kind, ctx.req.schedule, ctx.req.board, ctx.req.contractor.noticeWording);
    const copies = kind === 'earthing' ? ctx.options.earthingCount : 1;
    if (copies > 0) warnIfOverdue(content, ctx);
    const piece = copies > 0 ? noticePiece(content, slot, ctx) : null;
    for (let i = 0; i < copies && piece; i++) pieces.push(piece);
  }
  if (pieces.length === 0) ctx.warnings.add({ code: 'nothing-to-print', message: 'No notices chosen' });
  return { title: `${ctx.req.board.code} notices`, pages: placePieces(pieces, ctx.req.medium, ctx.tm), warnings: ctx.warnings.list };
}
