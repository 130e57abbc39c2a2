import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { users } from '../../server/db/schema.js';
import { BCRYPT_COST } from '../../server/auth/passwords.js';
import { client, signupOwner, startTestApp, TEST_PASSWORD, uniqueEmail, type TestApp } from '../helpers/app.js';

describe('sign-in rate limits', () => {
  let t: TestApp;
  // Low limits so the tests reach them; the per-IP limit is high enough not to interfere with the per-account one.
  beforeAll(async () => {
    t = await startTestApp({ rateLimits: { loginPerAccount: 3, loginPerIp: 12, publicPerMinute: 120, reportsPerHour: 10, sendsPerHour: 10_000 } });
  });
  afterAll(async () => {
    await t.close();
  });

  it('when one account gets more attempts than its limit, then 429 with Retry-After, even with the right password', async () => {
    const owner = await signupOwner(t.app);
    const c = await client(t.app);
    for (let i = 0; i < 3; i++) await c.post('/api/auth/login', { email: owner.email, password: 'wrong-password-123' }).expect(401);
    const res = await c.post('/api/auth/login', { email: owner.email, password: TEST_PASSWORD }).expect(429);
    expect(Number(res.headers['retry-after'])).toBeGreaterThan(0);
    expect(res.body.error.code).toBe('rate_limited');
  });

  it('when the limit counts an account, then the same address in capitals counts as the same account', async () => {
    const owner = await signupOwner(t.app);
    const c = await client(t.app);
    for (let i = 0; i < 3; i++) await c.post('/api/auth/login', { email: owner.email.toUpperCase(), password: 'wrong-password-123' }).expect(401);
    await c.post('/api/auth/login', { email: owner.email, password: TEST_PASSWORD }).expect(429);
  });

  it('when one account is limited, then another account can still sign in', async () => {
    const other = await signupOwner(t.app);
    await (await client(t.app)).post('/api/auth/login', { email: other.email, password: TEST_PASSWORD }).expect(200);
  });

  it('when one address tries many accounts, then the per-IP limit answers 429 with Retry-After', async () => {
    const c = await client(t.app);
    let last = 0;
    let retryAfter: string | undefined;
    for (let i = 0; i < 14 && last !== 429; i++) {
      const res = await c.post('/api/auth/login', { email: uniqueEmail('guess'), password: 'wrong-password-123' });
      last = res.status;
      retryAfter = res.headers['retry-after'];
    }
    expect(last).toBe(429);
    expect(Number(retryAfter)).toBeGreaterThan(0);
  });
});

describe('password reset request limit', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await startTestApp({ rateLimits: { loginPerAccount: 2, loginPerIp: 50, publicPerMinute: 120, reportsPerHour: 10, sendsPerHour: 10_000 } });
  });
  afterAll(async () => {
    await t.close();
  });

  it('when one address is asked for too often, then 429 with Retry-After, the same whether it exists or not', async () => {
    const owner = await signupOwner(t.app);
    const nobody = uniqueEmail('nobody');
    for (const email of [owner.email, nobody]) {
      const c = await client(t.app);
      for (let i = 0; i < 2; i++) await c.post('/api/auth/forgot', { email }).expect(204);
      const res = await c.post('/api/auth/forgot', { email }).expect(429);
      expect(Number(res.headers['retry-after'])).toBeGreaterThan(0);
    }
  });
});

describe('password hashing', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await startTestApp();
  });
  afterAll(async () => {
    await t.close();
  });

  it('when an account is made, then its password is stored as bcrypt with cost at least 10', async () => {
    const owner = await signupOwner(t.app);
    const [row] = await t.database.db.select().from(users).where(eq(users.email, owner.email));
    const [, variant, cost] = row.passwordHash.split('$');
    expect(variant).toMatch(/^2[aby]$/); // bcrypt modular crypt format
    expect(Number(cost)).toBeGreaterThanOrEqual(10); // issue 2: bcrypt cost at least 10
    expect(BCRYPT_COST).toBeGreaterThanOrEqual(10);
    expect(row.passwordHash).not.toContain(TEST_PASSWORD);
  });
});
