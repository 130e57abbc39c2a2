/**
 * Use-cases for printer profiles: the tape and label printers an organisation prints images for,
 * described once so any images print can name one as `profile=<id>`.
 */
import type { Db } from '../db/client.js';
import type { PrinterProfile, PrinterProfileRecord, PrinterProfileUpdate } from '../../shared/schemas/printer-profile.js';
import { notFound, stale } from '../errors.js';
import * as repo from './repository.js';

const missing = () => notFound('No such printer profile');

export const listProfiles = (db: Db, organisationId: number) => repo.listPrinterProfiles(db, organisationId);

export async function getProfile(db: Db, organisationId: number, id: number): Promise<PrinterProfileRecord> {
  const profile = await repo.findPrinterProfile(db, organisationId, id);
  if (!profile) throw missing();
  return profile;
}

export async function createProfile(db: Db, organisationId: number, profile: PrinterProfile): Promise<PrinterProfileRecord> {
  const id = await repo.insertPrinterProfile(db, organisationId, profile);
  return getProfile(db, organisationId, id);
}

/** Replaces the profile if nobody saved it since `baseRevision` (else 409 `stale` with the current revision). */
export async function replaceProfile(db: Db, organisationId: number, id: number, update: PrinterProfileUpdate): Promise<PrinterProfileRecord> {
  const { baseRevision, ...profile } = update;
  const won = await repo.updatePrinterProfileIfAt(db, organisationId, id, baseRevision, profile);
  const now = await getProfile(db, organisationId, id);
  if (!won) throw stale('printer profile', now.revision);
  return now;
}

export async function removeProfile(db: Db, organisationId: number, id: number): Promise<void> {
  if (!(await repo.deletePrinterProfile(db, organisationId, id))) throw missing();
}
