/**
 * `npm start`: a private MariaDB (unless DATABASE_URL is set), migrations, the demo seed,
 * the client build, the local capture SMTP server, then the app on PORT. Ctrl-C stops it all.
 */
import { spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { randomBytes } from 'node:crypto';
import { join } from 'node:path';
import { startPrivateMariadb, type PrivateMariadb } from './mariadb.js';
import { checkProductionMail, configFromEnv, demoWanted } from '../server/config.js';
import { openDatabase } from '../server/db/client.js';
import { migrateDatabase } from '../server/db/migrate.js';
import { seedDemo, DEMO_USERS, DEMO_PASSWORD } from '../server/seed/index.js';
import { seedDemoBoards } from '../server/seed/boards.js';
import { startCaptureServer, type CaptureServer } from '../server/mail/capture.js';
import { startServer, type RunningServer } from '../server/server.js';

const root = join(import.meta.dirname, '..');
const dataDir = join(root, '.data');
mkdirSync(dataDir, { recursive: true });

/** A session secret generated once and kept in the data dir: never a hard-coded one. */
function sessionSecret(): string {
  if (process.env.SESSION_SECRET) return process.env.SESSION_SECRET;
  const file = join(dataDir, 'session-secret');
  if (!existsSync(file)) writeFileSync(file, randomBytes(48).toString('base64url'), { mode: 0o600 });
  return readFileSync(file, 'utf8').trim();
}

let mariadb: PrivateMariadb | null = null;
let capture: CaptureServer | null = null;
let server: RunningServer | null = null;
let stopping = false;

async function stopAll(code: number) {
  if (stopping) return;
  stopping = true;
  console.log('\nwaymark: stopping…');
  await server?.stop().catch(() => {});
  await capture?.close().catch(() => {});
  await mariadb?.stop().catch(() => {});
  process.exit(code);
}
for (const sig of ['SIGINT', 'SIGTERM', 'SIGHUP'] as const) process.on(sig, () => void stopAll(0));

try {
  checkProductionMail(process.env);
  let databaseUrl = process.env.DATABASE_URL;
  if (!databaseUrl) {
    const port = Number(process.env.WAYMARK_DB_PORT ?? 3307);
    console.log(`waymark: starting a private MariaDB on 127.0.0.1:${port} (data in .data/mariadb)…`);
    mariadb = await startPrivateMariadb({ dataDir: join(dataDir, 'mariadb'), port, supervise: true });
    databaseUrl = mariadb.url;
  }
  const database = openDatabase(databaseUrl);
  await migrateDatabase(database);
  if (demoWanted(process.env)) {
    const seeded = await seedDemo(database.db, seedDemoBoards);
    console.log(seeded === 'created' ? 'waymark: demo data created' : 'waymark: demo data already present');
  }
  await database.close();

  const useCapture = !process.env.SMTP_HOST;
  if (useCapture) {
    const probe = openDatabase(databaseUrl);
    capture = await startCaptureServer(probe.db, Number(process.env.SMTP_PORT ?? 0));
  }

  if (process.env.WAYMARK_SKIP_BUILD !== '1' || !existsSync(join(root, 'dist', 'index.html'))) {
    console.log('waymark: building the client…');
    const r = spawnSync(join(root, 'node_modules', '.bin', 'vite'), ['build', '--logLevel', 'warn'], { stdio: 'inherit', cwd: root });
    if (r.status !== 0) throw new Error('client build failed');
  }

  const config = configFromEnv(
    {
      ...process.env,
      DATABASE_URL: databaseUrl,
      SESSION_SECRET: sessionSecret(),
      ...(capture ? { SMTP_HOST: '127.0.0.1', SMTP_PORT: String(capture.port) } : {}),
    },
    { clientDir: join(root, 'dist'), devMail: useCapture },
  );
  server = await startServer(config);
  console.log(`
Waymark is running: ${config.publicBaseUrl}
${useCapture ? `Outgoing mail is captured locally (owners: ${config.publicBaseUrl}/dev/mail).\n` : ''}
${demoWanted(process.env) ? `Demo sign-ins (demo data only, password ${DEMO_PASSWORD}):\n${DEMO_USERS.map((u) => `  ${u.role.padEnd(12)} ${u.email}`).join('\n')}\n` : ''}
Press Ctrl-C to stop.`);
} catch (err) {
  console.error('waymark: could not start:', err instanceof Error ? err.message : err);
  await stopAll(1);
}
