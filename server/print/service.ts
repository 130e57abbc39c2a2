/**
 * Print use-cases: one output as a PDF, its warnings alone, the whole pack as a ZIP, the print
 * history and the printer offset. The engine (`server/pdf`) lays out and draws; this layer
 * finds the board, resolves the medium, works out "changed since" and records prints.
 */
import type { AppContext } from '../context.js';
import type { CurrentUser } from '../http/context.js';
import type { Medium, RenderResult } from '../pdf/types.js';
import { LayoutError } from '../pdf/types.js';
import { resolveMedium, type TapeSettings } from '../pdf/index.js';
import { printOptionSchemas, type MediaId, type PrintOptions, type PrintWarning } from '../../shared/schemas/print.js';
import type { PrintOffsetSave, PrintOffsetState, PrintRecord } from '../../shared/schemas/print-records.js';
import { flagWorkProblem } from '../pdf/layout/work.js';
import { waysChangedBetween } from '../../shared/schedule/diff.js';
import { AppError, invalid, notFound, stale } from '../errors.js';
import { NO_SURVEY } from '../pdf/layout/changeover/index.js';
import { getLayout } from '../sheet-layouts/service.js';
import { loadCalibrationSource, loadPrintSource, scheduleAtRevision, type PrintSource } from './source.js';
import { sheetLayoutId, type PrintQuery } from './query.js';
import * as repo from './repository.js';
import { todayIso as today } from '../http/clock.js';
import { requireOwnBoardState } from '../boards/member-board.js';
import { findOrganisation, updatePrintOffsetIfAt } from '../organisation/repository.js';
import { runRenderJob } from './workers/pool.js';
import { withinOrganisationShare } from './workers/fair-share.js';
import type { PrintJobRequest } from './workers/jobs.js';

export interface PrintedPdf extends RenderResult {
  filename: string;
}

/** A layout the engine cannot make (e.g. a QR too small on this tape): the message says what would work. */
function cannotLayOut(err: LayoutError): AppError {
  return new AppError(422, 'cannot_lay_out', err.message, { [err.field ?? 'media']: err.message });
}

/** Runs engine work; a layout the medium cannot take becomes 422 with the field to change. */
export async function engine<T>(work: () => Promise<T> | T): Promise<T> {
  try {
    return await work();
  } catch (err) {
    if (err instanceof LayoutError) throw cannotLayOut(err);
    throw err;
  }
}

/** `sheet-<id>` must be one of the caller's organisation's layouts (another's id is a 404). */
async function mediumFor(ctx: AppContext, organisationId: number, media: MediaId, tape: TapeSettings = {}): Promise<Medium> {
  const layoutId = sheetLayoutId(media);
  if (layoutId === null) return engine(() => resolveMedium(media, undefined, tape));
  const layout = await getLayout(ctx.db, organisationId, layoutId);
  const { id: _id, ...sheet } = layout;
  return engine(() => resolveMedium(media, { [String(layoutId)]: sheet }));
}

/** Way numbers to print for "changed since", or undefined for all of them. */
async function onlyWaysFor(ctx: AppContext, organisationId: number, source: PrintSource, query: PrintQuery): Promise<number[] | undefined> {
  const since = (query.options as { changedSince?: number }).changedSince;
  if (since === undefined || (query.output !== 'flags' && query.output !== 'way-labels')) return undefined;
  const before = await scheduleAtRevision(ctx.db, organisationId, source, since);
  const ways = waysChangedBetween(before, source.schedule);
  if (!ways.length) {
    throw new AppError(422, 'nothing_changed', `No way's label changed since revision ${since}: nothing to print`, {
      changedSince: `Nothing changed since revision ${since}`,
    });
  }
  return ways;
}

/**
 * The engine's request for one output of a loaded board, after the work limit is checked. `tape` is a
 * printer profile's printable bands and end margin (the images route); the PDF uses the usual ones.
 */
export async function renderRequestFor(
  ctx: AppContext,
  user: CurrentUser,
  source: PrintSource,
  query: PrintQuery,
  tape: TapeSettings = {},
): Promise<PrintJobRequest> {
  // A changeover schedule of a board with no survey is the caller's mistake, not a layout the medium cannot take.
  if (query.output === 'changeover' && !source.schedule.survey?.ways.length) throw invalid(NO_SURVEY, { survey: NO_SURVEY });
  const medium = await mediumFor(ctx, user.organisationId, query.media, tape);
  const onlyWays = await onlyWaysFor(ctx, user.organisationId, source, query);
  if (query.output === 'flags') {
    const problem = flagWorkProblem(source.schedule, query.options as PrintOptions['flags'], onlyWays);
    if (problem) throw new AppError(422, 'too_much_work', problem, { legs: problem });
  }
  return {
    output: query.output,
    medium,
    options: query.options,
    schedule: source.schedule,
    board: source.board,
    contractor: source.contractor,
    checkedOn: source.checkedOn,
    offset: source.offset,
    onlyWays,
    today: today(),
  };
}

