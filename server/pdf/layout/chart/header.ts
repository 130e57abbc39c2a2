/**
 * The chart's header: on the first page the board, the contractor (with logo), the board-page QR
 * code, the supply, inspection dates and what each RCD protects; on later pages one line naming
 * the board so a loose page is never anonymous.
 */
import { rcdGroups, rcdFor, wayText, deviceShortText, hasOwnRcd } from '../../../../shared/schedule/derive.js';
import type { Schedule } from '../../../../shared/schemas/schedule.js';
import { GREY, type Box, type FontFace, type Item, type Color } from '../../model.js';
import { qrItems, qrMinSideMm } from '../../qr.js';
import type { LayoutContext } from '../context.js';
import { printedDate } from '../dates.js';
import { blockHeight, runsForLines, wrapText, type FitStyle } from '../fit.js';
import { imageSize } from '../image-size.js';
import { supplyVoltageShortText } from '../../../../shared/schedule/voltage.js';
import { waysText } from '../../../../shared/rules/index.js';

export interface Line {
  text: string;
  face: FontFace;
  sizePt: number;
  color?: Color;
  maxLines?: number;
}

/**
 * Lines stacked from `y` in a column `w` wide, wrapped; returns the items and where they end.
 * Any page output may use it; `label` names the output in a cut-text warning.
 */
export function stack(
  lines: Line[],
  x: number,
  y: number,
  w: number,
  ctx: Pick<LayoutContext, 'tm' | 'warnings'>,
  align: FitStyle['align'] = 'left',
  label = 'Circuit chart header',
): { items: Item[]; bottom: number } {
  const items: Item[] = [];
  for (const l of lines) {
    const style: FitStyle = { face: l.face, maxPt: l.sizePt, minPt: l.sizePt, lineSpacing: 1.2, align, color: l.color };
    const wrapped = wrapText(l.text, w, l.face, l.sizePt, ctx.tm, l.maxLines ?? 3);
    if (wrapped.cut) ctx.warnings.cut(label, l.text);
    const h = blockHeight(wrapped.lines.length, l.sizePt, style, ctx.tm);
    items.push(...runsForLines(wrapped.lines, { x, y, w, h }, style, l.sizePt, ctx.tm));
    y += h + l.sizePt * 0.12;
  }
  return { items, bottom: y };
}

function supplyText(s: Schedule): string {
  const p = s.board.supply;
  const parts = [
    p.earthing,
    supplyVoltageShortText(s.board.phases, p.nominalVoltage),
    p.ze != null ? `Ze ${p.ze} Ω` : '',
    p.pfcKa != null ? `PFC ${p.pfcKa} kA` : '',
    p.mainSwitchRating != null ? `main switch ${p.mainSwitchRating} A` : '',
    p.tailsCsa != null ? `tails ${p.tailsCsa} mm²` : '',
    p.mainEarthCsa != null ? `main earth ${p.mainEarthCsa} mm²` : '',
    p.mainBondingCsa != null ? `main bonding ${p.mainBondingCsa} mm²` : '',
  ];
  return `Supply: ${parts.filter(Boolean).join(' · ')}`;
}

function datesText(ctx: LayoutContext<'chart'>): string {
  const b = ctx.req.schedule.board;
  const parts = [
    b.installedOn ? `Installed ${printedDate(b.installedOn)}` : '',
    b.lastInspectionOn ? `last inspection ${printedDate(b.lastInspectionOn)}` : 'last inspection not recorded',
    ctx.req.board.nextInspectionOn ? `next inspection due ${printedDate(ctx.req.board.nextInspectionOn)}` : '',
  ]
    .filter(Boolean)
    .join(' · ');
  return parts.charAt(0).toUpperCase() + parts.slice(1);
}

/** "RCD 1 · 63 A 30 mA Type A: ways 1 Kitchen sockets, 2 … and 5 …" (or "way 1 …") per RCD, then RCBOs and unprotected ways. */
export function rcdLines(s: Schedule): string[] {
  const ways = (cs: Schedule['circuits']) => waysText(cs.map((c) => `${wayText(c)} ${c.label}`));
  const lines = rcdGroups(s).map(
    (g) =>
      `${g.name} · ${deviceShortText(g.rcd).replace(/^RCD /, '')}${g.rcd.rcdType ? ` Type ${g.rcd.rcdType}` : ''}: ${g.circuits.length ? ways(g.circuits) : 'protects no recorded way'}`,
  );
  const rcds = rcdFor(s);
  const own = s.circuits.filter((c) => {
    const rcd = c.deviceId ? rcds.get(c.deviceId) : null;
    return rcd != null && hasOwnRcd(rcd);
  });
  if (own.length) lines.push(`RCBOs (own residual-current protection): ${waysText(own.map((c) => wayText(c)))}`);
  const none = s.circuits.filter((c) => !c.deviceId || !rcds.get(c.deviceId));
  if (none.length) lines.push(`No RCD protection: ${waysText(none.map((c) => wayText(c)))}`);
  return lines;
}

