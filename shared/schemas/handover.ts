/** Handing a board over to its client by e-mail: what is sent and the record of each send. */
import { z } from 'zod';
import { emailAddress as email, text } from './fields.js';

/** `POST /api/boards/:id/handover`: the client's address and an optional personal line. */
export const handoverSendSchema = z.strictObject({
  to: email,
  message: text(1000).optional(),
});
export type HandoverSend = z.infer<typeof handoverSendSchema>;

export const handoverSchema = z.object({
  id: z.number(),
  toEmail: z.string(),
  revision: z.number(),
  sentByName: z.string().nullable(),
  createdAt: z.string(),
});
export const handoverListSchema = z.object({ items: z.array(handoverSchema) });
export type Handover = z.infer<typeof handoverSchema>;
