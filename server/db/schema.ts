/**
 * The database schema. camelCase in TypeScript, snake_case in SQL.
 * A board's schedule (supply, devices, circuits) is one JSON document: it is always read
 * and saved whole against a revision number, and every saved version is kept in
 * `board_revisions`, so a normalised copy would only add joins.
 */
import { mysqlTable, int, varchar, text, boolean, datetime, mysqlEnum, uniqueIndex, index, json, customType, double, bigint } from 'drizzle-orm/mysql-core';
import { sql } from 'drizzle-orm';
import type { NoticeWordingSet } from '../../shared/schemas/notice-wording.js';

const longBlob = customType<{ data: Buffer; driverData: Buffer }>({
  dataType: () => 'longblob',
});
const mediumText = customType<{ data: string; driverData: string }>({
  dataType: () => 'mediumtext',
});

const now = () =>
  datetime('created_at', { mode: 'date', fsp: 3 })
    .notNull()
    .default(sql`CURRENT_TIMESTAMP(3)`);

export const roles = ['owner', 'electrician', 'viewer'] as const;

export const organisations = mysqlTable('organisations', {
  id: int('id').autoincrement().primaryKey(),
  name: varchar('name', { length: 120 }).notNull(),
  contactPhone: varchar('contact_phone', { length: 40 }).notNull().default(''),
  contactEmail: varchar('contact_email', { length: 254 }).notNull().default(''),
  /** Millimetre offsets applied to every PDF page, to correct a printer's feed. */
  printOffsetXMm: double('print_offset_x_mm').notNull().default(0),
  printOffsetYMm: double('print_offset_y_mm').notNull().default(0),
  /** The organisation's own wording of the notices it may reword (`shared/schemas/notice-wording.ts`); null or a notice left out: the prescribed words. */
  noticeWording: json('notice_wording').$type<NoticeWordingSet>(),
  /** Bumped by every write; a save names the revision it was made from (`WHERE revision = baseRevision`), so a stale one is 409. */
  revision: int('revision').notNull().default(1),
  createdAt: now(),
});

export const users = mysqlTable(
  'users',
  {
    id: int('id').autoincrement().primaryKey(),
    organisationId: int('organisation_id')
      .notNull()
      .references(() => organisations.id),
    email: varchar('email', { length: 254 }).notNull(),
    name: varchar('name', { length: 120 }).notNull(),
    passwordHash: varchar('password_hash', { length: 100 }).notNull(),
    role: mysqlEnum('role', roles).notNull(),
    disabled: boolean('disabled').notNull().default(false),
    createdAt: now(),
  },
  (t) => [uniqueIndex('users_email_unique').on(t.email), index('users_org_idx').on(t.organisationId)],
);

export const invitations = mysqlTable(
  'invitations',
  {
    id: int('id').autoincrement().primaryKey(),
    organisationId: int('organisation_id')
      .notNull()
      .references(() => organisations.id),
    email: varchar('email', { length: 254 }).notNull(),
    role: mysqlEnum('role', roles).notNull(),
    tokenHash: varchar('token_hash', { length: 64 }).notNull(),
    invitedBy: int('invited_by')
      .notNull()
      .references(() => users.id),
    expiresAt: datetime('expires_at', { mode: 'date', fsp: 3 }).notNull(),
    usedAt: datetime('used_at', { mode: 'date', fsp: 3 }),
    createdAt: now(),
  },
  (t) => [uniqueIndex('invitations_token_unique').on(t.tokenHash)],
);

export const passwordResets = mysqlTable(
  'password_resets',
  {
    id: int('id').autoincrement().primaryKey(),
    userId: int('user_id')
      .notNull()
      .references(() => users.id),
    tokenHash: varchar('token_hash', { length: 64 }).notNull(),
    expiresAt: datetime('expires_at', { mode: 'date', fsp: 3 }).notNull(),
    usedAt: datetime('used_at', { mode: 'date', fsp: 3 }),
    createdAt: now(),
  },
  (t) => [uniqueIndex('password_resets_token_unique').on(t.tokenHash)],
);

/**
 * A sign-up waiting for its e-mail link: nothing of the account exists until the link is used, so the
 * sign-up answer is the same whether or not the address already has an account.
 */
export const signupRequests = mysqlTable(
  'signup_requests',
  {
    id: int('id').autoincrement().primaryKey(),
    email: varchar('email', { length: 254 }).notNull(),
    name: varchar('name', { length: 120 }).notNull(),
    organisationName: varchar('organisation_name', { length: 120 }).notNull(),
    passwordHash: varchar('password_hash', { length: 100 }).notNull(),
    tokenHash: varchar('token_hash', { length: 64 }).notNull(),
    expiresAt: datetime('expires_at', { mode: 'date', fsp: 3 }).notNull(),
    usedAt: datetime('used_at', { mode: 'date', fsp: 3 }),
    createdAt: now(),
  },
  (t) => [uniqueIndex('signup_requests_token_unique').on(t.tokenHash)],
);

