/**
 * Every signed-in screen passes axe-core with no serious or critical violation, at a laptop's
 * 1366 × 900 and a phone's 390 × 844. One browser, one organisation and one page per size: the
 * organisation holds a 10-way board on a site (with a second revision), the surveyed bungalow
 * board for the survey tab, a waiting invitation and so a captured e-mail.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { AxeBuilder } from '@axe-core/playwright';
import type { Page } from 'playwright-core';
import { bungalowBoard, bungalowSite } from '../../server/seed/demo-bungalow.js';
import { makeSchedule } from '../helpers/boards.js';
import { signedInOwnerPage, startBrowserApp, type BrowserApp } from '../helpers/browser.js';
import { uniqueEmail } from '../helpers/app.js';

/** Set to a folder to keep screenshots of what the tests saw (for looking, not for asserting). */
const SHOTS = process.env.WAYMARK_SHOTS;
const LAPTOP = { width: 1366, height: 900 }; // a common laptop viewport in CSS pixels // from memory
const PHONE = { width: 390, height: 844 }; // a common phone viewport in CSS pixels // from memory

let app: BrowserApp;
let owner: Page;
/** Any dialog a screen opened (none is expected). */
const dialogs: string[] = [];
/** What the screens show: the 10-way board (on a site, two revisions) and the surveyed board. */
const made = { boardId: 0, surveyBoardId: 0, siteId: 0 };

async function api(page: Page, method: 'POST' | 'PUT', path: string, data: unknown): Promise<{ id?: number; revision?: number }> {
  const { token } = (await (await page.request.get('/api/auth/csrf')).json()) as { token: string };
  const res = await page.request.fetch(path, { method, headers: { 'X-CSRF-Token': token }, data });
  if (!res.ok()) throw new Error(`${method} ${path}: ${res.status()} ${await res.text()}`);
  return res.json();
}

beforeAll(async () => {
  app = await startBrowserApp();
  ({ page: owner } = await signedInOwnerPage(app, 'Brackenfold Test Electrical', { viewport: LAPTOP }));
  made.siteId = (await api(owner, 'POST', '/api/sites', bungalowSite)).id!;
  const schedule = makeSchedule(10, 'Kitchen extension board');
  made.boardId = (await api(owner, 'POST', '/api/boards', { name: schedule.board.name, siteId: made.siteId })).id!;
  await api(owner, 'PUT', `/api/boards/${made.boardId}/schedule`, { ...schedule, baseRevision: 1 });
  const changed = { ...schedule, board: { ...schedule.board, lastInspectionOn: '2025-06-01' } };
  await api(owner, 'PUT', `/api/boards/${made.boardId}/schedule`, { ...changed, baseRevision: 2 });
  made.surveyBoardId = (await api(owner, 'POST', '/api/boards/import', { format: 2, kind: 'waymark-board', ...bungalowBoard.schedule })).id!;
  await api(owner, 'POST', '/api/members/invitations', { email: uniqueEmail('electrician'), role: 'electrician' });
}, 120_000);
afterAll(async () => {
  await app?.close();
});

/** Runs axe on the page as it is and fails with each serious or critical rule, where it hit and why. */
async function expectAxeClean(page: Page, screen: string, exclude: string[] = []): Promise<void> {
  if (SHOTS) await page.screenshot({ path: `${SHOTS}/axe-${screen}-${page.viewportSize()!.width}.png`, fullPage: true });
  const builder = new AxeBuilder({ page });
  for (const selector of exclude) builder.exclude(selector);
  const result = await builder.analyze();
  const serious = result.violations.filter((v) => v.impact === 'serious' || v.impact === 'critical');
  const report = serious.flatMap((v) =>
    v.nodes.map((n) => `${v.id} on ${n.target.join(' ')}: ${n.failureSummary?.replace(/\s+/g, ' ')} | ${n.html.slice(0, 160)}`),
  );
  expect(report, `${screen} at ${page.viewportSize()!.width} px`).toEqual([]);
}

/** Opens a screen by its address and waits until what identifies it has drawn. */
async function open(page: Page, path: string, ready: (page: Page) => Promise<unknown>): Promise<void> {
  await page.goto(path);
  await ready(page);
  await page.waitForLoadState('networkidle');
}

/** The editor's Save stays disabled while nothing has been changed. */
const expectUnchanged = async (page: Page) => expect(await page.getByTestId('save').first().isDisabled(), 'the board reads as changed').toBe(true);
const heading = (name: string | RegExp) => (page: Page) => page.getByRole('heading', { level: 1, name }).waitFor();
const editorTab = (page: Page, name: RegExp) => page.getByRole('tab', { name }).click();