/** The contractor's logo, name, phone and e-mail, right-aligned in `box`; page outputs share it. */
export function contractorBlock(ctx: LayoutContext, box: Box, k: number, label?: string): { items: Item[]; bottom: number } {
  const c = ctx.req.contractor;
  const items: Item[] = [];
  let y = box.y;
  const size = c.logo ? imageSize(c.logo.bytes, c.logo.mime) : null;
  if (c.logo && size) {
    const h = 11 * k;
    const w = Math.min(box.w, (h * size.w) / size.h);
    items.push({ kind: 'image', box: { x: box.x + box.w - w, y, w, h: (w * size.h) / size.w }, bytes: c.logo.bytes, mime: c.logo.mime });
    y += (w * size.h) / size.w + 1;
  }
  const lines: Line[] = [
    { text: c.name, face: 'bold', sizePt: 9 * k, maxLines: 2 },
    { text: c.phone, face: 'regular', sizePt: 7.5 * k, maxLines: 1 },
    { text: c.email, face: 'regular', sizePt: 7.5 * k, maxLines: 1 },
  ];
  const text = stack(
    lines.filter((l) => l.text),
    box.x,
    y,
    box.w,
    ctx,
    'right',
    label,
  );
  return { items: [...items, ...text.items], bottom: text.bottom };
}

/** First-page header across `box` (x, y, w); `k` scales type to the page. */
export function firstPageHeader(ctx: LayoutContext<'chart'>, box: Box, k: number): { items: Item[]; bottom: number } {
  const { board, schedule } = ctx.req;
  const items: Item[] = [];
  const qrSide = board.publicEnabled ? Math.max(22 * k, qrMinSideMm(board.publicUrl)) : 0;
  if (qrSide) {
    items.push(...qrItems(board.publicUrl, { x: box.x + box.w - qrSide, y: box.y, w: qrSide, h: qrSide }, 'choose a larger page'));
    items.push(
      ...stack(
        [{ text: 'Board page', face: 'regular', sizePt: 6 * k, color: GREY, maxLines: 1 }],
        box.x + box.w - qrSide,
        box.y + qrSide,
        qrSide,
        ctx,
        'centre',
      ).items,
    );
  }
  const rest = box.w - qrSide - (qrSide ? 4 : 0);
  const contractorW = Math.min(62 * k, rest * 0.4);
  const leftLines: Line[] = [
    { text: 'Circuit chart', face: 'bold', sizePt: 15 * k, maxLines: 1 },
    { text: schedule.board.name, face: 'bold', sizePt: 11 * k, maxLines: 2 },
    { text: schedule.board.location, face: 'regular', sizePt: 8 * k, maxLines: 2 },
    {
      text: `Board ${board.code} · revision ${board.revision} of ${printedDate(board.revisionDate)}`,
      face: 'regular',
      sizePt: 7.5 * k,
      color: GREY,
      maxLines: 1,
    },
  ];
  const left = stack(
    leftLines.filter((l) => l.text),
    box.x,
    box.y,
    rest - contractorW - 3,
    ctx,
  );
  const contractor = contractorBlock(ctx, { x: box.x + rest - contractorW, y: box.y, w: contractorW, h: 30 }, k);
  items.push(...left.items, ...contractor.items);
  const top = Math.max(left.bottom, contractor.bottom, box.y + qrSide + 3 * k) + 2 * k;
  const alt = schedule.board.alternativeSupply.present
    ? [{ text: 'This board has more than one source of supply: isolate every source before work.', face: 'bold' as const, sizePt: 7.5 * k }]
    : [];
  const info = stack(
    [
      { text: supplyText(schedule), face: 'regular', sizePt: 7.5 * k },
      { text: datesText(ctx), face: 'regular', sizePt: 7.5 * k },
      ...alt,
      ...rcdLines(schedule).map((t) => ({ text: t, face: 'regular' as const, sizePt: 7.5 * k, maxLines: 4 })),
    ],
    box.x,
    top,
    box.w,
    ctx,
  );
  items.push({ kind: 'line', from: { x: box.x, y: top - 1 * k }, to: { x: box.x + box.w, y: top - 1 * k }, lineMm: 0.3, color: GREY }, ...info.items);
  return { items, bottom: info.bottom + 2 * k };
}

/** Later pages: one line naming the board. */
export function continuationHeader(ctx: LayoutContext<'chart'>, box: Box, k: number): { items: Item[]; bottom: number } {
  const text = `Circuit chart · ${ctx.req.schedule.board.name} · board ${ctx.req.board.code} (continued)`;
  const s = stack([{ text, face: 'bold', sizePt: 9 * k, maxLines: 1 }], box.x, box.y, box.w, ctx);
  return { items: s.items, bottom: s.bottom + 1.5 * k };
}
