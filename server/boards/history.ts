/**
 * A board's history: its revisions, one revision's snapshot, and the differences between two.
 */
import type { Db } from '../db/client.js';
import type { DiffResponse, RevisionListItem, RevisionSnapshot } from '../../shared/schemas/boards.js';
import { diffSchedules } from '../../shared/schedule/diff.js';
import { notFound } from '../errors.js';
import { requireLiveBoardState } from './member-board.js';
import { findRevision, listRevisions } from './revision-repository.js';

export async function boardRevisions(db: Db, organisationId: number, boardId: number): Promise<{ items: RevisionListItem[] }> {
  await requireLiveBoardState(db, organisationId, boardId);
  return { items: await listRevisions(db, organisationId, boardId) };
}

export async function boardRevision(db: Db, organisationId: number, boardId: number, number: number): Promise<RevisionSnapshot> {
  await requireLiveBoardState(db, organisationId, boardId);
  const revision = await findRevision(db, organisationId, boardId, number);
  if (!revision) throw notFound(`No revision ${number} of this board`);
  return revision;
}

/** What changed from revision `from` to revision `to` (either order; `from` later than `to` reads backwards). */
export async function diffRevisions(db: Db, organisationId: number, boardId: number, from: number, to: number): Promise<DiffResponse> {
  const a = await boardRevision(db, organisationId, boardId, from);
  const b = await boardRevision(db, organisationId, boardId, to);
  const { changes, summary } = diffSchedules(a.schedule, b.schedule);
  return { from, to, changes, summary };
}
