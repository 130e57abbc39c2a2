/**
 * "A live board of the member's organisation": the lookup every board-scoped use-case starts with
 * (print, uploads, reports, handover, sharing). Another organisation's id is the same 404 as an unknown one.
 */
import { and, eq, isNull } from 'drizzle-orm';
import type { Db } from '../db/client.js';
import { boards } from '../db/schema.js';
import { notFound } from '../errors.js';
import { findBoardSchedule, findBoardState, type BoardScheduleRow } from './repository.js';

export interface MemberBoardRow {
  id: number;
  organisationId: number;
  name: string;
  code: string;
  publicToken: string;
  publicEnabled: boolean;
  revision: number;
  schedule: unknown;
}

/** A live board of the member's organisation, or null (unknown, deleted or another organisation's). */
export async function findMemberBoard(db: Db, organisationId: number, boardId: number): Promise<MemberBoardRow | null> {
  const [row] = await db
    .select({
      id: boards.id,
      organisationId: boards.organisationId,
      name: boards.name,
      code: boards.code,
      publicToken: boards.publicToken,
      publicEnabled: boards.publicEnabled,
      revision: boards.revision,
      schedule: boards.schedule,
    })
    .from(boards)
    .where(and(eq(boards.id, boardId), eq(boards.organisationId, organisationId), isNull(boards.deletedAt)))
    .limit(1);
  return row ?? null;
}

/** The board, or a 404 "No such board" for an unknown, deleted or another organisation's id. */
export async function requireMemberBoard(db: Db, organisationId: number, boardId: number): Promise<MemberBoardRow> {
  const board = await findMemberBoard(db, organisationId, boardId);
  if (!board) throw notFound('No such board');
  return board;
}

/** The live board with its whole schedule, or the same 404 as {@link requireMemberBoard}. */
export async function requireBoardSchedule(db: Db, organisationId: number, boardId: number): Promise<BoardScheduleRow> {
  const row = await findBoardSchedule(db, organisationId, boardId);
  if (!row) throw notFound('No such board');
  return row;
}

/** Id, revision and code of a live (not deleted) board, or the same 404. */
export async function requireLiveBoardState(db: Db, organisationId: number, boardId: number) {
  const state = await findBoardState(db, organisationId, boardId);
  if (!state || state.deletedAt) throw notFound('No such board');
  return state;
}

/** The board's state even when deleted (print history stays readable), or the same 404 for another organisation's id. */
export async function requireOwnBoardState(db: Db, organisationId: number, boardId: number) {
  const state = await findBoardState(db, organisationId, boardId);
  if (!state) throw notFound('No such board');
  return state;
}
