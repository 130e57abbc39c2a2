/**
 * Every text response of the board page and the editor goes out compressed: brotli to a client
 * that accepts it, gzip to one that accepts only gzip. The browser records what each page loads;
 * each URL is then fetched again over plain HTTP with a chosen Accept-Encoding and decoded with
 * node:zlib (a decoder independent of the server), and the bytes are compared with the file in dist/.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { request as httpRequest, type IncomingHttpHeaders } from 'node:http';
import { join } from 'node:path';
import { brotliDecompressSync, gunzipSync } from 'node:zlib';
import type { Page, Response } from 'playwright-core';
import { demoSites } from '../../server/seed/demo-data.js';
import { startBrowserApp, signedInOwnerPage, type BrowserApp } from '../helpers/browser.js';

let app: BrowserApp;
beforeAll(async () => {
  app = await startBrowserApp();
});
afterAll(async () => {
  await app?.close();
});

const DIST = join(import.meta.dirname, '..', '..', 'dist');
const flatMain = demoSites[0].boards.find((b) => b.key === 'flat-main')!.schedule;
/** The server's threshold for compressing dynamic responses (bytes); smaller JSON goes out as it is. */
const DYNAMIC_THRESHOLD = 1024;
const TEXT_TYPE = /^(text\/|application\/(javascript|json)|image\/svg\+xml)/;

interface Raw {
  status: number;
  headers: IncomingHttpHeaders;
  body: Buffer;
}

/** A GET with exactly the Accept-Encoding given (node:http adds none of its own and decodes nothing). */
function rawGet(url: string, acceptEncoding: string, cookie = ''): Promise<Raw> {
  return new Promise((resolve, reject) => {
    const req = httpRequest(url, { headers: { 'Accept-Encoding': acceptEncoding, ...(cookie ? { Cookie: cookie } : {}) } }, (res) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => resolve({ status: res.statusCode ?? 0, headers: res.headers, body: Buffer.concat(chunks) }));
      res.on('error', reject);
    });
    req.on('error', reject);
    req.end();
  });
}

function decode(raw: Raw): Buffer {
  const encoding = raw.headers['content-encoding'];
  if (encoding === 'br') return brotliDecompressSync(raw.body);
  if (encoding === 'gzip') return gunzipSync(raw.body);
  return raw.body;
}

/** The built file a URL is served from: an asset under dist/, or the shell page for a client route. */
function distFile(url: string): string | null {
  const path = new URL(url).pathname;
  // A live board page is the shell with the board in it (server/public/page-html.ts): made per board, not a file.
  if (path.startsWith('/api/') || /^\/b\/[^/]+$/.test(path)) return null;
  return path.startsWith('/assets/') ? join(DIST, path) : join(DIST, 'index.html');
}

/** The shell page's own scripts, stylesheets and preloads, as a visitor's first request finds them. */
function shellAssetUrls(): string[] {
  const html = readFileSync(join(DIST, 'index.html'), 'utf8');
  return [...html.matchAll(/(?:src|href)="(\/assets\/[^"]+\.(?:js|css))"/g)].map((m) => new URL(m[1], app.baseUrl).toString());
}

/** Bytes received for a page: all responses, and its text responses alone (fonts and images are sent as they are). */
interface Loaded {
  urls: Set<string>;
  browserCodings: Map<string, string>;
  wireBytes: number;
  plainBytes: number;
  textWire: number;
  textPlain: number;
}

/** Opens a path, recording every same-origin text response and the bytes it took on the wire. */
async function load(page: Page, path: string, ready: (p: Page) => Promise<unknown>): Promise<Loaded> {
  const responses: Response[] = [];
  page.on('response', (r) => {
    if (r.url().startsWith(app.baseUrl)) responses.push(r);
  });
  await page.goto(path, { waitUntil: 'networkidle' });
  await ready(page);
  const loaded: Loaded = { urls: new Set(), browserCodings: new Map(), wireBytes: 0, plainBytes: 0, textWire: 0, textPlain: 0 };
  for (const r of responses) {
    const sizes = await r.request().sizes();
    const wire = sizes.responseBodySize + sizes.responseHeadersSize;
    const plain = (await r.body().catch(() => Buffer.alloc(0))).length + sizes.responseHeadersSize;
    loaded.wireBytes += wire;
    loaded.plainBytes += plain;
    if (r.status() === 200 && TEXT_TYPE.test(r.headers()['content-type'] ?? '')) {
      loaded.urls.add(r.url());
      loaded.browserCodings.set(r.url(), (await r.allHeaders())['content-encoding'] ?? 'none');
      loaded.textWire += wire;
      loaded.textPlain += plain;
    }
  }
  return loaded;
}

