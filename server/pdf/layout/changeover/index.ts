/**
 * The changeover schedule: the job-file sheet for swapping an old board, on A4 or A5 (portrait or
 * landscape). One row per old way as surveyed (reference, feeds, device and cable, readings as
 * found, action, the new ways it goes to, a verdict), its findings and notes under it, then the
 * survey's own findings and a caution. The table runs over pages with its header row repeated; a
 * way's row and its findings never split.
 */
import { isSurveyFinding } from '../../../../shared/rules/types.js';
import type { Survey } from '../../../../shared/schemas/survey.js';
import { BLACK, GREY, RED, type Box, type Item, type LayoutDoc, type LayoutPage } from '../../model.js';
import { LayoutError } from '../../types.js';
import type { LayoutContext } from '../context.js';
import { stack } from '../chart/header.js';
import type { Paragraph } from '../chart/columns.js';
import { columnRules, columnWidths, measureRow, rowItems, type MeasuredRow, type TableStyle } from '../chart/table.js';
import { changeoverColumns, detailLines, findingsOfWay, worstOf, type ChangeoverColumn, type WayFacts } from './cells.js';
import { cautionBlock, continuationHeader, firstPageHeader, footerLines, LABEL } from './sheet.js';

type Ctx = LayoutContext<'changeover'>;

/** Sheets the schedule is designed for: ISO 216 A4 and A5, either way round. */
const SHEETS = ['a4', 'a5', 'a4-landscape', 'a5-landscape'];
export const NO_SURVEY = 'This board has no survey of an old board: record the old board’s ways in the survey, then print the changeover schedule';

interface Frame {
  w: number;
  h: number;
  k: number;
  content: Box;
  style: TableStyle;
  columns: ChangeoverColumn[];
  widths: number[];
  detailWidths: number[];
  bottom: number;
  headerRow: MeasuredRow;
}

function surveyOf(ctx: Ctx): Survey {
  const survey = ctx.req.schedule.survey;
  if (!survey || survey.ways.length === 0) throw new LayoutError(NO_SURVEY, 'survey');
  const m = ctx.req.medium;
  if (m.kind !== 'page' || !SHEETS.includes(m.id))
    throw new LayoutError('The changeover schedule goes on a sheet: use a4 or a5 (portrait or landscape)', 'media');
  return survey;
}

/** Table cells are set in the condensed faces, as on the chart. */
const condensed = (p: Paragraph): Paragraph => ({ ...p, face: p.face === 'bold' ? 'condensed-bold' : p.face === 'regular' ? 'condensed' : p.face });

function frameFor(ctx: Ctx, survey: Survey): Frame {
  const m = ctx.req.medium as { widthMm: number; heightMm: number };
  const [w, h] = [m.widthMm, m.heightMm];
  const k = Math.min(1.1, Math.max(0.84, Math.sqrt(w / 210)));
  const margin = Math.min(12, Math.max(7, w * 0.05));
  const content: Box = { x: margin, y: margin, w: w - 2 * margin, h: h - 2 * margin };
  const style: TableStyle = { sizePt: 7.5 * k, padMm: 1.1 * k, wayWidthMm: 0, tm: ctx.tm };
  const columns = changeoverColumns.filter((c) => ctx.options.showReadings || !c.readings);
  const widths = withMinimums(
    columnWidths(
      content.w,
      columns.map((c) => c.weight),
      0,
    ),
    columns.map((c) => ctx.tm.measure(c.minWord, 'condensed-bold', style.sizePt) + 2 * style.padMm + 0.3),
  );
  const footerH = stack(footerLines(ctx, survey, k, 99, 99), 0, 0, content.w, ctx).bottom;
  const headerRow = measureRow(
    columns.map((c) => [{ text: c.header, face: 'condensed-bold' }]),
    widths,
    columns.map(() => 3),
    style,
  );
  return {
    w,
    h,
    k,
    content,
    style,
    columns,
    widths,
    detailWidths: [widths[0], content.w - widths[0]],
    bottom: content.y + content.h - footerH - 1.5,
    headerRow,
  };
}

/** Widths raised to their minimums (a verdict never breaks inside "changeover"), the difference taken from the wider columns. */
function withMinimums(widths: number[], mins: number[]): number[] {
  const deficit = widths.reduce((d, w, i) => d + Math.max(0, mins[i] - w), 0);
  const surplus = widths.map((w, i) => Math.max(0, w - mins[i]));
  const spare = surplus.reduce((a, b) => a + b, 0);
  if (deficit <= 0 || spare <= deficit) return widths;
  return widths.map((w, i) => (w < mins[i] ? mins[i] : w - (deficit * surplus[i]) / spare));
}

/** A cursor down the pages: a new page (header, then the table's header row) when a group would reach the footer. */
class Pager {
  readonly pages: Item[][] = [];
  y = 0;
  private rowsOnPage = 0;

  constructor(
    private readonly ctx: Ctx,
    private readonly survey: Survey,
    private readonly facts: WayFacts[],
    private readonly f: Frame,
  ) {}

  private get items(): Item[] {
    return this.pages[this.pages.length - 1];
  }

  newPage(withTable: boolean): void {
    const { f } = this;
    const header = this.pages.length === 0 ? firstPageHeader(this.ctx, this.survey, this.facts, f.content, f.k) : continuationHeader(this.ctx, f.content, f.k);
    this.pages.push([...header.items]);
    this.y = header.bottom;
    this.rowsOnPage = 0;
    if (withTable) this.tableHeader();
  }

