/** The organisation's own row: name, contact details shown on printed charts, print offsets. */
import { eq } from 'drizzle-orm';
import type { Db } from '../db/client.js';
import { organisations } from '../db/schema.js';
import type { Organisation, OrganisationSettings } from '../../shared/schemas/auth.js';

const columns = {
  id: organisations.id, name: organisations.name, contactPhone: organisations.contactPhone, contactEmail: organisations.contactEmail,
  printOffsetXMm: organisations.printOffsetXMm, printOffsetYMm: organisations.printOffsetYMm,
};

export async function findOrganisation(db: Db, id: number): Promise<Organisation | null> {
  const [row] = await db.select(columns).from(organisations).where(eq(organisations.id, id)).limit(1);
  return row ?? null;
}

export async function updateOrganisation(db: Db, id: number, settings: OrganisationSettings): Promise<void> {
  await db.update(organisations).set(settings).where(eq(organisations.id, id));
}
