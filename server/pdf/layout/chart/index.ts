/**
 * The circuit chart (BS 7671 514.9.1) on A4, A5, landscape or a custom board-door size: header,
 * the way table running over as many pages as it needs with its header row repeated, the
 * findings, and on every page the caution, the revision and the page number.
 */
import { isSurveyFinding } from '../../../../shared/rules/types.js';
import { wayText } from '../../../../shared/schedule/derive.js';
import { boardWays } from '../../../../shared/schedule/ways.js';
import { waysText } from '../../../../shared/rules/index.js';
import { BLACK, GREY, RED, type Box, type LayoutDoc, type LayoutPage } from '../../model.js';
import { LayoutError } from '../../types.js';
import type { LayoutContext } from '../context.js';
import { overdueInspection, printedDate } from '../dates.js';
import { chartColumns, chartFacts, spareRow, type Paragraph } from './columns.js';
import { stack, type Line } from './header.js';
import { ChartPager, type ChartFrame } from './pages.js';
import { columnWidths, measureRow, type TableStyle } from './table.js';

/** Smallest page a legible chart fits (mm). */
const MIN_PAGE_MM = 120;
export const CHART_CAUTION =
  'Caution: isolate the supply and prove dead before working on this board. Electrical work is for competent persons only, following BS 7671 and local regulations.';

function pageSize(ctx: LayoutContext<'chart'>): { w: number; h: number } {
  const m = ctx.req.medium;
  if (m.kind !== 'page') throw new LayoutError('The circuit chart goes on a page: choose A4, A5, a landscape size or custom-<w>x<h>', 'media');
  if (m.widthMm < MIN_PAGE_MM || m.heightMm < MIN_PAGE_MM)
    throw new LayoutError(`The circuit chart needs a page at least ${MIN_PAGE_MM} × ${MIN_PAGE_MM} mm`, 'media');
  return { w: m.widthMm, h: m.heightMm };
}

function footerLines(ctx: LayoutContext<'chart'>, k: number, page: number, pages: number): Line[] {
  const b = ctx.req.board;
  const meta = `${ctx.req.schedule.board.name} · board ${b.code} · revision ${b.revision} of ${printedDate(b.revisionDate)} · ${ctx.req.contractor.name} · page ${page} of ${pages}`;
  return [
    { text: CHART_CAUTION, face: 'bold', sizePt: 6.5 * k, maxLines: 2 },
    { text: meta, face: 'regular', sizePt: 6 * k, color: GREY, maxLines: 1 },
  ];
}

function findingParagraphs(ctx: LayoutContext<'chart'>): Paragraph[] {
  if (!ctx.options.showFindings) return [];
  // The survey's findings are about the old board: they go on the changeover sheet, not this board's chart.
  const findings = ctx.req.findings.filter((f) => !isSurveyFinding(f));
  if (findings.length === 0) return [{ text: 'None from the wiring-rule checks.', face: 'regular' }];
  const word = { error: 'Must fix', warning: 'Check', info: 'Note' } as const;
  return findings.map((f) => ({
    text: `${word[f.severity]} · ${f.ways.length ? `${waysText(f.ways)} · ` : ''}${f.rule}: ${f.message}`,
    face: f.severity === 'info' ? 'regular' : 'bold',
    color: f.severity === 'error' ? RED : BLACK,
  }));
}

/** Table cells are set in the condensed faces: narrow columns keep more of each description on a line. */
function condensed(p: Paragraph): Paragraph {
  return { ...p, face: p.face === 'bold' ? 'condensed-bold' : p.face === 'regular' ? 'condensed' : p.face };
}

function chartFrame(ctx: LayoutContext<'chart'>): ChartFrame {
  const { w, h } = pageSize(ctx);
  const k = Math.min(1.15, Math.max(0.82, Math.sqrt(w / 210)));
  const margin = Math.min(12, Math.max(7, w * 0.05));
  const content: Box = { x: margin, y: margin, w: w - 2 * margin, h: h - 2 * margin };
  const style: TableStyle = { sizePt: 7.5 * k, padMm: 1.1 * k, wayWidthMm: 9 * k, tm: ctx.tm };
  const widths = columnWidths(
    content.w,
    chartColumns.map((c) => c.weight),
    style.wayWidthMm,
  );
  const footerH = stack(footerLines(ctx, k, 99, 99), 0, 0, content.w, ctx).bottom;
  const headerRow = measureRow(
    chartColumns.map((c) => [{ text: c.header, face: 'condensed-bold' }]),
    widths,
    chartColumns.map(() => 3),
    style,
  );
  return { w, h, k, content, style, widths, bottom: content.y + content.h - footerH - 1.5, headerRow };
}

function notes(ctx: LayoutContext<'chart'>, k: number): Line[] {
  return [
    {
      text: 'Max Zs: the highest earth fault loop impedance at which the circuit’s device still disconnects in time (BS 7671 Chapter 41). Zs: as measured; “over max” marks a reading above the maximum.',
      face: 'regular',
      sizePt: 6 * k,
      color: GREY,
    },
    ...(ctx.options.showFindings ? [{ text: `Findings at revision ${ctx.req.board.revision}`, face: 'bold' as const, sizePt: 8.5 * k, maxLines: 1 }] : []),
    ...findingParagraphs(ctx).map((p): Line => ({ text: p.text, face: p.face, sizePt: 7 * k, color: p.color, maxLines: 6 })),
  ];
}

export function layoutChart(ctx: LayoutContext<'chart'>): LayoutDoc {
  const frame = chartFrame(ctx);
  const { content, k } = frame;
  const facts = chartFacts(ctx.req.schedule, ctx.req.maxZsByCircuit);
  const maxLines = chartColumns.map((c) => c.maxLines);
  const pager = new ChartPager(ctx, frame);
  pager.newPage(true);
  boardWays(ctx.req.schedule).forEach((w, i) => {
    const cells = w.kind === 'circuit' ? chartColumns.map((col) => col.cell(w.circuit, facts)) : spareRow(w.spare, facts);
    const row = measureRow(
      cells.map((cell) => cell.map(condensed)),
      frame.widths,
      maxLines,
      frame.style,
    );
    if (row.cut && w.kind === 'circuit') ctx.warnings.cut(`Way ${wayText(w.circuit)} on the chart`, w.circuit.description || w.circuit.label);
    pager.row(row, i % 2 === 1);
  });
  pager.endTable();
  pager.y += 1.5 * k;
  for (const line of notes(ctx, k)) pager.block((y) => stack([line], content.x, y, content.w, ctx));
  const pages: LayoutPage[] = pager.pages.map((items, i) => ({
    widthMm: frame.w,
    heightMm: frame.h,
    items: [
      ...items,
      { kind: 'line', from: { x: content.x, y: frame.bottom + 0.8 }, to: { x: content.x + content.w, y: frame.bottom + 0.8 }, lineMm: 0.2, color: GREY },
      ...stack(footerLines(ctx, k, i + 1, pager.pages.length), content.x, frame.bottom + 1.5, content.w, ctx).items,
    ],
  }));
  const due = overdueInspection(ctx.req.board.nextInspectionOn, ctx.req.today);
  if (due) {
    const label = 'Circuit chart';
    ctx.warnings.add({
      code: 'inspection-overdue',
      label,
      message: `${label}: the next inspection was due on ${due}, which has passed. Have the installation inspected and print the chart with the new dates.`,
    });
  }
  return { title: `${ctx.req.board.code} circuit chart`, pages, warnings: ctx.warnings.list };
}
