/** The demo seed is one transaction: a start that fails half-way leaves no half-seeded demo that reads as present. */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { findUserByEmail } from '../../server/auth/repository.js';
import { DEMO_CONTRACTOR, DEMO_USERS, seedDemo } from '../../server/seed/index.js';
import { seedDemoBoards } from '../../server/seed/boards.js';
import { organisations } from '../../server/db/schema.js';
import { startAppOnPrivateDb, type PrivateDbApp } from '../helpers/private-db-app.js';

let running: PrivateDbApp;
beforeAll(async () => {
  running = await startAppOnPrivateDb('seed');
});
afterAll(async () => {
  await running?.close();
});

describe('seeding the demo', () => {
  it('when seeding fails after the accounts are written, then nothing of the demo is left, and the next start seeds it whole', async () => {
    const db = running.database.db;
    const failing = async (tx: typeof db, organisationId: number, ownerId: number) => {
      await seedDemoBoards(tx, organisationId, ownerId);
      throw new Error('the machine lost power half-way');
    };
    await expect(seedDemo(db, failing)).rejects.toThrow(/half-way/);
    expect(await findUserByEmail(db, DEMO_USERS[0].email)).toBeNull();
    expect(await db.select().from(organisations)).toEqual([]);

    expect(await seedDemo(db, seedDemoBoards)).toBe('created');
    expect(await seedDemo(db, seedDemoBoards)).toBe('present');
    expect((await db.select().from(organisations)).map((o) => o.name)).toEqual([DEMO_CONTRACTOR]);
    expect(DEMO_CONTRACTOR).toMatch(/\(demo\)/);
  });
});
