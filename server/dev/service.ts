/** Reading the captured mail for the dev-only mail page. */
import type { Db } from '../db/client.js';
import type { CapturedMailMessage } from '../../shared/schemas/dev-mail.js';
import { notFound } from '../errors.js';
import { readMessage } from '../mail/read.js';
import { findCapturedMail, listCapturedMail } from './repository.js';

export async function capturedMailList(db: Db, organisationId: number, to?: string) {
  const rows = await listCapturedMail(db, organisationId, to);
  return rows.map((r) => ({ ...r, createdAt: r.createdAt.toISOString() }));
}

/** One message with its text decoded from the raw MIME source. */
export async function capturedMailMessage(db: Db, organisationId: number, id: number): Promise<CapturedMailMessage> {
  const row = await findCapturedMail(db, organisationId, id);
  if (!row) throw notFound('No such captured message');
  const { raw, ...rest } = row;
  const read = await readMessage(raw);
  return {
    ...rest,
    createdAt: rest.createdAt.toISOString(),
    from: read.from,
    subject: read.subject || rest.subject,
    text: read.text,
    attachments: read.attachments,
  };
}
