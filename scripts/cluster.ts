/**
 * `npm run cluster`: a three-node MariaDB Galera cluster on loopback (data in .data/cluster/node1…3, MariaDB on
 * 3401–3403, Galera on 4561–4563, 4571–4573, 4581–4583), migrations and the demo seed once, the local capture
 * SMTP server, then two app processes on PORT and PORT + 1 (3000, 3001), each using every node. Ctrl-C stops it all.
 */
import { spawnSync, type ChildProcess } from 'node:child_process';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { randomBytes } from 'node:crypto';
import { join } from 'node:path';
import { startGaleraCluster, type GaleraCluster } from './galera.js';
import { openDatabase } from '../server/db/client.js';
import { migrateDatabase } from '../server/db/migrate.js';
import { seedDemo, DEMO_USERS, DEMO_PASSWORD } from '../server/seed/index.js';
import { seedDemoBoards } from '../server/seed/boards.js';
import { startCaptureServer, type CaptureServer } from '../server/mail/capture.js';
import { spawnServer } from '../bench/load.js';

const root = join(import.meta.dirname, '..');
const dataDir = join(root, '.data');
mkdirSync(dataDir, { recursive: true });
const firstPort = Number(process.env.PORT ?? 3000);

/** The same session secret `npm start` keeps, so both processes (and npm start) read each other's sessions. */
function sessionSecret(): string {
  if (process.env.SESSION_SECRET) return process.env.SESSION_SECRET;
  const file = join(dataDir, 'session-secret');
  if (!existsSync(file)) writeFileSync(file, randomBytes(48).toString('base64url'), { mode: 0o600 });
  return readFileSync(file, 'utf8').trim();
}

let cluster: GaleraCluster | null = null;
let capture: CaptureServer | null = null;
const apps: ChildProcess[] = [];
let stopping = false;

async function stopAll(code: number) {
  if (stopping) return;
  stopping = true;
  console.log('\nwaymark: stopping…');
  await Promise.all(apps.map((child) => new Promise((r) => (child.exitCode !== null ? r(null) : (child.once('exit', r), child.kill('SIGTERM'))))));
  await capture?.close().catch(() => {});
  await cluster?.stop().catch(() => {});
  process.exit(code);
}
for (const sig of ['SIGINT', 'SIGTERM', 'SIGHUP'] as const) process.on(sig, () => void stopAll(0));

try {
  console.log('waymark: starting a three-node Galera cluster on 127.0.0.1:3401–3403 (data in .data/cluster)…');
  // Supervised: a node that dies is started again and rejoins the other two.
  cluster = await startGaleraCluster({ dir: join(dataDir, 'cluster'), firstSqlPort: 3401, firstGroupPort: 4561, supervise: true });
  const database = openDatabase(cluster.url);
  await migrateDatabase(database);
  const seeded = await seedDemo(database.db, seedDemoBoards);
  console.log(seeded === 'created' ? 'waymark: demo data created' : 'waymark: demo data already present');
  await database.close();

  const probe = openDatabase(cluster.url);
  capture = await startCaptureServer(probe.db, 0);

  if (process.env.WAYMARK_SKIP_BUILD !== '1' || !existsSync(join(root, 'dist', 'index.html'))) {
    console.log('waymark: building the client…');
    const r = spawnSync(join(root, 'node_modules', '.bin', 'vite'), ['build', '--logLevel', 'warn'], { stdio: 'inherit', cwd: root });
    if (r.status !== 0) throw new Error('client build failed');
  }

  const env = {
    ...process.env,
    DATABASE_URL: cluster.url,
    SESSION_SECRET: sessionSecret(),
    SMTP_HOST: '127.0.0.1',
    SMTP_PORT: String(capture.port),
    WAYMARK_DEV_MAIL: 'on',
  };
  const urls: string[] = [];
  for (const port of [firstPort, firstPort + 1]) {
    const app = await spawnServer(['server/index.ts'], { ...env, PORT: String(port) });
    apps.push(app.child);
    app.child.on('exit', (code) => !stopping && console.error(`waymark: the app on port ${port} exited (${code})`));
    urls.push(`http://localhost:${app.port}`);
  }
  console.log(`
Waymark is running on a three-node Galera cluster, in two processes:
  ${urls.join('\n  ')}
Database nodes: ${cluster.url}
Outgoing mail is captured locally (owners: ${urls[0]}/dev/mail).
Demo sign-ins (demo data only, password ${DEMO_PASSWORD}):
${DEMO_USERS.map((u) => `  ${u.role.padEnd(12)} ${u.email}`).join('\n')}

Press Ctrl-C to stop.`);
} catch (err) {
  console.error('waymark: could not start the cluster:', err instanceof Error ? err.message : err);
  await stopAll(1);
}
