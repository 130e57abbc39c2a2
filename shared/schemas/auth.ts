/** Signing up, in and out, and resetting a password: the account's own contracts. Members and invitations are in members.ts. */
import { z } from 'zod';
import { emailAddress as email, personName, singleLine } from './fields.js';

export const roleSchema = z.enum(['owner', 'electrician', 'viewer']);
export type Role = z.infer<typeof roleSchema>;

/** At least 10 characters (our policy); bcrypt reads at most 72 bytes, so cap the length. */
export const passwordSchema = z.string().min(10, 'At least 10 characters').max(72, 'At most 72 characters');

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

export const forgotPasswordSchema = z.strictObject({ email });
/** The token of a sign-up link (`/signup/<token>`), sent back to open the account. */
export const linkTokenSchema = z.strictObject({ token: z.string().min(10, 'Too short to be a link token').max(200, 'Too long to be a link token') });
export const resetPasswordSchema = z.strictObject({ token: z.string().min(10).max(200), password: passwordSchema });
export type ResetPasswordInput = z.infer<typeof resetPasswordSchema>;
