/**
 * Data access for printing: the board to print, its contractor, a past revision's snapshot
 * and the print records. Every read is filtered by organisation, so another organisation's
 * board id finds nothing (and the caller answers 404).
 */
import { and, desc, eq, isNull } from 'drizzle-orm';
import type { Db } from '../db/client.js';
import { boardRevisions, boards, files, organisations, prints } from '../db/schema.js';

export interface PrintableBoard {
  id: number;
  code: string;
  publicToken: string;
  publicEnabled: boolean;
  revision: number;
  schedule: unknown;
  updatedAt: Date;
}

/** A live (not deleted) board of the organisation, or null. */
export async function findBoard(db: Db, organisationId: number, boardId: number): Promise<PrintableBoard | null> {
  const [row] = await db
    .select({
      id: boards.id, code: boards.code, publicToken: boards.publicToken, publicEnabled: boards.publicEnabled,
      revision: boards.revision, schedule: boards.schedule, updatedAt: boards.updatedAt,
    })
    .from(boards)
    .where(and(eq(boards.id, boardId), eq(boards.organisationId, organisationId), isNull(boards.deletedAt)))
    .limit(1);
  return row ?? null;
}

/** Whether the board belongs to the organisation (deleted boards keep their history readable). */
export async function boardBelongsTo(db: Db, organisationId: number, boardId: number): Promise<boolean> {
  const [row] = await db.select({ id: boards.id }).from(boards)
    .where(and(eq(boards.id, boardId), eq(boards.organisationId, organisationId))).limit(1);
  return Boolean(row);
}

/** The stored snapshot and date of one revision of a board (the board is already known to be the caller's). */
export async function findRevision(db: Db, boardId: number, number: number): Promise<{ snapshot: unknown; createdAt: Date } | null> {
  const [row] = await db.select({ snapshot: boardRevisions.snapshot, createdAt: boardRevisions.createdAt })
    .from(boardRevisions)
    .where(and(eq(boardRevisions.boardId, boardId), eq(boardRevisions.number, number)))
    .limit(1);
  return row ?? null;
}

export interface ContractorRow {
  name: string;
  contactPhone: string;
  contactEmail: string;
  printOffsetXMm: number;
  printOffsetYMm: number;
}

export async function findOrganisation(db: Db, organisationId: number): Promise<ContractorRow | null> {
  const [row] = await db.select({
    name: organisations.name, contactPhone: organisations.contactPhone, contactEmail: organisations.contactEmail,
    printOffsetXMm: organisations.printOffsetXMm, printOffsetYMm: organisations.printOffsetYMm,
  }).from(organisations).where(eq(organisations.id, organisationId)).limit(1);
  return row ?? null;
}

/** The organisation's newest logo, if it uploaded one. */
export async function findLogo(db: Db, organisationId: number): Promise<{ mime: string; data: Buffer } | null> {
  const [row] = await db.select({ mime: files.mime, data: files.data }).from(files)
    .where(and(eq(files.organisationId, organisationId), eq(files.kind, 'logo')))
    .orderBy(desc(files.id))
    .limit(1);
  return row ?? null;
}

export async function updateOffset(db: Db, organisationId: number, xMm: number, yMm: number): Promise<void> {
  await db.update(organisations).set({ printOffsetXMm: xMm, printOffsetYMm: yMm }).where(eq(organisations.id, organisationId));
}

export interface NewPrintRecord { boardId: number; userId: number; userName: string; output: string; media: string; revision: number }

/** Records prints in one statement, so a pack's files are recorded together or not at all. */
export async function insertPrints(db: Db, records: NewPrintRecord[]): Promise<void> {
  if (records.length) await db.insert(prints).values(records);
}

/** A board's print history, newest first (capped: the page shows recent prints, not an archive). */
export async function listPrints(db: Db, boardId: number, limit = 200) {
  return db.select({
    id: prints.id, output: prints.output, media: prints.media, revision: prints.revision,
    userName: prints.userName, createdAt: prints.createdAt,
  }).from(prints).where(eq(prints.boardId, boardId)).orderBy(desc(prints.id)).limit(limit);
}
