/**
 * Data access for boards. Every read and write filters by organisation: another organisation's
 * board id finds nothing, and the use-case answers 404. The schedule is one JSON document, so a
 * board read is one query whatever the number of circuits.
 */
import { and, count, desc, eq, inArray, isNotNull, isNull, like, or, sql, type SQL } from 'drizzle-orm';
import type { Db } from '../db/client.js';
import { boards, sites } from '../db/schema.js';
import type { Schedule } from '../../shared/schemas/schedule.js';
import type { BoardListItem, BoardListQuery, BoardSummary } from '../../shared/schemas/boards.js';
import { likeContains, readStoredSchedule } from './stored.js';
import { openReportsColumn } from '../reports/repository.js';

const circuitCount = sql<number>`JSON_LENGTH(${boards.schedule}, '$.circuits')`;
const openReports = openReportsColumn;
const iso = (d: Date) => d.toISOString();

export interface BoardScheduleRow {
  id: number;
  code: string;
  siteId: number | null;
  revision: number;
  updatedAt: string;
  schedule: Schedule;
  /** The board page's token and whether the page is on: the printed QR code's link. */
  publicToken: string;
  publicEnabled: boolean;
}

/** The board and its whole schedule in one query (not deleted). */
export async function findBoardSchedule(db: Db, organisationId: number, id: number): Promise<BoardScheduleRow | null> {
  const [row] = await db
    .select({
      id: boards.id,
      code: boards.code,
      siteId: boards.siteId,
      revision: boards.revision,
      updatedAt: boards.updatedAt,
      schedule: boards.schedule,
      publicToken: boards.publicToken,
      publicEnabled: boards.publicEnabled,
    })
    .from(boards)
    .where(and(eq(boards.id, id), eq(boards.organisationId, organisationId), isNull(boards.deletedAt)))
    .limit(1);
  return row ? { ...row, updatedAt: iso(row.updatedAt), schedule: readStoredSchedule(row.schedule) } : null;
}

/** Id, revision and deletion time: enough for the writes that do not touch the schedule. */
export async function findBoardState(db: Db, organisationId: number, id: number) {
  const [row] = await db
    .select({ id: boards.id, revision: boards.revision, deletedAt: boards.deletedAt, code: boards.code })
    .from(boards)
    .where(and(eq(boards.id, id), eq(boards.organisationId, organisationId)))
    .limit(1);
  return row ?? null;
}

export async function findBoardSummary(db: Db, organisationId: number, id: number): Promise<BoardSummary | null> {
  const [row] = await db
    .select({
      id: boards.id,
      name: boards.name,
      location: boards.location,
      code: boards.code,
      publicEnabled: boards.publicEnabled,
      publicToken: boards.publicToken,
      revision: boards.revision,
      createdAt: boards.createdAt,
      updatedAt: boards.updatedAt,
      circuitCount,
      openReports,
      siteId: boards.siteId,
      siteReference: sites.reference,
      siteClientName: sites.clientName,
      siteClientEmail: sites.clientEmail,
    })
    .from(boards)
    .leftJoin(sites, eq(sites.id, boards.siteId))
    .where(and(eq(boards.id, id), eq(boards.organisationId, organisationId), isNull(boards.deletedAt)))
    .limit(1);
  if (!row) return null;
  const { siteReference, siteClientName, siteClientEmail, ...rest } = row;
  return {
    ...rest,
    publicEnabled: Boolean(rest.publicEnabled),
    circuitCount: Number(rest.circuitCount),
    openReports: Number(rest.openReports),
    createdAt: iso(rest.createdAt),
    updatedAt: iso(rest.updatedAt),
    site:
      rest.siteId != null ? { id: rest.siteId, reference: siteReference ?? '', clientName: siteClientName ?? '', clientEmail: siteClientEmail ?? '' } : null,
  };
}

const listColumns = {
  id: boards.id,
  name: boards.name,
  location: boards.location,
  code: boards.code,
  siteId: boards.siteId,
  siteReference: sites.reference,
  revision: boards.revision,
  updatedAt: boards.updatedAt,
  circuitCount,
  openReports,
  deletedAt: boards.deletedAt,
};

function toListItem(
  r: { circuitCount: number; openReports: number; updatedAt: Date; deletedAt: Date | null } & Omit<
    BoardListItem,
    'circuitCount' | 'openReports' | 'updatedAt' | 'deletedAt'
  >,
): BoardListItem {
  return {
    ...r,
    circuitCount: Number(r.circuitCount),
    openReports: Number(r.openReports),
    updatedAt: iso(r.updatedAt),
    deletedAt: r.deletedAt ? iso(r.deletedAt) : null,
  };
}

