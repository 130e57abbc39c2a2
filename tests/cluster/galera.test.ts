/**
 * The app on a three-node MariaDB Galera cluster (issue 15): a save through one node is read through another, the
 * one-winner rule for saves holds across nodes, and a node killed in the middle of saves and board-page reads loses
 * no acknowledged save, causes no 5xx, and rejoins.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { client, signupOwner, TEST_PASSWORD, type Client, type TestApp } from '../helpers/app.js';
import { createBoardWith, makeSchedule } from '../helpers/boards.js';
import { conflictCount, onNode, startTestAppOn, startTestCluster, type TestCluster } from '../helpers/galera.js';
import type { Schedule } from '../../shared/schemas/schedule.js';

let cluster: TestCluster;
const apps: TestApp[] = [];
const app = async (url: string) => {
  const t = await startTestAppOn(url);
  apps.push(t);
  return t;
};

beforeAll(async () => {
  cluster = await startTestCluster();
}, 180_000);
afterAll(async () => {
  for (const t of apps) await t.close().catch(() => {});
  await cluster?.close();
}, 60_000);

/** The same member signed in on another app (sessions live in the database, so any node's app knows them). */
async function signIn(t: TestApp, email: string): Promise<Client> {
  const c = await client(t.app);
  await c.post('/api/auth/login', { email, password: TEST_PASSWORD }).expect(200);
  return c;
}

/** Waits (up to 30 s) until node 1 sees a cluster of `size`: Galera drops a silent member after its suspect timeout. */
async function sizeBecomes(size: number): Promise<boolean> {
  for (const deadline = Date.now() + 30_000; Date.now() < deadline; await new Promise((r) => setTimeout(r, 250))) {
    if ((await cluster.clusterSize(cluster.nodes[0])) === size) return true;
  }
  return false;
}

/** The schedule with way 1's label changed: each save below is told apart by it. */
const labelled = (schedule: Schedule, label: string): Schedule => ({
  ...schedule,
  circuits: schedule.circuits.map((c, i) => (i === 0 ? { ...c, label } : c)),
});

describe('the app on a three-node Galera cluster', () => {
  let nodeA: TestApp;
  let nodeC: TestApp;
  let ownerA: Client & { email: string };
  let ownerC: Client;

  beforeAll(async () => {
    nodeA = await app(cluster.nodes[0].url);
    nodeC = await app(cluster.nodes[2].url);
    ownerA = await signupOwner(nodeA.app, 'Galera Electrical');
    ownerC = await signIn(nodeC, ownerA.email);
  });

  it('when a board is saved through node A, then node C reads the saved revision at once', async () => {
    const schedule = labelled(makeSchedule(6), 'Written on A');
    const board = await createBoardWith(ownerA, schedule);
    const onC = await ownerC.get(`/api/boards/${board.id}/schedule`).expect(200);
    expect(onC.body.revision).toBe(board.revision);
    expect(onC.body.circuits[0].label).toBe('Written on A');
  });

  it('when the same revision is saved through node A and node C at once, then one gets 200 and the other 409, five times over', async () => {
    const schedule = makeSchedule(6);
    const board = await createBoardWith(ownerA, schedule);
    const conflictsBefore = await conflictCount(cluster.nodes);
    let revision = board.revision;
    for (let round = 1; round <= 5; round++) {
      const [a, c] = await Promise.all([
        ownerA.put(`/api/boards/${board.id}/schedule`, { ...labelled(schedule, `A ${round}`), baseRevision: revision }),
        ownerC.put(`/api/boards/${board.id}/schedule`, { ...labelled(schedule, `C ${round}`), baseRevision: revision }),
      ]);
      expect([a.status, c.status].sort()).toEqual([200, 409]);
      const winner = a.status === 200 ? `A ${round}` : `C ${round}`;
      revision++;
      for (const reader of [ownerA, ownerC]) {
        const now = await reader.get(`/api/boards/${board.id}/schedule`).expect(200);
        expect(now.body.revision).toBe(revision);
        expect(now.body.circuits[0].label).toBe(winner);
      }
    }
    const history = await onNode<{ n: number }>(cluster.nodes[1], 'SELECT COUNT(*) AS n FROM board_revisions WHERE board_id = ?', [board.id]);
    expect(Number(history[0].n)).toBe(revision);
    console.log(`cluster test: ${(await conflictCount(cluster.nodes)) - conflictsBefore} Galera certification conflicts in the five races`);
  });
});

