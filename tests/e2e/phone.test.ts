import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { scheduleSchema } from '../../shared/schemas/schedule.js';
import { makeSchedule } from '../helpers/boards.js';
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

/** A board with two revisions (the second changes the last inspection date), made in the page's session. */
async function boardWithTwoRevisions(page: Page): Promise<number> {
  const { token } = (await (await page.request.get('/api/auth/csrf')).json()) as { token: string };
  const headers = { 'X-CSRF-Token': token };
  const { id } = (await (await page.request.post('/api/boards', { headers, data: { name: 'Garden studio board' } })).json()) as { id: number };
  const base = makeSchedule(6, 'Garden studio board');
  for (const [baseRevision, lastInspectionOn] of [
    [1, '2021-05-14'],
    [2, '2025-06-01'],
  ] as const) {
    const schedule = scheduleSchema.parse({ ...base, board: { ...base.board, lastInspectionOn } });
    const saved = await page.request.put(`/api/boards/${id}/schedule`, { headers, data: { ...schedule, baseRevision } });
    if (saved.status() !== 200) throw new Error(`save failed: ${saved.status()} ${await saved.text()}`);
  }
  return id;
}

/** The little of the DOM the check reads (the test's own type-check has no DOM library). */
interface Box {
  scrollWidth: number;
  clientWidth: number;
  className: string;
  querySelector(selector: string): { textContent: string | null } | null;
}
interface PageDocument {
  documentElement: Box;
  querySelectorAll(selector: string): ArrayLike<Box>;
}

/** How far the page, and any card on it, is wider than what shows; 0 when nothing scrolls sideways. */
async function sidewaysOverflow(page: Page): Promise<{ page: number; cards: string[] }> {
  return page.evaluate(() => {
    const doc = (globalThis as unknown as { document: PageDocument }).document;
    const cards = Array.from(doc.querySelectorAll('.wm-section'))
      .filter((el) => el.scrollWidth > el.clientWidth + 1)
      .map((el) => `${el.querySelector('h2')?.textContent ?? el.className}: ${el.scrollWidth} > ${el.clientWidth}`);
    return { page: doc.documentElement.scrollWidth - doc.documentElement.clientWidth, cards };
  });
}

