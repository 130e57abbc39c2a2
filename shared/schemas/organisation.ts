/** The organisation's own settings (name, contact shown on printed charts, print offsets) and how they read back. */
import { z } from 'zod';
import { emailAddress, singleLine } from './fields.js';

export const organisationSettingsSchema = z.strictObject({
  name: singleLine(120).min(1, 'Required'),
  contactPhone: singleLine(40),
  contactEmail: z.union([emailAddress, z.literal('')]),
  printOffsetXMm: z.number().min(-10, 'At least −10 mm').max(10, 'At most 10 mm').optional(),
  printOffsetYMm: z.number().min(-10, 'At least −10 mm').max(10, 'At most 10 mm').optional(),
});
export type OrganisationSettings = z.infer<typeof organisationSettingsSchema>;

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
