/**
 * The editor says, as the user types, which characters will not print: a circuit's label in the
 * table on a laptop, the board name on a phone. The warning names each character and its code
 * point (Unicode code charts) and never blocks saving.
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

const SHOTS = process.env.WAYMARK_SHOTS;
const LAPTOP = { width: 1366, height: 900 };
const PHONE = { width: 390, height: 844 }; // a common phone viewport in CSS pixels // from memory

async function boardWithCircuits(page: Page, secondLabel?: string): Promise<number> {
  const schedule = makeSchedule(2, 'Print fonts board');
  if (secondLabel) schedule.circuits[1].label = secondLabel;
  const { token } = (await (await page.request.get('/api/auth/csrf')).json()) as { token: string };
  const headers = { 'X-CSRF-Token': token };
  const { id } = await (await page.request.post('/api/boards', { headers, data: { name: schedule.board.name } })).json();
  const saved = await page.request.put(`/api/boards/${id}/schedule`, { headers, data: { ...schedule, baseRevision: 1 } });
  if (!saved.ok()) throw new Error(`save: ${saved.status()} ${await saved.text()}`);
  return id as number;
}

describe('characters that will not print, said while typing', { timeout: 240_000 }, () => {
  it('when 配電 is typed into a way label in the table, then its cell warns naming both characters; removed, the warning goes', async () => {
    const { page } = await signedInOwnerPage(app, 'Fontwell Test Electrical', { viewport: LAPTOP });
    const boardId = await boardWithCircuits(page);
    await page.goto(`/boards/${boardId}`);
    const cell = page.locator('[data-field="circuits.1.label"]');
    await cell.locator('input').fill('配電 lights');
    const mark = cell.locator('.board-cell__mark');
    const said = async () => ((await mark.count()) ? ((await mark.getAttribute('aria-label')) ?? '') : '');
    await expect.poll(said, { timeout: 5_000 }).toContain('"配" (U+914D)');
    expect(await mark.getAttribute('aria-label')).toContain('"電" (U+96FB)');
    if (SHOTS) await page.screenshot({ path: `${SHOTS}/print-fonts-laptop.png` });

    await cell.locator('input').fill('Sub-board lights');
    await expect.poll(said, { timeout: 5_000 }).not.toContain('U+914D');
    await page.getByTestId('save').click();
    await page.getByTestId('save-state').filter({ hasText: 'Saved' }).waitFor();
    expect(app.pageErrors).toEqual([]);
  });

  it('when an emoji is typed into the board name on a phone, then the field says it prints as □, within the screen', async () => {
    const { page } = await signedInOwnerPage(app, 'Fontwell Test Electrical', { viewport: PHONE });
    const boardId = await boardWithCircuits(page);
    await page.goto(`/boards/${boardId}`);
    await page.getByRole('tab', { name: /Board and supply/ }).click();
    await page.getByLabel('Board name').fill('Flat 2 💡');
    const field = page.locator('[data-field="board.name"]');
    const line = field.getByText(/"💡" \(U\+1F4A1\) cannot be drawn with the printing fonts and will print as □/);
    await line.waitFor({ timeout: 5_000 });
    const box = (await line.boundingBox())!;
    expect(box.x).toBeGreaterThanOrEqual(0);
    expect(box.x + box.width).toBeLessThanOrEqual(PHONE.width);
    if (SHOTS) await page.waitForTimeout(1000);
    if (SHOTS) await page.screenshot({ path: `${SHOTS}/print-fonts-phone.png` });
    expect(app.pageErrors).toEqual([]);
  });

  it('when a board with 配電 in a label is opened to print, then the print page lists the warning naming the label and both characters', async () => {
    const { page } = await signedInOwnerPage(app, 'Fontwell Test Electrical', { viewport: PHONE });
    const boardId = await boardWithCircuits(page, '配電 lights');
    await page.goto(`/boards/${boardId}/print`);
    const item = page.locator('.print-warning-list__item[data-code="undrawable-characters"]');
    await item.first().waitFor({ timeout: 30_000 });
    const text = (await item.first().textContent()) ?? '';
    expect(text).toMatch(/^\s*Way 2 label "配電 lights": "配" \(U\+914D\), "電" \(U\+96FB\) cannot be drawn/);
    if (SHOTS) await page.screenshot({ path: `${SHOTS}/print-fonts-print-page.png`, fullPage: true });
    expect(app.pageErrors).toEqual([]);
  });
});
