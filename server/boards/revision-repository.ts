/**
 * Data access for board revisions: the full snapshot of every saved version. Reads join the
 * board to filter by organisation, so another organisation's revisions are never found.
 */
import { and, desc, eq } from 'drizzle-orm';
import type { Db } from '../db/client.js';
import { boardRevisions, boards } from '../db/schema.js';
import type { Schedule } from '../../shared/schemas/schedule.js';
import type { RevisionListItem, RevisionSnapshot } from '../../shared/schemas/boards.js';
import { readStoredSchedule } from './stored.js';

export interface NewRevision {
  boardId: number;
  number: number;
  authorId: number | null;
  authorName: string;
  summary: string;
  snapshot: Schedule;
}

export async function insertRevision(db: Db, r: NewRevision): Promise<void> {
  await db.insert(boardRevisions).values(r);
}

/** Newest first; without the snapshots, which can be large. */
export async function listRevisions(db: Db, organisationId: number, boardId: number): Promise<RevisionListItem[]> {
  const rows = await db
    .select({
      number: boardRevisions.number,
      authorName: boardRevisions.authorName,
      createdAt: boardRevisions.createdAt,
      summary: boardRevisions.summary,
    })
    .from(boardRevisions)
    .innerJoin(boards, eq(boards.id, boardRevisions.boardId))
    .where(and(eq(boardRevisions.boardId, boardId), eq(boards.organisationId, organisationId)))
    .orderBy(desc(boardRevisions.number));
  return rows.map((r) => ({ ...r, createdAt: r.createdAt.toISOString() }));
}

export async function findRevision(db: Db, organisationId: number, boardId: number, number: number): Promise<RevisionSnapshot | null> {
  const [row] = await db
    .select({
      number: boardRevisions.number,
      authorName: boardRevisions.authorName,
      createdAt: boardRevisions.createdAt,
      summary: boardRevisions.summary,
      snapshot: boardRevisions.snapshot,
    })
    .from(boardRevisions)
    .innerJoin(boards, eq(boards.id, boardRevisions.boardId))
    .where(and(eq(boardRevisions.boardId, boardId), eq(boardRevisions.number, number), eq(boards.organisationId, organisationId)))
    .limit(1);
  if (!row) return null;
  const { snapshot, ...rest } = row;
  return { ...rest, createdAt: rest.createdAt.toISOString(), schedule: readStoredSchedule(snapshot) };
}
