/**
 * Use-cases on a board's schedule: create, list, read, save, check. Lifecycle writes (delete,
 * restore, duplicate, public page) are in `lifecycle.ts`; history in `history.ts`; files in `files.ts`.
 */
import type { Db } from '../db/client.js';
import { scheduleSchema, type Schedule, type ScheduleResponse, type ScheduleSave } from '../../shared/schemas/schedule.js';
import type { BoardCreate, BoardListQuery, BoardListResponse, BoardSummary } from '../../shared/schemas/boards.js';
import type { Finding } from '../../shared/rules/types.js';
import { checkSchedule } from '../../shared/rules/index.js';
import { notFound } from '../errors.js';
import { findBoardSummary, listBoards } from './repository.js';
import { requireBoardSchedule } from './member-board.js';
import { checkSiteField, createBoardRecord, saveScheduleAt, type Actor, type SaveOutcome } from './writes.js';
import { buildTemplate, scheduleTemplates } from '../../shared/schedule/templates.js';
import { todayIso } from '../http/clock.js';

/** An empty board: one row of 18 modules and the usual UK supply, for the electrician to fill in. */
function emptySchedule(name: string, location: string): Schedule {
  return scheduleSchema.parse({ board: { name, location, supply: { earthing: 'TN-C-S' } }, devices: [], circuits: [] }); // common practice: TN-C-S (PME) is the usual UK supply
}

/** `POST /api/boards`: from a starting layout when one is named, else empty. */
export async function createBoard(db: Db, actor: Actor, input: BoardCreate): Promise<number> {
  await checkSiteField(db, actor.organisationId, input.siteId);
  const location = input.location ?? '';
  const schedule = input.template ? buildTemplate(input.template, { name: input.name, location }) : emptySchedule(input.name, location);
  const layout = scheduleTemplates.find((t) => t.id === input.template);
  return createBoardRecord(db, actor, schedule, input.siteId ?? null, layout ? `Created from the ${layout.name} layout` : 'Created');
}

export async function listOrganisationBoards(db: Db, organisationId: number, query: BoardListQuery): Promise<BoardListResponse> {
  const { items, total } = await listBoards(db, organisationId, query);
  return { items, total, page: query.page, pageSize: query.pageSize };
}

export async function getBoardSummary(db: Db, organisationId: number, id: number): Promise<BoardSummary> {
  const summary = await findBoardSummary(db, organisationId, id);
  if (!summary) throw notFound('No such board');
  return summary;
}

/** The whole schedule with its revision: one query, whatever the number of circuits. */
export async function getSchedule(db: Db, organisationId: number, id: number): Promise<ScheduleResponse> {
  const row = await requireBoardSchedule(db, organisationId, id);
  return { ...row.schedule, id: row.id, revision: row.revision, updatedAt: row.updatedAt, code: row.code, siteId: row.siteId };
}

/** `PUT /api/boards/:id/schedule` */
export function saveSchedule(db: Db, actor: Actor, id: number, input: ScheduleSave): Promise<SaveOutcome> {
  const { board, devices, circuits, survey, baseRevision } = input;
  // A board without a survey stores no survey key, so its documents read as they did before surveys existed.
  return saveScheduleAt(db, actor, id, baseRevision, { board, devices, circuits, ...(survey ? { survey } : {}) });
}

/** `GET /api/boards/:id/check`: the rule set applied to the saved schedule, today. */
export async function checkBoard(db: Db, organisationId: number, id: number, today = todayIso()): Promise<{ findings: Finding[] }> {
  const row = await requireBoardSchedule(db, organisationId, id);
  return { findings: checkSchedule(row.schedule, { today }) };
}
