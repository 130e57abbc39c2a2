/**
 * Data access for sites. Every query filters by organisation, so another organisation's site id
 * finds nothing (and the use-case answers 404).
 */
import { and, asc, eq, isNotNull, like, or, sql, type SQL } from 'drizzle-orm';
import type { Db } from '../db/client.js';
import { boards, sites } from '../db/schema.js';
import type { Site, SiteInput } from '../../shared/schemas/site.js';
import { likeContains } from '../boards/stored.js';

// Written out in SQL: in a one-table select Drizzle leaves column names unqualified, which inside a subquery would bind to the wrong table.
const boardCount = sql<number>`(SELECT COUNT(*) FROM \`boards\` AS b WHERE b.site_id = \`sites\`.\`id\` AND b.deleted_at IS NULL)`;
const columns = {
  id: sites.id,
  reference: sites.reference,
  clientName: sites.clientName,
  address: sites.address,
  clientEmail: sites.clientEmail,
  clientPhone: sites.clientPhone,
  notes: sites.notes,
  createdAt: sites.createdAt,
  boardCount,
  revision: sites.revision,
};
type Row = { createdAt: Date; boardCount: number } & Omit<Site, 'createdAt' | 'boardCount'>;
const toSite = (r: Row): Site => ({ ...r, createdAt: r.createdAt.toISOString(), boardCount: Number(r.boardCount) });

/** The organisation's sites by reference; `q` matches reference, client name or address. */
export async function listSites(db: Db, organisationId: number, q?: string): Promise<Site[]> {
  const conditions: SQL[] = [eq(sites.organisationId, organisationId)];
  for (const word of (q ?? '').split(/\s+/).filter(Boolean).slice(0, 10)) {
    const p = likeContains(word);
    conditions.push(or(like(sites.reference, p), like(sites.clientName, p), like(sites.address, p))!);
  }
  const rows = await db
    .select(columns)
    .from(sites)
    .where(and(...conditions))
    .orderBy(asc(sites.reference), asc(sites.id));
  return rows.map(toSite);
}

export async function findSite(db: Db, organisationId: number, id: number): Promise<Site | null> {
  const [row] = await db
    .select(columns)
    .from(sites)
    .where(and(eq(sites.id, id), eq(sites.organisationId, organisationId)))
    .limit(1);
  return row ? toSite(row) : null;
}

export async function insertSite(db: Db, organisationId: number, input: SiteInput): Promise<number> {
  const [res] = await db
    .insert(sites)
    .values({ ...input, organisationId })
    .$returningId();
  return res.id;
}

/** Writes only while the site is still at `baseRevision`, and bumps it: true when it did (of two saves from one revision, one wins). */
export async function updateSiteIfAt(db: Db, organisationId: number, id: number, baseRevision: number, input: SiteInput): Promise<boolean> {
  const [res] = await db
    .update(sites)
    .set({ ...input, revision: sql`${sites.revision} + 1` })
    .where(and(eq(sites.id, id), eq(sites.organisationId, organisationId), eq(sites.revision, baseRevision)));
  return res.affectedRows > 0;
}

/** Deleted boards keep their schedule but let go of the site, so the site row can go. */
export async function detachDeletedBoards(db: Db, organisationId: number, siteId: number): Promise<void> {
  await db
    .update(boards)
    .set({ siteId: null })
    .where(and(eq(boards.siteId, siteId), eq(boards.organisationId, organisationId), isNotNull(boards.deletedAt)));
}

export async function deleteSiteRow(db: Db, organisationId: number, id: number): Promise<void> {
  await db.delete(sites).where(and(eq(sites.id, id), eq(sites.organisationId, organisationId)));
}
