/**
 * Data access for the print records (the `prints` table), the one table printing owns. The board,
 * its revisions, the organisation and its logo are read through their own domains' repositories.
 * Callers have already found the board within the caller's organisation.
 */
import { desc, eq } from 'drizzle-orm';
import type { Db } from '../db/client.js';
import { prints } from '../db/schema.js';

export interface NewPrintRecord {
  boardId: number;
  userId: number;
  userName: string;
  output: string;
  media: string;
  revision: number;
}

/** Records prints in one statement, so a pack's files are recorded together or not at all. */
export async function insertPrints(db: Db, records: NewPrintRecord[]): Promise<void> {
  if (records.length) await db.insert(prints).values(records);
}

/** A board's print history, newest first (capped: the page shows recent prints, not an archive). */
export async function listPrints(db: Db, boardId: number, limit = 200) {
  return db
    .select({
      id: prints.id,
      output: prints.output,
      media: prints.media,
      revision: prints.revision,
      userName: prints.userName,
      createdAt: prints.createdAt,
    })
    .from(prints)
    .where(eq(prints.boardId, boardId))
    .orderBy(desc(prints.id))
    .limit(limit);
}
