/**
 * The board page's first HTML across a release: the HTML names the build's hashed scripts, so an
 * entity tag from the old build must not revalidate (RFC 9110 §8.8.3: a strong tag changes with the
 * representation; §13.1.2: If-None-Match answers 304 only while it matches), or a cache keeps HTML
 * whose scripts the new build no longer serves.
 */
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import type { ServerConfig } from '../../server/config.js';
import { startTestApp, type TestApp } from '../helpers/app.js';
import { createBoard, signupMarkedOwner } from './public-fixture.js';

/** A stand-in build whose shell names its own script, as vite's hashed file names do. */
function build(script: string): string {
  const dir = mkdtempSync(join(tmpdir(), 'waymark-release-'));
  writeFileSync(join(dir, 'index.html'), `<!doctype html><title>Waymark</title><div id="app"></div><script type="module" src="/assets/${script}"></script>`);
  return dir;
}

const limits = { publicPerMinute: 1000 } as ServerConfig['rateLimits'];
let before: TestApp;
let after: TestApp;
let dirs: string[];
beforeAll(async () => {
  dirs = [build('index-AAAA1111.js'), build('index-BBBB2222.js')];
  before = await startTestApp({ clientDir: dirs[0], rateLimits: limits });
  after = await startTestApp({ clientDir: dirs[1], rateLimits: limits });
});
afterAll(async () => {
  await before.close();
  await after.close();
  for (const dir of dirs) rmSync(dir, { recursive: true, force: true });
});

describe("the board page's first HTML after a release", () => {
  it('when a cache revalidates with the old build’s tag, then it gets the new HTML naming the new script, not 304', async () => {
    const owner = await signupMarkedOwner(before.app);
    const board = await createBoard(owner, undefined, false);
    const url = `/b/${board.token}`;
    const old = await request(before.app).get(url).expect(200);
    expect(old.text).toContain('index-AAAA1111.js');
    // The same release still revalidates: the tag is stable while board and build are.
    await request(before.app).get(url).set('If-None-Match', old.headers.etag).expect(304);

    const fresh = await request(after.app).get(url).set('If-None-Match', old.headers.etag).expect(200);
    expect(fresh.text).toContain('index-BBBB2222.js');
    expect(fresh.text).toContain('Hallway consumer unit');
    expect(fresh.headers.etag).not.toBe(old.headers.etag);
  });
});
