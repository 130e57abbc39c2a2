/**
 * Invitations: an owner invites an address with a role; the e-mail carries a single-use link
 * valid for 7 days; opening it lets the invitee choose a name and password and join.
 */
import { inTransaction } from '../db/client.js';
import { isDuplicateKey } from '../db/errors.js';
import type { AppContext } from '../context.js';
import type { Db } from '../db/client.js';
import type { AcceptInvitationInput, InvitationInfo, InviteInput, PendingInvitation } from '../../shared/schemas/members.js';
import type { CurrentUser } from '../http/context.js';
import { conflict, invalid, notFound } from '../errors.js';
import { deliver } from '../mail/mailer.js';
import { alreadyRegisteredMessage, invitationMessage } from '../mail/messages.js';
import { hashPassword, hashToken, newLinkToken } from '../auth/passwords.js';
import { findUserByEmail, insertUser } from '../auth/repository.js';
import {
  deleteUnusedInvitation,
  deleteUnusedInvitationsFor,
  findInvitationByTokenHash,
  insertInvitation,
  listPendingInvitations,
  markInvitationUsed,
} from './invitation-repository.js';

/** Seven days, as the invitation e-mail says. */
export const INVITATION_LIFETIME_MS = 7 * 24 * 60 * 60 * 1000;

const alreadyMember = () =>
  conflict('This address is already a member of your organisation', {
    email: 'Already a member: see the members list',
  });

/** Said only to the holder of the link, who owns the address. */
const alreadyRegistered = () =>
  conflict('This address already has a Waymark account: sign in instead', {
    email: 'Already has an account',
  });

/** Records the invitation and sends its link; if the mail cannot be sent, the invitation is withdrawn. */
export async function inviteMember(ctx: AppContext, owner: CurrentUser, input: InviteInput, now = new Date()): Promise<PendingInvitation> {
  const existing = await findUserByEmail(ctx.db, input.email);
  // One's own members are no secret to an owner; another organisation's are, so that invitation is
  // answered and listed like any other, and the address's owner is told by e-mail instead of getting a link.
  if (existing?.organisationId === owner.organisationId) throw alreadyMember();
  const token = newLinkToken();
  const expiresAt = new Date(now.getTime() + INVITATION_LIFETIME_MS);
  // Not one transaction: its gap locks deadlock with other organisations' invitations, and two
  // links left by a simultaneous double invite are harmless (both are listed and revocable).
  await deleteUnusedInvitationsFor(ctx.db, owner.organisationId, input.email);
  const created = await insertInvitation(ctx.db, {
    ...input,
    organisationId: owner.organisationId,
    tokenHash: token.hash,
    invitedBy: owner.id,
    expiresAt,
  });
  const link = `${ctx.config.publicBaseUrl}/invite/${token.raw}`;
  try {
    await deliver(
      ctx.mailer,
      input.email,
      owner.organisationId,
      existing
        ? alreadyRegisteredMessage({
            name: existing.name,
            email: existing.email,
            link: `${ctx.config.publicBaseUrl}/forgot`,
            because: 'invitation',
            organisationName: owner.organisationName,
          })
        : invitationMessage({ organisationName: owner.organisationName, inviterName: owner.name, role: input.role, link, expiresAt }),
    );
  } catch (err) {
    await deleteUnusedInvitation(ctx.db, owner.organisationId, created.id);
    throw err;
  }
  return {
    id: created.id,
    email: input.email,
    role: input.role,
    invitedBy: owner.name,
    createdAt: created.createdAt.toISOString(),
    expiresAt: expiresAt.toISOString(),
  };
}

export async function pendingInvitations(db: Db, organisationId: number, now = new Date()): Promise<PendingInvitation[]> {
  const rows = await listPendingInvitations(db, organisationId, now);
  return rows.map((r) => ({ ...r, createdAt: r.createdAt.toISOString(), expiresAt: r.expiresAt.toISOString() }));
}

export async function revokeInvitation(db: Db, organisationId: number, id: number): Promise<void> {
  if (!(await deleteUnusedInvitation(db, organisationId, id))) throw notFound('No such pending invitation');
}

type InvitationRow = NonNullable<Awaited<ReturnType<typeof findInvitationByTokenHash>>>;
const usable = (row: InvitationRow | null, now: Date): row is InvitationRow => !!row && !row.usedAt && row.expiresAt.getTime() > now.getTime();

/** What the link page shows. Unknown, used and expired links all answer the same 404. */
export async function invitationByToken(db: Db, rawToken: string, now = new Date()): Promise<InvitationInfo> {
  const row = await findInvitationByTokenHash(db, hashToken(rawToken));
  if (!usable(row, now)) throw notFound('This invitation link is not valid any more: ask for a new invitation');
  return { email: row.email, role: row.role, organisation: { name: row.organisationName }, expiresAt: row.expiresAt.toISOString() };
}

/** Creates the member from a link and uses the link up, in one transaction. Returns the new user's id. */
export async function acceptInvitation(db: Db, input: AcceptInvitationInput, now = new Date()): Promise<number> {
  const notValid = () => invalid('This invitation link is not valid any more: ask for a new invitation', { token: 'Unknown, already used or expired' });
  // The token is checked before the password is hashed: hashing costs tens of milliseconds of CPU,
  // which an anonymous request with a made-up token must not be able to spend. The transaction checks it again.
  if (!usable(await findInvitationByTokenHash(db, hashToken(input.token), false), now)) throw notValid();
  const passwordHash = await hashPassword(input.password);
  try {
    return await inTransaction(db, async (tx) => {
      const row = await findInvitationByTokenHash(tx, hashToken(input.token), true);
      if (!usable(row, now)) throw notValid();
      if (await findUserByEmail(tx, row.email)) throw alreadyRegistered();
      await markInvitationUsed(tx, row.id, now);
      return insertUser(tx, { organisationId: row.organisationId, email: row.email, name: input.name, passwordHash, role: row.role });
    });
  } catch (err) {
    if (isDuplicateKey(err)) throw alreadyRegistered();
    throw err;
  }
}
