/**
 * `npm start`'s own MariaDB is supervised: killed, it is started again with a back-off, and the same
 * app answers 503 while it is down and 200 once it is back, without being restarted itself.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Express } from 'express';
import { startPrivateMariadb, removeDir, type PrivateMariadb } from '../../scripts/mariadb.js';
import { openDatabase, type Database } from '../../server/db/client.js';
import { migrateDatabase } from '../../server/db/migrate.js';
import { createApp } from '../../server/app.js';
import { configFromEnv } from '../../server/config.js';
import { smtpMailer } from '../../server/mail/mailer.js';

let mariadb: PrivateMariadb;
let database: Database;
let app: Express;
let closeApp: () => Promise<void>;
const dataDir = mkdtempSync(join(tmpdir(), 'waymark-restart-'));

beforeAll(async () => {
  mariadb = await startPrivateMariadb({ dataDir, dbName: 'waymark_restart', supervise: true });
  database = openDatabase(mariadb.url, { connectionLimit: 5 });
  await migrateDatabase(database);
  const config = configFromEnv({ DATABASE_URL: mariadb.url, SESSION_SECRET: 'restart-test' }, { smtp: { host: '127.0.0.1', port: 1, from: 'x@example.test' } });
  const built = createApp({ config, database, db: database.db, mailer: smtpMailer(config.smtp) });
  app = built.app;
  closeApp = built.close;
});

afterAll(async () => {
  await closeApp?.().catch(() => {});
  await database?.close().catch(() => {});
  await mariadb?.stop();
  removeDir(dataDir);
});

async function waitForStatus(status: number, timeoutMs: number): Promise<boolean> {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    if ((await request(app).get('/api/health')).status === status) return true;
    await new Promise((r) => setTimeout(r, 100));
  }
  return false;
}

describe('the private database under supervision', () => {
  it('when mariadbd is killed, then health answers 503, and 200 again once it has restarted itself, the app untouched', async () => {
    await request(app).get('/api/health').expect(200);
    const before = mariadb.pid();
    process.kill(before, 'SIGKILL');
    expect(await waitForStatus(503, 5_000)).toBe(true);
    expect(await waitForStatus(200, 30_000)).toBe(true);
    expect(mariadb.pid()).not.toBe(before);
    expect(mariadb.pid()).toBeGreaterThan(0);
  });
});
