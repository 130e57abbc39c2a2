/**
 * Stored sheet label layouts, per organisation. Every query carries the organisation id,
 * so another organisation's layout id finds nothing.
 */
import { and, asc, eq, sql } from 'drizzle-orm';
import type { Db } from '../db/client.js';
import { sheetLayouts } from '../db/schema.js';
import type { SheetLayout } from '../../shared/schemas/print.js';
import type { SheetLayoutRecord } from '../../shared/schemas/print-records.js';

const columns = {
  id: sheetLayouts.id,
  name: sheetLayouts.name,
  pageWidthMm: sheetLayouts.pageWidthMm,
  pageHeightMm: sheetLayouts.pageHeightMm,
  labelWidthMm: sheetLayouts.labelWidthMm,
  labelHeightMm: sheetLayouts.labelHeightMm,
  columns: sheetLayouts.columns,
  rows: sheetLayouts.rows,
  marginTopMm: sheetLayouts.marginTopMm,
  marginLeftMm: sheetLayouts.marginLeftMm,
  gapXMm: sheetLayouts.gapXMm,
  gapYMm: sheetLayouts.gapYMm,
  cornerRadiusMm: sheetLayouts.cornerRadiusMm,
  revision: sheetLayouts.revision,
};

export async function listSheetLayouts(db: Db, organisationId: number): Promise<SheetLayoutRecord[]> {
  return db.select(columns).from(sheetLayouts).where(eq(sheetLayouts.organisationId, organisationId)).orderBy(asc(sheetLayouts.name), asc(sheetLayouts.id));
}

export async function findSheetLayout(db: Db, organisationId: number, id: number): Promise<SheetLayoutRecord | null> {
  const [row] = await db
    .select(columns)
    .from(sheetLayouts)
    .where(and(eq(sheetLayouts.id, id), eq(sheetLayouts.organisationId, organisationId)))
    .limit(1);
  return row ?? null;
}

export async function insertSheetLayout(db: Db, organisationId: number, layout: SheetLayout): Promise<number> {
  const [res] = await db
    .insert(sheetLayouts)
    .values({ ...layout, organisationId })
    .$returningId();
  return res.id;
}

/**
 * Writes only while the layout is still at `baseRevision`, bumping it: true when it did. The bump means a
 * matched row always changes, so 0 affected rows is a missing or stale row, never an unchanged one.
 */
export async function updateSheetLayoutIfAt(db: Db, organisationId: number, id: number, baseRevision: number, layout: SheetLayout): Promise<boolean> {
  const [res] = await db
    .update(sheetLayouts)
    .set({ ...layout, revision: sql`${sheetLayouts.revision} + 1` })
    .where(and(eq(sheetLayouts.id, id), eq(sheetLayouts.organisationId, organisationId), eq(sheetLayouts.revision, baseRevision)));
  return res.affectedRows > 0;
}

export async function deleteSheetLayout(db: Db, organisationId: number, id: number): Promise<boolean> {
  const [res] = await db.delete(sheetLayouts).where(and(eq(sheetLayouts.id, id), eq(sheetLayouts.organisationId, organisationId)));
  return res.affectedRows > 0;
}
