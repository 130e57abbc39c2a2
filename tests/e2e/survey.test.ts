import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { bungalowBoard } from '../../server/seed/demo-bungalow.js';
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

async function csrf(page: Page): Promise<Record<string, string>> {
  const { token } = (await (await page.request.get('/api/auth/csrf')).json()) as { token: string };
  return { 'X-CSRF-Token': token };
}

/** The surveyed bungalow board, imported in the page's session; `mcbs` plans every new way on an MCB instead of an RCBO. */
async function surveyedBoard(page: Page, mcbs = false): Promise<number> {
  const schedule = structuredClone(bungalowBoard.schedule);
  if (mcbs) for (const w of schedule.survey!.ways) for (const t of w.targets) t.device.kind = 'mcb';
  const res = await page.request.post('/api/boards/import', { headers: await csrf(page), data: { format: 2, kind: 'waymark-board', ...schedule } });
  if (res.status() !== 201) throw new Error(`import failed: ${res.status()} ${await res.text()}`);
  return ((await res.json()) as { id: number }).id;
}

/** Full-page screenshots cut into screen-high pieces, so each can be looked at at its real size. */
async function shots(page: Page, name: string): Promise<void> {
  if (!SHOTS) return;
  const height = await page.evaluate(
    () => (globalThis as unknown as { document: { documentElement: { scrollHeight: number } } }).document.documentElement.scrollHeight,
  );
  const width = page.viewportSize()!.width;
  for (let y = 0, n = 0; y < height; y += 1200, n++) {
    await page.screenshot({ path: `${SHOTS}/${name}-${n}.png`, fullPage: true, clip: { x: 0, y, width, height: Math.min(1200, height - y) } });
  }
}

const sideways = (page: Page) =>
  page.evaluate(() => {
    const el = (globalThis as unknown as { document: { documentElement: { scrollWidth: number; clientWidth: number } } }).document.documentElement;
    return el.scrollWidth - el.clientWidth;
  });

async function openSurvey(page: Page): Promise<void> {
  await page.getByRole('tab', { name: /Old board survey/ }).click();
  await page.getByTestId('survey-picker').waitFor();
}

const field = (page: Page, path: string) => page.locator(`[data-field="${path}"] input`).first();

async function choose(page: Page, path: string, option: string): Promise<void> {
  await page.locator(`[data-field="${path}"] .ant-select-selector`).click();
  await page.locator('.ant-select-dropdown:not(.ant-select-dropdown-hidden) .ant-select-item-option').filter({ hasText: option }).first().click();
}

