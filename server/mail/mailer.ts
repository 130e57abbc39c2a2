import nodemailer from 'nodemailer';
import { unavailable } from '../errors.js';

export interface OutgoingMail {
  to: string;
  /** The organisation the message is sent for (its members, invitees, clients or board reports); null before one exists (a sign-up link). */
  organisationId: number | null;
  subject: string;
  text: string;
  html?: string;
  attachments?: Array<{ filename: string; content: Buffer; contentType: string }>;
}

export interface Mailer {
  send(mail: OutgoingMail): Promise<void>;
  close(): void;
}

/** The header that tells the local capture server which organisation a message was sent for. */
export const ORGANISATION_HEADER = 'X-Waymark-Organisation';

/**
 * Sends through SMTP with nodemailer: the local capture server in development and tests, a real relay in production.
 * With `tagOrganisation` (only when mail is captured) each message carries the organisation it was sent for, so the
 * captured-mail page shows an owner their own organisation's mail and nobody else's.
 */
export function smtpMailer(opts: { host: string; port: number; from: string; tagOrganisation?: boolean }): Mailer {
  const transport = nodemailer.createTransport({
    host: opts.host,
    port: opts.port,
    secure: false,
    ignoreTLS: opts.host === '127.0.0.1' || opts.host === 'localhost',
    pool: false,
  });
  return {
    async send({ organisationId, ...mail }) {
      const headers = opts.tagOrganisation && organisationId !== null ? { [ORGANISATION_HEADER]: String(organisationId) } : undefined;
      await transport.sendMail({ from: opts.from, ...mail, headers });
    },
    close: () => transport.close(),
  };
}

/** Sends one message; a relay that refuses or cannot be reached answers 503 (logged here with its cause), not 500. */
export async function deliver(mailer: Mailer, to: string, organisationId: number | null, message: { subject: string; text: string }): Promise<void> {
  try {
    await mailer.send({ to, organisationId, ...message });
  } catch (err) {
    console.error('Mail to %s not sent:', to, err);
    throw unavailable('The e-mail could not be sent; try again in a moment');
  }
}
