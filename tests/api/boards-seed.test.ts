import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { asc, eq } from 'drizzle-orm';
import { client, startTestApp, type TestApp } from '../helpers/app.js';
import { boardRevisions, boards, sites, users } from '../../server/db/schema.js';
import { DEMO_PASSWORD, DEMO_USERS, seedDemo } from '../../server/seed/index.js';
import { seedDemoBoards } from '../../server/seed/boards.js';
import { demoSites } from '../../server/seed/demo-data.js';
import { readStoredSchedule } from '../../server/boards/stored.js';
import { isDuplicateKey } from '../../server/db/errors.js';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => {
  await t.close();
});

/** Other test files share this database and may seed the demo too: a clash on the unique e-mail means it is already there. */
async function seedOnce(): Promise<void> {
  try {
    await seedDemo(t.database.db, seedDemoBoards);
  } catch (err) {
    if (!isDuplicateKey(err)) throw err;
  }
}

async function demoOrganisation() {
  const [owner] = await t.database.db.select().from(users).where(eq(users.email, DEMO_USERS[0].email));
  const orgSites = await t.database.db.select().from(sites).where(eq(sites.organisationId, owner.organisationId)).orderBy(asc(sites.id));
  const orgBoards = await t.database.db.select().from(boards).where(eq(boards.organisationId, owner.organisationId)).orderBy(asc(boards.id));
  return { owner, orgSites, orgBoards };
}

describe('demo seed', () => {
  it('when the demo is seeded twice, then its sites and boards exist once, each at revision 1 "Created"', async () => {
    await seedOnce();
    await seedOnce();
    const { owner, orgSites, orgBoards } = await demoOrganisation();
    expect(orgSites.map((s) => s.reference)).toEqual(demoSites.map((d) => d.site.reference));
    expect(orgBoards).toHaveLength(demoSites.reduce((n, d) => n + d.boards.length, 0));
    for (const b of orgBoards) {
      const revisions = await t.database.db.select().from(boardRevisions).where(eq(boardRevisions.boardId, b.id));
      expect(revisions.map((r) => [r.number, r.summary, r.authorName])).toEqual([[1, 'Created', owner.name]]);
    }
    // a second call of the board seeder alone adds nothing either
    await seedDemoBoards(t.database.db, owner.organisationId, owner.id);
    expect((await demoOrganisation()).orgBoards).toHaveLength(orgBoards.length);
  });

  it("when a demo board is fed by a sub-main, then that circuit names the sub-board's id", async () => {
    await seedOnce();
    const { orgBoards } = await demoOrganisation();
    const linked = demoSites.flatMap((s) => s.boards).filter((b) => b.feedsFromKey);
    expect(linked.length).toBeGreaterThan(0);
    for (const sub of linked) {
      const subRow = orgBoards.find((b) => b.name === sub.schedule.board.name)!;
      const feeder = demoSites.flatMap((s) => s.boards).find((b) => b.key === sub.feedsFromKey)!;
      const feederRow = orgBoards.find((b) => b.name === feeder.schedule.board.name)!;
      const [row] = await t.database.db.select().from(boards).where(eq(boards.id, feederRow.id));
      const circuit = readStoredSchedule(row.schedule).circuits.find((c) => c.id === sub.feedsFromCircuitId)!;
      expect(circuit.kind).toBe('sub-main');
      expect(circuit.feedsBoardId).toBe(subRow.id);
    }
  });

  it('when the demo owner signs in, then the boards list, a schedule and its check answer', async () => {
    await seedOnce();
    const c = await client(t.app);
    await c.post('/api/auth/login', { email: DEMO_USERS[0].email, password: DEMO_PASSWORD }).expect(200);
    const list = (await c.get('/api/boards').expect(200)).body;
    expect(list.total).toBeGreaterThanOrEqual(3);
    const studio = (await c.get('/api/boards?q=studio').expect(200)).body.items;
    expect(studio.length).toBeGreaterThan(0);
    const first = list.items[0];
    const schedule = (await c.get(`/api/boards/${first.id}/schedule`).expect(200)).body;
    expect(schedule.circuits.length).toBe(first.circuitCount);
    expect(Array.isArray((await c.get(`/api/boards/${first.id}/check`).expect(200)).body.findings)).toBe(true);
  });
});
