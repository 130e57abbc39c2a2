/**
 * The notice wording an organisation may make its own: the notices whose words BS 7671 prescribes and
 * a reader acts on (periodic inspection, RCD test, mixed wiring colours). Kept per organisation and
 * printed the same on every one of its boards; a notice without its own wording prints the prescribed words.
 */
import { z } from 'zod';
import { baseRevision, singleLine, text } from './fields.js';

export const editableNoticeKinds = ['inspection', 'rcd-test', 'mixed-colours'] as const;
export type EditableNoticeKind = (typeof editableNoticeKinds)[number];

/** Longest heading: it is set large on a notice, so a short line (our choice). */
export const NOTICE_TITLE_MAX = 60;
/** Longest wording: the longest prescribed wording (the RCD notice, about 330 characters) with room to spare (our choice). */
export const NOTICE_BODY_MAX = 500;

/** One notice's heading and wording. The wording may run on several lines as typed; it prints as one paragraph. */
export const noticeWordingSchema = z.strictObject({
  title: singleLine(NOTICE_TITLE_MAX).min(1, 'Required'),
  body: text(NOTICE_BODY_MAX).min(1, 'Required'),
});
export type NoticeWording = z.infer<typeof noticeWordingSchema>;

/** The organisation's own wordings, by notice; a notice left out prints the prescribed words. */
export const noticeWordingSetSchema = z.partialRecord(z.enum(editableNoticeKinds), noticeWordingSchema);
export type NoticeWordingSet = z.infer<typeof noticeWordingSetSchema>;

/**
 * `PUT /api/organisation/notice-wording`: one notice's wording, or `null` to go back to the prescribed
 * words, saved against the organisation's revision (its settings and offsets share the row; a stale one is 409).
 */
export const noticeWordingSaveSchema = z.strictObject({
  kind: z.enum(editableNoticeKinds, { error: `One of: ${editableNoticeKinds.join(', ')}` }),
  wording: noticeWordingSchema.nullable(),
  baseRevision,
});
export type NoticeWordingSave = z.infer<typeof noticeWordingSaveSchema>;

/** One notice as the settings screen shows it: the prescribed words, the organisation's own, the regulation. */
export const noticeWordingEntrySchema = z.object({
  kind: z.enum(editableNoticeKinds),
  /** Printed on the notice whatever the wording, e.g. "BS 7671 514.12.1". */
  regulation: z.string(),
  prescribed: noticeWordingSchema,
  custom: noticeWordingSchema.nullable(),
});
export type NoticeWordingEntry = z.infer<typeof noticeWordingEntrySchema>;

/** `GET` and `PUT /api/organisation/notice-wording`: every editable notice, and the organisation's revision for the next save. */
export const noticeWordingListSchema = z.object({
  notices: z.array(noticeWordingEntrySchema),
  revision: z.number().int(),
});
export type NoticeWordingList = z.infer<typeof noticeWordingListSchema>;
