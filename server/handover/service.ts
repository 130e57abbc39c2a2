/**
 * The handover: the client gets the circuit chart (A4, the same render as a print) and the
 * board page link by e-mail, and the send is recorded on the board. Recorded only once the
 * mail relay has accepted the message.
 */
import type { AppContext } from '../context.js';
import type { CurrentUser } from '../http/context.js';
import { unavailable } from '../errors.js';
import type { Handover, HandoverSend } from '../../shared/schemas/handover.js';
import { printOptionSchemas } from '../../shared/schemas/print.js';
import { loadPrintSource, type PrintSource } from '../print/source.js';
import { renderWith } from '../print/service.js';
import { todayIso as today } from '../http/clock.js';
import { requireMemberBoard } from '../boards/member-board.js';
import { handoverMail } from './messages.js';
import * as repo from './repository.js';

async function chartPdf(ctx: AppContext, user: CurrentUser, source: PrintSource): Promise<Uint8Array> {
  const result = await renderWith(ctx, user, source, { output: 'chart', media: 'a4', options: printOptionSchemas.chart.parse({}), record: false });
  return result.pdf;
}

/** `POST /api/boards/:id/handover`. */
export async function sendHandover(ctx: AppContext, user: CurrentUser, boardId: number, input: HandoverSend): Promise<Handover> {
  const source = await loadPrintSource(ctx.db, ctx.config, user.organisationId, boardId, today());
  const pdf = await chartPdf(ctx, user, source);
  const mail = handoverMail({
    contractor: source.contractor,
    boardName: source.schedule.board.name,
    boardLocation: source.schedule.board.location,
    revision: source.board.revision,
    publicUrl: source.board.publicEnabled ? source.board.publicUrl : null,
    nextInspectionOn: source.board.nextInspectionOn,
    personalMessage: input.message ?? '',
  });
  try {
    await ctx.mailer.send({
      to: input.to,
      organisationId: user.organisationId,
      ...mail,
      attachments: [{ filename: `${source.board.code}-circuit-chart.pdf`, content: Buffer.from(pdf), contentType: 'application/pdf' }],
    });
  } catch (err) {
    console.error('Handover e-mail not sent:', err);
    throw unavailable('The e-mail could not be sent; try again in a moment');
  }
  const id = await repo.insertHandover(ctx.db, { boardId, userId: user.id, toEmail: input.to, revision: source.board.revision });
  return { id, toEmail: input.to, revision: source.board.revision, sentByName: user.name, createdAt: new Date().toISOString() };
}

/** `GET /api/boards/:id/handovers`, newest first. */
export async function boardHandovers(ctx: AppContext, organisationId: number, boardId: number): Promise<Handover[]> {
  await requireMemberBoard(ctx.db, organisationId, boardId);
  const rows = await repo.listHandovers(ctx.db, boardId);
  return rows.map((r) => ({ ...r, createdAt: r.createdAt.toISOString() }));
}
