/**
 * Database outage: MariaDB stops while requests run → clear 503 answers and no crash;
 * MariaDB comes back → the same app serves again without a restart, and every write
 * acknowledged before the outage is still there.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { startPrivateMariadb, removeDir, type PrivateMariadb } from '../../scripts/mariadb.js';
import { openDatabase, type Database } from '../../server/db/client.js';
import { migrateDatabase } from '../../server/db/migrate.js';
import { createApp } from '../../server/app.js';
import { configFromEnv } from '../../server/config.js';
import { smtpMailer } from '../../server/mail/mailer.js';
import type { Express } from 'express';
import { TEST_PASSWORD, uniqueEmail } from '../helpers/app.js';

let mariadb: PrivateMariadb;
let database: Database;
let app: Express;
let closeApp: () => Promise<void>;
const dataDir = mkdtempSync(join(tmpdir(), 'waymark-outage-'));

beforeAll(async () => {
  mariadb = await startPrivateMariadb({ dataDir, dbName: 'waymark_outage' });
  database = openDatabase(mariadb.url, { connectionLimit: 5 });
  await migrateDatabase(database);
  const config = configFromEnv({ DATABASE_URL: mariadb.url, SESSION_SECRET: 'outage-test' }, { smtp: { host: '127.0.0.1', port: 1, from: 'x@example.test' } });
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

async function signup(agent: ReturnType<typeof request.agent>, email: string) {
  const { body } = await agent.get('/api/auth/csrf');
  return agent.post('/api/auth/signup').set('X-CSRF-Token', body.token).send({ organisation: 'Outage Ltd', name: 'Olwen', email, password: TEST_PASSWORD });
}

describe('when the database goes away and comes back', () => {
  it('then requests get 503 during the outage, the app keeps running, and acknowledged writes survive', async () => {
    const acknowledged: string[] = [];
    for (let i = 0; i < 5; i++) {
      const email = uniqueEmail('before');
      const res = await signup(request.agent(app), email);
      expect(res.status).toBe(201);
      acknowledged.push(email);
    }
    const signedIn = request.agent(app);
    await signup(signedIn, uniqueEmail('session'));
    await signedIn.get('/api/auth/me').expect(200);

    await mariadb.stop();
    const during = await Promise.all([
      request(app).get('/api/health'),
      signedIn.get('/api/auth/me'),
      request(app).get('/api/auth/csrf'),
      // Board-page reads go out together in one statement; its failure must reach each of them.
      ...['D', 'E', 'F'].map((c) => request(app).get(`/api/public/boards/${c.repeat(32)}`)),
    ]);
    for (const res of during) {
      expect(res.status).toBe(503);
      expect(res.body.error.message).toMatch(/database is unavailable/i);
    }

    await mariadb.start();
    let health = 0;
    for (let i = 0; i < 50 && health !== 200; i++) {
      health = (await request(app).get('/api/health')).status;
      if (health !== 200) await new Promise((r) => setTimeout(r, 200));
    }
    expect(health).toBe(200);
    await signedIn.get('/api/auth/me').expect(200);
    await request(app).get(`/api/public/boards/${'D'.repeat(32)}`).expect(404);
    for (const email of acknowledged) {
      const agent = request.agent(app);
      const { body } = await agent.get('/api/auth/csrf');
      await agent.post('/api/auth/login').set('X-CSRF-Token', body.token).send({ email, password: TEST_PASSWORD }).expect(200);
    }
  });
});
