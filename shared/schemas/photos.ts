/** Board photos (members only, never on the board page): a caption and how a photo is listed. */
import { z } from 'zod';

/** A board photo's caption (multipart field `caption`, or `PATCH` body). */
export const photoCaptionSchema = z.strictObject({
  caption: z.string().trim().max(200, 'At most 200 characters').default(''),
});

export const photoSchema = z.object({
  id: z.number(),
  caption: z.string(),
  mime: z.string(),
  size: z.number(),
  createdAt: z.string(),
});
export const photoListSchema = z.object({ items: z.array(photoSchema) });
export type Photo = z.infer<typeof photoSchema>;
