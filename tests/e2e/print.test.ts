import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { PDFDocument } from 'pdf-lib';
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

const MM = 72 / 25.4; // ISO 32000-1 8.3.2.1: user unit 1/72 inch
const LONG_LABEL = 'W'.repeat(24);

/** A board with one label too long for narrow tape, made through the API in the page's session. */
async function boardWithLongLabel(page: Page): Promise<number> {
  const { token } = (await (await page.request.get('/api/auth/csrf')).json()) as { token: string };
  const headers = { 'X-CSRF-Token': token };
  const created = await page.request.post('/api/boards', { headers, data: { name: 'Workshop board' } });
  const { id } = (await created.json()) as { id: number };
  const base = makeSchedule(4, 'Workshop board');
  const schedule = scheduleSchema.parse({ ...base, circuits: base.circuits.map((c, i) => (i === 1 ? { ...c, label: LONG_LABEL } : c)) });
  const saved = await page.request.put(`/api/boards/${id}/schedule`, { headers, data: { ...schedule, baseRevision: 1 } });
  if (saved.status() !== 200) throw new Error(`save failed: ${saved.status()} ${await saved.text()}`);
  // A new board's page starts off: switch it on, so the tag carries its QR code.
  const shared = await page.request.patch(`/api/boards/${id}/public`, { headers, data: { enabled: true } });
  if (shared.status() !== 200) throw new Error(`page switch failed: ${shared.status()}`);
  return id;
}

/**
 * Waits for the PDF request a change sets off (`output` on `media`) and for the preview to show a
 * new blob URL; returns the first page size in mm of the PDF that request answers.
 */
async function previewFollows(page: Page, change: () => Promise<void>, output: string, media: string, previous: string | null) {
  const response = page.waitForResponse((r) => r.url().includes(`/pdf/${output}?`) && r.url().includes(`media=${media}`) && r.status() === 200, {
    timeout: 60_000,
  });
  await change();
  // The browser hands the body to the page, not to the test: fetch the same URL again in the same session.
  const pdf = await (await page.request.get((await response).url())).body();
  const frame = page.getByTestId('print-preview-frame');
  await expect
    .poll(async () => frame.getAttribute('src').catch(() => null), { timeout: 30_000, interval: 200 })
    .toSatisfy((src: string | null) => typeof src === 'string' && src.startsWith('blob:') && src !== previous);
  const size = (await PDFDocument.load(pdf)).getPage(0).getSize();
  return { src: (await frame.getAttribute('src'))!, widthMm: size.width / MM, heightMm: size.height / MM };
}

async function pickMedium(page: Page, label: string) {
  await page.getByTestId('print-medium').click();
  await page.locator('.ant-select-item-option', { hasText: label }).click();
}

