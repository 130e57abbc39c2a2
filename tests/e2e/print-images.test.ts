/**
 * Sending labels to a tape printer's phone app from the print page: on a phone whose browser cannot
 * share files the images download; where it can, the share sheet gets one PNG a label. The print
 * settings page adds a printer profile.
 */
import { readFileSync } from 'node:fs';
import { PNG } from 'pngjs';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeSchedule } from '../helpers/boards.js';
import { signedInOwnerPage, startBrowserApp, type BrowserApp } from '../helpers/browser.js';

let app: BrowserApp;
beforeAll(async () => {
  app = await startBrowserApp();
});
afterAll(async () => {
  await app?.close();
});

const SHOTS = process.env.WAYMARK_SHOTS;
const PHONE = { width: 390, height: 844 };
const LAPTOP = { width: 1366, height: 900 };
const pixels = (mm: number, dpi: number) => Math.round((mm * dpi) / 25.4); // ISO 80000-1: 1 in = 25.4 mm

async function boardWithPage(page: Page, circuits = 3): Promise<number> {
  const { token } = (await (await page.request.get('/api/auth/csrf')).json()) as { token: string };
  const headers = { 'X-CSRF-Token': token };
  const { id } = (await (await page.request.post('/api/boards', { headers, data: { name: 'Garage board' } })).json()) as { id: number };
  const saved = await page.request.put(`/api/boards/${id}/schedule`, { headers, data: { ...makeSchedule(circuits, 'Garage board'), baseRevision: 1 } });
  if (saved.status() !== 200) throw new Error(`save failed: ${saved.status()}`);
  await page.request.patch(`/api/boards/${id}/public`, { headers, data: { enabled: true } });
  return id;
}

async function openReady(page: Page, id: number, output: string) {
  await page.goto(`/boards/${id}/print`);
  await page.locator(`[data-output="${output}"]`).click();
  await expect.poll(() => page.getByTestId('print-images-send').isEnabled(), { timeout: 60_000 }).toBe(true);
}

describe('send to printer app', { timeout: 180_000 }, () => {
  it('when a phone cannot share files, then "Send to printer app" downloads the tag as a PNG at the tape size', async () => {
    const { page } = await signedInOwnerPage(app, 'Phone Print Electrical', { viewport: PHONE });
    const id = await boardWithPage(page);
    await openReady(page, id, 'tag');
    const button = page.getByTestId('print-images-send');
    expect(await button.textContent()).toContain('Send to printer app');
    if (SHOTS) await page.screenshot({ path: `${SHOTS}/print-images-phone.png`, fullPage: true });
    const [download] = await Promise.all([page.waitForEvent('download'), button.click()]);
    expect(download.suggestedFilename()).toMatch(/-tag-tape-24-180dpi\.png$/);
    const png = PNG.sync.read(readFileSync((await download.path())!));
    expect(png.height).toBe(pixels(24, 180)); // 24 mm tape at 180 dpi // common practice
    expect(png.width).toBeGreaterThan(png.height);
    await expect.poll(() => page.getByTestId('print-history').textContent(), { timeout: 30_000 }).toContain('images at 180 dpi');
    expect(app.pageErrors).toEqual([]);
  });

  it('when the phone can share files, then the share sheet gets one PNG a flag, in print order', async () => {
    const { page } = await signedInOwnerPage(app, 'Share Print Electrical', { viewport: PHONE });
    // A phone browser that shares files, recorded instead of opening a real share sheet.
    await page.addInitScript(`
      window.sharedFiles = [];
      Object.defineProperty(navigator, 'canShare', { value: () => true });
      Object.defineProperty(navigator, 'share', {
        value: async (data) => { window.sharedFiles = data.files.map((f) => [f.name, f.size, f.type]); },
      });
    `);
    const id = await boardWithPage(page);
    await openReady(page, id, 'flags');
    await page.getByTestId('print-images-send').click();
    const sharedFiles = () => page.evaluate('window.sharedFiles') as Promise<Array<[string, number, string]>>;
    await expect.poll(async () => (await sharedFiles()).length, { timeout: 30_000 }).toBeGreaterThan(1);
    const shared = await sharedFiles();
    const names = shared.map(([name]) => name);
    expect(names).toEqual([...names].sort());
    expect(names[0]).toMatch(/-flags-tape-12-180dpi-01\.png$/);
    for (const [, size, type] of shared) {
      expect(type).toBe('image/png');
      expect(size).toBeGreaterThan(100);
    }
    expect(app.pageErrors).toEqual([]);
  });
});

describe('printer profiles on the print settings page', { timeout: 180_000 }, () => {
  it('when an owner adds a printer, then it is listed with its calibration image, and the print page offers it', async () => {
    const { page } = await signedInOwnerPage(app, 'Profile Electrical', { viewport: LAPTOP });
    await page.goto('/settings/printing');
    await page.getByTestId('printer-profile-add').click();
    await page.getByTestId('printer-name').fill('Van tape printer');
    await page.getByLabel('Printed band on 12 mm tape, in mm').fill('8');
    if (SHOTS) await page.screenshot({ path: `${SHOTS}/printer-profile-form.png`, fullPage: true });
    await page.getByRole('dialog').getByRole('button', { name: 'Save' }).click();
    const item = page.locator('[data-testid^="printer-profile-"]', { hasText: 'Van tape printer' });
    await item.waitFor();
    expect(await item.textContent()).toContain('8 mm on 12 mm');
    const href = await page.locator('[data-testid^="printer-calibration-"]').getAttribute('href');
    const calibration = await page.request.get(href!);
    expect(calibration.headers()['content-type']).toBe('image/png');
    expect(PNG.sync.read(await calibration.body()).height).toBe(pixels(12, 180)); // 12 mm tape at the profile's 180 dpi
    if (SHOTS) await page.screenshot({ path: `${SHOTS}/printer-profiles.png`, fullPage: true });
    const id = await boardWithPage(page, 2);
    await openReady(page, id, 'flags');
    expect(await page.getByTestId('print-image-profile').textContent()).toContain('Van tape printer');
    expect(await page.getByTestId('print-images-send').textContent()).toContain('Download images');
    if (SHOTS) await page.screenshot({ path: `${SHOTS}/print-images-laptop.png`, fullPage: true });
    expect(app.pageErrors).toEqual([]);
  });
});
