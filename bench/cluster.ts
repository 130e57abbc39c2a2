/**
 * The app on a three-node Galera cluster (issue 15): board-page reads per second against one app process and against
 * two, then a stream of saves and board-page reads through both while one node is SIGKILLed: how many saves were
 * acknowledged, how many of those any node lost, how many answers were 5xx.
 */
import type { ChildProcess } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { isNull } from 'drizzle-orm';
import mysql from 'mysql2/promise';
import { startGaleraCluster, type GaleraCluster } from '../scripts/galera.js';
import { removeDir } from '../scripts/mariadb.js';
import { openDatabase } from '../server/db/client.js';
import { migrateDatabase } from '../server/db/migrate.js';
import { boards } from '../server/db/schema.js';
import { seedDemo, DEMO_PASSWORD, DEMO_USERS } from '../server/seed/index.js';
import { seedDemoBoards } from '../server/seed/boards.js';
import { measure, productionServerEnv, spawnServer } from './load.js';

export interface ClusterFigures {
  nodes: number;
  killed: number;
  acknowledged: number;
  lost: number;
  errors5xx: number;
  rpsOneProcess: number;
  rpsTwoProcesses: number;
}

/** A cookie-keeping fetch for one signed-in member, aimed at either process. */
async function signedIn(base: string) {
  const cookies = new Map<string, string>();
  const call = async (url: string, method = 'GET', body?: unknown, csrf?: string) => {
    const headers: Record<string, string> = { 'Content-Type': 'application/json', Cookie: [...cookies].map(([k, v]) => `${k}=${v}`).join('; ') };
    if (csrf) headers['X-CSRF-Token'] = csrf;
    const res = await fetch(url, { method, headers, body: body === undefined ? undefined : JSON.stringify(body) });
    for (const set of res.headers.getSetCookie()) {
      const [pair] = set.split(';');
      cookies.set(pair.slice(0, pair.indexOf('=')), pair.slice(pair.indexOf('=') + 1));
    }
    const text = await res.text();
    return { status: res.status, body: text.startsWith('{') ? JSON.parse(text) : null };
  };
  const csrf = (await call(`${base}/api/auth/csrf`)).body.token as string;
  const owner = DEMO_USERS.find((u) => u.role === 'owner')!;
  await call(`${base}/api/auth/login`, 'POST', { email: owner.email, password: DEMO_PASSWORD }, csrf);
  return { call, csrf };
}

/** Saves through both processes in turn and board-page reads, while `during` runs (it kills a node). */
async function savesAndReads(bases: string[], boardId: number, token: string, during: () => Promise<void>) {
  const member = await signedIn(bases[0]);
  const path = `/api/boards/${boardId}/schedule`;
  const { id: _i, revision: start, updatedAt: _u, code: _c, siteId: _s, ...schedule } = (await member.call(`${bases[0]}${path}`)).body;
  const acknowledged = new Map<number, string>();
  let errors5xx = 0;
  let stop = false;
  const saves = (async () => {
    let revision = start as number;
    for (let n = 1; !stop; n++) {
      const label = `Bench save ${n}`;
      const circuits = schedule.circuits.map((c: { label: string }, i: number) => (i === 0 ? { ...c, label } : c));
      const res = await member.call(`${bases[n % 2]}${path}`, 'PUT', { ...schedule, circuits, baseRevision: revision }, member.csrf);
      if (res.status >= 500) errors5xx++;
      if (res.status === 200) acknowledged.set((revision = res.body.revision), label);
      else if (res.status === 409) revision = (await member.call(`${bases[0]}${path}`)).body.revision;
    }
  })();
  const reads = (async () => {
    for (let n = 0; !stop; n++) if ((await fetch(`${bases[n % 2]}/api/public/boards/${token}`)).status >= 500) errors5xx++;
  })();
  await during();
  stop = true;
  await Promise.all([saves, reads]);
  return { acknowledged, errors5xx };
}

