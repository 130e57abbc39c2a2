/**
 * Bytes over the wire, measured by headless Chromium (Debian's, driven by playwright-core) against the
 * production server: the board page's first visit, the board editor's first visit, and the editor's
 * repeat visit after a release that changed only the editor screen (bench/release-copy.ts). Then the
 * board page on a weak signal: 1.6 Mbit/s down, 150 ms latency (Chrome DevTools network throttling),
 * first visit, from navigation until the way a search matches is on screen.
 */
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { chromium, type BrowserContext, type Page } from 'playwright-core';
import { DEMO_PASSWORD, DEMO_USERS } from '../server/seed/index.js';
import { CHROMIUM_ARGS } from '../tests/helpers/browser.js';
import type { BoardListResponse } from '../shared/schemas/boards.js';
import { productionServerEnv, spawnServer } from './load.js';
import { releaseOneScreen } from './release-copy.js';

export interface TransferFigures {
  boardPageKb: number;
  editorKb: number;
  editorRepeatKb: number;
  boardPageMsAt1600kbit: number;
}

/** The weak signal of the issue: 1.6 Mbit/s down (bytes per second for DevTools), 150 ms round-trip latency; up assumed 750 kbit/s. */
const WEAK = { offline: false, latency: 150, downloadThroughput: 1_600_000 / 8, uploadThroughput: 750_000 / 8 };
const PHONE = { width: 390, height: 844 };
/** The editor is ready when a circuit's label box is on screen (the table's cells name their field). */
const EDITOR_READY = 'td[data-cell^="label-"] input';
const kb = (bytes: number) => Math.round((bytes / 1024) * 10) / 10;

/** Counts every response's encoded body and headers as the network delivered them (a response from the cache counts 0). */
function countBytes(page: Page): () => Promise<number> {
  let total = 0;
  const pending: Promise<void>[] = [];
  page.on('requestfinished', (request) => {
    pending.push(
      request.sizes().then((s) => {
        total += s.responseBodySize + s.responseHeadersSize;
      }),
    );
  });
  return async () => {
    await Promise.all(pending);
    return total;
  };
}

async function settle(page: Page): Promise<void> {
  await page.waitForLoadState('networkidle');
}

async function signIn(context: BrowserContext): Promise<Page> {
  const page = await context.newPage();
  const { token } = (await (await page.request.get('/api/auth/csrf')).json()) as { token: string };
  const res = await page.request.post('/api/auth/login', { headers: { 'X-CSRF-Token': token }, data: { email: DEMO_USERS[0].email, password: DEMO_PASSWORD } });
  if (!res.ok()) throw new Error(`sign-in: ${res.status()}`);
  return page;
}

/** The demo's first board whose page is on, with its token and the first label on it. */
async function demoBoard(page: Page): Promise<{ id: number; token: string; label: string }> {
  const { items } = (await (await page.request.get('/api/boards')).json()) as BoardListResponse;
  for (const b of items) {
    const summary = (await (await page.request.get(`/api/boards/${b.id}`)).json()) as { publicToken: string; publicEnabled: boolean };
    if (!summary.publicEnabled) continue;
    const schedule = (await (await page.request.get(`/api/boards/${b.id}/schedule`)).json()) as { circuits: { label: string }[] };
    if (schedule.circuits.length) return { id: b.id, token: summary.publicToken, label: schedule.circuits[schedule.circuits.length - 1].label };
  }
  throw new Error('no demo board with its page on');
}

export async function benchTransfer(databaseUrl: string): Promise<TransferFigures> {
  const env = (clientDir: string, port: string) => productionServerEnv(databaseUrl, { WAYMARK_CLIENT_DIR: clientDir, PORT: port });
  let server = await spawnServer(['server/index.ts'], env('dist', '0'));
  const port = server.port;
  const baseURL = `http://127.0.0.1:${port}`;
  const browser = await chromium.launch({ executablePath: '/usr/bin/chromium', args: CHROMIUM_ARGS });
  const released = mkdtempSync(join(tmpdir(), 'waymark-release-'));
  try {
    const owner = await signIn(await browser.newContext({ baseURL }));
    const board = await demoBoard(owner);

    const visitor = await (await browser.newContext({ baseURL, viewport: PHONE })).newPage();
    const visitorBytes = countBytes(visitor);
    await visitor.goto(`/b/${board.token}`);
    await visitor.getByRole('searchbox').waitFor();
    await settle(visitor);
    const boardPageKb = kb(await visitorBytes());

    const editorContext = await browser.newContext({ baseURL, viewport: { width: 1366, height: 900 } });
    const editor = await signIn(editorContext);
    const editorBytes = countBytes(editor);
    await editor.goto(`/boards/${board.id}`);
    await editor.locator(EDITOR_READY).first().waitFor();
    await settle(editor);
    const editorKb = kb(await editorBytes());

    // The next release, on the same origin (the browser's cache is per origin): only the editor screen changed.
    releaseOneScreen('dist', released, 'BoardEditorView-');
    server.child.kill('SIGTERM');
    await new Promise((resolve) => server.child.once('exit', resolve));
    server = await spawnServer(['server/index.ts'], env(released, String(port)));
    const again = await editorContext.newPage();
    const againBytes = countBytes(again);
    await again.goto(`/boards/${board.id}`);
    await again.locator(EDITOR_READY).first().waitFor();
    await settle(again);
    const editorRepeatKb = kb(await againBytes());

    const weakContext = await browser.newContext({ baseURL, viewport: PHONE });
    const weak = await weakContext.newPage();
    const cdp = await weakContext.newCDPSession(weak);
    await cdp.send('Network.enable');
    await cdp.send('Network.emulateNetworkConditions', WEAK);
    const started = Date.now();
    await weak.goto(`/b/${board.token}`, { waitUntil: 'commit' });
    await weak.getByRole('searchbox').fill(board.label);
    await weak.getByRole('heading', { level: 3, name: board.label }).first().waitFor({ state: 'visible' });
    const boardPageMsAt1600kbit = Date.now() - started;
    return { boardPageKb, editorKb, editorRepeatKb, boardPageMsAt1600kbit };
  } finally {
    await browser.close();
    server.child.kill('SIGTERM');
    rmSync(released, { recursive: true, force: true });
  }
}

/** Issue targets: board page under 60 KB everything included, editor under 450 KB first and 50 KB after a one-screen release. */
export function transferTargets(t: TransferFigures): string[] {
  const out: string[] = [];
  if (t.boardPageKb >= 60) out.push(`board page first visit ${t.boardPageKb} KB (target < 60)`);
  if (t.editorKb >= 450) out.push(`editor first visit ${t.editorKb} KB (target < 450)`);
  if (t.editorRepeatKb >= 50) out.push(`editor after a one-screen release ${t.editorRepeatKb} KB (target < 50)`);
  return out;
}
