/**
 * Rate limits are counted in MariaDB, so app processes on one database share them: two apps
 * (as two processes behind a balancer would be) do not double a limit, racing hits are each counted
 * once, sign-in still locks after N tries, and ended windows are deleted.
 */
import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { like } from 'drizzle-orm';
import type { Options } from 'express-rate-limit';
import type { ServerConfig } from '../../server/config.js';
import { rateLimitCounters } from '../../server/db/schema.js';
import { deleteExpiredCounters, SharedLimitStore } from '../../server/http/limit-store.js';
import { client, signupOwner, startTestApp, TEST_PASSWORD, type TestApp } from '../helpers/app.js';

const LOGIN_PER_ACCOUNT = 3;
const PUBLIC_PER_MINUTE = 10;
const limits = { loginPerAccount: LOGIN_PER_ACCOUNT, loginPerIp: 1000, publicPerMinute: PUBLIC_PER_MINUTE, reportsPerHour: 10, sendsPerHour: 100_000 };

let a: TestApp;
let b: TestApp;
beforeAll(async () => {
  // One deployment, two processes: the same counters (scope), each app its own pool and its own limiter objects.
  const rateLimitScope = `shared-${randomUUID().slice(0, 8)}:`;
  a = await startTestApp({ rateLimitScope, rateLimits: limits as ServerConfig['rateLimits'] });
  b = await startTestApp({ rateLimitScope, rateLimits: limits as ServerConfig['rateLimits'] });
});
afterAll(async () => {
  await a.close();
  await b.close();
});

describe('limits shared by two app processes', () => {
  it('when wrong passwords for one account are spread over two apps, then the account locks after N tries in all, not N on each', async () => {
    const owner = await signupOwner(a.app);
    const [onA, onB] = [await client(a.app), await client(b.app)];
    const wrong = { email: owner.email, password: 'wrong-password-123' };
    await onA.post('/api/auth/login', wrong).expect(401);
    await onB.post('/api/auth/login', wrong).expect(401);
    await onA.post('/api/auth/login', wrong).expect(401);
    // Three tries in all: both apps now refuse, even the right password.
    const refused = await onB.post('/api/auth/login', { email: owner.email, password: TEST_PASSWORD }).expect(429);
    expect(refused.body.error.code).toBe('rate_limited');
    expect(Number(refused.headers['retry-after'])).toBeGreaterThan(0);
    await onA.post('/api/auth/login', { email: owner.email, password: TEST_PASSWORD }).expect(429);
  });

  it('when many board-page reads race on both apps at once, then exactly the limit get through and the rest get 429', async () => {
    const reads = Array.from({ length: 3 * PUBLIC_PER_MINUTE }, (_, i) => request(i % 2 ? a.app : b.app).get(`/api/public/boards/${'Q'.repeat(32)}`));
    const statuses = (await Promise.all(reads)).map((r) => r.status);
    expect(statuses.filter((s) => s !== 429)).toHaveLength(PUBLIC_PER_MINUTE);
    expect(statuses.filter((s) => s === 429)).toHaveLength(2 * PUBLIC_PER_MINUTE);
    expect(statuses.filter((s) => s !== 429 && s !== 404)).toEqual([]); // an unknown board: 404, never 500
  });
});

describe('the shared store itself', () => {
  const store = (prefix: string, windowMs: number) => {
    const s = new SharedLimitStore(a.database.db, prefix);
    s.init({ windowMs } as Options);
    return s;
  };

  it('when a window ends, then the next hit starts again at 1 and the ended row is deleted by the sweep', async () => {
    const prefix = `sweep-${randomUUID().slice(0, 8)}:`;
    const short = store(prefix, 200);
    expect((await short.increment('k')).totalHits).toBe(1);
    const second = await short.increment('k');
    expect(second.totalHits).toBe(2);
    expect(second.resetTime!.getTime()).toBeGreaterThan(Date.now() - 1000);
    await new Promise((r) => setTimeout(r, 300));
    expect(await short.get('k')).toBeUndefined();
    expect((await short.increment('k')).totalHits).toBe(1);
    await short.increment('gone');
    await new Promise((r) => setTimeout(r, 300));
    expect(await deleteExpiredCounters(a.database.db)).toBeGreaterThanOrEqual(2);
    const left = await a.database.db
      .select()
      .from(rateLimitCounters)
      .where(like(rateLimitCounters.counterKey, `${prefix}%`));
    expect(left).toEqual([]);
  });

  it('when twenty hits of one key race in one process, then they are counted together and each gets its own count, 1 to 20', async () => {
    const racing = store(`race-${randomUUID().slice(0, 8)}:`, 60_000);
    const counts = await Promise.all(Array.from({ length: 20 }, () => racing.increment('k')));
    expect(counts.map((c) => c.totalHits).sort((x, y) => x - y)).toEqual(Array.from({ length: 20 }, (_, i) => i + 1));
    expect((await racing.get('k'))?.totalHits).toBe(20);
  });

  it('when a key is longer than the column, then it is counted under its hash, apart from a key that shares its start', async () => {
    const long = store(`long-${randomUUID().slice(0, 8)}:`, 60_000);
    const base = 'x'.repeat(300);
    expect((await long.increment(`${base}1`)).totalHits).toBe(1);
    expect((await long.increment(`${base}1`)).totalHits).toBe(2);
    expect((await long.increment(`${base}2`)).totalHits).toBe(1);
  });
});
