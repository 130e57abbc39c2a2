import { z } from 'zod';

export const roleSchema = z.enum(['owner', 'electrician', 'viewer']);
export type Role = z.infer<typeof roleSchema>;

const email = z.string().trim().toLowerCase().max(254, 'At most 254 characters').email('Not a valid e-mail address');
/** At least 10 characters (our policy); bcrypt reads at most 72 bytes, so cap the length. */
export const passwordSchema = z.string().min(10, 'At least 10 characters').max(72, 'At most 72 characters');
const personName = z.string().trim().min(1, 'Required').max(120, 'At most 120 characters');

export const signupSchema = z.strictObject({
  organisation: z.string().trim().min(1, 'Required').max(120, 'At most 120 characters'),
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

export const inviteSchema = z.strictObject({ email, role: roleSchema });
export const acceptInvitationSchema = z.strictObject({ token: z.string().min(10).max(200), name: personName, password: passwordSchema });
export const forgotPasswordSchema = z.strictObject({ email });
export const resetPasswordSchema = z.strictObject({ token: z.string().min(10).max(200), password: passwordSchema });
export const memberUpdateSchema = z.strictObject({ role: roleSchema.optional(), disabled: z.boolean().optional() });

export const organisationSettingsSchema = z.strictObject({
  name: z.string().trim().min(1, 'Required').max(120, 'At most 120 characters'),
  contactPhone: z.string().trim().max(40, 'At most 40 characters'),
  contactEmail: z.union([email, z.literal('')]),
  printOffsetXMm: z.number().min(-10, 'At least −10 mm').max(10, 'At most 10 mm').optional(),
  printOffsetYMm: z.number().min(-10, 'At least −10 mm').max(10, 'At most 10 mm').optional(),
});
export type OrganisationSettings = z.infer<typeof organisationSettingsSchema>;
