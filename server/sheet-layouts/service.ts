/**
 * Use-cases for sheet label layouts: the die-cut sheets an organisation buys, described once
 * so any print can go on them as `media=sheet-<id>`.
 */
import type { Db } from '../db/client.js';
import type { SheetLayout } from '../../shared/schemas/print.js';
import type { SheetLayoutRecord } from '../../shared/schemas/print-records.js';
import { notFound } from '../errors.js';
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

export async function replaceLayout(db: Db, organisationId: number, id: number, layout: SheetLayout): Promise<SheetLayoutRecord> {
  // MariaDB reports 0 affected rows for an update that changes nothing, so look the row up first.
  await getLayout(db, organisationId, id);
  await repo.updateSheetLayout(db, organisationId, id, layout);
  return getLayout(db, organisationId, id);
}

export async function removeLayout(db: Db, organisationId: number, id: number): Promise<void> {
  if (!(await repo.deleteSheetLayout(db, organisationId, id))) throw missing();
}
