/**
 * Discrepancy reports sent from the board page. Reads for members go through a board the
 * caller has already checked belongs to their organisation.
 */
import { and, asc, count, desc, eq, sql } from 'drizzle-orm';
import type { Db } from '../db/client.js';
import { reports, users } from '../db/schema.js';
import type { ReportStatus } from '../../shared/schemas/reports.js';

export interface ReportRow {
  id: number;
  message: string;
  reporterName: string;
  reporterContact: string;
  status: ReportStatus;
  resolvedByName: string | null;
  resolvedAt: Date | null;
  createdAt: Date;
}

export async function insertReport(db: Db, report: { boardId: number; message: string; reporterName: string; reporterContact: string }): Promise<number> {
  const [result] = await db.insert(reports).values(report);
  return result.insertId;
}

const reportColumns = {
  id: reports.id,
  message: reports.message,
  reporterName: reports.reporterName,
  reporterContact: reports.reporterContact,
  status: reports.status,
  resolvedByName: users.name,
  resolvedAt: reports.resolvedAt,
  createdAt: reports.createdAt,
};

/** Open reports first, newest first within each status. */
export async function listReports(db: Db, boardId: number): Promise<ReportRow[]> {
  const rows = await db
    .select(reportColumns)
    .from(reports)
    .leftJoin(users, eq(users.id, reports.resolvedBy))
    .where(eq(reports.boardId, boardId))
    .orderBy(asc(reports.status), desc(reports.id));
  return rows;
}

export async function findReport(db: Db, boardId: number, reportId: number): Promise<ReportRow | null> {
  const [row] = await db
    .select(reportColumns)
    .from(reports)
    .leftJoin(users, eq(users.id, reports.resolvedBy))
    .where(and(eq(reports.boardId, boardId), eq(reports.id, reportId)))
    .limit(1);
  return row ?? null;
}

export async function resolveReport(db: Db, boardId: number, reportId: number, status: Exclude<ReportStatus, 'open'>, userId: number): Promise<boolean> {
  const [result] = await db
    .update(reports)
    .set({ status, resolvedBy: userId, resolvedAt: new Date() })
    .where(and(eq(reports.boardId, boardId), eq(reports.id, reportId)));
  return result.affectedRows > 0;
}

/**
 * Open reports of the board in the row being selected from `boards`, as a column for the boards
 * list and a board's summary (a correlated count, so the reports table stays this module's).
 * Written out in SQL: Drizzle may leave column names unqualified, which inside a subquery would
 * bind to the wrong table.
 */
export const openReportsColumn = sql<number>`(SELECT COUNT(*) FROM \`reports\` AS r WHERE r.board_id = \`boards\`.\`id\` AND r.status = 'open')`;

export async function countOpenReports(db: Db, boardId: number): Promise<number> {
  const [row] = await db
    .select({ n: count() })
    .from(reports)
    .where(and(eq(reports.boardId, boardId), eq(reports.status, 'open')));
  return Number(row?.n ?? 0);
}

/** E-mail addresses of the organisation's active owners: where reports go when no contact address is set. */
export async function ownerEmails(db: Db, organisationId: number): Promise<string[]> {
  const rows = await db
    .select({ email: users.email })
    .from(users)
    .where(and(eq(users.organisationId, organisationId), eq(users.role, 'owner'), eq(users.disabled, false)));
  return rows.map((r) => r.email);
}
