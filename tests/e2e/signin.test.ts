import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { loginSchema } from '../../shared/schemas/auth.js';
import { startBrowserApp, signedInOwnerPage, type BrowserApp } from '../helpers/browser.js';
import { mailText, uniqueEmail } from '../helpers/app.js';

let app: BrowserApp;
beforeAll(async () => {
  app = await startBrowserApp();
});
afterAll(async () => {
  await app?.close();
});

/** True on the sign-in page when it will send the member back to `path` afterwards. */
const signInFor = (path: string) => (url: URL) => url.pathname === '/signin' && url.searchParams.get('redirect') === path;

/** The message the shared schema gives for a field, so the test holds the form to the same contract. */
function schemaMessage(input: unknown, field: string): string {
  const result = loginSchema.safeParse(input);
  const issue = result.error?.issues.find((i) => i.path.join('.') === field);
  if (!issue) throw new Error(`the schema accepts ${field}`);
  return issue.message;
}

// Browser steps are slow on a loaded machine; each test gets two minutes.
describe('signing up and in through the forms', { timeout: 120_000 }, () => {
  it('when a contractor signs up, signs out and signs in again, then the shell shows them as owner', async () => {
    const page = await app.newPage();
    const email = uniqueEmail('e2e-owner');
    const password = 'lamp-post-cable-99';

    await page.goto('/');
    await page.waitForURL(signInFor('/boards'));
    await page.getByRole('link', { name: /create an account/i }).click();
    await page.getByLabel('Organisation (as printed on your charts)').fill('Larkspur Test Electrical');
    await page.getByLabel('Your name').fill('Ada Fenwick');
    await page.getByLabel('E-mail').fill(email);
    await page.getByLabel('Password', { exact: true }).fill(password);
    await page.getByRole('button', { name: 'Create account' }).click();
    await page.getByText('Check your e-mail').waitFor();
    expect((await page.request.get('/api/auth/me')).status()).toBe(401); // nothing opened until the link is used

    const link = (await mailText(app.database, email, 1, 30_000)).text.match(/https?:\/\/\S+\/signup\/[\w-]+/)?.[0];
    expect(link).toMatch(new RegExp(`^${app.baseUrl}/signup/`));
    await page.goto(link!);
    await page.getByRole('button', { name: 'Open my account' }).click();
    await page.waitForURL('**/boards');

    const account = page.getByRole('button', { name: 'Account menu for Ada Fenwick' });
    await account.waitFor();
    expect(await account.textContent()).toContain('Larkspur Test Electrical');
    await account.click();
    await page.getByRole('menuitem', { name: /sign out/i }).click();
    await page.waitForURL('**/signin');
    expect((await page.request.get('/api/auth/me')).status()).toBe(401);

    await page.getByLabel('E-mail').fill(email);
    await page.getByLabel('Password', { exact: true }).fill(password);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL('**/boards');

    const nav = page.getByRole('navigation', { name: 'Main' });
    // The captured-mail entry appears once the server has said it captures mail.
    await nav.getByRole('link', { name: 'Captured mail' }).waitFor();
    const labels = await nav.getByRole('link').allTextContents();
    expect(labels.map((l) => l.trim())).toEqual(['Boards', 'Sites', 'Print settings', 'Members', 'Organisation', 'Captured mail']);
    const me = await (await page.request.get('/api/auth/me')).json();
    expect(me.user).toMatchObject({ email, name: 'Ada Fenwick', role: 'owner' });
    expect(app.outsideRequests).toEqual([]);
    expect(app.pageErrors).toEqual([]);
  });

  it('when the e-mail is malformed, then the schema message shows beside the field and nothing is sent', async () => {
    const page = await app.newPage();
    const logins: string[] = [];
    page.on('request', (r) => {
      if (r.url().endsWith('/api/auth/login')) logins.push(r.url());
    });
    await page.goto('/signin');
    await page.getByLabel('E-mail').fill('not-an-address');
    await page.getByLabel('Password', { exact: true }).fill('anything-at-all');
    await page.getByRole('button', { name: 'Sign in' }).click();

    const help = page.locator('.ant-form-item-has-error').filter({ has: page.getByLabel('E-mail') });
    await help.getByText(schemaMessage({ email: 'not-an-address', password: 'x' }, 'email')).waitFor();
    expect(logins).toEqual([]);
    expect(page.url()).toMatch(/\/signin$/);
  });

  it("when the sign-up password is too short, then the hint shows once, as the field's message, not twice", async () => {
    const page = await app.newPage();
    await page.goto('/signup');
    const hint = page.getByText('At least 10 characters');
    await hint.first().waitFor();
    expect(await hint.count()).toBe(1); // the hint before anything is typed
    await page.getByLabel('Password', { exact: true }).fill('short');
    await page.getByRole('button', { name: 'Create account' }).click();
    await page.locator('.ant-form-item-explain-error').first().waitFor();
    expect(await hint.count()).toBe(1);
  });

  it('when the password is wrong, then the server message shows and the member stays signed out', async () => {
    const { email } = await signedInOwnerPage(app, 'Wrong Password Test Ltd');
    const page = await app.newPage();
    await page.goto('/signin');
    await page.getByLabel('E-mail').fill(email);
    await page.getByLabel('Password', { exact: true }).fill('not-the-password-1');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page
      .getByRole('alert')
      .getByText(/e-mail or password/i)
      .waitFor();
    expect((await page.request.get('/api/auth/me')).status()).toBe(401);
  });

  it('when a signed-out member opens a settings page, then after signing in they land on that page', async () => {
    const owner = await signedInOwnerPage(app, 'Redirect Test Electrical');
    const page = await app.newPage();
    await page.goto('/settings/organisation');
    await page.waitForURL(signInFor('/settings/organisation'));
    await page.getByLabel('E-mail').fill(owner.email);
    await page.getByLabel('Password', { exact: true }).fill(owner.password);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL('**/settings/organisation');
    const name = page.getByLabel('Organisation name');
    await name.waitFor();
    expect(await name.inputValue()).toBe('Redirect Test Electrical');
  });

  it('when a member forgets the password, then the mailed link sets a new one they can sign in with', async () => {
    const owner = await signedInOwnerPage(app, 'Reset Test Electrical');
    await owner.page.goto('/boards'); // an open tab, signed in before the reset
    await owner.page.getByRole('navigation', { name: 'Main' }).waitFor();
    const page = await app.newPage();
    await page.goto('/signin');
    await page.getByRole('link', { name: 'Forgotten your password?' }).click();
    await page.getByRole('heading', { name: 'Forgotten password' }).waitFor();
    await page.getByLabel('E-mail').fill(owner.email);
    await page.getByRole('button', { name: 'Send the link' }).click();
    await page.getByText('Check your e-mail').waitFor();

    // The link as the captured-mail API reads it (the owner's old session can still ask).
    const captured = (await mailText(app.database, owner.email, 2, 30_000)).row; // after the sign-up link
    const message = (await (await owner.page.request.get(`/api/dev/mail/${captured.id}`)).json()) as { text: string };
    const link = message.text.match(/https?:\/\/\S+\/reset\/[\w-]+/)?.[0];
    expect(link).toMatch(new RegExp(`^${app.baseUrl}/reset/`));

    await page.goto(link!);
    await page.getByLabel('New password', { exact: true }).fill('fresh-fuse-spur-42');
    await page.getByRole('button', { name: 'Set password' }).click();
    await page.getByText('Password changed').waitFor();
    expect((await owner.page.request.get('/api/auth/me')).status()).toBe(401);
    // The open tab finds out on its next request and asks to sign in, to come back after.
    await owner.page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Members' }).click();
    await owner.page.waitForURL(signInFor('/members'));

    await page.getByRole('link', { name: 'Sign in' }).first().click();
    await page.getByRole('heading', { name: 'Sign in' }).waitFor();
    await page.getByLabel('E-mail').fill(owner.email);
    await page.getByLabel('Password', { exact: true }).fill('fresh-fuse-spur-42');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL('**/boards');

    // The link works once.
    const again = await app.newPage();
    await again.goto(link!);
    await again.getByLabel('New password', { exact: true }).fill('another-fuse-spur-43');
    await again.getByRole('button', { name: 'Set password' }).click();
    await again.getByText('Ask for a new link').waitFor();
  });
});