/** Fetches each URL as a br client and as a gzip-only client and checks what came back. */
async function expectCompressed(urls: Iterable<string>, cookie = ''): Promise<void> {
  for (const url of urls) {
    for (const [accept, expected] of [
      ['gzip, deflate, br', 'br'],
      ['gzip', 'gzip'],
    ] as const) {
      const raw = await rawGet(url, accept, cookie);
      expect(raw.status, url).toBe(200);
      const file = distFile(url);
      const body = decode(raw);
      if (!file && body.length < DYNAMIC_THRESHOLD) continue;
      expect(raw.headers['content-encoding'], `${url} to a client accepting ${accept}`).toBe(expected);
      expect(String(raw.headers.vary ?? '').toLowerCase(), url).toContain('accept-encoding');
      if (file) {
        expect(body.equals(readFileSync(file)), `${url} decoded (${expected}) equals ${file}`).toBe(true);
        expect(raw.headers['content-type'], url).toMatch(TEXT_TYPE);
      } else if (new URL(url).pathname.startsWith('/b/')) {
        expect(body.toString('utf8'), url).toContain('<div id="app"><style>');
      } else {
        expect(() => JSON.parse(body.toString('utf8')), url).not.toThrow();
      }
      if (new URL(url).pathname.startsWith('/assets/')) expect(raw.headers['cache-control'], url).toBe('public, max-age=31536000, immutable');
    }
  }
}

describe('compressed responses', { timeout: 180_000 }, () => {
  it('when the board page and the editor load, then every text response goes out brotli to a br client and gzip to a gzip-only client, decoding to the built files', async () => {
    const { page: owner } = await signedInOwnerPage(app, 'Compression Test Electrical');
    const headers = { 'X-CSRF-Token': ((await (await owner.request.get('/api/auth/csrf')).json()) as { token: string }).token };
    const { id } = (await (await owner.request.post('/api/boards', { headers, data: { name: flatMain.board.name } })).json()) as { id: number };
    const current = (await (await owner.request.get(`/api/boards/${id}/schedule`)).json()) as { revision: number };
    expect((await owner.request.put(`/api/boards/${id}/schedule`, { headers, data: { ...flatMain, baseRevision: current.revision } })).status()).toBe(200);
    expect((await owner.request.patch(`/api/boards/${id}/public`, { headers, data: { enabled: true } })).status()).toBe(200); // a new board's page starts off
    const token = ((await (await owner.request.get(`/api/boards/${id}`)).json()) as { publicToken: string }).publicToken;

    const visitor = await app.newPage({ viewport: { width: 390, height: 844 } });
    const boardPage = await load(visitor, `/b/${token}`, (p) => p.getByRole('heading', { level: 1, name: flatMain.board.name }).waitFor());
    const editor = await load(owner, `/boards/${id}`, (p) => p.getByText(flatMain.circuits[0].label).first().waitFor());
    const kb = (n: number) => `${(n / 1024).toFixed(1)} KB`;
    for (const [name, l] of [
      ['board page', boardPage],
      ['editor', editor],
    ] as const) {
      console.log(
        `${name}: ${kb(l.wireBytes)} on the wire (${kb(l.plainBytes)} decoded); its ${l.urls.size} text responses ${kb(l.textWire)} (${kb(l.textPlain)} decoded)`,
      );
    }

    // Issue target: a first visit to a typical board page, everything included, under 60 KB over the wire.
    expect(boardPage.wireBytes, 'board page first visit over 60 KB on the wire').toBeLessThan(60 * 1024);
    // The page itself (with the board's data in it), its scripts and its styles are all among what it loaded.
    expect([...boardPage.urls].some((u) => u.endsWith(`/b/${token}`))).toBe(true);
    expect([...boardPage.urls].filter((u) => u.includes('/assets/') && u.endsWith('.css')).length).toBeGreaterThan(0);
    // What the browser itself was sent: brotli for the shell and every built file.
    for (const l of [boardPage, editor]) {
      for (const [url, coding] of l.browserCodings) if (distFile(url)) expect(coding, url).toBe('br');
    }
    await expectCompressed(new Set([...boardPage.urls, ...shellAssetUrls()]));
    const cookie = (await owner.context().cookies()).map((c) => `${c.name}=${c.value}`).join('; ');
    await expectCompressed(new Set([...editor.urls, ...shellAssetUrls()]), cookie);
    expect(boardPage.textWire).toBeLessThan(boardPage.textPlain / 2);
    expect(editor.textWire).toBeLessThan(editor.textPlain / 2);
    expect(app.pageErrors).toEqual([]);
  });

  it('when a client accepts no encoding, then assets and the shell go out as they are', async () => {
    // A token that opens no page gets the plain shell, which the app then turns into its not-found page.
    for (const url of [app.baseUrl + '/b/unknown-token-for-identity', ...shellAssetUrls()]) {
      const raw = await rawGet(url, 'identity');
      expect(raw.headers['content-encoding'], url).toBeUndefined();
      expect(raw.body.equals(readFileSync(distFile(url) ?? join(DIST, 'index.html'))), url).toBe(true);
    }
  });
});
