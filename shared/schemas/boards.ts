/**
 * The boards API contracts besides the schedule itself (that is `schedule.ts`): lists, summaries,
 * revisions, diffs and the small writes. The server parses requests with these; the client parses
 * responses with them.
 */
import { z } from 'zod';
import { singleLine } from './fields.js';
import { scheduleSchema } from './schedule.js';
import { templateIdSchema } from '../schedule/templates.js';

const id = z.number({ error: 'Must be a number' }).int('Must be a whole number').positive('Must be positive').max(2_147_483_647, 'Too large');
const queryInt = (min: number, max: number) =>
  z.coerce.number({ error: 'Must be a number' }).int('Must be a whole number').min(min, `At least ${min}`).max(max, `At most ${max}`);
const queryFlag = z.enum(['true', 'false', '1', '0'], { error: 'Use true or false' }).transform((v) => v === 'true' || v === '1');

/** `GET /api/boards?q=&page=&pageSize=&siteId=&deleted=`: `deleted=true` lists the deleted boards (to restore). */
export const boardListQuerySchema = z.object({
  q: z.string().trim().max(200, 'At most 200 characters').optional(),
  page: queryInt(1, 100_000).default(1),
  pageSize: queryInt(1, 100).default(20),
  siteId: queryInt(1, 2_147_483_647).optional(),
  deleted: queryFlag.default(false),
});
export type BoardListQuery = z.infer<typeof boardListQuerySchema>;

export const boardListItemSchema = z.object({
  id: z.number(),
  name: z.string(),
  location: z.string(),
  code: z.string(),
  siteId: z.number().nullable(),
  siteReference: z.string().nullable(),
  revision: z.number(),
  updatedAt: z.string(),
  circuitCount: z.number(),
  /** Reports from the board page that no one has accepted or dismissed yet. */
  openReports: z.number(),
  deletedAt: z.string().nullable(),
});
export type BoardListItem = z.infer<typeof boardListItemSchema>;

export const boardListResponseSchema = z.object({
  items: z.array(boardListItemSchema),
  total: z.number(),
  page: z.number(),
  pageSize: z.number(),
});
export type BoardListResponse = z.infer<typeof boardListResponseSchema>;

/** `POST /api/boards`: `template` is a starting layout id from `shared/schedule/templates.ts`; without one, an empty board. */
export const boardCreateSchema = z.strictObject({
  name: singleLine(120).min(1, 'Required'),
  location: singleLine(200).optional(),
  siteId: id.nullable().optional(),
  template: templateIdSchema.optional(),
});
export type BoardCreate = z.infer<typeof boardCreateSchema>;

export const createdSchema = z.object({ id: z.number() });

/** `PATCH /api/boards/:id`: move a board to another site (or to none with null). */
export const boardPatchSchema = z.strictObject({ siteId: id.nullable().optional() });
export type BoardPatch = z.infer<typeof boardPatchSchema>;

/** `PATCH /api/boards/:id/public`: switch the public board page on or off. */
export const boardPublicSchema = z.strictObject({ enabled: z.boolean({ error: 'Must be true or false' }) });

/** `GET /api/boards/:id`: what the board's pages need besides the schedule. */
export const boardSummarySchema = z.object({
  id: z.number(),
  name: z.string(),
  location: z.string(),
  code: z.string(),
  publicEnabled: z.boolean(),
  /** Behind the QR code: `<publicBaseUrl>/b/<publicToken>`. */
  publicToken: z.string(),
  revision: z.number(),
  createdAt: z.string(),
  updatedAt: z.string(),
  circuitCount: z.number(),
  /** Reports from the board page that no one has accepted or dismissed yet. */
  openReports: z.number(),
  siteId: z.number().nullable(),
  /** The board's site; its client's e-mail is where the handover goes unless the electrician types another. */
  site: z.object({ id: z.number(), reference: z.string(), clientName: z.string(), clientEmail: z.string() }).nullable(),
});
export type BoardSummary = z.infer<typeof boardSummarySchema>;

/** `PUT /api/boards/:id/schedule` and the CSV import: `changed` is false when the save changed nothing (no revision made). */
export const saveResultSchema = z.object({ revision: z.number(), summary: z.string(), changed: z.boolean() });
export type SaveResult = z.infer<typeof saveResultSchema>;

/** The 409 body of a stale save: the standard error plus the board's current revision. */
export const staleResponseSchema = z.object({
  error: z.object({ code: z.literal('stale'), message: z.string(), fields: z.record(z.string(), z.string()).optional() }),
  revision: z.number(),
});

export const revisionListItemSchema = z.object({
  number: z.number(),
  authorName: z.string(),
  createdAt: z.string(),
  summary: z.string(),
});
export type RevisionListItem = z.infer<typeof revisionListItemSchema>;
export const revisionListResponseSchema = z.object({ items: z.array(revisionListItemSchema) });

/** `GET /api/boards/:id/revisions/:number`: the schedule exactly as saved in that revision. */
export const revisionSnapshotSchema = revisionListItemSchema.extend({ schedule: scheduleSchema });
export type RevisionSnapshot = z.infer<typeof revisionSnapshotSchema>;

/** `GET /api/boards/:id/diff?from=&to=` */
export const diffQuerySchema = z.object({ from: queryInt(1, 2_147_483_647), to: queryInt(1, 2_147_483_647) });
export const diffResponseSchema = z.object({
  from: z.number(),
  to: z.number(),
  changes: z.array(
    z.object({
      path: z.string(),
      kind: z.enum(['added', 'removed', 'changed']),
      before: z.unknown().optional(),
      after: z.unknown().optional(),
      text: z.string(),
    }),
  ),
  summary: z.string(),
});
export type DiffResponse = z.infer<typeof diffResponseSchema>;

/** `POST /api/boards/:id/circuits/import-csv` as JSON (a `text/csv` body takes `?baseRevision=` instead). */
export const circuitCsvImportSchema = z.strictObject({
  csv: z.string({ error: 'csv must be text' }).min(1, 'The file is empty').max(4_000_000, 'The file is too large'),
  baseRevision: z.number({ error: 'baseRevision is required' }).int().min(1),
});
export const baseRevisionQuerySchema = z.object({ baseRevision: queryInt(1, 2_147_483_647) });

/** `POST /api/boards/:id/changeover/apply`: make the new board's circuits and devices from the survey's plan. */
export const changeoverApplySchema = z.strictObject({
  baseRevision: z.number({ error: 'baseRevision is required' }).int().min(1),
});
/** Its answer: the save's outcome and the circuits the plan made or updated, by id. */
export const changeoverApplyResponseSchema = z.object({
  revision: z.number().int(),
  summary: z.string(),
  changed: z.boolean(),
  created: z.array(z.string()),
  updated: z.array(z.string()),
});
export type ChangeoverApplyResponse = z.infer<typeof changeoverApplyResponseSchema>;
