/**
 * The organisation's own row: name, contact details shown on printed charts, print offsets. Every write of
 * the row (settings or offsets) is made against a `baseRevision` and bumps `revision`, so of two saves from
 * one revision exactly one wins and the other is refused as stale, never silently overwritten.
 */
import { and, eq, sql } from 'drizzle-orm';
import type { Db } from '../db/client.js';
import { organisations } from '../db/schema.js';
import type { Organisation, OrganisationSettings } from '../../shared/schemas/organisation.js';
import { noticeWordingSetSchema, type NoticeWordingSet } from '../../shared/schemas/notice-wording.js';

const columns = {
  id: organisations.id,
  name: organisations.name,
  contactPhone: organisations.contactPhone,
  contactEmail: organisations.contactEmail,
  printOffsetXMm: organisations.printOffsetXMm,
  printOffsetYMm: organisations.printOffsetYMm,
  revision: organisations.revision,
  // Written out with table names: in a one-table select Drizzle leaves columns unqualified, and an
  // unqualified `id` inside the subquery would mean the file's id, not the organisation's.
  hasLogo: sql<number>`exists(select 1 from files where files.organisation_id = organisations.id and files.kind = 'logo')`,
};

export async function findOrganisation(db: Db, id: number): Promise<Organisation | null> {
  const [row] = await db.select(columns).from(organisations).where(eq(organisations.id, id)).limit(1);
  return row ? { ...row, hasLogo: Number(row.hasLogo) === 1 } : null;
}

/** Writes `values` only while the row is at `baseRevision`, bumping it; true when it did. */
async function updateIfAt(db: Db, id: number, baseRevision: number, values: Partial<typeof organisations.$inferInsert>): Promise<boolean> {
  const [res] = await db
    .update(organisations)
    .set({ ...values, revision: sql`${organisations.revision} + 1` })
    .where(and(eq(organisations.id, id), eq(organisations.revision, baseRevision)));
  return res.affectedRows > 0;
}

/** The printer offsets of the print settings page (mm): the same row, so the same revision check. */
export function updatePrintOffsetIfAt(db: Db, id: number, baseRevision: number, xMm: number, yMm: number): Promise<boolean> {
  return updateIfAt(db, id, baseRevision, { printOffsetXMm: xMm, printOffsetYMm: yMm });
}

export function updateOrganisationIfAt(db: Db, id: number, baseRevision: number, settings: OrganisationSettings): Promise<boolean> {
  return updateIfAt(db, id, baseRevision, settings);
}

/**
 * The organisation's own notice wording and the row's revision. MariaDB hands JSON back as text; a
 * stored value that no longer passes the schema reads as none, so a notice falls back to the prescribed words.
 */
export async function findNoticeWording(db: Db, id: number): Promise<{ wording: NoticeWordingSet; revision: number } | null> {
  const [row] = await db
    .select({ wording: organisations.noticeWording, revision: organisations.revision })
    .from(organisations)
    .where(eq(organisations.id, id))
    .limit(1);
  if (!row) return null;
  const raw: unknown = typeof row.wording === 'string' ? JSON.parse(row.wording) : row.wording;
  const parsed = noticeWordingSetSchema.safeParse(raw ?? {});
  return { wording: parsed.success ? parsed.data : {}, revision: row.revision };
}

/** The notice wording, on the same row and so under the same revision check as the settings. */
export function updateNoticeWordingIfAt(db: Db, id: number, baseRevision: number, wording: NoticeWordingSet): Promise<boolean> {
  return updateIfAt(db, id, baseRevision, { noticeWording: Object.keys(wording).length ? wording : null });
}