  private tableHeader(): void {
    const { f } = this;
    this.items.push(
      ...rowItems(f.headerRow, f.content.x, this.y, f.widths, f.style, false, true),
      ...columnRules(f.content.x, this.y, this.y + f.headerRow.heightMm, f.widths),
    );
    this.y += f.headerRow.heightMm;
  }

  /** One old way: its row with column rules, then its detail row; moved whole to a new page if it would reach the footer. */
  way(row: MeasuredRow, detail: MeasuredRow | null, shade: boolean): void {
    const { f } = this;
    const height = row.heightMm + (detail?.heightMm ?? 0);
    if (this.y + height > f.bottom && this.rowsOnPage > 0) this.newPage(true);
    const x = f.content.x;
    this.items.push(...rowItems(row, x, this.y, f.widths, f.style, shade), ...columnRules(x, this.y, this.y + row.heightMm, f.widths));
    this.y += row.heightMm;
    if (detail) {
      this.items.push(...rowItems(detail, x, this.y, f.detailWidths, f.style, shade));
      this.y += detail.heightMm;
    }
    this.items.push({ kind: 'line', from: { x, y: this.y }, to: { x: x + f.content.w, y: this.y }, lineMm: 0.25, color: GREY });
    this.rowsOnPage++;
  }

  /** A block laid out by `place(y)`, moved to a new page if it overruns. */
  block(place: (y: number) => { items: Item[]; bottom: number }): void {
    let placed = place(this.y);
    if (placed.bottom > this.f.bottom) {
      this.newPage(false);
      placed = place(this.y);
    }
    this.items.push(...placed.items);
    this.y = placed.bottom;
  }
}

function wayFacts(ctx: Ctx, survey: Survey): WayFacts[] {
  return survey.ways.map((way, index) => {
    const findings = findingsOfWay(ctx.req.findings, index);
    return { way, index, survey, findings, worst: worstOf(findings) };
  });
}

/** Survey findings that concern no one old way (the survey as a whole, its junction boxes). */
function otherFindings(ctx: Ctx, count: number): Paragraph[] {
  const own = new Set(Array.from({ length: count }, (_, i) => findingsOfWay(ctx.req.findings, i)).flat());
  return ctx.req.findings
    .filter((f) => isSurveyFinding(f) && !own.has(f))
    .map((f) => ({
      text: f.message,
      face: f.severity === 'error' ? 'bold' : 'regular',
      color: f.severity === 'error' ? RED : f.severity === 'info' ? GREY : BLACK,
    }));
}

/** Names the columns whose text was cut, so the warning points at what to shorten. */
function cutWarning(ctx: Ctx, f: Frame, fact: WayFacts, detailCut: boolean): void {
  const cut = f.columns
    .filter((c, i) => measureRow([c.cell(fact).map(condensed)], [f.widths[i]], [c.maxLines], f.style).cut)
    .map((c) => c.header.toLowerCase());
  if (detailCut) cut.push('findings and notes');
  const label = `Old way ${fact.way.reference} on the ${LABEL.toLowerCase()}`;
  ctx.warnings.add({
    code: 'text-cut',
    label,
    message: `${label}: the ${cut.join(', ')} did not fit and ${cut.length === 1 ? 'was' : 'were'} cut short; a larger or landscape page holds more`,
  });
}

export function layoutChangeover(ctx: Ctx): LayoutDoc {
  const survey = surveyOf(ctx);
  const f = frameFor(ctx, survey);
  const facts = wayFacts(ctx, survey);
  const pager = new Pager(ctx, survey, facts, f);
  pager.newPage(true);
  facts.forEach((fact, i) => {
    const row = measureRow(
      f.columns.map((c) => c.cell(fact).map(condensed)),
      f.widths,
      f.columns.map((c) => c.maxLines),
      f.style,
    );
    const lines = detailLines(fact).map(condensed);
    const detail = lines.length ? measureRow([[], lines], f.detailWidths, [0, 40], f.style) : null;
    if (row.cut || detail?.cut) cutWarning(ctx, f, fact, detail?.cut ?? false);
    pager.way(row, detail, i % 2 === 1);
  });
  const { content, k } = f;
  pager.y += 2 * k;
  const others = otherFindings(ctx, facts.length);
  if (others.length)
    pager.block((y) =>
      stack([{ text: 'Findings on the survey as a whole', face: 'bold', sizePt: 8.5 * k, maxLines: 1 }], content.x, y, content.w, ctx, 'left', LABEL),
    );
  for (const p of others)
    pager.block((y) => stack([{ text: p.text, face: p.face, sizePt: 7 * k, color: p.color, maxLines: 6 }], content.x, y, content.w, ctx, 'left', LABEL));
  pager.y += 1.5 * k;
  pager.block((y) => cautionBlock(ctx, survey, content.x, y, content.w, k));
  const pages: LayoutPage[] = pager.pages.map((items, i) => ({
    widthMm: f.w,
    heightMm: f.h,
    items: [
      ...items,
      { kind: 'line', from: { x: content.x, y: f.bottom + 0.8 }, to: { x: content.x + content.w, y: f.bottom + 0.8 }, lineMm: 0.2, color: GREY },
      ...stack(footerLines(ctx, survey, k, i + 1, pager.pages.length), content.x, f.bottom + 1.5, content.w, ctx, 'left', LABEL).items,
    ],
  }));
  return { title: `${ctx.req.board.code} changeover schedule`, pages, warnings: ctx.warnings.list };
}
