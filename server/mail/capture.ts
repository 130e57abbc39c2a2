/**
 * The local capture SMTP server: accepts every message on loopback and stores it in the
 * `captured_mail` table, where the dev-only mail page and the tests read it. Never used in production.
 */
import { SMTPServer } from 'smtp-server';
import { simpleParser } from 'mailparser';
import type { Db } from '../db/client.js';
import { capturedMail } from '../db/schema.js';
import { ORGANISATION_HEADER } from './mailer.js';

export interface CaptureServer {
  port: number;
  close(): Promise<void>;
}

/** The subject (encoded words decoded) and the sending organisation's header, read by mailparser. */
async function headersOf(raw: string): Promise<{ subject: string; organisation: number }> {
  const mail = await simpleParser(raw, { skipHtmlToText: true, skipTextToHtml: true, skipImageLinks: true });
  const org = mail.headers.get(ORGANISATION_HEADER.toLowerCase());
  return { subject: mail.subject ?? '', organisation: Number(typeof org === 'string' ? org.trim() : NaN) };
}

export async function startCaptureServer(db: Db, port = 0): Promise<CaptureServer> {
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['AUTH', 'STARTTLS'],
    logger: false,
    size: 30 * 1024 * 1024,
    onData(stream, session, callback) {
      const chunks: Buffer[] = [];
      stream.on('data', (c: Buffer) => chunks.push(c));
      stream.on('end', async () => {
        try {
          const raw = Buffer.concat(chunks).toString('utf8');
          const { subject, organisation } = await headersOf(raw);
          await db.insert(capturedMail).values({
            organisationId: Number.isInteger(organisation) && organisation > 0 ? organisation : null,
            envelopeFrom: session.envelope.mailFrom ? session.envelope.mailFrom.address : '',
            envelopeTo: session.envelope.rcptTo.map((r) => r.address).join(', '),
            subject: subject.slice(0, 500),
            raw,
          });
          callback();
        } catch (err) {
          callback(err as Error);
        }
      });
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, '127.0.0.1', () => resolve());
  });
  const address = server.server.address();
  const actual = typeof address === 'object' && address ? address.port : port;
  return { port: actual, close: () => new Promise<void>((r) => server.close(() => r())) };
}
