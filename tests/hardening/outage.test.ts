/**
 * Database outage: MariaDB stops while requests run → clear 503 answers and no crash;
 * MariaDB comes back → the same app serves again without a restart, and every write
 * acknowledged before the outage is still there.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import type { Express } from 'express';
import type { PrivateMariadb } from '../../scripts/mariadb.js';
import { TEST_PASSWORD, uniqueEmail } from '../helpers/app.js';
import { startAppOnPrivateDb, type PrivateDbApp } from '../helpers/private-db-app.js';

let running: PrivateDbApp;
let mariadb: PrivateMariadb;
let app: Express;

beforeAll(async () => {
  running = await startAppOnPrivateDb('outage');
  ({ mariadb, app } = running);
});
afterAll(async () => { await running?.close(); });

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
    await request(app).get(`/api/public/boards/${'D'.repeat(32)}`).expect(404);
    for (const email of acknowledged) {
      const agent = request.agent(app);
      const { body } = await agent.get('/api/auth/csrf');
      await agent.post('/api/auth/login').set('X-CSRF-Token', body.token).send({ email, password: TEST_PASSWORD }).expect(200);
    }
  });
});
