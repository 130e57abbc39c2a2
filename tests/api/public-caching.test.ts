/**
 * What a shared HTTP cache in front of the app may keep, read from the headers as RFC 9111 and
 * RFC 5861 define them: the board page (JSON and HTML shell) for a stated time with an entity tag
 * to revalidate, and nothing private: signed-in answers, 404s and 429s are `private, no-store`.
 */
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import type { ServerConfig } from '../../server/config.js';
import { startTestApp, type TestApp } from '../helpers/app.js';
import { createBoard, signupMarkedOwner } from './public-fixture.js';

/** The time the README states: a change reaches every visitor within two minutes. */
const STATED_SECONDS = 120;

let t: TestApp;
let shellDir: string;
beforeAll(async () => {
  // A stand-in client build: the shell page is served from whatever index.html the build left.
  shellDir = mkdtempSync(join(tmpdir(), 'waymark-shell-'));
  writeFileSync(join(shellDir, 'index.html'), '<!doctype html><title>Waymark</title><div id="app"></div>');
  t = await startTestApp({ clientDir: shellDir, rateLimits: { publicPerMinute: 1000 } as ServerConfig['rateLimits'] });
});
afterAll(async () => {
  await t.close();
  rmSync(shellDir, { recursive: true, force: true });
});

/** Cache-Control as directives (RFC 9111 §5.2): `public, max-age=60` → { public: true, 'max-age': 60 }. */
function directives(header: string | undefined): Record<string, number | true> {
  const out: Record<string, number | true> = {};
  for (const part of (header ?? '').split(',')) {
    const [name, value] = part.trim().toLowerCase().split('=');
    if (name) out[name] = value === undefined ? true : Number(value.replace(/"/g, ''));
  }
  return out;
}

/** How long a shared cache may hand out this answer without the app's say: fresh, then stale while revalidating (RFC 5861 §3). */
function sharedCacheSeconds(header: string | undefined): number {
  const d = directives(header);
  if (d['no-store'] || d.private) return 0;
  const fresh = Number(d['s-maxage'] ?? d['max-age'] ?? 0);
  return fresh + Number(d['stale-while-revalidate'] ?? 0);
}

const expectUncached = (res: request.Response, what = '') => {
  const d = directives(res.headers['cache-control']);
  expect(d['no-store'], `${what}: ${res.headers['cache-control']}`).toBe(true);
  expect(d.private, what).toBe(true);
};

describe('the board page in a shared cache', () => {
  it('when the page is read, then a shared cache may keep it for at most the stated time, with a strong entity tag and no cookie', async () => {
    const owner = await signupMarkedOwner(t.app);
    const board = await createBoard(owner, undefined, false);
    const res = await request(t.app).get(`/api/public/boards/${board.token}`).expect(200);
    const d = directives(res.headers['cache-control']);
    expect(d.public).toBe(true);
    expect(d['max-age']).toBeGreaterThan(0);
    expect(sharedCacheSeconds(res.headers['cache-control'])).toBeLessThanOrEqual(STATED_SECONDS);
    expect(res.headers.etag).toMatch(/^"[^"]+"$/); // RFC 9110 §8.8.3: strong, quoted
    expect(res.headers['set-cookie']).toBeUndefined();
  });

  it('when a cache revalidates with the entity tag, then 304 with the same tag and lifetime until a save, then the new page with a new tag', async () => {
    const owner = await signupMarkedOwner(t.app);
    const board = await createBoard(owner, undefined, false);
    const url = `/api/public/boards/${board.token}`;
    const first = await request(t.app).get(url).expect(200);
    const etag = first.headers.etag as string;
    // RFC 9110 §13.1.2: a matching If-None-Match on GET answers 304; RFC 9111 §4.3.4: its Cache-Control refreshes the stored copy.
    const same = await request(t.app).get(url).set('If-None-Match', etag).expect(304);
    expect(same.headers.etag).toBe(etag);
    expect(same.headers['cache-control']).toBe(first.headers['cache-control']);
    expect(same.text ?? '').toBe('');

    const current = (await owner.get(`/api/boards/${board.id}/schedule`).expect(200)).body;
    const { id: _i, revision, updatedAt: _u, code: _c, siteId: _s, ...schedule } = current;
    schedule.circuits[0].label = 'Renamed way';
    await owner.put(`/api/boards/${board.id}/schedule`, { ...schedule, baseRevision: revision }).expect(200);
    const changed = await request(t.app).get(url).set('If-None-Match', etag).expect(200);
    expect(changed.headers.etag).not.toBe(etag);
    expect(JSON.stringify(changed.body)).toContain('Renamed way');
  });

  it('when the page is switched off, then a cache that revalidates gets a 404 it may not store, and it could have served the old page no longer than the stated time', async () => {
    const owner = await signupMarkedOwner(t.app);
    const board = await createBoard(owner, undefined, false);
    const url = `/api/public/boards/${board.token}`;
    const before = await request(t.app).get(url).expect(200);
    expect(sharedCacheSeconds(before.headers['cache-control'])).toBeLessThanOrEqual(STATED_SECONDS);
    await owner.patch(`/api/boards/${board.id}/public`, { enabled: false }).expect(200);
    const off = await request(t.app).get(url).set('If-None-Match', before.headers.etag).expect(404);
    expectUncached(off);
    expect(off.headers.etag).not.toBe(before.headers.etag);
  });

  it('when the token is rotated, then the old address revalidates to an uncached 404 and the new one is cacheable', async () => {
    const owner = await signupMarkedOwner(t.app);
    const board = await createBoard(owner, undefined, false);
    const old = await request(t.app).get(`/api/public/boards/${board.token}`).expect(200);
    await owner.post(`/api/boards/${board.id}/token/rotate`).expect(200);
    expectUncached(await request(t.app).get(`/api/public/boards/${board.token}`).set('If-None-Match', old.headers.etag).expect(404));
    const fresh = (await owner.get(`/api/boards/${board.id}`).expect(200)).body.publicToken as string;
    const now = await request(t.app).get(`/api/public/boards/${fresh}`).expect(200);
    expect(directives(now.headers['cache-control']).public).toBe(true);
  });

  it("when the board page's HTML is asked for, then it is cacheable like its JSON and revalidates to 304; other screens' HTML is revalidated each time", async () => {
    const page = await request(t.app)
      .get(`/b/${'T'.repeat(32)}`)
      .expect(200);
    expect(directives(page.headers['cache-control']).public).toBe(true);
    expect(sharedCacheSeconds(page.headers['cache-control'])).toBeLessThanOrEqual(STATED_SECONDS);
    expect(page.headers['set-cookie']).toBeUndefined();
    await request(t.app)
      .get(`/b/${'T'.repeat(32)}`)
      .set('If-None-Match', page.headers.etag)
      .expect(304);
    const editor = await request(t.app).get('/boards/1').expect(200);
    expect(directives(editor.headers['cache-control'])['no-cache']).toBe(true);
  });
});

describe("the board page's first HTML in a shared cache", () => {
  it('when a board page is opened, then its HTML with the board in it is cacheable like the JSON, revalidates to 304, and after a switch-off revalidates to the plain shell', async () => {
    const owner = await signupMarkedOwner(t.app);
    const board = await createBoard(owner, undefined, false);
    const url = `/b/${board.token}`;
    const page = await request(t.app).get(url).expect(200);
    expect(page.text).toContain('Hallway consumer unit');
    expect(directives(page.headers['cache-control']).public).toBe(true);
    expect(sharedCacheSeconds(page.headers['cache-control'])).toBeLessThanOrEqual(STATED_SECONDS);
    expect(page.headers['set-cookie']).toBeUndefined();
    const json = await request(t.app).get(`/api/public/boards/${board.token}`).expect(200);
    expect(page.headers.etag).not.toBe(json.headers.etag); // one URL's tag never answers the other's request
    await request(t.app).get(url).set('If-None-Match', page.headers.etag).expect(304);

    await owner.patch(`/api/boards/${board.id}/public`, { enabled: false }).expect(200);
    const off = await request(t.app).get(url).set('If-None-Match', page.headers.etag).expect(200);
    expect(off.headers.etag).not.toBe(page.headers.etag);
    expect(off.text).not.toContain('Hallway consumer unit');
  });
});

describe('nothing private is cacheable', () => {
  it("when a member reads their boards, a board's schedule, its sharing state or who they are, then every answer is private, no-store", async () => {
    const owner = await signupMarkedOwner(t.app);
    const board = await createBoard(owner);
    for (const path of [
      '/api/auth/me',
      '/api/boards',
      `/api/boards/${board.id}/schedule`,
      `/api/boards/${board.id}/sharing`,
      '/api/organisation',
      '/api/health',
    ]) {
      expectUncached(await owner.get(path).expect(200), path);
    }
    expectUncached(await owner.get('/api/no-such-route').expect(404));
    expectUncached(await request(t.app).get('/api/auth/me').expect(401));
  });

  it('when a board page is unknown or an address is over its limit, then the 404 and the 429 are not cacheable', async () => {
    expectUncached(
      await request(t.app)
        .get(`/api/public/boards/${'U'.repeat(32)}`)
        .expect(404),
    );
    const limited = await startTestApp({ clientDir: shellDir, rateLimits: { publicPerMinute: 1 } as ServerConfig['rateLimits'] });
    try {
      await request(limited.app)
        .get(`/api/public/boards/${'U'.repeat(32)}`)
        .expect(404);
      expectUncached(
        await request(limited.app)
          .get(`/api/public/boards/${'U'.repeat(32)}`)
          .expect(429),
      );
      // The page's HTML counts against the same limit, and its 429 is not cacheable either.
      expectUncached(
        await request(limited.app)
          .get(`/b/${'U'.repeat(32)}`)
          .expect(429),
      );
    } finally {
      await limited.close();
    }
  });
});