describe('the survey of an old board, on a phone', { timeout: 300_000 }, () => {
  it('when a reading is changed, the page reloads mid-survey, and the survey is finished, then nothing is lost and the plan makes the new board', async () => {
    const { page } = await signedInOwnerPage(app, 'Phone Survey Electrical', { viewport: PHONE });
    const id = await surveyedBoard(page);
    await page.goto(`/boards/${id}`);
    await openSurvey(page);
    expect(await sideways(page)).toBe(0);

    // The back ring's Zs is over the planned B32's limit: its card says to fix it first.
    await page.getByTestId('survey-picker').getByRole('button', { name: 'Fuse 2' }).click();
    await expect.poll(() => page.getByTestId('survey-verdict').textContent()).toBe('Fix before the changeover');
    expect(await page.getByTestId('survey-findings').textContent()).toContain('Table 41.3');
    await shots(page, 'survey-phone-fuse2');
    expect(await sideways(page)).toBe(0);

    // The next way is one tap away; its readings bring up the number keypad.
    await page.locator('[data-action="next-way"]').click();
    await expect.poll(() => page.locator('.survey-way__title').textContent()).toBe('Old Fuse 3');
    const ne = field(page, 'survey.ways.2.readings.insulation.neutralEarth');
    expect(await ne.getAttribute('inputmode')).toBe('decimal');
    expect(await page.getByTestId('survey-verdict').textContent()).toBe('Fix before the changeover');
    // The damp outside socket is found and fixed: N–E now reads 50 MΩ, and the verdict follows.
    await ne.fill('50');
    await expect.poll(() => page.getByTestId('survey-verdict').textContent()).not.toBe('Fix before the changeover');
    // Mid-survey the page reloads (the phone locked, the tab was dropped) before anything is saved.
    await page.waitForTimeout(800); // the draft is written a beat after the last keystroke
    await page.reload();
    await page.getByTestId('draft-restored').waitFor();
    await openSurvey(page);
    await page.getByTestId('survey-picker').getByRole('button', { name: 'Fuse 3' }).click();
    expect(await field(page, 'survey.ways.2.readings.insulation.neutralEarth').inputValue()).toBe('50');

    // One more old way is found behind the board: added, but not planned yet, so the plan cannot be applied.
    await page.locator('[data-action="add-old-way"]').click();
    await field(page, 'survey.ways.7.reference').fill('Fuse 8 (behind the meter)');
    await page.locator('[data-field="survey.ways.7.feeds"] textarea').fill('Doorbell transformer');
    await page.locator('[data-action="apply-plan"]').click();
    await page.locator('[data-field="survey.ways.7.action"] .ant-form-item-explain').filter({ hasText: 'has no plan' }).waitFor();
    await choose(page, 'survey.ways.7.action', 'Retire');
    await page.locator('[data-action="apply-plan"]').click();
    await page.getByText('New board made from the plan: 5 circuits added').waitFor();
    await shots(page, 'survey-phone-applied');

    const saved = (await (await page.request.get(`/api/boards/${id}/schedule`)).json()) as {
      circuits: Array<{ way: number; label: string }>;
      survey: { ways: Array<{ reference: string; readings: { insulation: { neutralEarth: number } } }> };
    };
    expect(saved.circuits.map((c) => c.way).sort()).toEqual([2, 3, 4, 5, 6]);
    expect(saved.survey.ways[2]!.readings.insulation.neutralEarth).toBe(50);
    expect(saved.survey.ways[7]!.reference).toBe('Fuse 8 (behind the meter)');
    await expect.poll(() => page.getByRole('tab', { name: /Circuits \(5\)/ }).count()).toBe(1);
    // Saved: no draft is left on the phone.
    expect(
      await page.evaluate(
        (key) => (globalThis as unknown as { localStorage: { getItem(k: string): string | null } }).localStorage.getItem(key),
        `waymark.draft.${id}`,
      ),
    ).toBeNull();
    expect(await sideways(page)).toBe(0);

    // The survey's print links open the print page on the changeover sheet and on the junction-box flags.
    await openSurvey(page);
    await page.getByRole('link', { name: 'Print the changeover sheet' }).click();
    await page.locator('[data-output="changeover"].ant-radio-button-wrapper-checked').waitFor();
    await expect.poll(() => page.getByTestId('print-preview-status').textContent(), { timeout: 60_000 }).toMatch(/page/);
    expect(await page.getByTestId('print-preview-error').count()).toBe(0);
    await page.goBack();
    await openSurvey(page);
    await page.getByRole('link', { name: 'Print the junction-box flags' }).click();
    await page.locator('[data-output="flags"].ant-radio-button-wrapper-checked').waitFor();
    await expect.poll(() => page.getByTestId('print-preview-status').textContent(), { timeout: 60_000 }).toMatch(/1 page/);
    await shots(page, 'survey-phone-print-flags');
    expect(app.pageErrors).toEqual([]);
  });

  it('when a laptop opens a board without a survey, then a survey can be started and the first old way shows', async () => {
    const { page } = await signedInOwnerPage(app, 'Laptop Survey Electrical');
    const { id } = (await (await page.request.post('/api/boards', { headers: await csrf(page), data: { name: 'Garage board' } })).json()) as { id: number };
    await page.goto(`/boards/${id}`);
    await page.getByRole('tab', { name: /Old board survey/ }).click();
    await page.locator('[data-action="start-survey"]').click();
    await expect.poll(() => page.locator('.survey-way__title').textContent()).toBe('Old Fuse 1');
    await shots(page, 'survey-laptop-start');
    expect(app.pageErrors).toEqual([]);
  });

  it("when a new circuit's insulation is recorded in its drawer below Table 64, then the finding shows beside the reading and the readings are saved", async () => {
    const { page } = await signedInOwnerPage(app, 'Drawer Readings Electrical');
    const applied = await surveyedBoard(page);
    const schedule = (await (await page.request.get(`/api/boards/${applied}/schedule`)).json()) as { revision: number };
    const made = await page.request.post(`/api/boards/${applied}/changeover/apply`, { headers: await csrf(page), data: { baseRevision: schedule.revision } });
    expect(made.status()).toBe(200);
    await page.goto(`/boards/${applied}`);
    await page.getByRole('button', { name: 'Details of way 2' }).click();
    await page.locator('[data-action="record-readings"]').click();
    const at = 'circuits.0.readings'; // the cooker, the first circuit the plan made
    await choose(page, `${at}.insulation.testVoltage`, '500 V');
    await field(page, `${at}.insulation.lineEarth`).fill('0.5');
    // 0.5 MΩ at 500 V is under Table 64's 1 MΩ (BS 7671:2018+A2 Table 64, from memory)
    await page
      .locator(`[data-field="${at}.insulation.lineEarth"]`)
      .getByText(/below the 1 MΩ minimum of Table 64/)
      .waitFor();
    await page.keyboard.press('Escape');
    await page.getByTestId('save').click();
    await expect
      .poll(
        async () =>
          (
            (await (await page.request.get(`/api/boards/${applied}/schedule`)).json()) as {
              circuits: Array<{ id: string; readings?: { insulation: { lineEarth: number | null } } }>;
            }
          ).circuits.find((c) => c.id === 'cooker')?.readings?.insulation.lineEarth,
      )
      .toBe(0.5);
    expect(app.pageErrors).toEqual([]);
  });

  it('when the plan puts its ways on MCBs, then an RCD arrangement is suggested with reasons, and accepting it gives the new board those RCDs', async () => {
    const { page } = await signedInOwnerPage(app, 'RCD Split Electrical', { viewport: PHONE });
    const id = await surveyedBoard(page, true);
    await page.goto(`/boards/${id}`);
    await openSurvey(page);
    await page.locator('[data-action="suggest-rcds"]').click();
    const panel = page.getByTestId('rcd-split');
    await panel.getByText('Suggested RCD arrangement').waitFor();
    const text = (await panel.textContent()) ?? '';
    expect(text).toContain('RCD 1');
    expect(text).toContain('RCD 2');
    expect(text).toContain('BS 7671 531.3.2');
    await shots(page, 'survey-phone-rcd-split');
    expect(await sideways(page)).toBe(0);
    await page.locator('[data-action="accept-rcds"]').click();
    await page.locator('[data-action="apply-plan"]').click();
    await page.getByText(/New board made from the plan/).waitFor();
    const saved = (await (await page.request.get(`/api/boards/${id}/schedule`)).json()) as { devices: Array<{ kind: string; label: string }> };
    expect(
      saved.devices
        .filter((d) => d.kind === 'rcd')
        .map((d) => d.label)
        .sort(),
    ).toEqual(['RCD 1', 'RCD 2']);
    expect(app.pageErrors).toEqual([]);
  });
});
