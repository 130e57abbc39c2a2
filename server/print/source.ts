/**
 * Gathers what every print of a board needs, once per request: the stored schedule, the board
 * facts the QR and footer show, the contractor, the rule findings and the printer offset.
 * Renders of several outputs (the pack) share one source.
 */
import type { Db } from '../db/client.js';
import type { ServerConfig } from '../config.js';
import type { BoardMeta, Contractor } from '../pdf/types.js';
import { scheduleSchema, type Schedule } from '../../shared/schemas/schedule.js';
import { nextInspectionDate } from '../../shared/rules/index.js';
import { isoDay } from '../../shared/rules/dates.js';
import { boardPageUrl } from '../../shared/public/board-page.js';
import { invalid, notFound } from '../errors.js';
import { requireBoardSchedule } from '../boards/member-board.js';
import { findRevision } from '../boards/revision-repository.js';
import { findNoticeWording, findOrganisation } from '../organisation/repository.js';
import { findLogo } from '../uploads/repository.js';

export interface PrintSource {
  schedule: Schedule;
  board: BoardMeta;
  contractor: Contractor;
  /** The day the rules judge the board on, in the render thread (findings, maximum Zs); null: not judged (calibration). */
  checkedOn: string | null;
  offset: { xMm: number; yMm: number };
}

async function contractorOf(db: Db, organisationId: number): Promise<{ contractor: Contractor; offset: PrintSource['offset'] }> {
  const [org, logo, notices] = await Promise.all([findOrganisation(db, organisationId), findLogo(db, organisationId), findNoticeWording(db, organisationId)]);
  if (!org) throw notFound('No such organisation');
  // The notice wording is the organisation's, so every one of its boards prints the same words.
  const contractor: Contractor = { name: org.name, phone: org.contactPhone, email: org.contactEmail, noticeWording: notices?.wording ?? {} };
  if (logo && (logo.mime === 'image/png' || logo.mime === 'image/jpeg')) contractor.logo = { bytes: new Uint8Array(logo.data), mime: logo.mime };
  return { contractor, offset: { xMm: org.printOffsetXMm, yMm: org.printOffsetYMm } };
}

/**
 * Loads a board of the caller's organisation for printing; another organisation's board,
 * a deleted board or an unknown id is a 404.
 */
export async function loadPrintSource(db: Db, config: ServerConfig, organisationId: number, boardId: number, today: string): Promise<PrintSource> {
  const row = await requireBoardSchedule(db, organisationId, boardId);
  const [{ contractor, offset }, current] = await Promise.all([contractorOf(db, organisationId), findRevision(db, organisationId, row.id, row.revision)]);
  const schedule = row.schedule;
  const board: BoardMeta = {
    id: row.id,
    code: row.code,
    publicUrl: boardPageUrl(config.publicBaseUrl, row.publicToken),
    publicEnabled: row.publicEnabled,
    revision: row.revision,
    revisionDate: isoDay(new Date(current?.createdAt ?? row.updatedAt)),
    nextInspectionOn: nextInspectionDate(schedule.board),
  };
  return { schedule, board, contractor, checkedOn: today, offset };
}

/**
 * The schedule as it was at an earlier revision, for "changed since". A revision the board
 * never had is the caller's mistake: 400 on the `changedSince` field.
 */
export async function scheduleAtRevision(db: Db, organisationId: number, source: PrintSource, revision: number): Promise<Schedule> {
  if (revision > source.board.revision) {
    throw invalid(`The board is at revision ${source.board.revision}`, {
      changedSince: `No revision ${revision} yet: the board is at revision ${source.board.revision}`,
    });
  }
  const found = await findRevision(db, organisationId, source.board.id, revision);
  if (!found) throw invalid(`Revision ${revision} is not stored`, { changedSince: `Revision ${revision} is not stored for this board` });
  return found.schedule;
}

/**
 * The calibration page checks a printer, not a board: it is printed from the print settings with
 * the organisation's offset, on a stand-in board that carries no one's data.
 */
export async function loadCalibrationSource(db: Db, config: ServerConfig, organisationId: number, today: string): Promise<PrintSource> {
  const { contractor, offset } = await contractorOf(db, organisationId);
  const schedule = scheduleSchema.parse({ board: { name: 'Printer calibration', supply: { earthing: 'TN-C-S' } }, devices: [], circuits: [] });
  const board: BoardMeta = {
    id: 0,
    code: 'CALIBRATION',
    publicUrl: config.publicBaseUrl,
    publicEnabled: false,
    revision: 0,
    revisionDate: today,
    nextInspectionOn: null,
  };
  return { schedule, board, contractor, checkedOn: null, offset };
}
