/**
 * The captured mail table: the capture SMTP server catches mail to any address, and each message
 * records the organisation it was sent for. Every read is scoped to one organisation, so an owner
 * never sees another organisation's mail (a reset link or an invitation there would be a way in).
 */
import { and, desc, eq, like } from 'drizzle-orm';
import type { Db } from '../db/client.js';
import { capturedMail } from '../db/schema.js';

/** How many messages the list shows: the newest ones are what a developer looks for. */
export const CAPTURED_MAIL_LIST_LIMIT = 100;

const summary = { id: capturedMail.id, to: capturedMail.envelopeTo, subject: capturedMail.subject, createdAt: capturedMail.createdAt };

/** Newest first; `to` keeps messages whose recipients contain it (LIKE wildcards in it are taken literally). */
export async function listCapturedMail(db: Db, organisationId: number, to?: string) {
  const own = eq(capturedMail.organisationId, organisationId);
  const where = to ? and(own, like(capturedMail.envelopeTo, `%${to.replace(/[\\%_]/g, (c) => `\\${c}`)}%`)) : own;
  return db.select(summary).from(capturedMail).where(where).orderBy(desc(capturedMail.id)).limit(CAPTURED_MAIL_LIST_LIMIT);
}

export async function findCapturedMail(db: Db, organisationId: number, id: number) {
  const [row] = await db
    .select({ ...summary, raw: capturedMail.raw })
    .from(capturedMail)
    .where(and(eq(capturedMail.id, id), eq(capturedMail.organisationId, organisationId)))
    .limit(1);
  return row ?? null;
}
