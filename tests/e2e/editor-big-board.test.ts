/**
 * A 120-circuit board in the editor (a school's distribution board, say): only the lines in view are
 * built, yet way 117 is reached, edited by keyboard, saved with Ctrl+S and found again after a reload,
 * and the rules' finding for the Zs typed there appears beside it without waiting for a save.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
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

async function boardOf(page: Page, circuits: number): Promise<number> {
  const { token } = (await (await page.request.get('/api/auth/csrf')).json()) as { token: string };
  const headers = { 'X-CSRF-Token': token };
  const schedule = makeSchedule(circuits, 'Science block DB2');
  const { id } = (await (await page.request.post('/api/boards', { headers, data: { name: schedule.board.name } })).json()) as { id: number };
  const saved = await page.request.put(`/api/boards/${id}/schedule`, { headers, data: { ...schedule, baseRevision: 1 } });
  if (saved.status() !== 200) throw new Error(`save failed: ${saved.status()} ${await saved.text()}`);
  return id;
}

/** The focused control's accessible name (its aria-label). */
const focusedName = (page: Page) => page.evaluate(`document.activeElement?.getAttribute('aria-label') ?? ''`) as Promise<string>;

async function tabTo(page: Page, name: string): Promise<void> {
  const seen: string[] = [];
  for (let i = 0; i < 30; i++) {
    await page.keyboard.press('Tab');
    const now = await focusedName(page);
    if (now === name) return;
    seen.push(now);
  }
  throw new Error(`Tab never reached "${name}": ${seen.join(' → ')}`);
}

describe('a 120-way board in the editor', { timeout: 180_000 }, () => {
  it('when way 117 is edited by keyboard and saved, then its finding appears as typed and the edit is there after a reload', async () => {
    const { page } = await signedInOwnerPage(app, 'Thornbury Test Electrical', { viewport: LAPTOP });
    const id = await boardOf(page, 120);

    // A visitor's report links to a way like this; the editor opens it with the cursor in its label.
    await page.goto(`/boards/${id}?way=117`);
    await expect.poll(() => focusedName(page), { timeout: 30_000 }).toBe('Way 117 label');
    // Only the lines around the one in view are built, not all 120.
    expect(await page.locator('tbody tr[data-circuit-id]').count()).toBeLessThan(60);
    expect(await page.locator('tr[data-circuit-id="c1"]').count()).toBe(0);

    await page.keyboard.press('ControlOrMeta+A');
    await page.keyboard.type('Prep room fume hood');
    await tabTo(page, 'Way 117 measured Zs (Ω)');
    await page.keyboard.press('ControlOrMeta+A');
    // Way 117 is a radial on a B32 RCBO: BS 7671:2018+A2 Table 41.3 allows 1.37 Ω at 0.4 s, so 2.5 Ω is over.
    await page.keyboard.type('2.5');
    const typedAt = Date.now();
    const finding = page.locator('.board-findings [data-finding-code="zs-over-max"]', { hasText: 'Way 117' });
    await finding.waitFor();
    const shownAfterMs = Date.now() - typedAt;
    console.log(`zs-over-max for way 117 shown ${shownAfterMs} ms after the last key`);
    // The checks run 200 ms after the last key; on a machine shared with other work, allow a second.
    expect(shownAfterMs).toBeLessThan(1000);
    await page.locator('td[data-cell="zs-c117"].board-cell--error').waitFor();

    await page.keyboard.press('ControlOrMeta+S');
    await page.getByTestId('save-state').filter({ hasText: 'Saved · revision 3' }).waitFor();

    await page.goto(`/boards/${id}?way=117`);
    await expect.poll(() => focusedName(page), { timeout: 30_000 }).toBe('Way 117 label');
    expect(await page.locator('td[data-cell="label-c117"] input').inputValue()).toBe('Prep room fume hood');
    expect(await page.locator('td[data-cell="zs-c117"] input').inputValue()).toBe('2.50');
    await finding.waitFor();
    const saved = (await (await page.request.get(`/api/boards/${id}/schedule`)).json()) as {
      circuits: Array<{ id: string; label: string; measuredZs: number }>;
    };
    expect(saved.circuits.find((c) => c.id === 'c117')).toMatchObject({ label: 'Prep room fume hood', measuredZs: 2.5 });
    expect(saved.circuits).toHaveLength(120);
    expect(app.pageErrors).toEqual([]);
  });
});