function listConditions(organisationId: number, query: BoardListQuery): SQL {
  const conditions: SQL[] = [eq(boards.organisationId, organisationId), query.deleted ? isNotNull(boards.deletedAt) : isNull(boards.deletedAt)];
  if (query.siteId) conditions.push(eq(boards.siteId, query.siteId));
  // Every word must appear somewhere: in the board's own words or its site's reference or client.
  for (const word of (query.q ?? '').toLowerCase().split(/\s+/).filter(Boolean).slice(0, 10)) {
    const pattern = likeContains(word);
    conditions.push(or(like(boards.searchText, pattern), like(sites.reference, pattern), like(sites.clientName, pattern))!);
  }
  return and(...conditions)!;
}

/** One page of boards, most recently changed first, and the total that match. */
export async function listBoards(db: Db, organisationId: number, query: BoardListQuery): Promise<{ items: BoardListItem[]; total: number }> {
  const where = listConditions(organisationId, query);
  const [{ total }] = await db.select({ total: count() }).from(boards).leftJoin(sites, eq(sites.id, boards.siteId)).where(where);
  const rows = await db
    .select(listColumns)
    .from(boards)
    .leftJoin(sites, eq(sites.id, boards.siteId))
    .where(where)
    .orderBy(desc(boards.updatedAt), desc(boards.id))
    .limit(query.pageSize)
    .offset((query.page - 1) * query.pageSize);
  return { items: rows.map(toListItem), total: Number(total) };
}

/** A site's boards that are not deleted, most recently changed first (the site page lists them all). */
export async function listSiteBoards(db: Db, organisationId: number, siteId: number): Promise<BoardListItem[]> {
  const rows = await db
    .select(listColumns)
    .from(boards)
    .leftJoin(sites, eq(sites.id, boards.siteId))
    .where(and(eq(boards.siteId, siteId), eq(boards.organisationId, organisationId), isNull(boards.deletedAt)))
    .orderBy(desc(boards.updatedAt), desc(boards.id));
  return rows.map(toListItem);
}

export interface NewBoard {
  organisationId: number;
  siteId: number | null;
  code: string;
  publicToken: string;
  /** Whether the board page answers its QR code from the start. */
  publicEnabled: boolean;
  schedule: Schedule;
  searchText: string;
}

export async function insertBoard(db: Db, b: NewBoard): Promise<number> {
  const [res] = await db
    .insert(boards)
    .values({
      organisationId: b.organisationId,
      siteId: b.siteId,
      code: b.code,
      publicToken: b.publicToken,
      publicEnabled: b.publicEnabled,
      name: b.schedule.board.name,
      location: b.schedule.board.location,
      schedule: b.schedule,
      searchText: b.searchText,
      revision: 1,
    })
    .$returningId();
  return res.id;
}

/**
 * Writes a new schedule only if the board is still at `baseRevision`: of two saves made from the
 * same revision exactly one matches (the row lock serialises them). Returns whether this one won.
 */
export async function updateScheduleIfAt(
  db: Db,
  organisationId: number,
  id: number,
  baseRevision: number,
  schedule: Schedule,
  searchText: string,
): Promise<boolean> {
  const [res] = await db
    .update(boards)
    .set({
      schedule,
      searchText,
      name: schedule.board.name,
      location: schedule.board.location,
      revision: sql`${boards.revision} + 1`,
      updatedAt: new Date(),
    })
    .where(and(eq(boards.id, id), eq(boards.organisationId, organisationId), eq(boards.revision, baseRevision), isNull(boards.deletedAt)));
  return res.affectedRows === 1;
}

/** Changes columns that are not part of the schedule (site, public page, deletion). */
export async function updateBoardColumns(
  db: Db,
  organisationId: number,
  id: number,
  set: Partial<{
    siteId: number | null;
    publicEnabled: boolean;
    publicToken: string;
    deletedAt: Date | null;
  }>,
): Promise<void> {
  await db
    .update(boards)
    .set(set)
    .where(and(eq(boards.id, id), eq(boards.organisationId, organisationId)));
}

/** Which of these board ids belong to the organisation (deleted ones count: they can be restored). */
export async function existingBoardIds(db: Db, organisationId: number, ids: number[]): Promise<Set<number>> {
  if (!ids.length) return new Set();
  const rows = await db
    .select({ id: boards.id })
    .from(boards)
    .where(and(eq(boards.organisationId, organisationId), inArray(boards.id, ids)));
  return new Set(rows.map((r) => r.id));
}

/** True when the site exists in the organisation. */
export async function siteExists(db: Db, organisationId: number, siteId: number): Promise<boolean> {
  const [row] = await db
    .select({ id: sites.id })
    .from(sites)
    .where(and(eq(sites.id, siteId), eq(sites.organisationId, organisationId)))
    .limit(1);
  return Boolean(row);
}
