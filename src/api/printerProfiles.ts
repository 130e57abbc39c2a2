/**
 * Typed calls for tape printers: the organisation's printer profiles and the images route, which
 * answers the print page's labels as PNGs (one PNG, or a ZIP of them in print order).
 */
import { json, request, send } from './http.js';
import { printerProfileListSchema, printerProfileRecordSchema, type PrinterProfile, type PrinterProfileUpdate } from '../../shared/schemas/printer-profile.js';
import { printQuery, type PrintSelection } from './print.js';

export type { PrinterProfile, PrinterProfileRecord } from '../../shared/schemas/printer-profile.js';

export const listPrinterProfiles = () => json(printerProfileListSchema, 'GET', '/api/printer-profiles');
export const createPrinterProfile = (profile: PrinterProfile) => json(printerProfileRecordSchema, 'POST', '/api/printer-profiles', { body: profile });
/** Saves against `profile.baseRevision`; a profile saved by someone else since answers 409 (`ApiError.code === 'stale'`). */
export const updatePrinterProfile = (id: number, profile: PrinterProfileUpdate) =>
  json(printerProfileRecordSchema, 'PUT', `/api/printer-profiles/${id}`, { body: profile });
export const deletePrinterProfile = (id: number) => send('DELETE', `/api/printer-profiles/${id}`);

/** What the images are drawn for: a profile (its dpi and bands) and/or a resolution. */
export interface ImageTarget {
  profileId: number | null;
  dpi: number | null;
}

function targetQuery(target: ImageTarget): string {
  const search = new URLSearchParams();
  if (target.profileId !== null) search.set('profile', String(target.profileId));
  if (target.dpi !== null) search.set('dpi', String(target.dpi));
  return search.toString();
}

export interface FetchedImages {
  blob: Blob;
  fileName: string;
  /** One PNG (`image/png`) or a ZIP of them (`application/zip`). */
  zipped: boolean;
}

function fileNameOf(res: Response, fallback: string): string {
  const m = /filename="([^"]+)"/.exec(res.headers.get('Content-Disposition') ?? '');
  return m ? m[1] : fallback;
}

/** The selection as images, recorded in the board's print history (a POST, with the CSRF token). */
export async function fetchImages(boardId: number, selection: PrintSelection, target: ImageTarget): Promise<FetchedImages> {
  const res = await request('POST', `/api/boards/${boardId}/image/${selection.output}?${printQuery(selection)}&${targetQuery(target)}`);
  const blob = await res.blob();
  return { blob, fileName: fileNameOf(res, `${selection.output}.png`), zipped: blob.type === 'application/zip' };
}

/** The calibration page as an image for a profile, to check its band and margins by printing it once. */
export const calibrationImagePath = (media: string, target: ImageTarget) => `/api/print-settings/calibration/image?media=${media}&${targetQuery(target)}`;
