/**
 * Printer profiles: what Waymark needs to know about a tape or label printer to draw images for it
 * (the images route, `GET /api/boards/:id/image/:output`). Each organisation names its printers once:
 * the head's resolution, how much of each tape width it can print on, the unprinted margin it leaves
 * at each end of a label, and whether it cuts between labels.
 */
import { z } from 'zod';
import { baseRevision, singleLine } from './fields.js';
import { tapeWidths, type TapeWidth } from './print.js';

/** Resolutions a head may have, in dots per inch; 180, 203, 300 and 360 are the usual ones. // common practice */
export const DPI_MIN = 100;
export const DPI_MAX = 600;

/** A resolution in a query string (`?dpi=180`) or a profile. */
export const dpiSchema = z.coerce
  .number({ error: 'dpi must be a number' })
  .int('dpi is a whole number')
  .min(DPI_MIN, `dpi is at least ${DPI_MIN}`)
  .max(DPI_MAX, `dpi is at most ${DPI_MAX}`);

/** `?profile=<id>`: one of the organisation's printer profiles. */
export const profileParamSchema = z.coerce
  .number({ error: 'profile is a profile id' })
  .int('profile is a profile id')
  .positive('profile is a profile id')
  .max(2_147_483_647, 'profile is a profile id');

const bandMm = z.number({ error: 'Must be a number (mm)' }).positive('More than 0 mm');

/** The printable band across each tape width the printer takes (mm); a width left out keeps Waymark's usual band. */
const bandsSchema = z
  .strictObject(Object.fromEntries(tapeWidths.map((w) => [String(w), bandMm.optional()])) as Record<`${TapeWidth}`, z.ZodOptional<typeof bandMm>>)
  .superRefine((bands, ctx) => {
    for (const w of tapeWidths) {
      const band = bands[`${w}`];
      if (band !== undefined && band > w) ctx.addIssue({ code: 'custom', path: [`${w}`], message: `At most the tape's ${w} mm` });
    }
  });
export type PrinterBands = z.infer<typeof bandsSchema>;

/** `POST /api/printer-profiles`: a new profile. */
export const printerProfileSchema = z.strictObject({
  name: singleLine(80).min(1, 'Required'),
  dpi: z.number({ error: 'Must be a number' }).int('A whole number').min(DPI_MIN, `At least ${DPI_MIN} dpi`).max(DPI_MAX, `At most ${DPI_MAX} dpi`),
  bands: bandsSchema.default({}),
  /** Unprinted length the printer leaves at each end of a label (mm). */
  endMarginMm: z.number({ error: 'Must be a number (mm)' }).min(0, 'At least 0 mm').max(20, 'At most 20 mm'),
  /** A printer with a cutter separates labels itself; without one, labels are cut by hand. */
  cutsBetweenLabels: z.boolean({ error: 'Yes or no' }),
});
export type PrinterProfile = z.infer<typeof printerProfileSchema>;

/** `PUT /api/printer-profiles/:id`: the profile and the revision it was loaded at (a stale one is 409). */
export const printerProfileUpdateSchema = printerProfileSchema.extend({ baseRevision });
export type PrinterProfileUpdate = z.infer<typeof printerProfileUpdateSchema>;

/** A stored profile as the API returns it; `profile=<id>` on the images route uses it. */
export const printerProfileRecordSchema = z.object({
  id: z.number().int(),
  name: z.string(),
  dpi: z.number().int(),
  bands: z.record(z.string(), z.number()),
  endMarginMm: z.number(),
  cutsBetweenLabels: z.boolean(),
  /** Bumped by every save; send it back as `baseRevision`. */
  revision: z.number().int(),
});
export type PrinterProfileRecord = z.infer<typeof printerProfileRecordSchema>;
export const printerProfileListSchema = z.object({ items: z.array(printerProfileRecordSchema) });
