/** The organisation's own row: name, contact details shown on printed charts, print offsets. */
import { eq, sql } from 'drizzle-orm';
import type { Db } from '../db/client.js';
import { organisations } from '../db/schema.js';
import type { Organisation, OrganisationSettings } from '../../shared/schemas/organisation.js';

const columns = {
  id: organisations.id, name: organisations.name, contactPhone: organisations.contactPhone, contactEmail: organisations.contactEmail,
  printOffsetXMm: organisations.printOffsetXMm, printOffsetYMm: organisations.printOffsetYMm,
  // Written out with table names: in a one-table select Drizzle leaves columns unqualified, and an
  // unqualified `id` inside the subquery would mean the file's id, not the organisation's.
  hasLogo: sql<number>`exists(select 1 from files where files.organisation_id = organisations.id and files.kind = 'logo')`,
};

export async function findOrganisation(db: Db, id: number): Promise<Organisation | null> {
  const [row] = await db.select(columns).from(organisations).where(eq(organisations.id, id)).limit(1);
  return row ? { ...row, hasLogo: Number(row.hasLogo) === 1 } : null;
}

/** The printer offsets of the print settings page (mm). */
export async function updatePrintOffset(db: Db, id: number, xMm: number, yMm: number): Promise<void> {
  await db.update(organisations).set({ printOffsetXMm: xMm, printOffsetYMm: yMm }).where(eq(organisations.id, id));
}

export async function updateOrganisation(db: Db, id: number, settings: OrganisationSettings): Promise<void> {
  await db.update(organisations).set(settings).where(eq(organisations.id, id));
}
