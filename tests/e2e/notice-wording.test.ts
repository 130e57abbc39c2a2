import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startBrowserApp, signedInOwnerPage, type BrowserApp } from '../helpers/browser.js';
import { NOTICE_BODY_MAX, noticeWordingListSchema } from '../../shared/schemas/notice-wording.js';
import { prescribedNotices } from '../../shared/notices/prescribed-wording.js';

let app: BrowserApp;
beforeAll(async () => {
  app = await startBrowserApp();
});
afterAll(async () => {
  await app?.close();
});

const PHONE = { width: 390, height: 844 }; // a common phone viewport in CSS pixels // from memory
const OWN_BODY = 'Press T on every RCD on the first of each month. If one does not trip, ring us.';

describe('notice wording on the organisation screen', { timeout: 120_000 }, () => {
  it('when the owner rewords the RCD notice on a phone, then it is saved, the count shows as they type, reset brings back the prescribed words, and the details still save', async () => {
    const { page } = await signedInOwnerPage(app, 'Notice Words Ltd', { viewport: PHONE });
    await page.goto('/settings/organisation');
    const form = page.getByTestId('notice-form-rcd-test');
    const body = form.getByLabel('Wording', { exact: true });
    await body.waitFor();
    expect(await body.inputValue()).toBe(prescribedNotices['rcd-test'].wording.body);
    await expect.poll(() => form.getByTestId('notice-state-rcd-test').textContent()).toContain('prescribed words');

    // Characters the printing fonts lack are named as the owner types, and the warning goes once they are gone.
    await form.getByLabel('Heading', { exact: true }).fill('月次 RCD check');
    await form.getByText('"月" (U+6708), "次" (U+6B21) cannot be drawn with the printing fonts').waitFor();
    await form.getByLabel('Heading', { exact: true }).fill('Monthly RCD check');
    await expect.poll(() => form.getByText('cannot be drawn with the printing fonts').count()).toBe(0);
    await body.fill(OWN_BODY);
    // The length limit shows as the user types.
    expect(await form.locator('[data-count]').last().getAttribute('data-count')).toBe(`${OWN_BODY.length} / ${NOTICE_BODY_MAX}`);
    await form.getByRole('button', { name: 'Save the RCD test wording' }).click();
    await form.getByText('Saved. Notices printed from now on').waitFor();
    await expect.poll(() => form.getByTestId('notice-state-rcd-test').textContent()).toContain("your organisation's wording");
    const saved = noticeWordingListSchema.parse(await (await page.request.get('/api/organisation/notice-wording')).json());
    expect(saved.notices.find((n) => n.kind === 'rcd-test')!.custom).toEqual({ title: 'Monthly RCD check', body: OWN_BODY });

    // Nothing on the page is wider than the phone.
    expect(await page.evaluate<number>('document.documentElement.scrollWidth')).toBeLessThanOrEqual(PHONE.width);
    const box = await form.getByTestId('notice-reset-rcd-test').boundingBox();
    expect(box!.x + box!.width).toBeLessThanOrEqual(PHONE.width);

    await form.getByTestId('notice-reset-rcd-test').click();
    await form.getByText('Back to the prescribed words.').waitFor();
    await expect.poll(() => body.inputValue()).toBe(prescribedNotices['rcd-test'].wording.body);

    // The notice saves moved the organisation's revision on; the details form saves against the new one.
    await page.getByLabel('Contact phone').fill('01632 960 123');
    await page.getByRole('button', { name: 'Save', exact: true }).click();
    await page.getByText('Saved. Charts printed from now on').waitFor();
    expect(app.pageErrors).toEqual([]);
  });
});