/** Renders one output of a loaded board (the pack renders several from one source). */
export async function renderWith(ctx: AppContext, user: CurrentUser, source: PrintSource, query: PrintQuery): Promise<RenderResult> {
  const request = await renderRequestFor(ctx, user, source, query);
  return engine(() => withinOrganisationShare(user.organisationId, () => runRenderJob({ kind: 'pdf', request }, ctx.config.printTimeLimitMs)));
}

/** The history row for one printed file. */
export const printRecordFor = (user: CurrentUser, source: PrintSource, output: string, media: string): repo.NewPrintRecord => ({
  boardId: source.board.id,
  userId: user.id,
  userName: user.name,
  output,
  media,
  revision: source.board.revision,
});

/** One output as a PDF; recorded in the history when the query asks (`record=1`). */
export async function printPdf(ctx: AppContext, user: CurrentUser, boardId: number, query: PrintQuery): Promise<PrintedPdf> {
  const source = await loadPrintSource(ctx.db, ctx.config, user.organisationId, boardId, today());
  const result = await renderWith(ctx, user, source, query);
  if (query.record) await repo.insertPrints(ctx.db, [printRecordFor(user, source, query.output, query.media)]);
  return { ...result, filename: `${source.board.code}-${query.output}-${query.media}.pdf` };
}

/** The calibration page with the organisation's offset, from the print settings (no board, so not recorded). */
export async function printCalibration(ctx: AppContext, user: CurrentUser, media: MediaId): Promise<PrintedPdf> {
  const source = await loadCalibrationSource(ctx.db, ctx.config, user.organisationId, today());
  const options = printOptionSchemas.calibration.parse({});
  const result = await renderWith(ctx, user, source, { output: 'calibration', media, options, record: false });
  return { ...result, filename: `calibration-${media}.pdf` };
}

/**
 * What a print would warn about, for the print page's list (never recorded). Laid out only, never
 * drawn: the list is asked for at every change of an option, and drawing is most of a print's cost.
 */
export async function checkPrint(
  ctx: AppContext,
  user: CurrentUser,
  boardId: number,
  query: PrintQuery,
): Promise<{ warnings: PrintWarning[]; pageCount: number }> {
  const source = await loadPrintSource(ctx.db, ctx.config, user.organisationId, boardId, today());
  const request = await renderRequestFor(ctx, user, source, query);
  return engine(() => withinOrganisationShare(user.organisationId, () => runRenderJob({ kind: 'check', request }, ctx.config.printTimeLimitMs)));
}

export async function printHistory(ctx: AppContext, user: CurrentUser, boardId: number): Promise<PrintRecord[]> {
  // Deleted boards keep their print history readable, so this asks only whose board it is.
  await requireOwnBoardState(ctx.db, user.organisationId, boardId);
  const rows = await repo.listPrints(ctx.db, boardId);
  return rows.map((r) => ({ ...r, createdAt: r.createdAt.toISOString() }));
}

/** The offset with the organisation's revision, which a change of the offset sends back as `baseRevision`. */
export async function printOffset(ctx: AppContext, user: CurrentUser): Promise<PrintOffsetState> {
  const org = await findOrganisation(ctx.db, user.organisationId);
  if (!org) throw notFound('No such organisation');
  return { xMm: org.printOffsetXMm, yMm: org.printOffsetYMm, revision: org.revision };
}

/**
 * The offset lives on the organisation's row, so it is written against the organisation's revision and bumps it,
 * like the settings: a stale offset (or one racing a settings save that also sent offsets) is 409, never a silent overwrite.
 */
export async function setPrintOffset(ctx: AppContext, user: CurrentUser, save: PrintOffsetSave): Promise<PrintOffsetState> {
  const won = await updatePrintOffsetIfAt(ctx.db, user.organisationId, save.baseRevision, save.xMm, save.yMm);
  const now = await printOffset(ctx, user);
  if (!won) throw stale('organisation', now.revision);
  return now;
}
