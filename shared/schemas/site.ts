/**
 * Sites: where a contractor's boards are. Private to the organisation (the public board page
 * never shows any of this). One schema per contract: the server parses with it, the site forms reuse it.
 */
import { z } from 'zod';
import { boardListItemSchema } from './boards.js';
import { baseRevision, singleLine, text } from './fields.js';

/** `POST /api/sites` and `PUT /api/sites/:id` (a PUT replaces every field; omitted ones become empty). */
export const siteInputSchema = z.strictObject({
  reference: singleLine(60).min(1, 'Required'),
  clientName: singleLine(120).default(''),
  address: text(1000).default(''),
  clientEmail: z.union([z.string().trim().toLowerCase().max(254, 'At most 254 characters').email('Not a valid e-mail address'), z.literal('')]).default(''),
  clientPhone: singleLine(40).default(''),
  notes: text(4000).default(''),
});
export type SiteInput = z.infer<typeof siteInputSchema>;

/** `PUT /api/sites/:id`: every field, plus the revision the form was loaded at (a stale one is 409). */
export const siteUpdateSchema = siteInputSchema.extend({ baseRevision });
export type SiteUpdate = z.infer<typeof siteUpdateSchema>;

export const siteSchema = z.object({
  id: z.number(),
  reference: z.string(),
  clientName: z.string(),
  address: z.string(),
  clientEmail: z.string(),
  clientPhone: z.string(),
  notes: z.string(),
  createdAt: z.string(),
  /** Boards on the site that are not deleted. */
  boardCount: z.number(),
  /** Bumped by every save; send it back as `baseRevision`. */
  revision: z.number().int(),
});
export type Site = z.infer<typeof siteSchema>;

/** `GET /api/sites` */
export const siteListResponseSchema = z.object({ items: z.array(siteSchema) });

/** `GET /api/sites?q=`: a filter on reference, client name and address. */
export const siteListQuerySchema = z.object({ q: z.string().trim().max(200, 'At most 200 characters').optional() });

/** `GET /api/sites/:id`: the site and its boards (not deleted), newest first. */
export const siteDetailSchema = siteSchema.extend({ boards: z.array(boardListItemSchema) });
export type SiteDetail = z.infer<typeof siteDetailSchema>;
