import { z } from 'zod';
import { singleLine } from './fields.js';

export const roleSchema = z.enum(['owner', 'electrician', 'viewer']);
export type Role = z.infer<typeof roleSchema>;

const email = z.string().trim().toLowerCase().max(254, 'At most 254 characters').email('Not a valid e-mail address');
/** At least 10 characters (our policy); bcrypt reads at most 72 bytes, so cap the length. */
export const passwordSchema = z.string().min(10, 'At least 10 characters').max(72, 'At most 72 characters');
const personName = singleLine(120).min(1, 'Required');

export const signupSchema = z.strictObject({
  organisation: singleLine(120).min(1, 'Required'),
  name: personName,
  email,
  password: passwordSchema,
});
export type SignupInput = z.infer<typeof signupSchema>;

export const loginSchema = z.strictObject({
  email,
  password: z.string().min(1, 'Required').max(200, 'Too long'),
});
export type LoginInput = z.infer<typeof loginSchema>;

export const meSchema = z.object({
  user: z.object({ id: z.number(), email: z.string(), name: z.string(), role: roleSchema }),
  organisation: z.object({ id: z.number(), name: z.string() }),
});
export type Me = z.infer<typeof meSchema>;

export const csrfSchema = z.object({ token: z.string() });

/** The token in an invitation link's path (`/invite/<token>`); the server issues 43 characters. */
export const invitationTokenParamSchema = z.object({
  token: z.string().min(10, 'Too short to be a link token').max(200, 'Too long to be a link token'),
});
export const inviteSchema = z.strictObject({ email, role: roleSchema });
export const acceptInvitationSchema = z.strictObject({ token: z.string().min(10).max(200), name: personName, password: passwordSchema });
export const forgotPasswordSchema = z.strictObject({ email });
/** The token of a sign-up link (`/signup/<token>`), sent back to open the account. */
export const linkTokenSchema = z.strictObject({ token: z.string().min(10, 'Too short to be a link token').max(200, 'Too long to be a link token') });
export const resetPasswordSchema = z.strictObject({ token: z.string().min(10).max(200), password: passwordSchema });
export const memberUpdateSchema = z.strictObject({ role: roleSchema.optional(), disabled: z.boolean().optional() });

export const organisationSettingsSchema = z.strictObject({
  name: singleLine(120).min(1, 'Required'),
  contactPhone: singleLine(40),
  contactEmail: z.union([email, z.literal('')]),
  printOffsetXMm: z.number().min(-10, 'At least −10 mm').max(10, 'At most 10 mm').optional(),
  printOffsetYMm: z.number().min(-10, 'At least −10 mm').max(10, 'At most 10 mm').optional(),
});
export type OrganisationSettings = z.infer<typeof organisationSettingsSchema>;

/** The refinement on member updates: an empty PATCH is a mistake worth saying so. */
export const memberChangeSchema = memberUpdateSchema.refine(
  (v) => v.role !== undefined || v.disabled !== undefined,
  { message: 'Send a role, a disabled flag, or both', path: ['(body)'] },
);
export type MemberUpdate = z.infer<typeof memberUpdateSchema>;
export type InviteInput = z.infer<typeof inviteSchema>;
export type AcceptInvitationInput = z.infer<typeof acceptInvitationSchema>;
export type ResetPasswordInput = z.infer<typeof resetPasswordSchema>;

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

export const organisationSchema = z.object({
  id: z.number(),
  name: z.string(),
  contactPhone: z.string(),
  contactEmail: z.string(),
  printOffsetXMm: z.number(),
  printOffsetYMm: z.number(),
  /** Whether a logo is uploaded, so screens need not ask for one that is not there. */
  hasLogo: z.boolean(),
});
export type Organisation = z.infer<typeof organisationSchema>;

/** Query of the dev-only captured mail list: optionally only messages to one address. */
export const capturedMailQuerySchema = z.strictObject({
  to: z.string().trim().max(254, 'At most 254 characters').optional(),
});

export const capturedMailSummarySchema = z.object({
  id: z.number(),
  to: z.string(),
  subject: z.string(),
  createdAt: z.string(),
});
export const capturedMailListSchema = z.object({ messages: z.array(capturedMailSummarySchema) });
export const capturedMailMessageSchema = capturedMailSummarySchema.extend({
  from: z.string(),
  text: z.string(),
  attachments: z.array(z.object({ filename: z.string(), contentType: z.string(), size: z.number() })),
});
export type CapturedMailMessage = z.infer<typeof capturedMailMessageSchema>;
