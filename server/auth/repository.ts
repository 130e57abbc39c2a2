import { eq } from 'drizzle-orm';
import type { Db } from '../db/client.js';
import { organisations, users } from '../db/schema.js';
import type { Role } from '../../shared/schemas/auth.js';

export async function findUserByEmail(db: Db, email: string) {
  const [row] = await db.select().from(users).where(eq(users.email, email)).limit(1);
  return row ?? null;
}

export async function insertOrganisation(db: Db, name: string): Promise<number> {
  const [res] = await db.insert(organisations).values({ name }).$returningId();
  return res.id;
}

export async function insertUser(db: Db, u: { organisationId: number; email: string; name: string; passwordHash: string; role: Role }): Promise<number> {
  const [res] = await db.insert(users).values(u).$returningId();
  return res.id;
}
