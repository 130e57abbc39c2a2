import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { startBrowserApp, signedInOwnerPage, type BrowserApp } from '../helpers/browser.js';
import { uniqueEmail } from '../helpers/app.js';
import { organisationSettingsSchema } from '../../shared/schemas/organisation.js';
import { fieldErrors } from '../../shared/schemas/errors.js';

let app: BrowserApp;
beforeAll(async () => {
  app = await startBrowserApp();
});
afterAll(async () => {
  await app?.close();
});

async function chooseOption(page: Page, select: ReturnType<Page['locator']>, label: string) {
  await select.click();
  await page.locator('.ant-select-dropdown:visible .ant-select-item-option', { hasText: label }).click();
}

/** What the shared schema says about a contact e-mail: the form must show the same words. */
function contactEmailMessage(value: string): string {
  const result = organisationSettingsSchema.pick({ contactEmail: true }).safeParse({ contactEmail: value });
  if (result.success) throw new Error(`the schema accepts ${value}`);
  return fieldErrors(result.error).contactEmail;
}

async function mainNavigation(page: Page): Promise<string[]> {
  const nav = page.getByRole('navigation', { name: 'Main' });
  await nav.waitFor();
  return (await nav.getByRole('link').allTextContents()).map((l) => l.trim());
}

