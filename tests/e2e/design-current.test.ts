/**
 * The design current Ib in the circuit drawer: typed, it is judged live against the device rating
 * (Ib ≤ In, BS 7671 433.1.1) beside the field, and it saves and reloads as entered.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { startBrowserApp, signedInOwnerPage, type BrowserApp } from '../helpers/browser.js';
import { makeSchedule } from '../helpers/boards.js';

let app: BrowserApp;
beforeAll(async () => {
  app = await startBrowserApp();
});
afterAll(async () => {
  await app?.close();
});

/** Set to a folder to keep screenshots of what the tests saw (for looking, not for asserting). */
const SHOTS = process.env.WAYMARK_SHOTS;
const LAPTOP = { width: 1366, height: 900 };
const PHONE = { width: 390, height: 844 }; // a common phone viewport in CSS pixels // from memory
const IB_LABEL = 'Design current Ib (A)';

/** A board of two circuits made through the page's own session: way 2 is lighting on a B6 RCBO (makeSchedule). */
async function boardWithCircuits(page: Page): Promise<number> {
  const schedule = makeSchedule(2, 'Design current board');
  const { token } = (await (await page.request.get('/api/auth/csrf')).json()) as { token: string };
  const headers = { 'X-CSRF-Token': token };
  const { id } = await (await page.request.post('/api/boards', { headers, data: { name: schedule.board.name } })).json();
  const saved = await page.request.put(`/api/boards/${id}/schedule`, { headers, data: { ...schedule, baseRevision: 1 } });
  if (!saved.ok()) throw new Error(`save: ${saved.status()} ${await saved.text()}`);
  return id as number;
}

describe('the design current in the circuit drawer', { timeout: 240_000 }, () => {
  it('when Ib above the B6 is typed, then the Ib ≤ In finding shows beside it; corrected, it saves and reloads', async () => {
    const { page } = await signedInOwnerPage(app, 'Ibstock Test Electrical', { viewport: LAPTOP });
    const boardId = await boardWithCircuits(page);
    await page.goto(`/boards/${boardId}`);
    await page.getByRole('button', { name: /^Details of way 2/ }).click();

    const input = page.getByLabel(IB_LABEL);
    await input.fill('8');
    await input.press('Tab');
    // 8 A > 6 A: BS 7671 433.1.1 (Ib ≤ In)
    const beside = page.locator('[data-field="circuits.1.designCurrent"]');
    await beside.getByText(/design current Ib 8 A recorded exceeds the device rating 6 A/).waitFor();
    if (SHOTS) await page.screenshot({ path: `${SHOTS}/design-current-laptop.png` });

    await input.fill('2.5');
    await input.press('Tab');
    await expect.poll(() => beside.getByText(/exceeds the device rating/).count()).toBe(0);
    await page.keyboard.press('Escape');
    await page.getByTestId('save').click();
    await page.getByTestId('save-state').filter({ hasText: 'Saved · revision 3' }).waitFor();
    const saved = await (await page.request.get(`/api/boards/${boardId}/schedule`)).json();
    expect(saved.circuits.map((c: { designCurrent?: number | null }) => c.designCurrent ?? null)).toEqual([null, 2.5]);

    await page.reload();
    await page.getByRole('button', { name: /^Details of way 2/ }).click();
    expect(await page.getByLabel(IB_LABEL).inputValue()).toBe('2.5');
    expect(app.pageErrors).toEqual([]);
    expect(app.outsideRequests).toEqual([]);
  });

  it('when the drawer is opened on a phone, then the Ib field is there and fits the screen', async () => {
    const { page } = await signedInOwnerPage(app, 'Ibstock Test Electrical', { viewport: PHONE });
    const boardId = await boardWithCircuits(page);
    await page.goto(`/boards/${boardId}`);
    await page.getByRole('button', { name: /^Details of way 2/ }).click();
    const input = page.getByLabel(IB_LABEL);
    await input.scrollIntoViewIfNeeded();
    const box = (await input.boundingBox())!;
    expect(box.x).toBeGreaterThanOrEqual(0);
    expect(box.x + box.width).toBeLessThanOrEqual(PHONE.width);
    if (SHOTS) await page.screenshot({ path: `${SHOTS}/design-current-phone.png` });
    expect(app.pageErrors).toEqual([]);
  });
});
