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
import { scheduleSchema } from '../../shared/schemas/schedule.js';
import { SWITCH_ONLY_CAUTIONS } from '../../shared/public/cautions.js';
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
/**
 * An invented two-row split-load board for the switch locator. Top row: RCD 1, ways 1, 3 (the garage) and 2, a blank, way 6.
 * Second row: the main switch, way 7, RCD 2, way 4 and way 5 on a 2-pole RCBO.
 */
const landing = scheduleSchema.parse({
  board: { name: 'Landing consumer unit', rows: 2, modulesPerRow: 12, supply: { earthing: 'TN-C-S' } },
  devices: [
    { id: 'rcd1', row: 1, kind: 'rcd', modules: 2, poles: 2, rating: 63, residualMa: 30, rcdType: 'A' },
    { id: 'b32', row: 1, kind: 'mcb', rating: 32, curve: 'B' },
    { id: 'b16', row: 1, kind: 'mcb', rating: 16, curve: 'B' },
    { id: 'b6', row: 1, kind: 'mcb', rating: 6, curve: 'B' },
    { id: 'gap', row: 1, kind: 'blank' },
    { id: 'b20', row: 1, kind: 'mcb', rating: 20, curve: 'B' },
    { id: 'main', row: 2, kind: 'main-switch', modules: 2, poles: 2, rating: 100, label: 'Main switch' },
    { id: 'b10', row: 2, kind: 'mcb', rating: 10, curve: 'B' },
    { id: 'rcd2', row: 2, kind: 'rcd', modules: 2, poles: 2, rating: 63, residualMa: 30, rcdType: 'A' },
    { id: 'b40', row: 2, kind: 'mcb', rating: 40, curve: 'B' },
    { id: 'rcbo', row: 2, kind: 'rcbo', modules: 2, poles: 2, rating: 40, curve: 'B', residualMa: 30, rcdType: 'A' },
  ],
  circuits: [
    { id: 'c1', way: 1, deviceId: 'b32', label: 'Kitchen sockets', locations: ['Kitchen'] },
    { id: 'c2', way: 2, deviceId: 'b6', label: 'Lights', locations: ['Hall', 'Landing'] },
    { id: 'c3', way: 3, deviceId: 'b16', label: 'Garage sockets', locations: ['Garage'] },
    { id: 'c4', way: 4, deviceId: 'b40', label: 'Cooker', locations: ['Kitchen'] },
    { id: 'c5', way: 5, deviceId: 'rcbo', label: 'Shower', locations: ['Bathroom'] },
    { id: 'c6', way: 6, deviceId: 'b20', label: 'Loft sockets', locations: ['Loft'] },
    { id: 'c7', way: 7, deviceId: 'b10', label: 'Doorbell', locations: ['Hall'] },
  ],
});
const SHOTS = process.env.WAYMARK_SHOTS;
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
    // One way found: the locator says which switch it is (the flat's board is one row, with no shared RCD).
    expect(await page.locator('.public-locator__words').textContent()).toBe('The switch for way 8 (Garden studio) is the RCBO B32 100 mA, 10th from the left.');

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
    // Nine ways: 5 L3 is the workshop's spare, listed like any other way.
    await page.getByText('1 of 9 ways match').waitFor();
    expect(await page.locator('.public-way').first().getByRole('heading').textContent()).toContain('Bench sockets');
    // 4 L2 has its own RCBO, the second device on the lower row.
    expect(await page.locator('.public-locator__words').textContent()).toBe(
      'The switch for way 4 L2 (Bench sockets) is the RCBO B32 30 mA, 2nd from the left on the 2nd row.',
    );
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

  it('when the garage is searched at 390×844, then the board’s rows are drawn with its switch picked out and said in words, with the switching caution, and axe passes', async () => {
    const { page: owner } = await signedInOwnerPage(app, 'Quillmarsh Test Electrical');
    const boardId = await storeDemoBoard(owner, uniqueEmail('office'), landing);
    const token = ((await (await owner.request.get(`/api/boards/${boardId}`)).json()) as { publicToken: string }).publicToken;
    const page = await app.newPage({ viewport: PHONE });
    page.setDefaultTimeout(60_000);
    await page.goto(`/b/${token}`, { waitUntil: 'networkidle' });
    await page.getByRole('heading', { level: 1, name: landing.board.name }).waitFor();
    // No search yet, or several ways found: no locator, and a hint to narrow it down.
    expect(await page.locator('.public-locator').count()).toBe(0);
    await page.getByLabel('Find a way by room, place or name').fill('sockets');
    await page.getByText('Narrow the search to one way to see which switch it is on the board.').waitFor();

    await page.getByLabel('Find a way by room, place or name').fill('garage');
    await page.getByText('1 of 7 ways match').waitFor();
    const words = 'The switch for way 3 (Garage sockets) is the MCB B16, 3rd from the left on the top row, after RCD 1.';
    expect(await page.locator('.public-locator__words').textContent()).toBe(words);
    // The picture is an image whose text alternative is the same words.
    const picture = page.getByRole('img', { name: words });
    await picture.waitFor();
    // Both rows drawn, every device of the schedule, and exactly one picked out: the third on the top row.
    expect(await picture.locator('.public-din__device').count()).toBe(landing.devices.length);
    const found = picture.locator('.public-din__device.is-found');
    expect(await found.count()).toBe(1);
    expect(await found.getAttribute('data-place')).toBe('1:2');
    expect(await found.textContent()).toContain('B16');
    // To scale: 12 modules of 17.5 mm (DIN 43880) plus two 6 mm margins across; a body is its modules less a 0.6 mm gap.
    const pxPerMm = (await picture.boundingBox())!.width / (12 * 17.5 + 12);
    const rcd = (await picture.locator('[data-place="1:0"] .public-din__body').boundingBox())!;
    const mcb = (await found.locator('.public-din__body').boundingBox())!;
    // The box takes in the outline too: 0.4 mm round a device, 1 mm round the picked-out one.
    expect(rcd.width / pxPerMm).toBeCloseTo(2 * 17.5 - 0.6 + 0.4, 0);
    expect(mcb.width / pxPerMm).toBeCloseTo(17.5 - 0.6 + 1, 0);
    // Centre to centre: half of RCD 1, all of way 1, half of the garage MCB.
    expect((mcb.x + mcb.width / 2 - (rcd.x + rcd.width / 2)) / pxPerMm).toBeCloseTo(17.5 + 17.5 + 17.5 / 2, 0);
    // Switching is as far as a householder goes; the cover and what is behind it are for an electrician.
    for (const caution of SWITCH_ONLY_CAUTIONS) expect(await page.locator('.public-locator').textContent()).toContain(caution);
    expect(await page.locator('.public-locator').textContent()).toContain('Only a competent person may remove the cover of this board');

    const scrollWidth = await page.evaluate(
      () => (globalThis as unknown as { document: { documentElement: { scrollWidth: number } } }).document.documentElement.scrollWidth,
    );
    expect(scrollWidth).toBeLessThanOrEqual(PHONE.width);
    const axe = await new AxeBuilder({ page }).analyze();
    expect(axe.violations.filter((v) => v.impact === 'serious' || v.impact === 'critical').map((v) => v.id)).toEqual([]);
    if (SHOTS) await page.screenshot({ path: join(SHOTS, 'board-locator-390.png'), fullPage: true });
    if (SHOTS) await page.locator('.public-locator').screenshot({ path: join(SHOTS, 'board-locator-390-close.png') });

    // The 2-pole RCBO on the second row says so, and the picture follows the search.
    await page.getByLabel('Find a way by room, place or name').fill('shower');
    await page
      .getByText(
        'The switch for way 5 (Shower) is the RCBO B40 30 mA, 5th and last from the left on the 2nd row, after RCD 2 — a 2-pole device, 2 modules wide.',
      )
      .waitFor();
    expect(await page.locator('.public-din__device.is-found').getAttribute('data-place')).toBe('2:4');
    await page.setViewportSize({ width: 1366, height: 900 });
    if (SHOTS) await page.locator('.public-locator').screenshot({ path: join(SHOTS, 'board-locator-1366.png') });
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
