/**
 * Discrepancy reports sent from the board page back to the contractor, and how the contractor
 * lists and resolves them. Handover, photos and sharing have their own files beside this one.
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
export const reportSubmitSchema = z
  .strictObject({
    message: text(1000).min(1, 'Please say what does not match'),
    way: z.number({ error: 'Way must be a number' }).int('Whole way numbers only').min(1, 'Ways start at 1').max(999, 'At most 999').nullable().optional(),
    phase: z.enum(phases, { error: "Phase must be 'L1', 'L2' or 'L3'" }).nullable().optional(),
    name: optionalLine(120),
    contact: optionalLine(254),
    website: z.string().max(500).optional(),
  })
  .refine((r) => r.phase == null || r.way != null, { path: ['phase'], message: 'Give the way number with the phase' });
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
  /** The way the report names, as the board writes it ("4", "4 L2"), read from the message; null when none. */
  way: z.string().nullable(),
  reporterName: z.string(),
  reporterContact: z.string(),
  status: z.enum(reportStatuses),
  resolvedByName: z.string().nullable(),
  resolvedAt: z.string().nullable(),
  createdAt: z.string(),
});
export const reportListSchema = z.object({ items: z.array(reportSchema) });
export type Report = z.infer<typeof reportSchema>;

/**
 * The way a stored report names: the server leads the message with "Way 4 L2: " when the visitor
 * picks a way, and keeps a message that already begins "way 4…". Anything else names no way.
 */
export function wayNamedIn(message: string): string | null {
  const m = /^\s*way\s*(\d{1,3})(?:\s*(L[123]))?\b/i.exec(message);
  if (!m) return null;
  return m[2] ? `${Number(m[1])} ${m[2].toUpperCase()}` : String(Number(m[1]));
}
