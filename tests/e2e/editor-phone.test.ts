/**
 * The board editor on a phone: the circuits as a list that opens each circuit's form, Save in
 * reach with its unsaved marker, the number keypad on number fields, the rules' words written
 * beside the field, and no page that scrolls sideways.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { signedInOwnerPage, startBrowserApp, type BrowserApp } from '../helpers/browser.js';

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

/** The little of the DOM these checks read (the test's own type-check has no DOM library). */
interface PageWindow {
  innerWidth: number;
  document: { documentElement: { scrollWidth: number }; elementFromPoint(x: number, y: number): { closest(s: string): unknown } | null };
}

/** How wide the page is against the window: never wider, or it scrolls sideways. */
const widths = (page: Page) =>
  page.evaluate(() => {
    const w = globalThis as unknown as PageWindow;
    return { scrollWidth: w.document.documentElement.scrollWidth, innerWidth: w.innerWidth };
  });
async function expectNoSidewaysScroll(page: Page, where: string): Promise<void> {
  const { scrollWidth, innerWidth } = await widths(page);
  expect({ where, scrollWidth: Math.min(scrollWidth, innerWidth) }).toEqual({ where, scrollWidth });
}

/** The Save button is on screen and nothing (a drawer, its mask) lies over its middle. */
async function expectSaveInReach(page: Page): Promise<void> {
  const box = (await page.getByTestId('save').boundingBox())!;
  expect(box.x).toBeGreaterThanOrEqual(0);
  expect(box.x + box.width).toBeLessThanOrEqual(PHONE.width);
  expect(box.y + box.height).toBeLessThanOrEqual(PHONE.height);
  const onTop = await page.evaluate(
    ([x, y]) => Boolean((globalThis as unknown as PageWindow).document.elementFromPoint(x, y)?.closest('[data-testid="save"]')),
    [box.x + box.width / 2, box.y + box.height / 2],
  );
  expect(onTop).toBe(true);
}

/** Writes through the page's own session, as the API client the editor uses would. */
async function api(page: Page, method: 'POST' | 'PUT', path: string, data: unknown) {
  const { token } = (await (await page.request.get('/api/auth/csrf')).json()) as { token: string };
  const res = await page.request.fetch(path, { method, headers: { 'X-CSRF-Token': token }, data });
  if (!res.ok()) throw new Error(`${method} ${path}: ${res.status()} ${await res.text()}`);
  return res.json();
}

/**
 * Every line of the circuit list as [way, label], scrolling the page top to bottom: only the lines
 * in view (and a few either side) are built, so no one moment shows them all.
 */
async function listedWays(page: Page): Promise<[string, string][]> {
  const seen = new Map<number, [string, string]>();
  for (let y = 0; ; y += 300) {
    await page.evaluate((top) => (globalThis as unknown as { scrollTo(x: number, y: number): void }).scrollTo(0, top), y);
    await page.waitForTimeout(100);
    for (const li of await page.locator('.circuit-list__items > li').all()) {
      const way = (await li.locator('.circuit-list__way').textContent()) ?? '';
      seen.set(Number(await li.getAttribute('data-index')), [way, (await li.locator('.circuit-list__label').textContent()) ?? '']);
    }
    const { scrollY, innerHeight, height } = await page.evaluate(() => {
      const w = globalThis as unknown as { scrollY: number; innerHeight: number; document: { documentElement: { scrollHeight: number } } };
      return { scrollY: w.scrollY, innerHeight: w.innerHeight, height: w.document.documentElement.scrollHeight };
    });
    if (scrollY + innerHeight >= height) break;
  }
  return [...seen.entries()].sort((a, b) => a[0] - b[0]).map(([, line]) => line);
}

const form = (page: Page) => page.locator('.ant-drawer-open');
const formInput = (page: Page, path: string) => form(page).locator(`[data-field="${path}"] input`).first();
async function choose(page: Page, path: string, option: string): Promise<void> {
  await form(page).locator(`[data-field="${path}"] .ant-select-selector`).click();
  await page.locator(`.ant-select-dropdown:not(.ant-select-dropdown-hidden) .ant-select-item-option[title="${option}"]`).click();
}
/** The form slides in from the right; wait until it has settled on the screen. */
async function formOpen(page: Page): Promise<void> {
  await expect.poll(async () => Math.round((await form(page).locator('.ant-drawer-content-wrapper').boundingBox())?.x ?? -1), { timeout: 5_000 }).toBe(0);
}

