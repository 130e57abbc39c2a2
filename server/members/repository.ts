/** Members of an organisation. Every query is scoped to one organisation: another one's ids find nothing. */
import { and, asc, eq } from 'drizzle-orm';
import type { Db } from '../db/client.js';
import { users } from '../db/schema.js';
import type { MemberUpdate } from '../../shared/schemas/members.js';
import type { Role } from '../../shared/schemas/auth.js';

export interface MemberRow {
  id: number;
  email: string;
  name: string;
  role: Role;
  disabled: boolean;
  createdAt: Date;
}

const memberColumns = {
  id: users.id,
  email: users.email,
  name: users.name,
  role: users.role,
  disabled: users.disabled,
  createdAt: users.createdAt,
};

export async function listMembers(db: Db, organisationId: number): Promise<MemberRow[]> {
  return db.select(memberColumns).from(users).where(eq(users.organisationId, organisationId)).orderBy(asc(users.name), asc(users.id));
}

export async function findMember(db: Db, organisationId: number, id: number): Promise<MemberRow | null> {
  const [row] = await db
    .select(memberColumns)
    .from(users)
    .where(and(eq(users.organisationId, organisationId), eq(users.id, id)))
    .limit(1);
  return row ?? null;
}

/**
 * The ids of the organisation's active owners, locked until the transaction ends, so two
 * owners demoting each other at the same moment cannot leave the organisation with none.
 */
export async function lockActiveOwnerIds(db: Db, organisationId: number): Promise<number[]> {
  const rows = await db
    .select({ id: users.id })
    .from(users)
    .where(and(eq(users.organisationId, organisationId), eq(users.role, 'owner'), eq(users.disabled, false)))
    .for('update');
  return rows.map((r) => r.id);
}

export async function updateMember(db: Db, organisationId: number, id: number, change: MemberUpdate): Promise<void> {
  await db
    .update(users)
    .set(change)
    .where(and(eq(users.organisationId, organisationId), eq(users.id, id)));
}
