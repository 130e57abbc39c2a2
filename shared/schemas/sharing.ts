/** The board page's sharing state as members see it: its link and whether it is on. */
import { z } from 'zod';

/** `GET /api/boards/:id/sharing`: the board page's link and state, for members. */
export const sharingSchema = z.object({
  boardId: z.number(),
  name: z.string(),
  code: z.string(),
  publicEnabled: z.boolean(),
  publicUrl: z.string(),
  revision: z.number(),
  openReports: z.number(),
});
export type Sharing = z.infer<typeof sharingSchema>;
