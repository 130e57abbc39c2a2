/** The organisation's own settings (name, contact shown on printed charts, print offsets) and how they read back. */
import { z } from 'zod';
import { baseRevision, emailAddress, singleLine } from './fields.js';

export const organisationSettingsSchema = z.strictObject({
  name: singleLine(120).min(1, 'Required'),
  contactPhone: singleLine(40),
  contactEmail: z.union([emailAddress, z.literal('')]),
  printOffsetXMm: z.number().min(-10, 'At least −10 mm').max(10, 'At most 10 mm').optional(),
  printOffsetYMm: z.number().min(-10, 'At least −10 mm').max(10, 'At most 10 mm').optional(),
});
export type OrganisationSettings = z.infer<typeof organisationSettingsSchema>;

/** `PUT /api/organisation`: the settings and the revision they were loaded at (a stale one is 409). */
export const organisationSaveSchema = organisationSettingsSchema.extend({ baseRevision });
export type OrganisationSave = z.infer<typeof organisationSaveSchema>;

export const organisationSchema = z.object({
  id: z.number(),
  name: z.string(),
  contactPhone: z.string(),
  contactEmail: z.string(),
  printOffsetXMm: z.number(),
  printOffsetYMm: z.number(),
  /** Whether a logo is uploaded, so screens need not ask for one that is not there. */
  hasLogo: z.boolean(),
  /** Bumped by every write of the row (settings and print offsets); send it back as `baseRevision`. */
  revision: z.number().int(),
});
export type Organisation = z.infer<typeof organisationSchema>;
