/**
 * Database outage: MariaDB stops while requests run → clear 503 answers and no crash;
 * MariaDB comes back → the same app serves again without a restart, and every write
 * acknowledged before the outage is still there.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import type { Express } from 'express';
import type { PrivateMariadb } from '../../scripts/mariadb.js';
import { insertOwnerAccount, TEST_PASSWORD, uniqueEmail } from '../helpers/app.js';
import { startAppOnPrivateDb, type PrivateDbApp } from '../helpers/private-db-app.js';

let running: PrivateDbApp;
let mariadb: PrivateMariadb;
let app: Express;

beforeAll(async () => {
  running = await startAppOnPrivateDb('outage');
  ({ mariadb, app } = running);
});
afterAll(async () => {
  await running?.close();
});

/** Signs an owner in on the app (the account is made in its database: this app has no mail to send a sign-up link). */
async function signedInOwner(email: string) {
  await insertOwnerAccount(running.database, email, 'Outage Ltd', 'Olwen');
  const agent = request.agent(app);
  const { body } = await agent.get('/api/auth/csrf');
  await agent.post('/api/auth/login').set('X-CSRF-Token', body.token).send({ email, password: TEST_PASSWORD }).expect(200);
  return { agent, csrf: body.token as string };
}

describe('when the database goes away and comes back', () => {
  it('then requests get 503 during the outage, the app keeps running, and acknowledged writes survive', async () => {
    const { agent: signedIn, csrf } = await signedInOwner(uniqueEmail('session'));
    const acknowledged: number[] = [];
    for (let i = 0; i < 5; i++) {
      const res = await signedIn
        .post('/api/boards')
        .set('X-CSRF-Token', csrf)
        .send({ name: `Before the outage ${i}` });
      expect(res.status).toBe(201);
      acknowledged.push(res.body.id as number);
    }
    await signedIn.get('/api/auth/me').expect(200);

    await mariadb.stop();
    const during = await Promise.all([
      request(app).get('/api/health'),
      signedIn.get('/api/auth/me'),
      // Board-page reads go out together in one statement; its failure must reach each of them.
      ...['D', 'E', 'F'].map((c) => request(app).get(`/api/public/boards/${c.repeat(32)}`)),
    ]);
    // A CSRF token needs no database (it is signed, not stored), so a visitor can still fetch one.
    await request(app).get('/api/auth/csrf').expect(200);
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
    await request(app)
      .get(`/api/public/boards/${'D'.repeat(32)}`)
      .expect(404);
    for (const id of acknowledged) await signedIn.get(`/api/boards/${id}/schedule`).expect(200);
  });
});
