/** A stranger cannot lock the real owner out by guessing passwords from another address. */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { ServerConfig } from '../../server/config.js';
import { client, signupOwner, startTestApp, TEST_PASSWORD, type TestApp } from '../helpers/app.js';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp({ trustProxy: 1, rateLimits: { loginPerAccount: 10, loginPerIp: 50 } as ServerConfig['rateLimits'] });
});
afterAll(async () => {
  await t.close();
});

const login = async (from: string, email: string, password: string) => {
  const c = await client(t.app);
  return c.agent.post('/api/auth/login').set('X-CSRF-Token', c.csrf).set('X-Forwarded-For', from).send({ email, password });
};

describe('sign-in limits', () => {
  it('when ten wrong passwords come from one address, then that address is stopped but the owner signs in from another', async () => {
    const owner = await signupOwner(t.app);
    for (let i = 0; i < 10; i++) expect((await login('203.0.113.7', owner.email, 'wrong-password-xx')).status).toBe(401);
    expect((await login('203.0.113.7', owner.email, TEST_PASSWORD)).status).toBe(429);
    expect((await login('198.51.100.20', owner.email, TEST_PASSWORD)).status).toBe(200);
  });
});
