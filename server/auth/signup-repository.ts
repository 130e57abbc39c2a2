import { eq } from 'drizzle-orm';
import type { Db } from '../db/client.js';
import { signupRequests } from '../db/schema.js';

export async function insertSignupRequest(db: Db, r: typeof signupRequests.$inferInsert): Promise<void> {
  await db.insert(signupRequests).values(r);
}

/** The request behind a link, locked so two uses of one link queue up. */
export async function lockSignupRequest(db: Db, tokenHash: string) {
  const [row] = await db.select().from(signupRequests).where(eq(signupRequests.tokenHash, tokenHash)).limit(1).for('update');
  return row ?? null;
}

export async function markSignupRequestUsed(db: Db, id: number, when: Date): Promise<void> {
  await db.update(signupRequests).set({ usedAt: when }).where(eq(signupRequests.id, id));
}
