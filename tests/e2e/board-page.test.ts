import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { gzipSync } from 'node:zlib';
import jsQR from 'jsqr';
import { PNG } from 'pngjs';
import { AxeBuilder } from '@axe-core/playwright';
import type { APIRequestContext, Page } from 'playwright-core';
import { demoSites } from '../../server/seed/demo-data.js';
import { startBrowserApp, signedInOwnerPage, type BrowserApp } from '../helpers/browser.js';
import { simpleParser } from 'mailparser';
import { uniqueEmail, waitForMail } from '../helpers/app.js';

let app: BrowserApp;
beforeAll(async () => {
  app = await startBrowserApp();
});
afterAll(async () => {
  await app?.close();
});

/** The demo flat's main board: way 8 is the sub-main to the garden studio. */
const flatMain = demoSites[0].boards.find((b) => b.key === 'flat-main')!.schedule;
/** The demo workshop: three phases, way 4 split into 4 L1–4 L3, last inspected 8 November 2022. */
const workshop = demoSites[1].boards.find((b) => b.key === 'workshop')!.schedule;
const PHONE = { width: 390, height: 844 };
const DIST = join(import.meta.dirname, '..', '..', 'dist');
/** The budget for the board page route on a weak signal. */
const ROUTE_JS_BUDGET_GZIP = 80 * 1024;

async function csrf(request: APIRequestContext): Promise<string> {
  return ((await (await request.get('/api/auth/csrf')).json()) as { token: string }).token;
}

/** Stores a demo board through the API, as the editor would, and returns its id. */
async function storeDemoBoard(page: Page, contactEmail = uniqueEmail('office'), schedule = flatMain): Promise<number> {
  const headers = { 'X-CSRF-Token': await csrf(page.request) };
  const created = await page.request.post('/api/boards', { headers, data: { name: schedule.board.name } });
  expect(created.status()).toBe(201);
  const { id } = (await created.json()) as { id: number };
  const current = (await (await page.request.get(`/api/boards/${id}/schedule`)).json()) as { revision: number };
  const saved = await page.request.put(`/api/boards/${id}/schedule`, { headers, data: { ...schedule, baseRevision: current.revision } });
  expect(saved.status()).toBe(200);
  // A new board's page starts off: switch it on, as the electrician does on the sharing screen.
  expect((await page.request.patch(`/api/boards/${id}/public`, { headers, data: { enabled: true } })).status()).toBe(200);
  const organisation = (await (await page.request.get('/api/organisation')).json()) as { revision: number };
  const contact = await page.request.put('/api/organisation', {
    headers,
    data: { name: 'Quillmarsh Test Electrical', contactPhone: '01632 960418', contactEmail, baseRevision: organisation.revision },
  });
  expect(contact.status()).toBe(200);
  return id;
}

