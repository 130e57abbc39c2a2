/** Typed calls for the organisation's members and pending invitations (owner screens). */
import {
  memberListSchema,
  memberSchema,
  pendingInvitationListSchema,
  pendingInvitationSchema,
  type InviteInput,
  type Member,
  type MemberUpdate,
  type PendingInvitation,
} from '../../shared/schemas/members.js';
import { json, send } from './http.js';

export async function listMembers(): Promise<Member[]> {
  return (await json(memberListSchema, 'GET', '/api/members')).members;
}

/** Changes a member's role and/or disabled flag; the last owner is protected by the server (409). */
export async function updateMember(id: number, change: MemberUpdate): Promise<Member> {
  return json(memberSchema, 'PATCH', `/api/members/${id}`, { body: change });
}

export async function listInvitations(): Promise<PendingInvitation[]> {
  return (await json(pendingInvitationListSchema, 'GET', '/api/members/invitations')).invitations;
}

/** Sends the invitation e-mail with a single-use link valid for seven days. */
export async function inviteMember(input: InviteInput): Promise<PendingInvitation> {
  return json(pendingInvitationSchema, 'POST', '/api/members/invitations', { body: input });
}

export async function revokeInvitation(id: number): Promise<void> {
  await send('DELETE', `/api/members/invitations/${id}`);
}