describe('signed-in pages on a phone', { timeout: 240_000 }, () => {
  it('when each main page is opened at 390 px wide, then neither the page nor a card scrolls sideways', async () => {
    // A long organisation name: the account menu in the header must shorten it, not widen the page.
    const { page } = await signedInOwnerPage(app, 'Longfield and Harrowby Electrical Contractors', { viewport: PHONE });
    const id = await boardWithTwoRevisions(page);
    const pages: Array<[string, string]> = [
      ['/boards', 'Boards'],
      ['/sites', 'Sites'],
      [`/boards/${id}`, 'Garden studio board'],
      [`/boards/${id}/history`, 'History of'],
      [`/boards/${id}/print`, 'Print'],
      [`/boards/${id}/page`, 'Garden studio board'],
      ['/settings/printing', 'Print'],
      ['/members', 'Members'],
      ['/settings/organisation', 'Organisation'],
    ];
    for (const [path, title] of pages) {
      await page.goto(path);
      await page.locator('.wm-page__title, h1').filter({ hasText: title }).first().waitFor();
      await page.waitForLoadState('networkidle');
      if (SHOTS) await page.screenshot({ path: `${SHOTS}/phone${path.replaceAll('/', '_')}.png`, fullPage: true });
      expect({ path, ...(await sidewaysOverflow(page)) }).toEqual({ path, page: 0, cards: [] });
    }
    // The last page opened sits at the far end of the navigation row: its entry is scrolled into view.
    const nav = await page.getByRole('navigation', { name: 'Main' }).boundingBox();
    const current = await page.locator('nav [aria-current="page"]').boundingBox();
    expect(current!.x).toBeGreaterThanOrEqual(nav!.x - 1);
    expect(current!.x + current!.width).toBeLessThanOrEqual(nav!.x + nav!.width + 1);
    expect(app.pageErrors).toEqual([]);
  });

  it("when a board's history is read, then the days in the differences are written as elsewhere and every revision shows who and what changed on screen", async () => {
    const { page } = await signedInOwnerPage(app, 'Phone History Electrical', { viewport: PHONE });
    const id = await boardWithTwoRevisions(page);
    await page.goto(`/boards/${id}/history`);
    const diff = page.locator('.board-diff');
    await expect.poll(() => diff.textContent().catch(() => ''), { timeout: 30_000 }).toContain('14 May 2021 → 1 Jun 2025'); // the dates saved above
    expect(await diff.textContent()).not.toMatch(/\d{4}-\d{2}-\d{2}/);
    const list = page.getByTestId('revision-list');
    expect(await list.textContent()).not.toMatch(/\d{4}-\d{2}-\d{2}/);

    // "By" and "What changed" of each revision lie inside the 390 px screen, each named, not off to the right.
    const rows = list.locator('tbody tr.ant-table-row');
    expect(await rows.count()).toBe(3); // created, then the two saves above
    for (const column of ['By', 'What changed']) {
      const cells = list.locator(`tbody td[data-label="${column}"]`);
      expect(await cells.count()).toBe(3);
      for (let i = 0; i < 3; i++) {
        const box = await cells.nth(i).boundingBox();
        expect(box, column).not.toBeNull();
        expect(box!.x).toBeGreaterThanOrEqual(0);
        expect(box!.x + box!.width).toBeLessThanOrEqual(PHONE.width);
        expect(
          await cells
            .nth(i)
            .evaluate(
              (el) => (globalThis as unknown as { getComputedStyle(e: unknown, p: string): { content: string } }).getComputedStyle(el, '::before').content,
            ),
        ).toBe(`"${column}"`);
      }
    }
    expect(await list.locator('tbody td[data-label="By"]').first().textContent()).toContain('Test Owner');
    expect(await list.locator('tbody td[data-label="What changed"]').first().textContent()).not.toBe('');
    expect(await sidewaysOverflow(page)).toEqual({ page: 0, cards: [] });
    if (SHOTS) await page.screenshot({ path: `${SHOTS}/phone-history.png`, fullPage: true });
  });

  it("when a circuit's or a device's drawer is opened at 390 px, then the whole drawer is on the screen", async () => {
    const { page } = await signedInOwnerPage(app, 'Phone Drawer Electrical', { viewport: PHONE });
    const id = await boardWithTwoRevisions(page);
    await page.goto(`/boards/${id}`);
    await page.getByRole('button', { name: 'Details of way 1' }).click();
    const drawer = page.locator('.ant-drawer-open .ant-drawer-content-wrapper');
    await page.getByLabel('Circuits grouped, this one included').waitFor();
    const onScreen = async (what: string) => {
      // Polled: the drawer slides in from the right before it settles.
      await expect
        .poll(
          async () => {
            const box = await drawer.boundingBox();
            return { what, starts: box!.x >= 0, right: Math.round(box!.x + box!.width) };
          },
          { timeout: 5_000 },
        )
        .toEqual({ what, starts: true, right: PHONE.width });
      // Its fields too: the widest control ends inside the screen.
      const field = await page.locator('.ant-drawer-open .ant-form-item').first().boundingBox();
      expect(field!.x + field!.width).toBeLessThanOrEqual(PHONE.width);
    };
    await onScreen('circuit drawer');
    expect(Math.round((await drawer.boundingBox())!.width)).toBe(PHONE.width); // 400 px wanted, the screen is all there is
    if (SHOTS) await page.screenshot({ path: `${SHOTS}/phone-circuit-drawer.png` });
    await page.goto(`/boards/${id}`);

    await page.getByRole('tab', { name: /DIN rows/ }).click();
    await page.getByRole('button', { name: 'Add device to row 1' }).click();
    await page.getByRole('menuitem', { name: 'MCB' }).click();
    await page.getByRole('button', { name: 'Edit', exact: true }).click();
    await page.getByLabel('Rating (A)').waitFor();
    await onScreen('device drawer');
    if (SHOTS) await page.screenshot({ path: `${SHOTS}/phone-device-drawer.png` });
    expect(app.pageErrors).toEqual([]);
  });

  it('when the print page is opened on a phone, then a button opens the same PDF the preview holds', async () => {
    const { page } = await signedInOwnerPage(app, 'Phone Print Electrical', { viewport: PHONE });
    const id = await boardWithTwoRevisions(page);
    await page.goto(`/boards/${id}/print`);
    const open = page.getByTestId('print-preview-open');
    await open.waitFor({ state: 'visible', timeout: 60_000 });
    const href = await open.getAttribute('href');
    expect(href).toMatch(/^blob:/);
    expect(await page.getByTestId('print-preview-frame').getAttribute('src')).toBe(`${href}#view=Fit`);
    expect(await page.getByTestId('print-preview-frame').isVisible()).toBe(false);
    expect(await open.getAttribute('target')).toBe('_blank');
    if (SHOTS) await page.screenshot({ path: `${SHOTS}/phone-print.png`, fullPage: true });
  });
});
