/**
 * Reads a captured raw message (as the capture SMTP server stored it) into the parts the
 * dev mail page shows. mailparser handles the MIME details: transfer encodings, multipart
 * bodies with attachments, encoded headers.
 */
import { simpleParser } from 'mailparser';

export interface ReadMessage {
  from: string;
  subject: string;
  text: string;
  attachments: Array<{ filename: string; contentType: string; size: number }>;
}

/** Parses one raw RFC 5322 message. An HTML-only message falls back to its text rendering. */
export async function readMessage(raw: string): Promise<ReadMessage> {
  const mail = await simpleParser(raw, { skipImageLinks: true });
  return {
    from: mail.from?.text ?? '',
    subject: mail.subject ?? '',
    text: (mail.text ?? '').replace(/\s+$/, ''),
    attachments: mail.attachments.map((a) => ({
      filename: a.filename ?? '',
      contentType: a.contentType,
      size: a.size,
    })),
  };
}
