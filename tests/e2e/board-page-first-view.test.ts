/**
 * The board page's first HTML already holds the board: a visitor whose script never arrives (or is
 * switched off) still reads every way with its device and the RCD that turns it off, after the
 * cautions; with script the app takes over from the same data without a second request. Chromium
 * parses the page, so text a visitor or electrician typed is shown as text, never run as markup.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page, Request } from 'playwright-core';
import { demoSites } from '../../server/seed/demo-data.js';
import type { PublicBoard } from '../../shared/schemas/public-board.js';
import { wayProtectionText } from '../../shared/public/way-text.js';
import { startBrowserApp, signedInOwnerPage, type BrowserApp } from '../helpers/browser.js';

let app: BrowserApp;
let token: string;
let page: PublicBoard;
const PHONE = { width: 390, height: 844 };
const flatMain = demoSites[0].boards.find((b) => b.key === 'flat-main')!.schedule;
/** Markup typed into a description: it must come out as these very characters. */
const HOSTILE = '</script><img src=x onerror="window.__hit=1"><!-- Tap';

beforeAll(async () => {
  app = await startBrowserApp();
  const { page: owner } = await signedInOwnerPage(app, 'First View Electrical');
  const headers = { 'X-CSRF-Token': ((await (await owner.request.get('/api/auth/csrf')).json()) as { token: string }).token };
  const { id } = (await (await owner.request.post('/api/boards', { headers, data: { name: flatMain.board.name } })).json()) as { id: number };
  const current = (await (await owner.request.get(`/api/boards/${id}/schedule`)).json()) as { revision: number };
  const schedule = { ...flatMain, circuits: flatMain.circuits.map((c, i) => (i === 0 ? { ...c, description: HOSTILE } : c)) };
  expect((await owner.request.put(`/api/boards/${id}/schedule`, { headers, data: { ...schedule, baseRevision: current.revision } })).status()).toBe(200);
  expect((await owner.request.patch(`/api/boards/${id}/public`, { headers, data: { enabled: true } })).status()).toBe(200);
  token = ((await (await owner.request.get(`/api/boards/${id}`)).json()) as { publicToken: string }).publicToken;
  page = (await (await owner.request.get(`/api/public/boards/${token}`)).json()) as PublicBoard;
}, 180_000);
afterAll(async () => {
  await app?.close();
});

async function noSideways(p: Page) {
  // A string, as the page's `document` is not in the tests' Node types.
  expect(await p.evaluate<number>('document.documentElement.scrollWidth - document.documentElement.clientWidth')).toBeLessThanOrEqual(0);
}

describe('the board page before and without its script', { timeout: 180_000 }, () => {
  it('when script is off on a phone, then the cautions and every way with its device and RCD are on the page', async () => {
    const visitor = await app.newPage({ viewport: PHONE, javaScriptEnabled: false });
    const res = await visitor.goto(`/b/${token}`);
    expect(res?.status()).toBe(200);
    await expect(visitor.getByRole('heading', { level: 1, name: flatMain.board.name }).isVisible()).resolves.toBe(true);
    const main = visitor.getByRole('main');
    const text = (await main.innerText()).replace(/\s+/g, ' ');
    expect(text.indexOf('Before you touch this board')).toBeGreaterThan(-1);
    for (const caution of page.cautions) expect(text).toContain(caution.replace(/\s+/g, ' '));
    expect(page.ways.length).toBe(flatMain.circuits.length);
    for (const way of page.ways) {
      const item = main.getByRole('listitem').filter({ has: visitor.getByRole('heading', { level: 3, name: `Way ${way.wayText}: ${way.label}` }) });
      await expect(item.count(), `way ${way.wayText}`).resolves.toBe(1);
      const itemText = (await item.innerText()).replace(/\s+/g, ' ');
      if (way.device) expect(itemText, `way ${way.wayText}`).toContain(way.device);
      expect(itemText, `way ${way.wayText}`).toContain(wayProtectionText(way));
    }
    // The caution comes before the first way, as on the app's page.
    expect(text.indexOf('Before you touch this board')).toBeLessThan(text.indexOf(`Way ${page.ways[0].wayText}:`));
    await noSideways(visitor);
    if (process.env.WAYMARK_SHOTS) await visitor.screenshot({ path: `${process.env.WAYMARK_SHOTS}/board-page-no-script.png`, fullPage: true });
  });

  it('when typed text looks like markup, then it shows as those characters and runs nothing, with script off and on', async () => {
    const plain = await app.newPage({ viewport: PHONE, javaScriptEnabled: false });
    await plain.goto(`/b/${token}`);
    await expect(plain.getByText(HOSTILE, { exact: true }).count()).resolves.toBe(1);
    await expect(plain.locator('img').count()).resolves.toBe(0);

    const visitor = await app.newPage({ viewport: PHONE });
    const asked: Request[] = [];
    visitor.on('request', (r) => asked.push(r));
    await visitor.goto(`/b/${token}`, { waitUntil: 'networkidle' });
    // The app's own page (its search box) from the data in the HTML, with no second request for it.
    await visitor.getByRole('searchbox').waitFor();
    await expect(visitor.getByText(HOSTILE, { exact: true }).count()).resolves.toBe(1);
    expect(await visitor.evaluate<unknown>('window.__hit')).toBeUndefined();
    expect(asked.filter((r) => r.url().includes('/api/public/boards/')).map((r) => r.url())).toEqual([]);
    expect(app.pageErrors).toEqual([]);
  });

  it('when the token opens no page, then the plain shell carries no board and the app says there is none', async () => {
    const visitor = await app.newPage({ viewport: PHONE });
    await visitor.goto('/b/no-such-token-0000000000000000');
    await visitor.getByRole('heading', { level: 1, name: 'Board page not found' }).waitFor();
    expect(await visitor.locator('#wm-board-data').count()).toBe(0);
  });
});
