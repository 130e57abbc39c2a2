/**
 * The editor never loses or misreads what was typed: UK dates, text limits shown while typing,
 * legs that follow the circuit kind, devices named by their place, and edits thrown away only
 * after the app's own question.
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
const PHONE = { width: 390, height: 844 }; // a common phone viewport in CSS pixels // from memory

/** A board made through the page's session from the shared fixture (way 1 a ring on an RCBO B32), at revision 2. */
async function boardWithCircuits(page: Page, circuits: number): Promise<number> {
  const { token } = (await (await page.request.get('/api/auth/csrf')).json()) as { token: string };
  const headers = { 'X-CSRF-Token': token };
  const schedule = makeSchedule(circuits, 'Kitchen extension board');
  const { id } = (await (await page.request.post('/api/boards', { headers, data: { name: schedule.board.name } })).json()) as { id: number };
  const saved = await page.request.put(`/api/boards/${id}/schedule`, { headers, data: { ...schedule, baseRevision: 1 } });
  if (saved.status() !== 200) throw new Error(`save failed: ${saved.status()} ${await saved.text()}`);
  return id;
}

/** Native browser dialogs (confirm, alert) the page opened; each is dismissed. The app asks in its own popups instead. */
function nativeDialogs(page: Page): string[] {
  const seen: string[] = [];
  page.on('dialog', (dialog) => {
    seen.push(dialog.message());
    void dialog.dismiss();
  });
  return seen;
}

const popconfirm = (page: Page, title: string) => page.locator('.ant-popover:not(.ant-popover-hidden)', { hasText: title });

