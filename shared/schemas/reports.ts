/**
 * Contracts for the loop back to the contractor: discrepancy reports sent from the board
 * page, the handover e-mail to the client, board photos and the board page's sharing state.
 */
import { z } from 'zod';
import { phases } from './schedule.js';
import { singleLine, text } from './fields.js';

/** A visitor's name or contact: one line, so it can never add a line of its own to the e-mail it is quoted in. */
const optionalLine = (max: number) => singleLine(max).optional();

/**
 * `POST /api/public/boards/:token/reports`. `website` is a honeypot: people leave it empty.
 * On a three-phase board a way is one phase of a way number ("4 L2"), so `phase` may come with `way`.
 */
export const reportSubmitSchema = z.strictObject({
  message: text(1000).min(1, 'Please say what does not match'),
  way: z.number({ error: 'Way must be a number' }).int('Whole way numbers only').min(1, 'Ways start at 1').max(999, 'At most 999').nullable().optional(),
  phase: z.enum(phases, { error: "Phase must be 'L1', 'L2' or 'L3'" }).nullable().optional(),
  name: optionalLine(120),
  contact: optionalLine(254),
  website: z.string().max(500).optional(),
}).refine((r) => r.phase == null || r.way != null, { path: ['phase'], message: 'Give the way number with the phase' });
export type ReportSubmit = z.infer<typeof reportSubmitSchema>;

export const reportStatuses = ['open', 'accepted', 'dismissed'] as const;
export type ReportStatus = (typeof reportStatuses)[number];

/** `PATCH /api/boards/:id/reports/:reportId`. */
export const reportResolveSchema = z.strictObject({
  status: z.enum(['accepted', 'dismissed'], { error: "Status must be 'accepted' or 'dismissed'" }),
});
export type ReportResolve = z.infer<typeof reportResolveSchema>;

export const reportSchema = z.object({
  id: z.number(),
  message: z.string(),
  reporterName: z.string(),
  reporterContact: z.string(),
  status: z.enum(reportStatuses),
  resolvedByName: z.string().nullable(),
  resolvedAt: z.string().nullable(),
  createdAt: z.string(),
});
export const reportListSchema = z.object({ items: z.array(reportSchema) });
export type Report = z.infer<typeof reportSchema>;

const email = z.string().trim().toLowerCase().max(254, 'At most 254 characters').email('Not a valid e-mail address');

/** `POST /api/boards/:id/handover`: the client's address and an optional personal line. */
export const handoverSendSchema = z.strictObject({
  to: email,
  message: text(1000).optional(),
});
export type HandoverSend = z.infer<typeof handoverSendSchema>;

export const handoverSchema = z.object({
  id: z.number(),
  toEmail: z.string(),
  revision: z.number(),
  sentByName: z.string().nullable(),
  createdAt: z.string(),
});
export const handoverListSchema = z.object({ items: z.array(handoverSchema) });
export type Handover = z.infer<typeof handoverSchema>;

/** A board photo's caption (multipart field `caption`, or `PATCH` body). */
export const photoCaptionSchema = z.strictObject({
  caption: z.string().trim().max(200, 'At most 200 characters').default(''),
});

export const photoSchema = z.object({
  id: z.number(),
  caption: z.string(),
  mime: z.string(),
  size: z.number(),
  createdAt: z.string(),
});
export const photoListSchema = z.object({ items: z.array(photoSchema) });
export type Photo = z.infer<typeof photoSchema>;

/** `GET /api/boards/:id/sharing`: the board page's link and state, for members. */
export const sharingSchema = z.object({
  boardId: z.number(),
  name: z.string(),
  code: z.string(),
  publicEnabled: z.boolean(),
  publicUrl: z.string(),
  revision: z.number(),
  openReports: z.number(),
});
export type Sharing = z.infer<typeof sharingSchema>;
