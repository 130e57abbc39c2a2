/**
 * Inserts the demo's sites and boards (`demo-data.ts`) through the boards and sites repositories,
 * each board at revision 1 "Created" by the demo owner, with each sub-main linked to the board it
 * feeds. One transaction; an organisation that already has sites is left alone (idempotent).
 */
import { and, eq } from 'drizzle-orm';
import type { Db } from '../db/client.js';
import { users } from '../db/schema.js';
import type { Schedule } from '../../shared/schemas/schedule.js';
import type { DemoBoardsSeeder } from './index.js';
import { demoSites, type DemoBoard } from './demo-data.js';
import { createBoardRecord, type Actor } from '../boards/writes.js';
import { inTransaction } from '../db/client.js';
import { insertSite, listSites } from '../sites/repository.js';

/** The schedule with the sub-main circuits pointing at the boards they feed, now that those have ids. */
function linkSubMains(board: DemoBoard, all: DemoBoard[], ids: Map<string, number>): Schedule {
  const fed = all.filter((b) => b.feedsFromKey === board.key);
  const circuits = board.schedule.circuits.map((c) => {
    const child = fed.find((b) => b.feedsFromCircuitId === c.id);
    return child ? { ...c, feedsBoardId: ids.get(child.key)! } : c;
  });
  return { ...board.schedule, circuits };
}

/** Boards that feed others come after the boards they feed, so every link has an id to point at. */
function insertOrder(boards: DemoBoard[]): DemoBoard[] {
  const done = new Set<string>();
  const order: DemoBoard[] = [];
  while (order.length < boards.length) {
    const ready = boards.filter((b) => !done.has(b.key) && boards.every((c) => c.feedsFromKey !== b.key || done.has(c.key)));
    if (!ready.length) throw new Error('The demo boards feed each other in a loop');
    for (const b of ready) {
      done.add(b.key);
      order.push(b);
    }
  }
  return order;
}

export const seedDemoBoards: DemoBoardsSeeder = async (db: Db, organisationId: number, ownerId: number) => {
  const [owner] = await db
    .select({ name: users.name })
    .from(users)
    .where(and(eq(users.id, ownerId), eq(users.organisationId, organisationId)))
    .limit(1);
  if (!owner) throw new Error(`No owner ${ownerId} in organisation ${organisationId}`);
  const actor: Actor = { id: ownerId, name: owner.name, organisationId };
  await inTransaction(db, async (tx) => {
    if ((await listSites(tx, organisationId)).length) return;
    for (const { site, boards } of demoSites) {
      const siteId = await insertSite(tx, organisationId, site);
      const ids = new Map<string, number>();
      for (const board of insertOrder(boards)) {
        ids.set(board.key, await createBoardRecord(tx, actor, linkSubMains(board, boards, ids), siteId, 'Created', { publicEnabled: true }));
      }
    }
  });
};
