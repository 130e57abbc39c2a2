import nodemailer from 'nodemailer';

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