/** The table express-mysql-session reads and writes (its default column names). */
export const sessions = mysqlTable('sessions', {
  sessionId: varchar('session_id', { length: 128 }).primaryKey(),
  expires: int('expires', { unsigned: true }).notNull(),
  data: mediumText('data'),
});

/**
 * Rate-limit counters every app process shares (`server/http/limit-store.ts`): one row per limit and
 * key (`login-ip:…`), counting hits until `reset_at`; the next hit after that starts a new window.
 * Expired rows are deleted now and then by the store.
 */
export const rateLimitCounters = mysqlTable(
  'rate_limit_counters',
  {
    counterKey: varchar('counter_key', { length: 255 }).primaryKey(),
    hits: int('hits', { unsigned: true }).notNull(),
    resetAt: datetime('reset_at', { mode: 'date', fsp: 3 }).notNull(),
  },
  (t) => [index('rate_limit_counters_reset_idx').on(t.resetAt)],
);

/** Messages caught by the local capture SMTP server (development and tests only). */
export const capturedMail = mysqlTable('captured_mail', {
  id: int('id').autoincrement().primaryKey(),
  envelopeFrom: varchar('envelope_from', { length: 254 }).notNull(),
  envelopeTo: text('envelope_to').notNull(),
  subject: varchar('subject', { length: 500 }).notNull().default(''),
  raw: mediumText('raw').notNull(),
  /** The organisation the message was sent for; null for mail that belongs to no organisation (shown to nobody). */
  organisationId: int('organisation_id'),
  createdAt: now(),
});

export const sites = mysqlTable(
  'sites',
  {
    id: int('id').autoincrement().primaryKey(),
    organisationId: int('organisation_id')
      .notNull()
      .references(() => organisations.id),
    reference: varchar('reference', { length: 60 }).notNull(),
    clientName: varchar('client_name', { length: 120 }).notNull().default(''),
    address: text('address').notNull(),
    clientEmail: varchar('client_email', { length: 254 }).notNull().default(''),
    clientPhone: varchar('client_phone', { length: 40 }).notNull().default(''),
    notes: text('notes').notNull(),
    /** Bumped by every write; a save names the revision it was made from (`WHERE revision = baseRevision`), so a stale one is 409. */
    revision: int('revision').notNull().default(1),
    createdAt: now(),
  },
  (t) => [index('sites_org_idx').on(t.organisationId)],
);

export const boards = mysqlTable(
  'boards',
  {
    id: int('id').autoincrement().primaryKey(),
    organisationId: int('organisation_id')
      .notNull()
      .references(() => organisations.id),
    siteId: int('site_id').references(() => sites.id),
    /** Copied from the schedule so lists and searches need not parse the JSON. */
    name: varchar('name', { length: 120 }).notNull(),
    location: varchar('location', { length: 200 }).notNull().default(''),
    /** Short human code printed on the board tag and its barcode, unique everywhere. */
    code: varchar('code', { length: 16 }).notNull(),
    /** Random URL-safe token behind the QR code; rotating it retires printed tags. */
    publicToken: varchar('public_token', { length: 64 }).notNull(),
    publicEnabled: boolean('public_enabled').notNull().default(true),
    revision: int('revision').notNull().default(1),
    schedule: json('schedule').notNull(),
    /** Lower-cased words of names, locations and way texts, for the boards search. */
    searchText: mediumText('search_text').notNull(),
    createdAt: now(),
    updatedAt: datetime('updated_at', { mode: 'date', fsp: 3 })
      .notNull()
      .default(sql`CURRENT_TIMESTAMP(3)`),
    deletedAt: datetime('deleted_at', { mode: 'date', fsp: 3 }),
  },
  (t) => [uniqueIndex('boards_code_unique').on(t.code), uniqueIndex('boards_token_unique').on(t.publicToken), index('boards_org_idx').on(t.organisationId)],
);

export const boardRevisions = mysqlTable(
  'board_revisions',
  {
    id: int('id').autoincrement().primaryKey(),
    boardId: int('board_id')
      .notNull()
      .references(() => boards.id),
    number: int('number').notNull(),
    authorId: int('author_id').references(() => users.id),
    authorName: varchar('author_name', { length: 120 }).notNull(),
    summary: text('summary').notNull(),
    snapshot: json('snapshot').notNull(),
    createdAt: now(),
  },
  (t) => [uniqueIndex('board_revisions_board_number').on(t.boardId, t.number)],
);