for (const [size, viewport] of [
  ['laptop', LAPTOP],
  ['phone', PHONE],
] as const) {
  describe(`every signed-in screen passes axe on a ${size} (${viewport.width} × ${viewport.height})`, { timeout: 120_000 }, () => {
    let page: Page;
    beforeAll(async () => {
      // The owner's session in a page of this size: same organisation, same cookies.
      page = await owner.context().newPage();
      await page.setViewportSize(viewport);
      page.setDefaultTimeout(30_000);
      // Looking at a board must never leave it unsaved: a leave-page prompt here would be a fault.
      page.on('dialog', (dialog) => {
        dialogs.push(`${dialog.type()}: ${dialog.message()}`);
        void dialog.accept();
      });
    });

    it('boards', async () => {
      await open(page, '/boards', async (p) => p.getByText('Kitchen extension board').first().waitFor());
      await expectAxeClean(page, 'boards');
    });
    it('new board', async () => {
      await open(page, '/boards/new', heading('New board'));
      await expectAxeClean(page, 'new-board');
    });
    it('editor, circuits tab', async () => {
      await open(page, `/boards/${made.boardId}`, async (p) => p.getByRole('tab', { name: /Circuits/ }).waitFor());
      await expectAxeClean(page, 'editor-circuits');
      await expectUnchanged(page);
    });
    it.runIf(size === 'laptop')('editor, a circuit table select open: named by its way and column, and says it is open', async () => {
      const kind = page.getByRole('combobox', { name: 'Way 2 kind' });
      expect(await kind.getAttribute('aria-expanded')).toBe('false');
      expect(await kind.getAttribute('aria-activedescendant')).toBeNull();
      await page.locator('td[data-cell="kind-c2"] .ant-select-selector').click();
      await page.locator('.ant-select-dropdown:not(.ant-select-dropdown-hidden)').waitFor();
      await expect.poll(() => kind.getAttribute('aria-expanded')).toBe('true');
      // The open list itself is the library's: its options are walked with the arrow keys from the input, which keeps
      // the focus and points at the option read out (checked here); the drawn list is for the pointer.
      await expectAxeClean(page, 'editor-circuits-select-open', ['.ant-select-dropdown']);
      expect(await page.locator(`#${await kind.getAttribute('aria-activedescendant')}`).count()).toBe(1);
      await page.keyboard.press('Escape');
      await expect.poll(() => kind.getAttribute('aria-expanded')).toBe('false');
    });
    it('editor, a circuit drawer open', async () => {
      await page.getByRole('button', { name: 'Details of way 3' }).click();
      await page.locator('.ant-drawer-open').waitFor();
      await expectAxeClean(page, 'editor-circuit-drawer');
      await expectUnchanged(page);
      await page.locator('.ant-drawer-open').getByRole('button', { name: 'Close', exact: true }).click();
      await page.locator('.ant-drawer-open').waitFor({ state: 'detached' });
    });
    it('editor, DIN rows tab', async () => {
      await editorTab(page, /DIN rows/);
      await page.locator('.board-din-row').first().waitFor();
      await expectAxeClean(page, 'editor-rows');
      await expectUnchanged(page);
    });
    it('editor, board and supply tab', async () => {
      await editorTab(page, /Board and supply/);
      await page.getByLabel('Board name').waitFor();
      await expectAxeClean(page, 'editor-supply');
      await expectUnchanged(page);
    });
    it('editor, old board survey tab (empty, then surveyed)', async () => {
      await editorTab(page, /Old board survey/);
      await page.waitForTimeout(300);
      await expectAxeClean(page, 'editor-survey-empty');
      await expectUnchanged(page);
      await open(page, `/boards/${made.surveyBoardId}`, async (p) => p.getByRole('tab', { name: /Old board survey/ }).click());
      await page.getByTestId('survey-picker').waitFor();
      await expectAxeClean(page, 'editor-survey');
      await expectUnchanged(page);
    });
    it('history', async () => {
      await open(page, `/boards/${made.boardId}/history`, heading(/History of/));
      await expectAxeClean(page, 'history');
    });
    it('print', async () => {
      await open(page, `/boards/${made.boardId}/print`, heading(/Print: /));
      await expectAxeClean(page, 'print');
    });
    it('print settings', async () => {
      await open(page, '/settings/printing', heading('Print settings'));
      await expectAxeClean(page, 'print-settings');
    });
    it('sharing', async () => {
      await open(page, `/boards/${made.boardId}/page`, heading(/Sharing: /));
      await expectAxeClean(page, 'sharing');
    });
    it('sites', async () => {
      await open(page, '/sites', heading('Sites'));
      await expectAxeClean(page, 'sites');
    });
    it('site', async () => {
      await open(page, `/sites/${made.siteId}`, heading(bungalowSite.reference));
      await expectAxeClean(page, 'site');
    });
    it('members', async () => {
      await open(page, '/members', heading('Members'));
      await expectAxeClean(page, 'members');
    });
    it('organisation', async () => {
      await open(page, '/settings/organisation', heading('Organisation'));
      await expectAxeClean(page, 'organisation');
    });
    it('captured mail, with a message open', async () => {
      await open(page, '/dev/mail', heading('Captured mail'));
      await page.locator('.dev-mail__item').first().click();
      await page.getByTestId('mail-text').waitFor();
      await expectAxeClean(page, 'mail');
    });
    it('no page error and nothing fetched from elsewhere', () => {
      expect(app.pageErrors).toEqual([]);
      expect(dialogs).toEqual([]);
      // The print preview's PDF opens in Chromium's own viewer, which loads its parts from chrome-extension://.
      expect(app.outsideRequests.filter((url) => !/^chrome(-extension)?:/.test(url))).toEqual([]);
    });
  });
}
