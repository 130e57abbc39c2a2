/**
 * Use-cases for sheet label layouts: the die-cut sheets an organisation buys, described once
 * so any print can go on them as `media=sheet-<id>`.
 */
import type { Db } from '../db/client.js';
import type { SheetLayout, SheetLayoutUpdate } from '../../shared/schemas/print.js';
import type { SheetLayoutRecord } from '../../shared/schemas/print-records.js';
import { notFound, stale } from '../errors.js';
import * as repo from './repository.js';

const missing = () => notFound('No such sheet layout');

export const listLayouts = (db: Db, organisationId: number) => repo.listSheetLayouts(db, organisationId);

export async function getLayout(db: Db, organisationId: number, id: number): Promise<SheetLayoutRecord> {
  const layout = await repo.findSheetLayout(db, organisationId, id);
  if (!layout) throw missing();
  return layout;
}

export async function createLayout(db: Db, organisationId: number, layout: SheetLayout): Promise<SheetLayoutRecord> {
  const id = await repo.insertSheetLayout(db, organisationId, layout);
  return getLayout(db, organisationId, id);
}

/** Replaces the layout if nobody saved it since `baseRevision` (else 409 `stale` with the current revision). */
export async function replaceLayout(db: Db, organisationId: number, id: number, update: SheetLayoutUpdate): Promise<SheetLayoutRecord> {
  const { baseRevision, ...layout } = update;
  const won = await repo.updateSheetLayoutIfAt(db, organisationId, id, baseRevision, layout);
  const now = await getLayout(db, organisationId, id);
  if (!won) throw stale('sheet layout', now.revision);
  return now;
}

export async function removeLayout(db: Db, organisationId: number, id: number): Promise<void> {
  if (!(await repo.deleteSheetLayout(db, organisationId, id))) throw missing();
}