describe('the print page', { timeout: 180_000 }, () => {
  it('when the output and medium change, then the live preview follows with the real PDF and its warnings', async () => {
    const { page } = await signedInOwnerPage(app, 'Print Page Electrical');
    const id = await boardWithLongLabel(page);
    const chart = await previewFollows(
      page,
      async () => {
        await page.goto(`/boards/${id}/print`);
      },
      'chart',
      'a4',
      null,
    );
    expect(chart.widthMm).toBeCloseTo(210, 1); // ISO 216 A4
    expect(chart.heightMm).toBeCloseTo(297, 1); // ISO 216 A4
    await page.getByTestId('print-caution').waitFor();
    await page.getByTestId('print-warnings-none').waitFor();

    const tape12 = await previewFollows(page, () => page.locator('[data-output="way-labels"]').click(), 'way-labels', 'tape-12', chart.src);
    expect(tape12.widthMm).toBeCloseTo(12, 6); // page width = 12 mm tape // common practice

    const tape6 = await previewFollows(page, () => pickMedium(page, 'Tape 6 mm'), 'way-labels', 'tape-6', tape12.src);
    expect(tape6.widthMm).toBeCloseTo(6, 6); // page width = 6 mm tape // common practice
    await expect.poll(() => page.getByTestId('print-warnings').textContent(), { timeout: 30_000 }).toContain(LONG_LABEL.slice(0, 10));
    // The server's cut-short message already begins with its label ("Way 2 …: \"WWW…\" did not fit"): the list says the label once.
    const items = await page.locator('.print-warning-list__item').allTextContents();
    expect(items.some((t) => t.includes('did not fit and was cut short'))).toBe(true);
    expect(items.filter((t) => /^\s*([^:]+): \1:/.test(t))).toEqual([]);

    await page.getByTestId('print-download').click();
    await expect.poll(() => page.getByTestId('print-history').textContent(), { timeout: 30_000 }).toContain('Way labels');
    expect(app.pageErrors).toEqual([]);
  });

  it('when the medium is too small for the QR code, then the page says which tape would work', async () => {
    const { page } = await signedInOwnerPage(app, 'Print Page Electrical');
    const id = await boardWithLongLabel(page);
    await previewFollows(
      page,
      async () => {
        await page.goto(`/boards/${id}/print`);
      },
      'chart',
      'a4',
      null,
    );
    await previewFollows(page, () => page.locator('[data-output="tag"]').click(), 'tag', 'tape-24', null);
    await pickMedium(page, 'Tape 6 mm');
    // Said beside the medium it is about.
    const mediumItem = page.locator('.ant-form-item').filter({ has: page.getByTestId('print-medium') });
    await expect
      .poll(
        () =>
          mediumItem
            .locator('.ant-form-item-explain')
            .textContent()
            .catch(() => ''),
        { timeout: 60_000 },
      )
      .toMatch(/tape-\d+/);
  });

  it('when a medium refuses the layout, then the old preview and "no warnings" go, the error shows once and nothing can be printed until a medium works', async () => {
    const { page } = await signedInOwnerPage(app, 'Print Refusal Electrical');
    const id = await boardWithLongLabel(page);
    await previewFollows(
      page,
      async () => {
        await page.goto(`/boards/${id}/print`);
      },
      'chart',
      'a4',
      null,
    );
    const tag24 = await previewFollows(page, () => page.locator('[data-output="tag"]').click(), 'tag', 'tape-24', null);
    await expect.poll(() => page.getByTestId('print-download').isEnabled()).toBe(true);

    const refused = page.waitForResponse((r) => r.url().includes('/pdf/tag?') && r.url().includes('media=tape-12'), { timeout: 60_000 });
    await pickMedium(page, 'Tape 12 mm');
    expect((await refused).status()).toBe(422); // the server's answer for a layout that cannot fit (DEVELOPERS.md, Print API)
    const message = ((await (await refused).json()) as { error: { message: string } }).error.message;
    expect(message).toMatch(/tape-\d+/);

    await page.getByTestId('print-preview-frame').waitFor({ state: 'detached', timeout: 30_000 });
    await page.getByTestId('print-preview-empty').waitFor();
    expect(await page.getByTestId('print-warnings-none').count()).toBe(0);
    for (const button of ['print-download', 'print-print', 'print-pack']) expect(await page.getByTestId(button).isDisabled()).toBe(true);
    // Once: beside the medium it names, not again over the preview or under the buttons.
    expect(await page.getByText(message, { exact: true }).count()).toBe(1);

    if (process.env.WAYMARK_SHOTS) await page.screenshot({ path: `${process.env.WAYMARK_SHOTS}/print-refused.png`, fullPage: true });

    const back = await previewFollows(page, () => pickMedium(page, 'Tape 24 mm'), 'tag', 'tape-24', tag24.src);
    expect(back.widthMm).toBeCloseTo(24, 6); // page width = 24 mm tape // common practice
    await expect.poll(() => page.getByTestId('print-download').isEnabled(), { timeout: 30_000 }).toBe(true);
    expect(await page.getByTestId('print-pack').isEnabled()).toBe(true);
    expect(app.pageErrors).toEqual([]);
  });
});