// Browser steps are slow on a loaded machine; each test gets two minutes.
describe('members and invitations through the screens', { timeout: 120_000 }, () => {
  it('when the owner invites a viewer, then the invitee joins from the mailed link and sees only what a viewer may use', async () => {
    const owner = await signedInOwnerPage(app, 'Quillon Test Electrical');
    const invitee = uniqueEmail('e2e-viewer');
    await owner.page.goto('/members');
    await owner.page.getByLabel('E-mail').fill(invitee);
    await chooseOption(owner.page, owner.page.locator('.members-invite__role .ant-select'), 'Viewer');
    await owner.page.getByRole('button', { name: 'Send invitation' }).click();
    await owner.page.getByText(`Invitation sent to ${invitee}.`).waitFor();
    await owner.page.locator('.members-invitations__item', { hasText: invitee }).waitFor();

    // The owner reads the invitation on the captured-mail page and takes its link.
    await owner.page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Captured mail' }).click();
    await owner.page.locator('.dev-mail__item', { hasText: invitee }).first().click();
    const href = await owner.page.getByTestId('mail-text').locator('a[href*="/invite/"]').getAttribute('href');
    expect(href).toMatch(new RegExp(`^${app.baseUrl}/invite/`));

    const page = await app.newPage();
    await page.goto(href!);
    await page.getByText('Quillon Test Electrical', { exact: true }).waitFor();
    await page.getByLabel('Your name').fill('Rhiannon Vale');
    await page.getByLabel('Choose a password').fill('ladder-and-torch-7');
    await page.getByRole('button', { name: 'Join Quillon Test Electrical' }).click();
    await page.waitForURL('**/boards');
    expect(await mainNavigation(page)).toEqual(['Boards', 'Sites', 'Print settings']);

    // A viewer typing the members address is sent back with the reason.
    await page.goto('/members');
    await page
      .getByRole('alert')
      .getByText(/for owners only/)
      .waitFor();
    expect(new URL(page.url()).pathname).toBe('/boards');

    // The link works once.
    const again = await app.newPage();
    await again.goto(href!);
    await again.getByText('This invitation cannot be used').waitFor();
    expect(app.pageErrors).toEqual([]);
  });

  it('when the owner changes a member role and disables them, then the table shows it and the member is signed out', async () => {
    const owner = await signedInOwnerPage(app, 'Tamsin Test Electrical');
    // The member joins through the API side of an invitation (the screens are covered above).
    const csrf = (await (await owner.page.request.get('/api/auth/csrf')).json()).token as string;
    const memberEmail = uniqueEmail('e2e-member');
    await owner.page.request.post('/api/members/invitations', { headers: { 'X-CSRF-Token': csrf }, data: { email: memberEmail, role: 'viewer' } });
    await owner.page.goto('/dev/mail');
    await owner.page.locator('.dev-mail__item', { hasText: memberEmail }).first().click();
    const href = await owner.page.getByTestId('mail-text').locator('a[href*="/invite/"]').getAttribute('href');
    const member = await app.newPage();
    await member.goto(href!);
    await member.getByLabel('Your name').fill('Osian Pryce');
    await member.getByLabel('Choose a password').fill('ladder-and-torch-8');
    await member.getByRole('button', { name: /^Join/ }).click();
    await member.waitForURL('**/boards');

    await owner.page.goto('/members');
    const row = owner.page.locator('.ant-table-row', { hasText: memberEmail });
    await chooseOption(owner.page, row.locator('.ant-select'), 'Electrician');
    await row.locator('.ant-select-selection-item', { hasText: 'Electrician' }).waitFor();
    await row.getByRole('button', { name: 'Disable' }).click();
    await owner.page.locator('.ant-popover:visible').getByRole('button', { name: 'Disable' }).click();
    await row.getByText('Disabled', { exact: true }).waitFor();

    const members = (await (await owner.page.request.get('/api/members')).json()) as { members: Array<{ email: string; role: string; disabled: boolean }> };
    expect(members.members.find((m) => m.email === memberEmail)).toMatchObject({ role: 'electrician', disabled: true });
    // The disabled member's next navigation to a signed-in screen goes to sign-in.
    expect((await member.request.get('/api/auth/me')).status()).toBe(401);
    await member.reload();
    await member.waitForURL((url) => url.pathname === '/signin');
  });

  it('when the owner saves the organisation details, then a bad e-mail is named beside its field and good ones reach the header', async () => {
    const owner = await signedInOwnerPage(app, 'Halyard Test Electrical');
    const page = owner.page;
    await page.goto('/settings/organisation');
    const name = page.getByLabel('Organisation name');
    await name.waitFor();
    await page.getByLabel('Contact e-mail').fill('office-at-halyard');
    await page.getByRole('button', { name: 'Save', exact: true }).click(); // the details form's; each notice wording has its own Save
    await page
      .locator('.ant-form-item-has-error', { has: page.getByLabel('Contact e-mail') })
      .getByText(contactEmailMessage('office-at-halyard'))
      .waitFor();

    await name.fill('Halyard & Daughters Electrical');
    await page.getByLabel('Contact phone').fill('01632 960 482'); // Ofcom's range kept for drama, never a real line (from memory)
    await page.getByLabel('Contact e-mail').fill('office@halyard.example');
    await page.getByRole('button', { name: 'Save', exact: true }).click(); // the details form's; each notice wording has its own Save
    await page.getByText('Saved.', { exact: false }).waitFor();
    await page.getByTestId('chart-foot-preview').getByText('Tel. 01632 960 482').waitFor();
    const account = page.getByRole('button', { name: 'Account menu for Test Owner' });
    expect(await account.textContent()).toContain('Halyard & Daughters Electrical');
    const saved = await (await page.request.get('/api/organisation')).json();
    expect(saved).toMatchObject({ name: 'Halyard & Daughters Electrical', contactPhone: '01632 960 482', contactEmail: 'office@halyard.example' });
  });

  it('when someone saves the organisation while the page is open, then Save shows the stale message and Reload shows theirs', async () => {
    const owner = await signedInOwnerPage(app, 'Stale Page Electrical');
    const page = owner.page;
    await page.goto('/settings/organisation');
    const name = page.getByLabel('Organisation name');
    await name.waitFor();
    // Another tab saves first, from the same revision the page loaded.
    const headers = { 'X-CSRF-Token': ((await (await page.request.get('/api/auth/csrf')).json()) as { token: string }).token };
    const { revision } = (await (await page.request.get('/api/organisation')).json()) as { revision: number };
    const other = await page.request.put('/api/organisation', {
      headers,
      data: { name: 'Saved In Another Tab Ltd', contactPhone: '', contactEmail: '', baseRevision: revision },
    });
    expect(other.status()).toBe(200);

    await name.fill('Overwriting Ltd');
    await page.getByRole('button', { name: 'Save', exact: true }).click(); // the details form's; each notice wording has its own Save
    await page.getByTestId('stale-save').getByText('Someone saved this since you opened it: reload to see their changes.').waitFor();
    expect((await (await page.request.get('/api/organisation')).json()).name).toBe('Saved In Another Tab Ltd');
    await page.getByTestId('stale-save-reload').click();
    await page.getByTestId('stale-save').waitFor({ state: 'detached' });
    expect(await name.inputValue()).toBe('Saved In Another Tab Ltd');
    // Saved again from the reloaded revision, the change goes through.
    await name.fill('Second Try Ltd');
    await page.getByRole('button', { name: 'Save', exact: true }).click(); // the details form's; each notice wording has its own Save
    await page.getByText('Saved.', { exact: false }).waitFor();
    expect(await (await page.request.get('/api/organisation')).json()).toMatchObject({ name: 'Second Try Ltd', revision: revision + 2 });
  });
});
