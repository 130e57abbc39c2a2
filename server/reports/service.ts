/**
 * Use-cases for discrepancy reports: a visitor sends one from the board page (stored, then
 * e-mailed to the organisation), members list them and accept or dismiss each.
 */
import type { AppContext } from '../context.js';
import type { Db } from '../db/client.js';
import { invalid, notFound } from '../errors.js';
import { readStoredSchedule } from '../boards/stored.js';
import { wayText } from '../../shared/schedule/derive.js';
import type { Schedule } from '../../shared/schemas/schedule.js';
import { wayNamedIn, type Report, type ReportResolve, type ReportSubmit } from '../../shared/schemas/reports.js';
import { boardWays } from '../../shared/schedule/ways.js';
import { requireMemberBoard } from '../boards/member-board.js';
import { reportMail } from './messages.js';
import * as repo from './repository.js';

/** The way a report names as the board writes it ("4", "4 L2"), or null when none is named. */
const reportedWay = (input: ReportSubmit): string | null => (input.way == null ? null : wayText({ way: input.way, phase: input.phase ?? null }));

/** The report's text as stored: the way it names, if any, leads the message (unless the visitor already began with it). */
function storedMessage(input: ReportSubmit): string {
  const way = reportedWay(input);
  if (way == null) return input.message;
  const begins = new RegExp(`^\\s*way\\s*${way.replace(' ', '\\s*')}\\b`, 'i');
  return begins.test(input.message) ? input.message : `Way ${way}: ${input.message}`;
}

/** A 400 naming the field when the reported way (or that phase of it) is not on the board. */
function checkReportedWay(schedule: Schedule, input: ReportSubmit): void {
  if (input.way == null) return;
  // Spare ways count: the board page lists them, and a visitor may find one is not spare at all.
  const ways = boardWays(schedule).map((w) => (w.kind === 'circuit' ? w.circuit : w.spare));
  if (!ways.some((w) => w.way === input.way)) {
    throw invalid('There is no such way on this board', { way: `No way ${input.way} on this board` });
  }
  if (input.phase != null && !ways.some((w) => w.way === input.way && w.phase === input.phase)) {
    throw invalid('There is no such way on this board', { phase: `No way ${reportedWay(input)} on this board` });
  }
}

async function notifyOrganisation(ctx: AppContext, organisationId: number, to: string[], mail: { subject: string; text: string }): Promise<void> {
  if (!to.length) return;
  try {
    await ctx.mailer.send({ to: to.join(', '), organisationId, ...mail });
  } catch (err) {
    // The report is stored and listed in the app; a mail relay hiccup must not lose it or fail the visitor.
    console.error('Report e-mail not sent:', err);
  }
}

/** What a report needs of the board it is sent from (the board page resolves its token to it). */
export interface ReportedBoard {
  id: number;
  organisationId: number;
  name: string;
  code: string;
  schedule: unknown;
  organisation: { contactEmail: string | null };
}

/**
 * `POST /api/public/boards/:token/reports`, once the board page's token is resolved. A filled
 * honeypot is accepted silently and nothing is stored, so a bot learns nothing from the answer.
 */
export async function submitReport(ctx: AppContext, board: ReportedBoard, input: ReportSubmit): Promise<void> {
  if (input.website) return;
  const schedule = readStoredSchedule(board.schedule);
  checkReportedWay(schedule, input);
  await repo.insertReport(ctx.db, {
    boardId: board.id,
    message: storedMessage(input),
    reporterName: input.name ?? '',
    reporterContact: input.contact ?? '',
  });
  const to = board.organisation.contactEmail ? [board.organisation.contactEmail] : await repo.ownerEmails(ctx.db, board.organisationId);
  await notifyOrganisation(
    ctx,
    board.organisationId,
    to,
    reportMail({
      boardName: board.name,
      boardCode: board.code,
      way: reportedWay(input),
      message: input.message,
      reporterName: input.name ?? '',
      reporterContact: input.contact ?? '',
      reviewUrl: `${ctx.config.publicBaseUrl}/boards/${board.id}/page`,
    }),
  );
}

const toReport = (row: repo.ReportRow): Report => ({
  ...row,
  way: wayNamedIn(row.message),
  resolvedAt: row.resolvedAt ? row.resolvedAt.toISOString() : null,
  createdAt: row.createdAt.toISOString(),
});

const requireBoard = async (db: Db, organisationId: number, boardId: number) => {
  await requireMemberBoard(db, organisationId, boardId);
};

export async function boardReports(db: Db, organisationId: number, boardId: number): Promise<Report[]> {
  await requireBoard(db, organisationId, boardId);
  return (await repo.listReports(db, boardId)).map(toReport);
}

export async function resolveBoardReport(
  db: Db,
  user: { id: number; organisationId: number },
  boardId: number,
  reportId: number,
  input: ReportResolve,
): Promise<Report> {
  await requireBoard(db, user.organisationId, boardId);
  if (!(await repo.resolveReport(db, boardId, reportId, input.status, user.id))) throw notFound('No such report');
  const row = await repo.findReport(db, boardId, reportId);
  if (!row) throw notFound('No such report');
  return toReport(row);
}
