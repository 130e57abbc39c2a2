/**
 * Members of an organisation and invitations to join it: what the owner sends and sees, and what an
 * invitation link shows before it is accepted.
 */
import { z } from 'zod';
import { emailAddress, personName } from './fields.js';
import { passwordSchema, roleSchema } from './auth.js';

/** The token in an invitation link's path (`/invite/<token>`); the server issues 43 characters. */
export const invitationTokenParamSchema = z.object({
  token: z.string().min(10, 'Too short to be a link token').max(200, 'Too long to be a link token'),
});
export const inviteSchema = z.strictObject({ email: emailAddress, role: roleSchema });
export const acceptInvitationSchema = z.strictObject({ token: z.string().min(10).max(200), name: personName, password: passwordSchema });
export const memberUpdateSchema = z.strictObject({ role: roleSchema.optional(), disabled: z.boolean().optional() });

/** The refinement on member updates: an empty PATCH is a mistake worth saying so. */
export const memberChangeSchema = memberUpdateSchema.refine((v) => v.role !== undefined || v.disabled !== undefined, {
  message: 'Send a role, a disabled flag, or both',
  path: ['(body)'],
});
export type MemberUpdate = z.infer<typeof memberUpdateSchema>;
export type InviteInput = z.infer<typeof inviteSchema>;
export type AcceptInvitationInput = z.infer<typeof acceptInvitationSchema>;
// Responses. Dates travel as ISO 8601 strings.

export const memberSchema = z.object({
  id: z.number(),
  email: z.string(),
  name: z.string(),
  role: roleSchema,
  disabled: z.boolean(),
  createdAt: z.string(),
});
export type Member = z.infer<typeof memberSchema>;
export const memberListSchema = z.object({ members: z.array(memberSchema) });

/** A pending invitation as its organisation's owner sees it. */
export const pendingInvitationSchema = z.object({
  id: z.number(),
  email: z.string(),
  role: roleSchema,
  invitedBy: z.string(),
  createdAt: z.string(),
  expiresAt: z.string(),
});
export type PendingInvitation = z.infer<typeof pendingInvitationSchema>;
export const pendingInvitationListSchema = z.object({ invitations: z.array(pendingInvitationSchema) });

/** What the invitation link shows before accepting: no ids, nothing else of the organisation. */
export const invitationInfoSchema = z.object({
  email: z.string(),
  role: roleSchema,
  organisation: z.object({ name: z.string() }),
  expiresAt: z.string(),
});
export type InvitationInfo = z.infer<typeof invitationInfoSchema>;
