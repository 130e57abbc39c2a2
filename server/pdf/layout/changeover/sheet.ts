/**
 * The changeover schedule's page furniture: the first-page header (board, contractor, the old
 * board as surveyed, Ze, junction boxes, a count of verdicts), the one-line header of later pages,
 * the footer on every page and the caution block that ends the schedule.
 */
import { BLACK, GREY, type Box, type Item } from '../../model.js';
import type { LayoutContext } from '../context.js';
import { printedDate } from '../dates.js';
import { contractorBlock, stack, type Line } from '../chart/header.js';
import { ohms } from '../chart/columns.js';
import type { Survey } from '../../../../shared/schemas/survey.js';
import type { WayFacts } from './cells.js';

export const LABEL = 'Changeover schedule';
type Ctx = LayoutContext<'changeover'>;
type Placed = { items: Item[]; bottom: number };

/** "24 Nov 2026", or a plain "date not recorded". */
export const surveyDate = (s: Survey) => printedDate(s.surveyedOn) ?? 'an unrecorded date';

function summary(facts: WayFacts[]): string {
  const fix = facts.filter((f) => f.worst === 'error').length;
  const check = facts.filter((f) => f.worst === 'warning').length;
  const parts = [fix ? `${fix} to fix before the changeover` : '', check ? `${check} to check` : '', `${facts.length - fix - check} OK`].filter(Boolean);
  return `${facts.length} old way${facts.length === 1 ? '' : 's'}: ${parts.join(', ')}`;
}

function surveyLines(ctx: Ctx, survey: Survey, facts: WayFacts[], k: number): Line[] {
  const boxes = survey.junctionBoxes.map((b) => `${b.name}${b.location ? ` ${b.location}` : ''}`).join('; ');
  const found = [`Surveyed on ${surveyDate(survey)}`, survey.ze != null ? `Ze ${ohms(survey.ze)} Ω at the old board` : 'Ze not recorded'].join(' · ');
  const line = (text: string, extra: Partial<Line> = {}): Line => ({ text, face: 'regular', sizePt: 7.5 * k, maxLines: 3, ...extra });
  return [
    line(`Old board: ${survey.oldBoard || 'not described'}`, { face: 'bold' }),
    line(found),
    ...(boxes ? [line(`Junction boxes: ${boxes}`)] : []),
    ...(survey.notes ? [line(`Survey notes: ${survey.notes}`, { maxLines: 4 })] : []),
    line(summary(facts), { face: 'bold', maxLines: 2 }),
    ...(ctx.req.schedule.board.alternativeSupply.present
      ? [line('This board has more than one source of supply: isolate every source before work.', { face: 'bold' })]
      : []),
  ];
}

/** First-page header across `box`; `k` scales type to the page. */
export function firstPageHeader(ctx: Ctx, survey: Survey, facts: WayFacts[], box: Box, k: number): Placed {
  const { board, schedule } = ctx.req;
  const contractorW = Math.min(62 * k, box.w * 0.36);
  const left = stack(
    [
      { text: LABEL, face: 'bold', sizePt: 15 * k, maxLines: 1 },
      { text: schedule.board.name, face: 'bold', sizePt: 11 * k, maxLines: 2 },
      { text: schedule.board.location, face: 'regular', sizePt: 8 * k, maxLines: 2 },
      {
        text: `Board ${board.code} · revision ${board.revision} of ${printedDate(board.revisionDate)}`,
        face: 'regular',
        sizePt: 7.5 * k,
        color: GREY,
        maxLines: 1,
      },
    ].filter((l) => l.text) as Line[],
    box.x,
    box.y,
    box.w - contractorW - 3,
    ctx,
    'left',
    LABEL,
  );
  const contractor = contractorBlock(ctx, { x: box.x + box.w - contractorW, y: box.y, w: contractorW, h: 30 }, k, LABEL);
  const top = Math.max(left.bottom, contractor.bottom) + 2 * k;
  const info = stack(surveyLines(ctx, survey, facts, k), box.x, top, box.w, ctx, 'left', LABEL);
  const rule: Item = { kind: 'line', from: { x: box.x, y: top - 1 * k }, to: { x: box.x + box.w, y: top - 1 * k }, lineMm: 0.3, color: GREY };
  return { items: [...left.items, ...contractor.items, rule, ...info.items], bottom: info.bottom + 2 * k };
}

/** Later pages: one line naming the board, so a loose page is never anonymous. */
export function continuationHeader(ctx: Ctx, box: Box, k: number): Placed {
  const text = `${LABEL} · ${ctx.req.schedule.board.name} · board ${ctx.req.board.code} (continued)`;
  const s = stack([{ text, face: 'bold', sizePt: 9 * k, maxLines: 1 }], box.x, box.y, box.w, ctx, 'left', LABEL);
  return { items: s.items, bottom: s.bottom + 1.5 * k };
}

/** The footer: a short caution and the board, revision, contractor and page. */
export function footerLines(ctx: Ctx, survey: Survey, k: number, page: number, pages: number): Line[] {
  const b = ctx.req.board;
  const meta = `${LABEL} · ${ctx.req.schedule.board.name} · board ${b.code} · revision ${b.revision} of ${printedDate(b.revisionDate)} · ${ctx.req.contractor.name} · page ${page} of ${pages}`;
  return [
    {
      text: `Isolate and prove dead before work. Readings are as found on the old board on ${surveyDate(survey)}: take them again after the changeover.`,
      face: 'bold',
      sizePt: 6.5 * k,
      maxLines: 2,
    },
    { text: meta, face: 'regular', sizePt: 6 * k, color: GREY, maxLines: 2 },
  ];
}

/** The caution that ends the schedule, in a ruled box. */
export function cautionBlock(ctx: Ctx, survey: Survey, x: number, y: number, w: number, k: number): Placed {
  const pad = 2 * k;
  const size = 7.5 * k;
  const body = (text: string): Line => ({ text, face: 'regular', sizePt: size, maxLines: 4 });
  const text = stack(
    [
      { text: 'Caution: before, during and after the changeover', face: 'bold', sizePt: 9 * k, maxLines: 2 },
      body(
        'Isolate the supply and prove dead with a tester proved on a known source before any work, on the old board and the new. Lock off the means of isolation and keep the key, so no one can switch it back on.',
      ),
      body(
        `The readings in this schedule were taken on the old board as found on ${surveyDate(survey)}. They describe the old installation only: test every circuit again on the new board after the changeover, before it is put into service.`,
      ),
      body(
        'Follow BS 7671 and the local codes that apply; the work is for competent persons, licensed where the law asks it. The findings help and do not replace the judgement of the designer and the inspector.',
      ),
    ],
    x + pad,
    y + pad,
    w - 2 * pad,
    ctx,
    'left',
    LABEL,
  );
  const box: Item = { kind: 'rect', box: { x, y, w, h: text.bottom - y + pad * 0.5 }, stroke: BLACK, lineMm: 0.4 };
  return { items: [box, ...text.items], bottom: text.bottom + pad * 0.5 };
}
