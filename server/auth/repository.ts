import { and, eq, inArray, isNull, sql } from 'drizzle-orm';
import type { Db } from '../db/client.js';
import { organisations, passwordResets, sessions, users } from '../db/schema.js';
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

export async function setPasswordHash(db: Db, userId: number, passwordHash: string): Promise<void> {
  await db.update(users).set({ passwordHash }).where(eq(users.id, userId));
}

export async function insertPasswordReset(db: Db, r: { userId: number; tokenHash: string; expiresAt: Date }): Promise<void> {
  await db.insert(passwordResets).values(r);
}

/** The reset row behind a link with its account's state, locked so two uses of one link queue up. */
export async function lockPasswordReset(db: Db, tokenHash: string) {
  const [row] = await db
    .select({
      id: passwordResets.id,
      userId: passwordResets.userId,
      expiresAt: passwordResets.expiresAt,
      usedAt: passwordResets.usedAt,
      userDisabled: users.disabled,
    })
    .from(passwordResets)
    .innerJoin(users, eq(users.id, passwordResets.userId))
    .where(eq(passwordResets.tokenHash, tokenHash))
    .limit(1)
    .for('update');
  return row ?? null;
}

/** Marks every unused reset link of the user as used: after a reset, older links must not work either. */
export async function retirePasswordResets(db: Db, userId: number, now: Date): Promise<void> {
  await db
    .update(passwordResets)
    .set({ usedAt: now })
    .where(and(eq(passwordResets.userId, userId), isNull(passwordResets.usedAt)));
}

/**
 * Ends the user's sessions except one. express-mysql-session keeps the session as JSON text,
 * so the owner of a session is read from its `userId` member. The matching ids are found with a
 * plain read and deleted by key, so the scan never locks the other users' session rows.
 */
export async function deleteSessionsOfUser(db: Db, userId: number, exceptSessionId: string): Promise<number> {
  const rows = await db
    .select({ id: sessions.sessionId })
    .from(sessions)
    .where(sql`CAST(JSON_VALUE(${sessions.data}, '$.userId') AS UNSIGNED) = ${userId}`);
  const ids = rows.map((r) => r.id).filter((id) => id !== exceptSessionId);
  if (ids.length === 0) return 0;
  const [res] = await db.delete(sessions).where(inArray(sessions.sessionId, ids));
  return res.affectedRows;
}
