import nodemailer from 'nodemailer';
import { unavailable } from '../errors.js';

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  html?: string;
  attachments?: Array<{ filename: string; content: Buffer; contentType: string }>;
}

export interface Mailer {
  send(mail: OutgoingMail): Promise<void>;
  close(): void;
}

/** Sends through SMTP with nodemailer: the local capture server in development and tests, a real relay in production. */
export function smtpMailer(opts: { host: string; port: number; from: string }): Mailer {
  const transport = nodemailer.createTransport({
    host: opts.host,
    port: opts.port,
    secure: false,
    ignoreTLS: opts.host === '127.0.0.1' || opts.host === 'localhost',
    pool: false,
  });
  return {
    async send(mail) {
      await transport.sendMail({ from: opts.from, ...mail });
    },
    close: () => transport.close(),
  };
}

/** Sends one message; a relay that refuses or cannot be reached answers 503 (logged here with its cause), not 500. */
export async function deliver(mailer: Mailer, to: string, message: { subject: string; text: string }): Promise<void> {
  try {
    await mailer.send({ to, ...message });
  } catch (err) {
    console.error('Mail to %s not sent:', to, err);
    throw unavailable('The e-mail could not be sent; try again in a moment');
  }
}