/** Renders the tag PDF at 300 dpi with poppler and decodes its QR code from the pixels. */
function decodeTagQr(pdf: Buffer): string {
  const dir = mkdtempSync(join(tmpdir(), 'waymark-tag-'));
  try {
    writeFileSync(join(dir, 'tag.pdf'), pdf);
    execFileSync('pdftoppm', ['-r', '300', '-png', '-f', '1', '-l', '1', join(dir, 'tag.pdf'), join(dir, 'tag')]);
    const file = readdirSync(dir).find((f) => f.endsWith('.png'))!;
    const png = PNG.sync.read(readFileSync(join(dir, file)));
    const code = jsQR.default(new Uint8ClampedArray(png.data), png.width, png.height);
    if (!code) throw new Error('no QR code found on the tag');
    return code.data;
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

describe('the board page on a phone, opened from the printed tag', { timeout: 180_000 }, () => {
  it('when the QR code of a generated tag is opened at 390×844, then the page loads small, searches "studio" to the right way and passes axe', async () => {
    const { page: owner } = await signedInOwnerPage(app, 'Quillmarsh Test Electrical');
    const boardId = await storeDemoBoard(owner);
    const tag = await owner.request.get(`/api/boards/${boardId}/pdf/tag`);
    expect(tag.status()).toBe(200);
    const decoded = new URL(decodeTagQr(await tag.body()));
    expect(decoded.pathname).toMatch(/^\/b\/[A-Za-z0-9_-]{22,}$/);
    // The QR carries PUBLIC_BASE_URL; point it at this test server.
    const url = new URL(decoded.pathname, app.baseUrl).toString();

    const page = await app.newPage({ viewport: PHONE });
    page.setDefaultTimeout(60_000);
    const scriptUrls = new Set<string>();
    page.on('request', (req) => {
      if (req.resourceType() === 'script') scriptUrls.add(req.url());
    });
    await page.goto(url, { waitUntil: 'networkidle' });
    await page.getByRole('heading', { level: 1, name: flatMain.board.name }).waitFor();
    await page.getByRole('heading', { name: 'Before you touch this board' }).waitFor();
    expect(await page.getByText(/prove the circuit dead/).count()).toBe(1);

    const ways = page.locator('.public-way');
    expect(await ways.count()).toBe(flatMain.circuits.length);
    await page.getByLabel('Find a way by room, place or name').pressSequentially('studio', { delay: 20 });
    await page.getByText('1 of 9 ways match').waitFor();
    expect(await ways.count()).toBe(1);
    const studio = ways.first();
    expect(await studio.getByRole('heading').textContent()).toContain('Garden studio');
    expect(await studio.textContent()).toContain('RCBO B32 100 mA');
    expect(await studio.textContent()).toContain('Own RCBO');
    // A sub-main takes the studio board with it: the card must not say only this way goes off.
    expect(await studio.textContent()).toContain('everything on that board goes off too');
    expect(await studio.textContent()).not.toContain('only this way goes off');
    expect(await page.getByText('Kitchen sockets').count()).toBe(0);

    // Nothing is cut off or needs sideways scrolling on a phone.
    // The test runs under Node's types, so the page's `document` is reached through globalThis.
    const scrollWidth = await page.evaluate(
      () => (globalThis as unknown as { document: { documentElement: { scrollWidth: number } } }).document.documentElement.scrollWidth,
    );
    expect(scrollWidth).toBeLessThanOrEqual(PHONE.width);
    await page.getByLabel('Find a way by room, place or name').fill('');
    // Every way of the flat has its own RCBO, so "if an RCD trips" names the sub-main's RCBO on its own line.
    expect(await page.locator('.public-rcds').textContent()).toContain(
      'If the RCBO of way 8 (Garden studio) trips, everything on the board it feeds goes off too',
    );
    const axe = await new AxeBuilder({ page }).analyze();
    const serious = axe.violations.filter((v) => v.impact === 'serious' || v.impact === 'critical');
    expect(serious.map((v) => `${v.id}: ${v.nodes.map((n) => n.target.join(' ')).join(', ')}`)).toEqual([]);
    await page.screenshot({ path: join(tmpdir(), 'waymark-board-page-390.png'), fullPage: true });
    expect(app.outsideRequests).toEqual([]);
    expect(app.pageErrors).toEqual([]);

    // Every script the route loaded, read from the built files and gzipped as a server would send them.
    // Modulepreloaded chunks count too, whether or not the browser reports them as script requests.
    const html = readFileSync(join(DIST, 'index.html'), 'utf8');
    for (const m of html.matchAll(/<(?:script|link rel="modulepreload")[^>]*(?:src|href)="(\/assets\/[^"]+\.js)"/g))
      scriptUrls.add(new URL(m[1], app.baseUrl).toString());
    const scripts = [...scriptUrls].map((u) => ({ url: u, gzip: gzipSync(readFileSync(join(DIST, new URL(u).pathname))).length }));
    const routeJs = scripts.reduce((sum, s) => sum + s.gzip, 0);
    console.log(
      `board page route: ${scripts.length} scripts, ${(routeJs / 1024).toFixed(1)} KB gzipped:`,
      scripts.map((s) => `${new URL(s.url).pathname} ${s.gzip}`).join(', '),
    );
    expect(scripts.some((s) => /antd|ant-design/i.test(s.url))).toBe(false);
    // The route guard loads the session store (and zod) only for signed-in screens; an eager import would cost ~25 KB here.
    expect(routeJs, 'board page route JS (gzip) over the 80 KB budget: see which scripts above').toBeLessThanOrEqual(ROUTE_JS_BUDGET_GZIP);
  });

  it('when a visitor sends a report from the page, then the contractor gets it by e-mail', async () => {
    const { page: owner } = await signedInOwnerPage(app, 'Quillmarsh Test Electrical');
    const contactEmail = uniqueEmail('office');
    const boardId = await storeDemoBoard(owner, contactEmail);
    const token = ((await (await owner.request.get(`/api/boards/${boardId}`)).json()) as { publicToken: string }).publicToken;
    const page = await app.newPage({ viewport: PHONE });
    page.setDefaultTimeout(60_000);
    await page.goto(`/b/${token}`);
    await page.getByRole('button', { name: 'Tell Quillmarsh Test Electrical' }).click();
    const message = page.getByLabel('What does not match? (required)');
    await message.waitFor();
    const axe = await new AxeBuilder({ page }).analyze();
    expect(axe.violations.filter((v) => v.impact === 'serious' || v.impact === 'critical').map((v) => v.id)).toEqual([]);
    await message.fill('Way 8 also feeds the shed lights');
    await page.getByLabel('Which way? (optional)').selectOption('8');
    await page.getByRole('button', { name: 'Send report' }).click();
    await page.getByText(/Your report has gone to Quillmarsh Test Electrical/).waitFor();
    const mail = await simpleParser((await waitForMail(app.database, contactEmail, 10_000)).raw);
    expect(mail.text).toContain('Way 8 also feeds the shed lights');
    expect(mail.text).toContain('Way: 8');
  });

  it('when the three-phase workshop board is opened at 390×844, then the 400 V caution, 400/230 V and "overdue" show in words, and a report names 4 L2', async () => {
    const { page: owner } = await signedInOwnerPage(app, 'Quillmarsh Test Electrical');
    const contactEmail = uniqueEmail('office');
    const boardId = await storeDemoBoard(owner, contactEmail, workshop);
    const token = ((await (await owner.request.get(`/api/boards/${boardId}`)).json()) as { publicToken: string }).publicToken;

    const page = await app.newPage({ viewport: PHONE });
    page.setDefaultTimeout(60_000);
    // IET Guidance Note 3 (found in secondary sources; see docs/sources.md): industrial, 3 years, so due by 8 November 2025. The browser's day decides.
    await page.clock.setFixedTime(new Date(2025, 10, 9, 9, 0));
    await page.goto(`/b/${token}`, { waitUntil: 'networkidle' });
    await page.getByRole('heading', { level: 1, name: workshop.board.name }).waitFor();
    // BS 7671 514.10.1 (found): warn where more than 230 V to earth would not normally be expected.
    const cautions = page.locator('.public-cautions li');
    expect(await cautions.nth(1).textContent()).toContain('400 V is present between the phases');
    // IEC 60038 nominal 230/400 V (from memory).
    expect(await page.locator('.public-facts__list').textContent()).toContain('400/230 V (three-phase, 230 V to earth)');
    await page.getByRole('heading', { name: 'Inspection overdue' }).waitFor();
    expect(await page.locator('.public-overdue').textContent()).toContain('recommended by 8 November 2025');
    expect(await page.locator('.public-facts__list').textContent()).toContain('Overdue (recommended by 8 November 2025)');
    const scrollWidth = await page.evaluate(
      () => (globalThis as unknown as { document: { documentElement: { scrollWidth: number } } }).document.documentElement.scrollWidth,
    );
    expect(scrollWidth).toBeLessThanOrEqual(PHONE.width);
    const axe = await new AxeBuilder({ page }).analyze();
    expect(axe.violations.filter((v) => v.impact === 'serious' || v.impact === 'critical').map((v) => v.id)).toEqual([]);
    await page.screenshot({ path: join(tmpdir(), 'waymark-board-page-3phase-390.png'), fullPage: true });

    // Search by way and phase, as printed on the board.
    await page.getByLabel('Find a way by room, place or name').fill('way 4 L2');
    await page.getByText('1 of 8 ways match').waitFor();
    expect(await page.locator('.public-way').first().getByRole('heading').textContent()).toContain('Bench sockets');
    await page.getByLabel('Find a way by room, place or name').fill('');

    // Each phase of way 4 can be picked in the report, and the contractor's e-mail names it.
    await page.getByRole('button', { name: 'Tell Quillmarsh Test Electrical' }).click();
    const wayPicker = page.getByLabel('Which way? (optional)');
    await wayPicker.waitFor();
    const choices = await wayPicker.locator('option').allTextContents();
    expect(choices).toEqual(expect.arrayContaining(['Way 4 L1', 'Way 4 L2', 'Way 4 L3']));
    await page.getByLabel('What does not match? (required)').fill('Bench sockets moved to the east wall');
    await wayPicker.selectOption({ label: 'Way 4 L2' });
    await page.getByRole('button', { name: 'Send report' }).click();
    await page.getByText(/Your report has gone to Quillmarsh Test Electrical/).waitFor();
    const mail = await simpleParser((await waitForMail(app.database, contactEmail, 10_000)).raw);
    expect(mail.text).toContain('Way: 4 L2');

    // The day before the date has not passed: no "overdue" anywhere.
    const earlier = await app.newPage({ viewport: PHONE });
    earlier.setDefaultTimeout(60_000);
    await earlier.clock.setFixedTime(new Date(2025, 10, 7, 9, 0));
    await earlier.goto(`/b/${token}`, { waitUntil: 'networkidle' });
    await earlier.getByRole('heading', { level: 1, name: workshop.board.name }).waitFor();
    expect(await earlier.locator('.public-facts__list').textContent()).toContain('Recommended by 8 November 2025');
    expect(await earlier.getByText(/overdue/i).count()).toBe(0);
    expect(app.pageErrors).toEqual([]);
  });

  it('when the token is unknown, then a plain not-found page that names no board', async () => {
    const page = await app.newPage({ viewport: PHONE });
    await page.goto(`/b/${'Z'.repeat(32)}`);
    await page.getByRole('heading', { name: 'Board page not found' }).waitFor();
    const axe = await new AxeBuilder({ page }).analyze();
    expect(axe.violations.filter((v) => v.impact === 'serious' || v.impact === 'critical')).toEqual([]);
  });
});
