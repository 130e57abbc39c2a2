/**
 * Board writes outside the schedule: soft delete and restore, duplicate, moving to another site,
 * and the public board page switch and token.
 */
import type { Db } from '../db/client.js';
import type { BoardPatch } from '../../shared/schemas/boards.js';
import { conflict } from '../errors.js';
import { newPublicToken } from './codes.js';
import { updateBoardColumns } from './repository.js';
import { requireBoardSchedule, requireLiveBoardState, requireOwnBoardState } from './member-board.js';
import { checkSiteField, createBoardRecord, type Actor } from './writes.js';

/** How long the owner can bring a deleted board back. */
export const RESTORE_DAYS = 30;
const DAY_MS = 24 * 3600 * 1000;

/** Soft delete: the board leaves every list and its public page, and can be restored for 30 days. */
export async function deleteBoard(db: Db, organisationId: number, id: number, now = new Date()): Promise<void> {
  await requireLiveBoardState(db, organisationId, id);
  await updateBoardColumns(db, organisationId, id, { deletedAt: now });
}

export async function restoreBoard(db: Db, organisationId: number, id: number, now = new Date()): Promise<void> {
  const state = await requireOwnBoardState(db, organisationId, id);
  if (!state.deletedAt) throw conflict('This board is not deleted');
  if (now.getTime() - state.deletedAt.getTime() > RESTORE_DAYS * DAY_MS) {
    throw conflict(`This board was deleted more than ${RESTORE_DAYS} days ago and can no longer be restored`);
  }
  await updateBoardColumns(db, organisationId, id, { deletedAt: null });
}

/** A copy with its own code and public token, starting its own history at revision 1. */
export async function duplicateBoard(db: Db, actor: Actor, id: number): Promise<number> {
  const source = await requireBoardSchedule(db, actor.organisationId, id);
  const name = `${source.schedule.board.name.slice(0, 113)} (copy)`;
  const schedule = { ...source.schedule, board: { ...source.schedule.board, name } };
  return createBoardRecord(db, actor, schedule, source.siteId, `Duplicated from ${source.code} revision ${source.revision}`);
}

/** `PATCH /api/boards/:id`: only the site; names and everything else live in the schedule and its revisions. */
export async function patchBoard(db: Db, organisationId: number, id: number, patch: BoardPatch): Promise<void> {
  await requireLiveBoardState(db, organisationId, id);
  if (patch.siteId === undefined) return;
  await checkSiteField(db, organisationId, patch.siteId);
  await updateBoardColumns(db, organisationId, id, { siteId: patch.siteId });
}

export async function setPublicEnabled(db: Db, organisationId: number, id: number, enabled: boolean): Promise<{ publicEnabled: boolean }> {
  await requireLiveBoardState(db, organisationId, id);
  await updateBoardColumns(db, organisationId, id, { publicEnabled: enabled });
  return { publicEnabled: enabled };
}

/** A new token retires the old link at once: every printed QR code for this board stops working. */
export async function rotatePublicToken(db: Db, organisationId: number, id: number): Promise<{ publicToken: string }> {
  await requireLiveBoardState(db, organisationId, id);
  const publicToken = newPublicToken();
  await updateBoardColumns(db, organisationId, id, { publicToken });
  return { publicToken };
}