export const prints = mysqlTable(
  'prints',
  {
    id: int('id').autoincrement().primaryKey(),
    boardId: int('board_id')
      .notNull()
      .references(() => boards.id),
    userId: int('user_id').references(() => users.id),
    userName: varchar('user_name', { length: 120 }).notNull(),
    output: varchar('output', { length: 32 }).notNull(),
    media: varchar('media', { length: 32 }).notNull(),
    revision: int('revision').notNull(),
    createdAt: now(),
  },
  (t) => [index('prints_board_idx').on(t.boardId)],
);

/** A sheet of die-cut labels, as the organisation buys it. All sizes in millimetres. */
export const sheetLayouts = mysqlTable(
  'sheet_layouts',
  {
    id: int('id').autoincrement().primaryKey(),
    organisationId: int('organisation_id')
      .notNull()
      .references(() => organisations.id),
    name: varchar('name', { length: 80 }).notNull(),
    pageWidthMm: double('page_width_mm').notNull(),
    pageHeightMm: double('page_height_mm').notNull(),
    labelWidthMm: double('label_width_mm').notNull(),
    labelHeightMm: double('label_height_mm').notNull(),
    columns: int('columns').notNull(),
    rows: int('rows').notNull(),
    marginTopMm: double('margin_top_mm').notNull(),
    marginLeftMm: double('margin_left_mm').notNull(),
    gapXMm: double('gap_x_mm').notNull().default(0),
    gapYMm: double('gap_y_mm').notNull().default(0),
    cornerRadiusMm: double('corner_radius_mm').notNull().default(0),
    /** Bumped by every write; a save names the revision it was made from (`WHERE revision = baseRevision`), so a stale one is 409. */
    revision: int('revision').notNull().default(1),
    createdAt: now(),
  },
  (t) => [index('sheet_layouts_org_idx').on(t.organisationId)],
);

/**
 * A tape or label printer an organisation prints images for: its head's resolution, the printable
 * band of each tape width it takes (`{"12": 9}`, mm; widths left out keep Waymark's usual band), the
 * unprinted margin it leaves at each end of a label, and whether it cuts between labels.
 */
export const printerProfiles = mysqlTable(
  'printer_profiles',
  {
    id: int('id').autoincrement().primaryKey(),
    organisationId: int('organisation_id')
      .notNull()
      .references(() => organisations.id),
    name: varchar('name', { length: 80 }).notNull(),
    dpi: int('dpi').notNull(),
    bands: json('bands').$type<Record<string, number>>().notNull(),
    endMarginMm: double('end_margin_mm').notNull(),
    cutsBetweenLabels: boolean('cuts_between_labels').notNull(),
    /** Bumped by every write; a save names the revision it was made from (`WHERE revision = baseRevision`), so a stale one is 409. */
    revision: int('revision').notNull().default(1),
    createdAt: now(),
  },
  (t) => [index('printer_profiles_org_idx').on(t.organisationId)],
);

export const reports = mysqlTable(
  'reports',
  {
    id: int('id').autoincrement().primaryKey(),
    boardId: int('board_id')
      .notNull()
      .references(() => boards.id),
    message: text('message').notNull(),
    reporterName: varchar('reporter_name', { length: 120 }).notNull().default(''),
    reporterContact: varchar('reporter_contact', { length: 254 }).notNull().default(''),
    status: mysqlEnum('status', ['open', 'accepted', 'dismissed']).notNull().default('open'),
    resolvedBy: int('resolved_by').references(() => users.id),
    resolvedAt: datetime('resolved_at', { mode: 'date', fsp: 3 }),
    createdAt: now(),
  },
  (t) => [index('reports_board_idx').on(t.boardId)],
);

export const handovers = mysqlTable(
  'handovers',
  {
    id: int('id').autoincrement().primaryKey(),
    boardId: int('board_id')
      .notNull()
      .references(() => boards.id),
    userId: int('user_id').references(() => users.id),
    toEmail: varchar('to_email', { length: 254 }).notNull(),
    revision: int('revision').notNull(),
    createdAt: now(),
  },
  (t) => [index('handovers_board_idx').on(t.boardId)],
);

/** Uploaded files live in the database so two app processes on one database see the same ones. */
export const files = mysqlTable(
  'files',
  {
    id: int('id').autoincrement().primaryKey(),
    organisationId: int('organisation_id')
      .notNull()
      .references(() => organisations.id),
    boardId: int('board_id').references(() => boards.id),
    kind: mysqlEnum('kind', ['logo', 'photo']).notNull(),
    mime: varchar('mime', { length: 40 }).notNull(),
    size: bigint('size', { mode: 'number' }).notNull(),
    caption: varchar('caption', { length: 200 }).notNull().default(''),
    data: longBlob('data').notNull(),
    createdAt: now(),
  },
  (t) => [index('files_org_idx').on(t.organisationId)],
);