describe('what is typed in the editor is kept as meant', () => {
  it('when an installed-on date is typed the British way, then it is saved as that day and shown as 2 Dec 2026 after a reload; an impossible date is named', async () => {
    const { page } = await signedInOwnerPage(app, 'Fernhollow Test Electrical', { viewport: PHONE });
    const boardId = await boardWithCircuits(page, 2);
    await page.goto(`/boards/${boardId}`);
    await page.getByRole('tab', { name: /Board and supply/ }).click();
    const installed = page.locator('[data-field="board.installedOn"] input[type="text"]');
    await installed.fill('31/02/2026');
    await installed.press('Enter');
    await page.locator('[data-field="board.installedOn"]').getByTestId('date-unreadable').getByText('“31/02/2026” is not a date').waitFor();

    await page.locator('[data-field="board.installedOn"]').getByText('Still 14 May 2021').waitFor(); // the fixture's day is kept
    await installed.fill('02/12/2026');
    await installed.press('Tab');
    expect(await page.locator('[data-field="board.installedOn"]').getByTestId('date-unreadable').count()).toBe(0);
    if (SHOTS) await page.screenshot({ path: `${SHOTS}/editor-date-phone.png` });
    await page.getByTestId('save').click();
    await page.getByTestId('save-state').filter({ hasText: 'Saved · revision 3' }).waitFor();
    expect((await (await page.request.get(`/api/boards/${boardId}/schedule`)).json()).board.installedOn).toBe('2026-12-02');

    await page.reload();
    await page.getByRole('tab', { name: /Board and supply/ }).click();
    await expect.poll(() => page.locator('[data-field="board.installedOn"] input[type="text"]').inputValue()).toBe('2 Dec 2026');
    expect(app.pageErrors).toEqual([]);
  }, 180_000);

  it('when a board address names no board, then the editor says there is no such board', async () => {
    const { page } = await signedInOwnerPage(app, 'Fernhollow Test Electrical');
    for (const path of ['/boards/abc', '/boards/999999999']) {
      await page.goto(path);
      await page.getByText('There is no such board').waitFor();
    }
    expect(app.pageErrors).toEqual([]);
  });

  it('when a ring is made a radial, then it keeps one leg; the label shows its limit while typing; each B32 is named by its place', async () => {
    const { page } = await signedInOwnerPage(app, 'Fernhollow Test Electrical');
    const boardId = await boardWithCircuits(page, 3);
    await page.goto(`/boards/${boardId}`);
    const label = page.locator('td[data-cell="label-c1"] input');
    await label.waitFor();
    expect(await page.locator('td[data-cell="legs-c1"] input').inputValue()).toBe('2'); // the fixture's ring

    await page.locator('td[data-cell="kind-c1"] .ant-select-selector').click();
    await page.locator('.ant-select-dropdown:not(.ant-select-dropdown-hidden) .ant-select-item-option[title="Radial"]').click();
    expect(await page.locator('td[data-cell="legs-c1"] input').inputValue()).toBe('1');

    // The 24-character limit of a label, counted as it is typed.
    await label.fill('Kitchen sockets');
    expect(await page.locator('td[data-cell="label-c1"] .ant-input-show-count-suffix').textContent()).toBe('15 / 24');

    // The fixture's main switch is 1st on row 1, so the RCBOs of ways 1 and 3 are 2nd and 4th.
    expect(await page.locator('td[data-cell="device-c1"]').textContent()).toContain('RCBO B32 30 mA · row 1, 2nd from left');
    expect(await page.locator('td[data-cell="device-c3"]').textContent()).toContain('RCBO B32 30 mA · row 1, 4th from left');

    await page.getByTestId('save').click();
    await page.getByTestId('save-state').filter({ hasText: 'Saved · revision 3' }).waitFor();
    const saved = await (await page.request.get(`/api/boards/${boardId}/schedule`)).json();
    expect(saved.circuits[0]).toMatchObject({ kind: 'radial', legs: 1, label: 'Kitchen sockets' });

    // In the drawer, the description shows its 500-character limit too.
    await page.getByRole('button', { name: 'Details of way 1' }).click();
    await page.locator('[data-field="circuits.0.description"] .ant-input-textarea-show-count').waitFor();
    expect(app.pageErrors).toEqual([]);
  }, 180_000);

  it('when Discard changes or Delete board is pressed, then the app asks first and Keep leaves everything as it was', async () => {
    const { page } = await signedInOwnerPage(app, 'Fernhollow Test Electrical', { viewport: PHONE });
    const dialogs = nativeDialogs(page);
    const boardId = await boardWithCircuits(page, 2);
    await page.goto(`/boards/${boardId}`);
    // On a phone the circuits are a list: way 1's fields are in its form, with the Save bar (and Discard) docked over it.
    await page.getByRole('button', { name: 'Details of way 1' }).click();
    const label = page.locator('.ant-drawer-open [data-field="circuits.0.label"] input');
    await label.fill('Hall sockets');

    await page.getByRole('button', { name: 'Discard changes' }).click();
    await popconfirm(page, 'Throw away your unsaved changes?').waitFor();
    if (SHOTS) await page.screenshot({ path: `${SHOTS}/editor-discard-phone.png` });
    expect(await label.inputValue()).toBe('Hall sockets');
    await popconfirm(page, 'Throw away your unsaved changes?').getByRole('button', { name: 'Keep editing' }).click();
    expect(await label.inputValue()).toBe('Hall sockets');

    await page.getByRole('button', { name: 'Discard changes' }).click();
    await popconfirm(page, 'Throw away your unsaved changes?').getByRole('button', { name: 'Discard' }).click();
    await expect.poll(() => label.inputValue()).toBe(makeSchedule(2).circuits[0].label);
    await page.getByRole('button', { name: 'Done' }).click();

    await page.getByRole('button', { name: 'More' }).click();
    await page.getByRole('menuitem', { name: 'Delete board' }).click();
    await popconfirm(page, 'Delete this board?').getByRole('button', { name: 'Keep' }).click();
    expect((await page.request.get(`/api/boards/${boardId}/schedule`)).status()).toBe(200);
    expect(new URL(page.url()).pathname).toBe(`/boards/${boardId}`);

    await page.getByRole('button', { name: 'More' }).click();
    await page.getByRole('menuitem', { name: 'Delete board' }).click();
    await popconfirm(page, 'Delete this board?').getByRole('button', { name: 'Delete board' }).click();
    await page.waitForURL(/\/boards$/);
    expect((await page.request.get(`/api/boards/${boardId}/schedule`)).status()).toBe(404);
    expect(dialogs).toEqual([]);
    expect(app.pageErrors).toEqual([]);
  }, 180_000);
});
