/**
 * Rate-limit keys the database's collation would take for one another. The counters' table compares
 * text as utf8mb4_unicode_ci (case and accent blind, trailing spaces ignored: MariaDB's collation
 * rules), while a board-page token is base64url, where `aB` and `Ab` are different tokens. A key
 * differing from a stored one only in case or accents is its own counter, and never a 500.
 */
import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Options } from 'express-rate-limit';
import type { ServerConfig } from '../../server/config.js';
import { SharedLimitStore } from '../../server/http/limit-store.js';
import { client, startTestApp, type TestApp } from '../helpers/app.js';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp({ rateLimits: { publicPerMinute: 1000, reportsPerHour: 1000 } as ServerConfig['rateLimits'] });
});
afterAll(async () => {
  await t.close();
});

const store = () => {
  const s = new SharedLimitStore(t.database.db, `keys-${randomUUID().slice(0, 8)}:`);
  s.init({ windowMs: 60_000 } as Options);
  return s;
};

describe('rate-limit keys that differ only in case, accents or trailing spaces', () => {
  it('when they are counted one after the other, then each has its own count', async () => {
    const s = store();
    for (const key of ['AbCdEf', 'abcdef', 'ABCDEF', 'abcdef ', 'äbcdef']) expect((await s.increment(key)).totalHits).toBe(1);
    expect((await s.increment('abcdef')).totalHits).toBe(2);
  });

  it('when they race in one statement, then each has its own count', async () => {
    const s = store();
    const counts = await Promise.all(['Token', 'token', 'TOKEN', 'Token', 'tökén'].map((k) => s.increment(k)));
    expect(counts.map((c) => c.totalHits)).toEqual([1, 1, 1, 2, 1]);
  });

  it("when reports are sent to a board page's token and to the same token in other case, then both are answered, never 500", async () => {
    const token = 'AbCdEfGhIjKlMnOpQrStUv';
    const report = { message: 'The label on way 3 is wrong', way: 3 };
    const visitor = await client(t.app);
    const first = await visitor.post(`/api/public/boards/${token}/reports`, report);
    const second = await visitor.post(`/api/public/boards/${token.toLowerCase()}/reports`, report);
    expect([first.status, second.status]).toEqual([404, 404]); // no such board either way
  });
});
