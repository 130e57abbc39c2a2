/**
 * Data access for the board page and for the members' sharing screen. The public lookup
 * goes by token only and answers nothing for a board whose page is off or that is deleted;
 * the members' lookup always filters by organisation (another organisation's id → null → 404).
 */
import { and, eq, isNull, sql } from 'drizzle-orm';
import type { Db } from '../db/client.js';
import { boardRevisions, boards, files, organisations } from '../db/schema.js';

export interface PublicBoardRow {
  id: number;
  organisationId: number;
  name: string;
  code: string;
  schedule: unknown;
  revision: number;
  revisionDate: Date | null;
  updatedAt: Date;
  organisation: { name: string; contactPhone: string; contactEmail: string };
  hasLogo: boolean;
}

/** One query: the board, its organisation's public contact, the current revision's date and whether a logo exists. */
export async function findPublicBoard(db: Db, token: string): Promise<PublicBoardRow | null> {
  const [row] = await db
    .select({
      id: boards.id,
      organisationId: boards.organisationId,
      boardName: boards.name,
      code: boards.code,
      schedule: boards.schedule,
      revision: boards.revision,
      revisionDate: boardRevisions.createdAt,
      updatedAt: boards.updatedAt,
      name: organisations.name,
      contactPhone: organisations.contactPhone,
      contactEmail: organisations.contactEmail,
      hasLogo: sql<number>`exists(select 1 from ${files} where ${files.organisationId} = ${boards.organisationId} and ${files.kind} = 'logo')`,
    })
    .from(boards)
    .innerJoin(organisations, eq(organisations.id, boards.organisationId))
    .leftJoin(boardRevisions, and(eq(boardRevisions.boardId, boards.id), eq(boardRevisions.number, boards.revision)))
    .where(and(eq(boards.publicToken, token), eq(boards.publicEnabled, true), isNull(boards.deletedAt)))
    .limit(1);
  if (!row) return null;
  const { boardName, name, contactPhone, contactEmail, hasLogo, ...rest } = row;
  return { ...rest, name: boardName, organisation: { name, contactPhone, contactEmail }, hasLogo: Number(hasLogo) === 1 };
}

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
      id: boards.id, organisationId: boards.organisationId, name: boards.name, code: boards.code,
      publicToken: boards.publicToken, publicEnabled: boards.publicEnabled, revision: boards.revision, schedule: boards.schedule,
    })
    .from(boards)
    .where(and(eq(boards.id, boardId), eq(boards.organisationId, organisationId), isNull(boards.deletedAt)))
    .limit(1);
  return row ?? null;
}
