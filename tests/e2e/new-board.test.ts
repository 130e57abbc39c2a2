/**
 * Starting a board as an electrician does on site: the site is made from the board form, the new
 * board's page starts off, the handover goes to the site's client unless another address is
 * typed, and a visitor's report shows on the boards list.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startBrowserApp, signedInOwnerPage, type BrowserApp } from '../helpers/browser.js';

let app: BrowserApp;
beforeAll(async () => {
  app = await startBrowserApp();
});
afterAll(async () => {
  await app?.close();
});

describe('a new board, from the form to the first report', { timeout: 180_000 }, () => {
  it('when a site is added from the board form, then it is chosen, the page starts off, the handover offers the site e-mail, and a report shows on the list', async () => {
    const { page } = await signedInOwnerPage(app, 'Brackenholt Test Electrical', { viewport: { width: 390, height: 844 } });
    await page.goto('/boards/new');
    await page.getByLabel('Board name').fill('Garage board');
    await page.getByRole('button', { name: 'New site…' }).click();
    const drawer = page.locator('.ant-drawer-content', { hasText: 'New site' });
    await drawer.getByLabel('Reference').fill('7 Fernbank Row');
    await drawer.getByLabel('Client name').fill('Idris Holloway');
    await drawer.getByLabel('Client e-mail').fill('idris.holloway@example.test');
    await drawer.getByRole('button', { name: 'Add site and use it' }).click();
    await drawer.waitFor({ state: 'hidden' });
    await page.locator('.ant-select-selection-item', { hasText: '7 Fernbank Row' }).waitFor();
    await page.getByRole('button', { name: 'Create board' }).click();
    await page.waitForURL(/\/boards\/\d+$/);
    const id = Number(/\/boards\/(\d+)$/.exec(page.url())![1]);

    // The page is off until switched on, and the QR link answers "not found" meanwhile.
    await page.goto(`/boards/${id}/page`);
    await page.getByText('The QR code shows “not found” until the page is switched on.').waitFor();
    expect(await page.getByRole('switch', { name: 'Board page on or off' }).getAttribute('aria-checked')).toBe('false');
    const summary = (await (await page.request.get(`/api/boards/${id}`)).json()) as { publicToken: string };
    expect((await page.request.get(`/api/public/boards/${summary.publicToken}`)).status()).toBe(404);
    await expect.poll(() => page.getByLabel("Client's e-mail").inputValue()).toBe('idris.holloway@example.test');
    await page.getByText("The client's e-mail from the site.").waitFor();

    // Switched on, a visitor reports way 2; the boards list says so and the link opens the sharing page.
    await page.getByRole('switch', { name: 'Board page on or off' }).click();
    await page.getByText('Anyone with the QR code can read the page.').waitFor();
    const visitor = await app.newPage({ viewport: { width: 390, height: 844 } });
    const { token } = (await (await visitor.request.get('/api/auth/csrf')).json()) as { token: string };
    const sent = await visitor.request.post(`/api/public/boards/${summary.publicToken}/reports`, {
      headers: { 'X-CSRF-Token': token },
      data: { message: 'The garage sockets are on this one', way: 2 },
    });
    expect(sent.status()).toBe(202);
    await page.goto('/boards');
    await page.getByRole('link', { name: '1 report from the board page to check' }).click();
    await page.waitForURL(new RegExp(`/boards/${id}/page`));
    await page.getByRole('link', { name: 'Correct way 2 in the schedule' }).click();
    // The editor opens way 2's circuit (on a phone, its form) with the cursor in its label.
    await page.waitForURL(new RegExp(`/boards/${id}\\?way=2$`));
    await expect.poll(() => page.evaluate('document.activeElement && document.activeElement.value')).toBe('Kitchen sockets');
    expect(await page.evaluate('document.documentElement.scrollWidth <= window.innerWidth')).toBe(true);
  });
});
