/**
 * Typed calls for the mail the local capture server caught (development and tests only).
 * The endpoint answers 404 when capture is off, which is how the app knows to hide the page.
 */
import { capturedMailListSchema, capturedMailMessageSchema, type CapturedMailMessage } from '../../shared/schemas/dev-mail.js';
import type { z } from 'zod';
import { ApiError, json } from './http.js';

export type CapturedMailSummary = z.infer<typeof capturedMailListSchema>['messages'][number];

export async function listCapturedMail(): Promise<CapturedMailSummary[]> {
  return (await json(capturedMailListSchema, 'GET', '/api/dev/mail')).messages;
}

export async function fetchCapturedMail(id: number): Promise<CapturedMailMessage> {
  return json(capturedMailMessageSchema, 'GET', `/api/dev/mail/${id}`);
}

/** True when this server captures mail (and the member may read it); false on 404 or 403. */
export async function capturedMailAvailable(): Promise<boolean> {
  try {
    await listCapturedMail();
    return true;
  } catch (err) {
    if (err instanceof ApiError && (err.status === 404 || err.status === 403)) return false;
    throw err;
  }
}
