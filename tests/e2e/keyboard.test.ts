/**
 * The editor without a mouse: from the board's page, Tab reaches Add circuit, the new row's cells
 * are filled in by typing and by opening each select with the arrow keys, Shift+Tab reaches Save,
 * and what was saved is read back through the API. Every key goes through `page.keyboard`.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { scheduleSchema, type Schedule } from '../../shared/schemas/schedule.js';
import { makeSchedule } from '../helpers/boards.js';
import { signedInOwnerPage, startBrowserApp, type BrowserApp } from '../helpers/browser.js';

let app: BrowserApp;
beforeAll(async () => {
  app = await startBrowserApp();
});
afterAll(async () => {
  await app?.close();
});

const LAPTOP = { width: 1366, height: 900 }; // a common laptop viewport in CSS pixels // from memory

/** What has the focus: its accessible name as the page gives it (aria-label, else its text) and its role. */
interface Focused {
  name: string;
  role: string;
  tag: string;
}
async function focused(page: Page): Promise<Focused> {
  return page.evaluate(() => {
    type El = { getAttribute(n: string): string | null; textContent: string | null; tagName: string };
    const el = (globalThis as unknown as { document: { activeElement: El | null } }).document.activeElement;
    return {
      name: el?.getAttribute('aria-label') ?? el?.textContent?.trim() ?? '',
      role: el?.getAttribute('role') ?? '',
      tag: el?.tagName.toLowerCase() ?? '',
    };
  });
}

/** Presses Tab (or Shift+Tab) until the focused element has this name; fails if it never comes. */
async function tabTo(page: Page, name: string, back = false): Promise<Focused> {
  const seen: string[] = [];
  for (let i = 0; i < 120; i++) {
    await page.keyboard.press(back ? 'Shift+Tab' : 'Tab');
    const now = await focused(page);
    if (now.name === name) return now;
    seen.push(now.name || now.tag);
  }
  throw new Error(`Tab never reached "${name}"; it went through: ${seen.join(' → ')}`);
}

/** Opens the focused select with ArrowDown, walks its options with the arrow keys to `option`, picks it with Enter. */
async function pickWithKeys(page: Page, option: string | RegExp): Promise<void> {
  const wanted = (text: string | null) => (typeof option === 'string' ? text?.trim() === option : option.test(text ?? ''));
  // The list this select controls (another one may still be fading out).
  const listId = await page.locator(':focus').getAttribute('aria-controls');
  await page.keyboard.press('ArrowDown');
  const list = page.locator('.ant-select-dropdown').filter({ has: page.locator(`[id="${listId}"]`) });
  await list.waitFor();
  const active = list.locator('.ant-select-item-option-active');
  for (let i = 0; i < 20 && !wanted(await active.textContent()); i++) await page.keyboard.press('ArrowDown');
  expect(wanted(await active.textContent()), `option ${option} reached with the arrow keys`).toBe(true);
  await page.keyboard.press('Enter');
  await list.waitFor({ state: 'hidden' });
}

/** Clears the focused box and types a value into it. */
async function typeInto(page: Page, value: string): Promise<void> {
  await page.keyboard.press('ControlOrMeta+A');
  await page.keyboard.type(value);
}

/** A board with a main switch and two RCBOs (B32, B6) and no circuits yet, in the page's session. */
async function boardWithFreeBreakers(page: Page): Promise<{ id: number; schedule: Schedule }> {
  const { token } = (await (await page.request.get('/api/auth/csrf')).json()) as { token: string };
  const headers = { 'X-CSRF-Token': token };
  const base = makeSchedule(2, 'Garage board');
  const schedule = scheduleSchema.parse({ ...base, circuits: [] });
  const created = await page.request.post('/api/boards', { headers, data: { name: schedule.board.name } });
  const { id } = (await created.json()) as { id: number };
  const saved = await page.request.put(`/api/boards/${id}/schedule`, { headers, data: { ...schedule, baseRevision: 1 } });
  if (saved.status() !== 200) throw new Error(`save failed: ${saved.status()} ${await saved.text()}`);
  return { id, schedule };
}

describe('the board editor by keyboard alone', { timeout: 180_000 }, () => {
  it('when a circuit is built with Tab, typing and arrow keys and saved from the Save button, then the board holds it as typed', async () => {
    const { page } = await signedInOwnerPage(app, 'Larchgate Test Electrical', { viewport: LAPTOP });
    const { id } = await boardWithFreeBreakers(page);
    await page.goto(`/boards/${id}`);
    await page.getByText('No circuits yet.').waitFor();

    // Add circuit puts the cursor in the new row's label, ready to be typed over.
    expect((await tabTo(page, 'Add circuit')).tag).toBe('button');
    await page.keyboard.press('Enter');
    expect(await focused(page)).toMatchObject({ name: 'Way 1 label', tag: 'input' });
    await typeInto(page, 'Workshop lights');

    // Each cell in turn, named by its way and column; the new row took the first free breaker (the B32).
    expect(await tabTo(page, 'Way 1 device')).toMatchObject({ role: 'combobox' });
    await pickWithKeys(page, /\bB6\b.* · row 1, 3rd from left/);
    expect(await tabTo(page, 'Way 1 kind')).toMatchObject({ role: 'combobox' });
    await pickWithKeys(page, 'Lighting');
    await tabTo(page, 'Way 1 cable type');
    await pickWithKeys(page, 'Flat twin and earth');
    await tabTo(page, 'Way 1 live csa (mm²)');
    await typeInto(page, '1.5');
    await tabTo(page, 'Way 1 cpc csa (mm²)');
    await typeInto(page, '1');
    await tabTo(page, 'Way 1 reference method');
    await pickWithKeys(page, 'C – clipped direct');
    await tabTo(page, 'Way 1 length (m)');
    await typeInto(page, '22');
    await tabTo(page, 'Way 1 points');
    await typeInto(page, '7');
    await tabTo(page, 'Way 1 measured Zs (Ω)');
    await typeInto(page, '0.91');
    await page.keyboard.press('Tab');

    // Back up to Save and press it.
    await tabTo(page, 'Save', true);
    await page.keyboard.press('Enter');
    await page
      .getByText(/^Saved/)
      .first()
      .waitFor();

    const saved = (await (await page.request.get(`/api/boards/${id}/schedule`)).json()) as Schedule & { revision: number };
    expect(saved.revision).toBe(3);
    expect(saved.circuits).toHaveLength(1);
    expect(saved.circuits[0]).toMatchObject({
      way: 1,
      label: 'Workshop lights',
      deviceId: 'd2',
      kind: 'lighting',
      socketOutlets: false,
      legs: 1,
      points: 7,
      measuredZs: 0.91,
      cable: { type: 'twin-earth', liveCsa: 1.5, cpcCsa: 1, referenceMethod: 'C', lengthM: 22 },
    });
    expect(app.pageErrors).toEqual([]);
  });
});