describe('the board editor on a phone (390 × 844)', { timeout: 240_000 }, () => {
  it('when a board is built through the circuit list and its forms, then it saves, reloads as entered, and no tab scrolls sideways', async () => {
    const { page } = await signedInOwnerPage(app, 'Hollowmere and Brackley Electrical Contractors', { viewport: PHONE });

    await page.goto('/boards');
    await page.getByRole('link', { name: 'New board' }).click();
    await page.getByLabel('Board name').fill('Workshop board');
    await page.getByLabel('Where it is').fill('Workshop, behind the door');
    await page.getByText('Empty board', { exact: true }).click();
    await page.getByRole('button', { name: 'Create board' }).click();
    await page.waitForURL(/\/boards\/\d+$/);
    const boardId = Number(new URL(page.url()).pathname.split('/').pop());

    // One B32 MCB on row 1, for the circuit to take.
    await page.getByRole('tab', { name: /DIN rows/ }).click();
    await page.getByRole('button', { name: 'Add device to row 1' }).click();
    await page.getByRole('menuitem', { name: 'MCB' }).click();
    await page.getByRole('button', { name: 'Edit', exact: true }).click();
    await page.getByLabel('Rating (A)').fill('32');
    await page.keyboard.press('Escape');

    // The circuits are a list, not the table; Add circuit opens the new one's form with its label ready to type over.
    await page.getByRole('tab', { name: /Circuits/ }).click();
    expect(await page.locator('table.board-circuits').count()).toBe(0);
    await page.getByRole('button', { name: 'Add circuit' }).click();
    await formOpen(page);
    await page.keyboard.type('Workshop sockets');
    expect(await formInput(page, 'circuits.0.label').inputValue()).toBe('Workshop sockets');
    expect(await formInput(page, 'circuits.0.way').getAttribute('inputmode')).toBe('numeric');
    expect(await formInput(page, 'circuits.0.cable.liveCsa').getAttribute('inputmode')).toBe('decimal');
    expect(await formInput(page, 'circuits.0.legs').getAttribute('inputmode')).toBe('numeric');
    expect(await form(page).locator('[data-field="circuits.0.deviceId"]').textContent()).toContain('B32');

    await choose(page, 'circuits.0.kind', 'Radial');
    await formInput(page, 'circuits.0.cable.liveCsa').fill('2.5');
    await formInput(page, 'circuits.0.cable.cpcCsa').fill('1.5');
    await choose(page, 'circuits.0.cable.referenceMethod', 'C – clipped direct');
    await formInput(page, 'circuits.0.cable.lengthM').fill('14');
    // BS 7671:2018+A2 Table 4D5: 2.5 mm² flat twin-and-earth, method C, Iz = 27 A < In = 32 A.
    // The rule's words are written under the field, not kept in a tooltip.
    const liveHelp = form(page).locator('[data-field="circuits.0.cable.liveCsa"] .board-field__line');
    await liveHelp.filter({ hasText: '27 A' }).waitFor();
    expect(await liveHelp.filter({ hasText: '27 A' }).isVisible()).toBe(true);

    // Save stays in reach over the open form, marked unsaved.
    await expectSaveInReach(page);
    expect(await page.getByTestId('save-state').textContent()).toContain('Unsaved changes');
    expect(await page.getByTestId('save-state').locator('.board-toolbar__dot').count()).toBe(1);
    await expectNoSidewaysScroll(page, 'circuit form');
    if (SHOTS) await page.screenshot({ path: `${SHOTS}/editor-phone-form.png` });

    // A second circuit, then way 1 moved to way 5: the list follows way order, the board keeps its own order.
    await page.getByRole('button', { name: 'Done' }).click();
    await page.getByRole('button', { name: 'Add circuit' }).click();
    await formOpen(page);
    await page.keyboard.type('Workshop lights');
    await page.getByRole('button', { name: 'Done' }).click();
    await page.getByRole('button', { name: /^Details of way 1: Workshop sockets/ }).click();
    await formOpen(page);
    await formInput(page, 'circuits.0.way').fill('5');
    await page.getByRole('button', { name: 'Done' }).click();
    const items = page.locator('.circuit-list__item');
    await expect.poll(() => items.locator('.circuit-list__label').allTextContents()).toEqual(['Workshop lights', 'Workshop sockets']);
    // The capacity finding marks way 5 in the list, and says so to a screen reader.
    expect(await items.nth(1).getByTestId('circuit-mark').isVisible()).toBe(true);
    expect(await items.nth(1).getAttribute('aria-label')).toMatch(
      /^Details of way 5: Workshop sockets, B32, 2\.5\/1\.5 mm² Flat twin and earth, \d+ things? to check$/,
    );
    await expectSaveInReach(page);
    if (SHOTS) await page.screenshot({ path: `${SHOTS}/editor-phone-list.png` });

    await page.getByTestId('save').click();
    await page.getByTestId('save-state').filter({ hasText: 'Saved · revision 2' }).waitFor();
    const saved = await (await page.request.get(`/api/boards/${boardId}/schedule`)).json();
    expect(saved.circuits.map((c: { way: number; label: string }) => [c.way, c.label])).toEqual([
      [5, 'Workshop sockets'],
      [2, 'Workshop lights'],
    ]);
    expect(saved.circuits[0]).toMatchObject({ kind: 'radial', cable: { liveCsa: 2.5, cpcCsa: 1.5, referenceMethod: 'C', lengthM: 14 } });

    // After a reload the list and the form show what was entered.
    await page.reload();
    await page.getByRole('button', { name: /^Details of way 5: Workshop sockets/ }).click();
    await formOpen(page);
    expect(await formInput(page, 'circuits.0.label').inputValue()).toBe('Workshop sockets');
    expect(await formInput(page, 'circuits.0.cable.liveCsa').inputValue()).toBe('2.5');
    expect(await formInput(page, 'circuits.0.cable.lengthM').inputValue()).toBe('14');
    await page.getByRole('button', { name: 'Done' }).click();

    // Every tab: its title shows whole on the screen, and the page never scrolls sideways.
    const tabs = page.getByRole('tab');
    expect(await tabs.count()).toBe(4);
    for (let i = 0; i < 4; i++) {
      const tab = tabs.nth(i);
      const box = (await tab.boundingBox())!;
      const name = (await tab.textContent()) ?? '';
      expect({ name, left: box.x >= 0, right: box.x + box.width <= PHONE.width }).toEqual({ name, left: true, right: true });
      expect(await tab.evaluate((el) => (el as unknown as { scrollWidth: number }).scrollWidth <= (el as unknown as { clientWidth: number }).clientWidth)).toBe(
        true,
      );
      await tab.click();
      await page.waitForLoadState('networkidle');
      await expectNoSidewaysScroll(page, name);
      if (SHOTS) await page.screenshot({ path: `${SHOTS}/editor-phone-tab-${i}.png` });
    }

    // Every entry of the main navigation shows whole on the screen (none hidden off to the side).
    const links = page.getByRole('navigation', { name: 'Main' }).getByRole('link');
    expect(await links.count()).toBeGreaterThanOrEqual(5); // an owner's Boards, Sites, Print settings, Members, Organisation
    for (const link of await links.all()) {
      const box = (await link.boundingBox())!;
      const name = (await link.textContent()) ?? '';
      expect({ name, left: box.x >= 0, right: box.x + box.width <= PHONE.width }).toEqual({ name, left: true, right: true });
    }

    // The owner's menu opens inside the screen.
    await page.getByRole('button', { name: /^Account menu for/ }).click();
    const panel = (await page.locator('.app-user-menu__panel').boundingBox())!;
    expect(panel.x).toBeGreaterThanOrEqual(0);
    expect(panel.x + panel.width).toBeLessThanOrEqual(PHONE.width);
    await expectNoSidewaysScroll(page, 'account menu');
    expect(app.pageErrors).toEqual([]);
    expect(app.outsideRequests).toEqual([]);
  });

  it('when a circuit is removed from its form on a phone, then it leaves the list and the saved board', async () => {
    const { page } = await signedInOwnerPage(app, 'Phone Remove Electrical', { viewport: PHONE });
    await page.goto('/boards/new');
    await page.getByLabel('Board name').fill('Shed board');
    await page.getByText('Empty board', { exact: true }).click();
    await page.getByRole('button', { name: 'Create board' }).click();
    await page.waitForURL(/\/boards\/\d+$/);
    const boardId = Number(new URL(page.url()).pathname.split('/').pop());
    for (const label of ['Shed lights', 'Shed sockets']) {
      await page.getByRole('button', { name: 'Add circuit' }).click();
      await formOpen(page);
      await page.keyboard.type(label);
      await page.getByRole('button', { name: 'Done' }).click();
    }
    await page.getByRole('button', { name: /^Details of way 1: Shed lights/ }).click();
    await formOpen(page);
    await form(page).getByRole('button', { name: 'Remove way 1' }).click();
    await page.locator('.ant-popover:not(.ant-popover-hidden)').getByRole('button', { name: 'Remove' }).click();
    await expect.poll(() => page.locator('.circuit-list__label').allTextContents()).toEqual(['Shed sockets']);
    await page.getByTestId('save').click();
    await page.getByTestId('save-state').filter({ hasText: 'Saved · revision 2' }).waitFor();
    const saved = await (await page.request.get(`/api/boards/${boardId}/schedule`)).json();
    expect(saved.circuits.map((c: { label: string }) => c.label)).toEqual(['Shed sockets']);
    expect(app.pageErrors).toEqual([]);
  });

  it('when a board from the 10-way layout has 9 circuits, then the phone list shows 10 ways with way 10 Spare, and using it makes a 10th circuit on that device that is saved', async () => {
    const { page } = await signedInOwnerPage(app, 'Phone Spare Electrical', { viewport: PHONE });
    const { id: boardId } = await api(page, 'POST', '/api/boards', { name: 'Hall consumer unit', template: 'split-load-10' });
    const before = await (await page.request.get(`/api/boards/${boardId}/schedule`)).json();
    // The layout is named for its ten ways: nine circuits and one breaker labelled Spare with none.
    const spareDevice = before.devices.find((d: { label: string }) => d.label === 'Spare');
    expect(before.circuits).toHaveLength(9);
    expect(before.circuits.some((c: { deviceId: string | null }) => c.deviceId === spareDevice.id)).toBe(false);

    await page.goto(`/boards/${boardId}`);
    const lines = page.locator('.circuit-list__items > li');
    const spareLines = page.locator('.circuit-list__item--spare');
    await page.getByRole('tab', { name: 'Circuits (9 + 1 spare)' }).waitFor();
    await lines.first().waitFor();
    expect(await page.locator('table.board-circuits').count()).toBe(0);
    // Ten ways in way order, the spare the last, numbered 10, on its device.
    const ways = await listedWays(page);
    expect(ways.map(([way]) => way)).toEqual(['1', '2', '3', '4', '5', '6', '7', '8', '9', '10']);
    expect(ways.filter(([, label]) => label === 'Spare')).toEqual([['10', 'Spare']]);
    await spareLines.scrollIntoViewIfNeeded();
    expect(await spareLines.count()).toBe(1);
    expect(await spareLines.getAttribute('data-spare-device')).toBe(spareDevice.id);
    expect(await spareLines.locator('.circuit-list__meta').textContent()).toBe('Spare (B16)'); // the layout's spare breaker, a B16
    // The button sits inside the screen, beside its way.
    const use = page.getByRole('button', { name: 'Use spare way 10' });
    const useBox = (await use.boundingBox())!;
    expect(useBox.x + useBox.width).toBeLessThanOrEqual(PHONE.width);
    await expectNoSidewaysScroll(page, 'list with a spare');
    await expectSaveInReach(page);
    if (SHOTS) await page.screenshot({ path: `${SHOTS}/editor-phone-spare.png` });

    // Using it opens the form of a new circuit on way 10 and the spare device, its label ready to type over.
    await use.click();
    await formOpen(page);
    expect(await formInput(page, 'circuits.9.way').inputValue()).toBe('10');
    expect(await form(page).locator('[data-field="circuits.9.deviceId"]').textContent()).toContain('Spare (B16)');
    await page.keyboard.type('Garden lights');
    expect(await formInput(page, 'circuits.9.label').inputValue()).toBe('Garden lights');
    await expectNoSidewaysScroll(page, 'form of the spare way');
    await page.getByRole('button', { name: 'Done' }).click();
    await page.getByRole('button', { name: /^Details of way 10: Garden lights, Spare \(B16\)/ }).waitFor();
    expect(await spareLines.count()).toBe(0);

    await page.getByTestId('save').click();
    await page.getByTestId('save-state').filter({ hasText: 'Saved · revision 2' }).waitFor();
    await page.reload();
    await page.getByRole('tab', { name: 'Circuits (10)' }).waitFor();
    await lines.first().waitFor();
    const reloaded = await listedWays(page);
    expect(reloaded.map(([way]) => way)).toEqual(['1', '2', '3', '4', '5', '6', '7', '8', '9', '10']);
    expect(reloaded[9]).toEqual(['10', 'Garden lights']);
    expect(reloaded.filter(([, label]) => label === 'Spare')).toEqual([]);
    await expectNoSidewaysScroll(page, 'list after reload');
    const saved = await (await page.request.get(`/api/boards/${boardId}/schedule`)).json();
    expect(saved.circuits).toHaveLength(10);
    expect(saved.circuits.find((c: { way: number }) => c.way === 10)).toMatchObject({ label: 'Garden lights', deviceId: spareDevice.id });
    expect(app.pageErrors).toEqual([]);
  });
});
