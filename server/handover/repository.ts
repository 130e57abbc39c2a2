/** Handover records: which client address got the chart of which revision, sent by whom. */
import { desc, eq } from 'drizzle-orm';
import type { Db } from '../db/client.js';
import { handovers, users } from '../db/schema.js';

export interface HandoverRow {
  id: number;
  toEmail: string;
  revision: number;
  sentByName: string | null;
  createdAt: Date;
}

export async function insertHandover(db: Db, handover: { boardId: number; userId: number; toEmail: string; revision: number }): Promise<number> {
  const [result] = await db.insert(handovers).values(handover);
  return result.insertId;
}

/** The board is already known to be the caller's. Newest first. */
export async function listHandovers(db: Db, boardId: number): Promise<HandoverRow[]> {
  return db
    .select({ id: handovers.id, toEmail: handovers.toEmail, revision: handovers.revision, sentByName: users.name, createdAt: handovers.createdAt })
    .from(handovers)
    .leftJoin(users, eq(users.id, handovers.userId))
    .where(eq(handovers.boardId, boardId))
    .orderBy(desc(handovers.id));
}
