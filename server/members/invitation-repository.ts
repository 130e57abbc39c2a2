/** Invitations, stored with the hash of their link token only. Owner-side reads are scoped to one organisation. */
import { and, asc, eq, gt, isNull } from 'drizzle-orm';
import type { Db } from '../db/client.js';
import { invitations, organisations, users } from '../db/schema.js';
import type { Role } from '../../shared/schemas/auth.js';

export interface NewInvitation {
  organisationId: number;
  email: string;
  role: Role;
  tokenHash: string;
  invitedBy: number;
  expiresAt: Date;
}

export async function insertInvitation(db: Db, inv: NewInvitation): Promise<{ id: number; createdAt: Date }> {
  const [res] = await db.insert(invitations).values(inv).$returningId();
  const [row] = await db.select({ createdAt: invitations.createdAt }).from(invitations).where(eq(invitations.id, res.id));
  return { id: res.id, createdAt: row.createdAt };
}

/** Invitations not yet used and not expired at `now`, oldest first, with the inviter's name. */
export async function listPendingInvitations(db: Db, organisationId: number, now: Date) {
  return db
    .select({
      id: invitations.id,
      email: invitations.email,
      role: invitations.role,
      invitedBy: users.name,
      createdAt: invitations.createdAt,
      expiresAt: invitations.expiresAt,
    })
    .from(invitations)
    .innerJoin(users, eq(users.id, invitations.invitedBy))
    .where(and(eq(invitations.organisationId, organisationId), isNull(invitations.usedAt), gt(invitations.expiresAt, now)))
    .orderBy(asc(invitations.createdAt), asc(invitations.id));
}

/** Removes an unused invitation; false when the id is unknown, used, or another organisation's. */
export async function deleteUnusedInvitation(db: Db, organisationId: number, id: number): Promise<boolean> {
  const [res] = await db.delete(invitations).where(and(eq(invitations.organisationId, organisationId), eq(invitations.id, id), isNull(invitations.usedAt)));
  return res.affectedRows === 1;
}

/** Re-inviting an address replaces its earlier unused invitations, so only the newest link works. */
export async function deleteUnusedInvitationsFor(db: Db, organisationId: number, email: string): Promise<void> {
  await db.delete(invitations).where(and(eq(invitations.organisationId, organisationId), eq(invitations.email, email), isNull(invitations.usedAt)));
}

/** The invitation behind a link, with its organisation's name; `lock` holds the row for an accept. */
export async function findInvitationByTokenHash(db: Db, tokenHash: string, lock = false) {
  const query = db
    .select({
      id: invitations.id,
      organisationId: invitations.organisationId,
      organisationName: organisations.name,
      email: invitations.email,
      role: invitations.role,
      expiresAt: invitations.expiresAt,
      usedAt: invitations.usedAt,
    })
    .from(invitations)
    .innerJoin(organisations, eq(organisations.id, invitations.organisationId))
    .where(eq(invitations.tokenHash, tokenHash))
    .limit(1);
  const [row] = lock ? await query.for('update') : await query;
  return row ?? null;
}

export async function markInvitationUsed(db: Db, id: number, now: Date): Promise<void> {
  await db.update(invitations).set({ usedAt: now }).where(eq(invitations.id, id));
}
