/**
 * Stored printer profiles, per organisation. Every query carries the organisation id, so another
 * organisation's profile id finds nothing.
 */
import { and, asc, eq, sql } from 'drizzle-orm';
import type { Db } from '../db/client.js';
import { printerProfiles } from '../db/schema.js';
import type { PrinterProfile, PrinterProfileRecord } from '../../shared/schemas/printer-profile.js';

const columns = {
  id: printerProfiles.id,
  name: printerProfiles.name,
  dpi: printerProfiles.dpi,
  bands: printerProfiles.bands,
  endMarginMm: printerProfiles.endMarginMm,
  cutsBetweenLabels: printerProfiles.cutsBetweenLabels,
  revision: printerProfiles.revision,
};

/** The band map as stored: only the widths given, as numbers. */
const bandsOf = (p: PrinterProfile): Record<string, number> =>
  Object.fromEntries(Object.entries(p.bands).filter((e): e is [string, number] => typeof e[1] === 'number'));

export async function listPrinterProfiles(db: Db, organisationId: number): Promise<PrinterProfileRecord[]> {
  return db
    .select(columns)
    .from(printerProfiles)
    .where(eq(printerProfiles.organisationId, organisationId))
    .orderBy(asc(printerProfiles.name), asc(printerProfiles.id));
}

export async function findPrinterProfile(db: Db, organisationId: number, id: number): Promise<PrinterProfileRecord | null> {
  const [row] = await db
    .select(columns)
    .from(printerProfiles)
    .where(and(eq(printerProfiles.id, id), eq(printerProfiles.organisationId, organisationId)))
    .limit(1);
  return row ?? null;
}

export async function insertPrinterProfile(db: Db, organisationId: number, profile: PrinterProfile): Promise<number> {
  const [res] = await db
    .insert(printerProfiles)
    .values({ ...profile, bands: bandsOf(profile), organisationId })
    .$returningId();
  return res.id;
}

/** Writes only while the profile is still at `baseRevision`, bumping it: true when it did (0 rows is missing or stale). */
export async function updatePrinterProfileIfAt(db: Db, organisationId: number, id: number, baseRevision: number, profile: PrinterProfile): Promise<boolean> {
  const [res] = await db
    .update(printerProfiles)
    .set({ ...profile, bands: bandsOf(profile), revision: sql`${printerProfiles.revision} + 1` })
    .where(and(eq(printerProfiles.id, id), eq(printerProfiles.organisationId, organisationId), eq(printerProfiles.revision, baseRevision)));
  return res.affectedRows > 0;
}

export async function deletePrinterProfile(db: Db, organisationId: number, id: number): Promise<boolean> {
  const [res] = await db.delete(printerProfiles).where(and(eq(printerProfiles.id, id), eq(printerProfiles.organisationId, organisationId)));
  return res.affectedRows > 0;
}
