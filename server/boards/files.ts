/**
 * Moving boards in and out as files: the board file (our own versioned JSON, validated whole by
 * `boardFileSchema`) and the circuit CSV. A bad file is refused whole and nothing is written.
 */
import { z } from 'zod';
import type { Db } from '../db/client.js';
import { BOARD_FILE_FORMAT, boardFileSchema, type BoardFile } from '../../shared/schemas/schedule.js';
import { invalid } from '../errors.js';
import { requireBoardSchedule } from './member-board.js';
import { circuitsFromCsv, circuitsToCsv } from './circuit-csv.js';
import { surveyToCsv } from './survey-csv.js';
import { checkSchedule } from '../../shared/rules/index.js';
import { todayIso } from '../http/clock.js';
import { checkFeedsBoardIds, checkSiteField, createBoardRecord, saveScheduleAt, type Actor, type SaveOutcome } from './writes.js';

/** `POST /api/boards/import` takes a board file, or `{file, siteId}` to place the new board on a site. */
export const boardImportSchema = z.union([
  z.strictObject({ file: boardFileSchema, siteId: z.number().int().positive().nullable().optional() }),
  boardFileSchema,
]);
export type BoardImport = z.infer<typeof boardImportSchema>;

/**
 * Parses an import body, reporting field paths from the form it resembles: a body with a `file`
 * key is the wrapped form (paths `file.…`), anything else a bare board file.
 */
export function parseBoardImport(body: unknown): BoardImport {
  const wrapped = typeof body === 'object' && body !== null && 'file' in body;
  const file = wrapped ? (body as { file: unknown }).file : body;
  // Anything that is not one of our files is said to be so in plain words, not as a list of schema faults.
  if (typeof file !== 'object' || file === null || Array.isArray(file) || (file as { kind?: unknown }).kind !== 'waymark-board') {
    throw invalid(NOT_A_BOARD_FILE, { [wrapped ? 'file' : 'kind']: NOT_A_BOARD_FILE });
  }
  return wrapped ? boardImportSchema.options[0].parse(body) : boardImportSchema.options[1].parse(body);
}

export const NOT_A_BOARD_FILE = 'This is not a Waymark board file: export one from a board (More → Export board file) and import that';

/** A safe file name from the board code and name: "WM-7K3QX2-main-consumer-unit". */
export function fileBaseName(code: string, name: string): string {
  const slug = name
    .toLowerCase()
    .normalize('NFKD')
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '')
    .slice(0, 60);
  return slug ? `${code}-${slug}` : code;
}

export async function exportBoardFile(db: Db, organisationId: number, id: number, now = new Date()): Promise<{ file: BoardFile; baseName: string }> {
  const row = await requireBoardSchedule(db, organisationId, id);
  const file: BoardFile = { format: BOARD_FILE_FORMAT, kind: 'waymark-board', exportedAt: now.toISOString(), ...row.schedule };
  return { file, baseName: fileBaseName(row.code, row.schedule.board.name) };
}

/** A new board from a board file, at revision 1 with its own code and token. */
export async function importBoardFile(db: Db, actor: Actor, input: BoardImport): Promise<number> {
  const wrapped = 'file' in input;
  const file = wrapped ? input.file : input;
  const siteId = wrapped ? (input.siteId ?? null) : null;
  await checkSiteField(db, actor.organisationId, siteId);
  const schedule = { board: file.board, devices: file.devices, circuits: file.circuits, ...(file.survey ? { survey: file.survey } : {}) };
  await checkFeedsBoardIds(db, actor.organisationId, schedule, null, (i) => `${wrapped ? 'file.' : ''}circuits.${i}.feedsBoardId`);
  return createBoardRecord(db, actor, schedule, siteId, 'Imported from a board file');
}

export async function exportCircuitsCsv(db: Db, organisationId: number, id: number): Promise<{ csv: string; baseName: string }> {
  const row = await requireBoardSchedule(db, organisationId, id);
  return { csv: circuitsToCsv(row.schedule.circuits), baseName: fileBaseName(row.code, row.schedule.board.name) };
}

/** `GET /api/boards/:id/survey.csv`: the old board's survey with today's verdicts; 400 on `survey` when there is none. */
export async function exportSurveyCsv(db: Db, organisationId: number, id: number, today = todayIso()): Promise<{ csv: string; baseName: string }> {
  const row = await requireBoardSchedule(db, organisationId, id);
  const csv = surveyToCsv(row.schedule, checkSchedule(row.schedule, { today }));
  if (csv == null) throw invalid('This board has no survey of an old board', { survey: 'No survey on this board' });
  return { csv, baseName: fileBaseName(row.code, row.schedule.board.name) };
}

/** Replaces the board's circuits with the file's, as one save against `baseRevision` (so stale is 409 as ever). */
export async function importCircuitsCsv(db: Db, actor: Actor, id: number, csv: string, baseRevision: number): Promise<SaveOutcome> {
  const row = await requireBoardSchedule(db, actor.organisationId, id);
  if (row.revision !== baseRevision) return { status: 'stale', revision: row.revision };
  const result = circuitsFromCsv(csv, row.schedule.circuits);
  if (!result.ok) throw invalid('The file has errors; nothing was imported', result.fields);
  const schedule = { ...row.schedule, circuits: result.circuits };
  await checkFeedsBoardIds(db, actor.organisationId, schedule, id, (i) => `rows.${result.rowOf[i]}.feeds_board_id`);
  return saveScheduleAt(db, actor, id, baseRevision, schedule);
}
