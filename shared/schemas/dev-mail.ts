/** The captured mail of a demo or test run (no mail relay configured): its list and one message. */
import { z } from 'zod';

/** Query of the dev-only captured mail list: optionally only messages to one address. */
export const capturedMailQuerySchema = z.strictObject({
  to: z.string().trim().max(254, 'At most 254 characters').optional(),
});

export const capturedMailSummarySchema = z.object({
  id: z.number(),
  to: z.string(),
  subject: z.string(),
  createdAt: z.string(),
});
export const capturedMailListSchema = z.object({ messages: z.array(capturedMailSummarySchema) });
export const capturedMailMessageSchema = capturedMailSummarySchema.extend({
  from: z.string(),
  text: z.string(),
  attachments: z.array(z.object({ filename: z.string(), contentType: z.string(), size: z.number() })),
});
export type CapturedMailMessage = z.infer<typeof capturedMailMessageSchema>;
