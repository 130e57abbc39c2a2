/**
 * Typed calls behind the board's sharing screen and the logo upload: the board page link and
 * switch, token rotation, discrepancy reports, the handover e-mail and board photos.
 * Responses are parsed with the shared schemas.
 */
import { z } from 'zod';
import { handoverListSchema, handoverSchema, type Handover, type HandoverSend } from '../../shared/schemas/handover.js';
import { photoListSchema, photoSchema, type Photo } from '../../shared/schemas/photos.js';
import { reportSchema, reportListSchema, type Report } from '../../shared/schemas/reports.js';
import { sharingSchema, type Sharing } from '../../shared/schemas/sharing.js';
import { json, send } from './http.js';

export type { Handover, Photo, Report, Sharing };

const board = (id: number | string) => `/api/boards/${encodeURIComponent(String(id))}`;

export const fetchSharing = (boardId: number | string): Promise<Sharing> => json(sharingSchema, 'GET', `${board(boardId)}/sharing`);

export const setPageEnabled = (boardId: number | string, enabled: boolean) =>
  json(z.object({ publicEnabled: z.boolean() }), 'PATCH', `${board(boardId)}/public`, { body: { enabled } });

/** A new token: the old link, and every printed QR code for it, stops working at once. */
export const rotatePageToken = (boardId: number | string) => json(z.object({ publicToken: z.string() }), 'POST', `${board(boardId)}/token/rotate`);

export const listReports = async (boardId: number | string): Promise<Report[]> => (await json(reportListSchema, 'GET', `${board(boardId)}/reports`)).items;

export const resolveReport = (boardId: number | string, reportId: number, status: 'accepted' | 'dismissed'): Promise<Report> =>
  json(reportSchema, 'PATCH', `${board(boardId)}/reports/${reportId}`, { body: { status } });

export const sendHandover = (boardId: number | string, input: HandoverSend): Promise<Handover> =>
  json(handoverSchema, 'POST', `${board(boardId)}/handover`, { body: input });

export const listHandovers = async (boardId: number | string): Promise<Handover[]> =>
  (await json(handoverListSchema, 'GET', `${board(boardId)}/handovers`)).items;

export const listPhotos = async (boardId: number | string): Promise<Photo[]> => (await json(photoListSchema, 'GET', `${board(boardId)}/photos`)).items;

export const photoUrl = (boardId: number | string, photoId: number) => `${board(boardId)}/photos/${photoId}`;

/** Multipart upload: the browser sets the boundary, so no content type is given here. */
export function uploadPhoto(boardId: number | string, file: File, caption: string): Promise<Photo> {
  const form = new FormData();
  form.append('caption', caption);
  form.append('file', file);
  return json(photoSchema, 'POST', `${board(boardId)}/photos`, { raw: form });
}

export const captionPhoto = (boardId: number | string, photoId: number, caption: string) =>
  send('PATCH', `${board(boardId)}/photos/${photoId}`, { body: { caption } });

export const deletePhoto = (boardId: number | string, photoId: number) => send('DELETE', `${board(boardId)}/photos/${photoId}`);

export const LOGO_URL = '/api/organisation/logo';

export function uploadLogo(file: File) {
  const form = new FormData();
  form.append('file', file);
  return json(z.object({ mime: z.string(), size: z.number() }), 'PUT', LOGO_URL, { raw: form });
}

export const deleteLogo = () => send('DELETE', LOGO_URL);