describe('a node killed in the middle of saves and board-page reads', () => {
  it('when node 2 is killed, then no acknowledged save is lost, nothing answers 5xx, the others serve, and node 2 rejoins', async () => {
    const first = await app(cluster.url);
    const second = await app(cluster.url);
    const owner = await signupOwner(first.app, 'Galera Outage Ltd');
    const owners = [owner, await signIn(second, owner.email)];
    const schedule = makeSchedule(8);
    const board = await createBoardWith(owner, schedule);
    await owner.patch(`/api/boards/${board.id}/public`, { enabled: true }).expect(200);
    const token = String((await owner.get(`/api/boards/${board.id}/sharing`).expect(200)).body.publicUrl)
      .split('/')
      .pop();

    const acknowledged = new Map<number, string>();
    const statuses: number[] = [];
    /** Each 5xx with what was asked and the error's code, so a failure says which request and why. */
    const failures: string[] = [];
    let killedAt = 0;
    let servedAfterKill = 0;
    let stop = false;
    const note = (status: number, what = '', body: { error?: { code?: string } } = {}) => {
      statuses.push(status);
      if (status >= 500) failures.push(`${what} ${status} ${body.error?.code ?? ''}`);
      if (killedAt && status < 400) servedAfterKill++;
    };
    const saves = (async () => {
      let revision = board.revision;
      for (let n = 1; !stop; n++) {
        const label = `Save ${n}`;
        const res = await owners[n % 2].put(`/api/boards/${board.id}/schedule`, { ...labelled(schedule, label), baseRevision: revision });
        note(res.status, 'PUT schedule', res.body);
        if (res.status === 200) acknowledged.set((revision = res.body.revision), label);
        // A 409 here is a save the app had committed just as its node went away: read where the board is now.
        else if (res.status === 409) revision = (await owners[0].get(`/api/boards/${board.id}/schedule`)).body.revision;
      }
    })();
    const reads = (async () => {
      for (let n = 0; !stop; n++) {
        const res = await (n % 2 ? owners[1] : owners[0]).get(`/api/public/boards/${token}`);
        note(res.status, 'GET board page', res.body);
      }
    })();

    await new Promise((r) => setTimeout(r, 1500));
    const victim = cluster.nodes[1];
    process.kill(victim.pid(), 'SIGKILL');
    killedAt = Date.now();
    // Long enough for the others to notice (Galera suspects a silent member after 5 s) and go on without it.
    await new Promise((r) => setTimeout(r, 9000));
    stop = true;
    await Promise.all([saves, reads]);

    expect(failures).toEqual([]);
    expect(statuses.filter((s) => s >= 500)).toEqual([]);
    expect(servedAfterKill).toBeGreaterThan(20);
    expect(acknowledged.size).toBeGreaterThan(5);
    expect(await sizeBecomes(2)).toBe(true);

    await victim.start();
    expect(await cluster.clusterSize(victim)).toBe(3);
    // Every acknowledged save, read on each node: the rejoined one has caught up too.
    for (const node of cluster.nodes) {
      const rows = await onNode<{ number: number; label: string }>(
        node,
        "SELECT number, JSON_UNQUOTE(JSON_EXTRACT(snapshot, '$.circuits[0].label')) AS label FROM board_revisions WHERE board_id = ?",
        [board.id],
      );
      const stored = new Map(rows.map((r) => [Number(r.number), r.label]));
      for (const [revision, label] of acknowledged) expect(stored.get(revision), `${node.name} revision ${revision}`).toBe(label);
    }
    console.log(`cluster test: ${acknowledged.size} saves acknowledged, ${statuses.length} answers, ${servedAfterKill} served after the kill`);
  }, 120_000);
});
