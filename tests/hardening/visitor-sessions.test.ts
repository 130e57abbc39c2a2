/**
 * A visitor who only fetches a CSRF token gets no session: before, every anonymous
 * `GET /api/auth/csrf` stored a session row for 14 days, and a script could add rows without limit.
 */
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { client, signupOwner, startTestApp, TEST_PASSWORD, type TestApp } from '../helpers/app.js';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => {
  await t.close();
});

const sessionCookie = (res: request.Response) => ([] as string[]).concat(res.headers['set-cookie'] ?? []).find((c) => c.startsWith('waymark.sid='));

describe('visitors and the session store', () => {
  it('when a script fetches a CSRF token 200 times, then no answer sets a session cookie and no session row is written for it', async () => {
    const rows = async () => (await t.database.pool.query('SELECT COUNT(*) AS n FROM sessions'))[0] as Array<{ n: number }>;
    const before = Number((await rows())[0].n);
    for (let i = 0; i < 200; i++) {
      const res = await request(t.app).get('/api/auth/csrf').expect(200);
      expect(sessionCookie(res)).toBeUndefined();
      expect(res.body.token).toMatch(/^[A-Za-z0-9_-]{43}$/);
    }
    // Other test files may sign in meanwhile, but not 200 times: the script's fetches left nothing.
    expect(Number((await rows())[0].n) - before).toBeLessThan(50);
  });

  it("when a visitor uses the token for a write, then it counts; a token with another browser's cookie, or none, is refused", async () => {
    const a = await client(t.app);
    const wrong = await a.post('/api/auth/login', { email: 'nobody@example.test', password: TEST_PASSWORD });
    expect(wrong.status).toBe(401); // past the CSRF check
    const b = await client(t.app);
    const swapped = await b.agent.post('/api/auth/login').set('X-CSRF-Token', a.csrf).send({ email: 'x@example.test', password: TEST_PASSWORD });
    expect(swapped.status).toBe(403);
    const bare = await request(t.app).post('/api/auth/login').set('X-CSRF-Token', a.csrf).send({ email: 'x@example.test', password: TEST_PASSWORD });
    expect(bare.status).toBe(403);
  });

  it('when a visitor signs in, then the token fetched before still works and the session is a new one', async () => {
    const owner = await signupOwner(t.app);
    await owner.post('/api/auth/logout').expect(204);
    const res = await owner.post('/api/auth/login', { email: owner.email, password: TEST_PASSWORD }).expect(200);
    expect(sessionCookie(res)).toBeDefined();
    await owner.post('/api/boards', { name: 'After sign-in' }).expect((r) => expect(r.status).not.toBe(403));
  });
});
