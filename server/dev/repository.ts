/**
 * The captured mail table. It is the one mailbox of a development machine (the capture SMTP
 * server catches mail to any address), not an organisation's data, so it is not scoped.
 */
import { desc, eq, like } from 'drizzle-orm';
import type { Db } from '../db/client.js';
import { capturedMail } from '../db/schema.js';

/** How many messages the list shows: the newest ones are what a developer looks for. */
export const CAPTURED_MAIL_LIST_LIMIT = 100;

const summary = { id: capturedMail.id, to: capturedMail.envelopeTo, subject: capturedMail.subject, createdAt: capturedMail.createdAt };

/** Newest first; `to` keeps messages whose recipients contain it (LIKE wildcards in it are taken literally). */
export async function listCapturedMail(db: Db, to?: string) {
  const query = db.select(summary).from(capturedMail);
  const filtered = to ? query.where(like(capturedMail.envelopeTo, `%${to.replace(/[\\%_]/g, (c) => `\\${c}`)}%`)) : query;
  return filtered.orderBy(desc(capturedMail.id)).limit(CAPTURED_MAIL_LIST_LIMIT);
}

export async function findCapturedMail(db: Db, id: number) {
  const [row] = await db.select({ ...summary, raw: capturedMail.raw }).from(capturedMail).where(eq(capturedMail.id, id)).limit(1);
  return row ?? null;
}