/** Acknowledged saves missing from any node's history (each node asked directly). */
async function lostOnAnyNode(cluster: GaleraCluster, boardId: number, acknowledged: Map<number, string>): Promise<number> {
  const lost = new Set<number>();
  for (const node of cluster.nodes) {
    const conn = await mysql.createConnection({ uri: node.url });
    const [rows] = await conn.query(
      "SELECT number, JSON_UNQUOTE(JSON_EXTRACT(snapshot, '$.circuits[0].label')) AS label FROM board_revisions WHERE board_id = ?",
      [boardId],
    );
    await conn.end();
    const stored = new Map((rows as Array<{ number: number; label: string }>).map((r) => [Number(r.number), r.label]));
    for (const [revision, label] of acknowledged) if (stored.get(revision) !== label) lost.add(revision);
  }
  return lost.size;
}

export async function benchCluster(opts: { seconds: number; connections: number }): Promise<ClusterFigures> {
  const dir = mkdtempSync(join(tmpdir(), 'waymark-bench-cluster-'));
  const cluster = await startGaleraCluster({ dir, dbName: 'waymark_bench', durable: false });
  const children: ChildProcess[] = [];
  try {
    const database = openDatabase(cluster.url);
    await migrateDatabase(database);
    await seedDemo(database.db, seedDemoBoards);
    const [board] = await database.db.select({ id: boards.id, token: boards.publicToken }).from(boards).where(isNull(boards.deletedAt)).limit(1);
    await database.close();
    const env = productionServerEnv(cluster.url);
    const bases: string[] = [];
    for (let i = 0; i < 2; i++) {
      const app = await spawnServer(['server/index.ts'], env);
      children.push(app.child);
      bases.push(`http://127.0.0.1:${app.port}`);
    }
    const page = (base: string) => `${base}/api/public/boards/${board.token}`;
    await measure(page(bases[0]), 1, 10); // warm-up: connections open, the projection cached
    const one = await measure(page(bases[0]), opts.seconds, opts.connections);
    const two = await Promise.all(bases.map((b) => measure(page(b), opts.seconds, opts.connections / 2)));

    const victim = cluster.nodes[1];
    const { acknowledged, errors5xx } = await savesAndReads(bases, board.id, board.token, async () => {
      await new Promise((r) => setTimeout(r, 1500));
      process.kill(victim.pid(), 'SIGKILL');
      await new Promise((r) => setTimeout(r, 9000));
    });
    await victim.start();
    return {
      nodes: await cluster.clusterSize(victim),
      killed: 1,
      acknowledged: acknowledged.size,
      lost: await lostOnAnyNode(cluster, board.id, acknowledged),
      errors5xx,
      rpsOneProcess: one.rps,
      rpsTwoProcesses: two.reduce((n, f) => n + f.rps, 0),
    };
  } finally {
    for (const c of children) c.kill('SIGTERM');
    await cluster.stop();
    removeDir(dir);
  }
}

/** Runs the cluster bench and adds `cluster` to bench-results.json; prints the figures and any target missed. */
export async function benchClusterInto(resultsFile: string, opts: { seconds: number }): Promise<void> {
  console.log('== Three-node Galera cluster: board page on one vs two app processes, then node 2 SIGKILLed mid-stream');
  const cluster = await benchCluster({ seconds: opts.seconds, connections: 50 });
  console.table([cluster]);
  const results = existsSync(resultsFile) ? JSON.parse(readFileSync(resultsFile, 'utf8')) : {};
  writeFileSync(resultsFile, JSON.stringify({ ...results, cluster }, null, 2) + '\n');
  const missed = [
    ...(cluster.lost ? [`cluster lost ${cluster.lost} acknowledged saves (target 0)`] : []),
    ...(cluster.errors5xx ? [`cluster answered 5xx ${cluster.errors5xx} times (target 0)`] : []),
    ...(cluster.rpsTwoProcesses < 1.6 * cluster.rpsOneProcess
      ? [`cluster two processes ${cluster.rpsTwoProcesses} rps < 1.6 × one ${cluster.rpsOneProcess}`]
      : []),
  ];
  console.log(missed.length ? `Cluster targets missed:\n  ${missed.join('\n  ')}` : 'Cluster targets met.');
}
