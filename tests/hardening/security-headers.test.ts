/**
 * Pages carry the browser's page protections; built assets carry only what a sub-resource obeys.
 * A script, stylesheet or font is never rendered as a document, so a Content-Security-Policy or
 * X-Frame-Options on it protects nothing and costs bytes on every file of a first visit.
 * What each header means: W3C Content Security Policy Level 3; RFC 7034 (X-Frame-Options);
 * RFC 6797 (HSTS); the Fetch standard (X-Content-Type-Options: nosniff, Cross-Origin-Resource-Policy).
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import request from 'supertest';
import { startTestApp, type TestApp } from '../helpers/app.js';

let t: TestApp;
let clientDir: string;
beforeAll(async () => {
  clientDir = mkdtempSync(join(tmpdir(), 'waymark-client-'));
  mkdirSync(join(clientDir, 'assets'));
  writeFileSync(join(clientDir, 'index.html'), '<!doctype html><title>Waymark</title><div id="app"></div>');
  writeFileSync(join(clientDir, 'assets', 'index-abc123.js'), 'console.log(1);\n');
  t = await startTestApp({ clientDir });
});
afterAll(async () => {
  await t?.close();
  rmSync(clientDir, { recursive: true, force: true });
});

describe('security headers', () => {
  it('when a page, the board page or an API answer is fetched, then it carries the page protections', async () => {
    for (const path of ['/', '/b/some-token', '/api/health']) {
      const res = await request(t.app).get(path);
      expect(res.headers['content-security-policy'], path).toMatch(/default-src 'self'/);
      expect(res.headers['content-security-policy'], path).toMatch(/script-src 'self'/);
      expect(res.headers['x-frame-options'], path).toBe('SAMEORIGIN');
      expect(res.headers['strict-transport-security'], path).toMatch(/max-age=\d+/);
      expect(res.headers['x-content-type-options'], path).toBe('nosniff');
    }
  });

  it('when a built asset is fetched, then it keeps nosniff, same-origin and no-referrer, without the page-only headers', async () => {
    const res = await request(t.app).get('/assets/index-abc123.js');
    expect(res.status).toBe(200);
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['cross-origin-resource-policy']).toBe('same-origin');
    expect(res.headers['referrer-policy']).toBe('no-referrer');
    for (const pageOnly of ['content-security-policy', 'x-frame-options', 'strict-transport-security', 'cross-origin-opener-policy']) {
      expect(res.headers[pageOnly], pageOnly).toBeUndefined();
    }
  });

  it('when a built file that does not exist is asked for, then 404, not the page without its protections', async () => {
    const res = await request(t.app).get('/assets/no-such-file.js');
    expect(res.status).toBe(404);
    expect(res.text).not.toContain('<div id="app">');
  });

  it('when a path only looks like an asset folder, then it is treated as a page', async () => {
    const res = await request(t.app).get('/assetsX/whatever');
    expect(res.headers['content-security-policy']).toMatch(/default-src 'self'/);
  });
});
