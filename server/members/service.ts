/** Use-cases of the members list: reading it, and an owner changing a member's role or access. */
import { inTransaction } from '../db/client.js';
import type { Db } from '../db/client.js';
import type { Member, MemberUpdate } from '../../shared/schemas/members.js';
import { conflict, notFound } from '../errors.js';
import { findMember, listMembers, lockActiveOwnerIds, updateMember, type MemberRow } from './repository.js';

const toMember = (row: MemberRow): Member => ({ ...row, createdAt: row.createdAt.toISOString() });

export async function membersOf(db: Db, organisationId: number): Promise<Member[]> {
  return (await listMembers(db, organisationId)).map(toMember);
}

/** Why a change is refused when it would leave the organisation with nobody able to manage it. */
function lastOwnerRefusal(change: MemberUpdate) {
  const fields: Record<string, string> = {};
  if (change.role !== undefined && change.role !== 'owner') fields.role = 'The only active owner must stay an owner';
  if (change.disabled) fields.disabled = 'The only active owner cannot be disabled';
  return conflict('The organisation needs at least one active owner: make another member an owner first', fields);
}

/**
 * Changes a member's role and/or disabled flag. A disabled member's sessions stop working on
 * their next request (the session's user is re-read every time). The last active owner is kept.
 */
export async function changeMember(db: Db, organisationId: number, memberId: number, change: MemberUpdate): Promise<Member> {
  return inTransaction(db, async (tx) => {
    const activeOwners = await lockActiveOwnerIds(tx, organisationId);
    const member = await findMember(tx, organisationId, memberId);
    if (!member) throw notFound('No such member in this organisation');
    const after = { ...member, ...change };
    const staysActiveOwner = after.role === 'owner' && !after.disabled;
    if (activeOwners.length === 1 && activeOwners[0] === member.id && !staysActiveOwner) throw lastOwnerRefusal(change);
    await updateMember(tx, organisationId, memberId, change);
    return toMember(after);
  });
}
