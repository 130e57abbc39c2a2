/**
 * The board editor in a real browser: a board built through the screens, a finding that
 * appears while typing, and the saved board coming back the same after a reload.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readFile } from 'node:fs/promises';
import type { Page } from 'playwright-core';
import { startBrowserApp, signedInOwnerPage, type BrowserApp } from '../helpers/browser.js';
import { makeSchedule } from '../helpers/boards.js';
import { TEST_PASSWORD, uniqueEmail } from '../helpers/app.js';
import { hashPassword } from '../../server/auth/passwords.js';
import { users } from '../../server/db/schema.js';

let app: BrowserApp;
beforeAll(async () => {
  app = await startBrowserApp();
});
afterAll(async () => {
  await app?.close();
});

/** Picks an option of the ant-design select inside a circuit table cell. */
async function choose(page: Page, cell: string, option: string): Promise<void> {
  await page.locator(`td[data-cell="${cell}"] .ant-select-selector`).click();
  await page.locator(`.ant-select-dropdown:not(.ant-select-dropdown-hidden) .ant-select-item-option[title="${option}"]`).click();
}

/** Writes through the page's own session, as the API client the editor uses would. */
async function api(page: Page, method: 'POST' | 'PUT', path: string, data: unknown) {
  const { token } = (await (await page.request.get('/api/auth/csrf')).json()) as { token: string };
  const res = await page.request.fetch(path, { method, headers: { 'X-CSRF-Token': token }, data });
  if (!res.ok()) throw new Error(`${method} ${path}: ${res.status()} ${await res.text()}`);
  return res.json();
}

/** A board made through the API from the shared fixture, at revision 2. */
async function boardWithCircuits(page: Page, circuits: number): Promise<number> {
  const schedule = makeSchedule(circuits, 'Kitchen extension board');
  const { id } = await api(page, 'POST', '/api/boards', { name: schedule.board.name });
  await api(page, 'PUT', `/api/boards/${id}/schedule`, { ...schedule, baseRevision: 1 });
  return id as number;
}

const finding = (page: Page, code: string) => page.locator(`.board-findings [data-finding-code="${code}"]`);

describe('building a board in the editor', () => {
  it('when a 2.5 mm² radial on a B32 is clipped direct, then the capacity finding appears live, and the board saves and reloads as entered', async () => {
    const { page } = await signedInOwnerPage(app, 'Fernhollow Test Electrical');

    // A new, empty board through the form.
    await page.goto('/boards');
    await page.getByRole('link', { name: 'New board' }).click();
    await page.getByLabel('Board name').fill('Garage sub-board');
    await page.getByLabel('Where it is').fill('Garage, left of the side door');
    await page.getByText('Empty board', { exact: true }).click();
    await page.getByRole('button', { name: 'Create board' }).click();
    await page.waitForURL(/\/boards\/\d+$/);
    const boardId = Number(new URL(page.url()).pathname.split('/').pop());

    // One MCB on row 1, made a B32 in its drawer; the DIN row picture shows it.
    await page.getByRole('tab', { name: /DIN rows/ }).click();
    await page.getByRole('button', { name: 'Add device to row 1' }).click();
    await page.getByRole('menuitem', { name: 'MCB' }).click();
    await page.getByRole('button', { name: 'Edit', exact: true }).click();
    await page.getByLabel('Rating (A)').fill('32');
    await page.getByLabel('Curve').waitFor();
    await page.keyboard.press('Escape');
    await page.locator('.board-din-row svg text', { hasText: 'B32' }).waitFor();

    // A circuit on it: the new row takes the free breaker and puts the cursor in its label.
    await page.getByRole('tab', { name: /Circuits/ }).click();
    await page.getByRole('button', { name: 'Add circuit' }).click();
    await page.keyboard.type('Garage sockets');
    const row = page.locator('tbody tr[data-circuit-id]').first();
    const id = await row.getAttribute('data-circuit-id');
    expect(await page.locator(`td[data-cell="device-${id}"]`).textContent()).toContain('B32');
    await choose(page, `kind-${id}`, 'Radial');
    await page.locator(`td[data-cell="live-${id}"] input`).fill('2.5');
    await page.locator(`td[data-cell="cpc-${id}"] input`).fill('1.5');
    // Without a reference method the capacity cannot be checked yet, and the panel says so.
    await finding(page, 'capacity-not-checked').waitFor();
    expect(await finding(page, 'rating-over-iz').count()).toBe(0);

    await choose(page, `method-${id}`, 'C – clipped direct');
    // BS 7671:2018+A2 Table 4D5: 2.5 mm² flat twin-and-earth, method C, Iz = 27 A < In = 32 A.
    await finding(page, 'rating-over-iz').waitFor();
    expect(await finding(page, 'rating-over-iz').textContent()).toContain('27 A');
    await page.locator(`td[data-cell="live-${id}"].board-cell--error`).waitFor();

    // Enter in a cell adds the next circuit below, with the cursor in its label.
    await page.locator(`td[data-cell="length-${id}"] input`).fill('14');
    await page.locator(`td[data-cell="length-${id}"] input`).press('Enter');
    await page.keyboard.type('Garage lights');
    expect(await page.locator('tbody tr[data-circuit-id]').count()).toBe(2);

    await page.getByTestId('save').click();
    await page.getByTestId('save-state').filter({ hasText: 'Saved · revision 2' }).waitFor();

    // After a reload the board is as entered and the finding is still there.
    await page.reload();
    const labelInput = page.locator(`td[data-cell="label-${id}"] input`);
    await labelInput.waitFor();
    expect(await labelInput.inputValue()).toBe('Garage sockets');
    expect(await page.locator(`td[data-cell="live-${id}"] input`).inputValue()).toBe('2.5');
    expect(await page.locator(`td[data-cell="length-${id}"] input`).inputValue()).toBe('14');
    await finding(page, 'rating-over-iz').waitFor();

    // The server's check agrees with what the editor showed.
    const saved = await (await page.request.get(`/api/boards/${boardId}/schedule`)).json();
    expect(saved.revision).toBe(2);
    expect(saved.circuits.map((c: { label: string }) => c.label)).toEqual(['Garage sockets', 'Garage lights']);
    expect(saved.devices).toMatchObject([{ kind: 'mcb', rating: 32, curve: 'B' }]);
    const check = await (await page.request.get(`/api/boards/${boardId}/check`)).json();
    expect(check.findings.filter((f: { code: string }) => f.code === 'rating-over-iz').map((f: { ways: number[] }) => f.ways)).toEqual([[1]]);

    expect(app.pageErrors).toEqual([]);
    expect(app.outsideRequests).toEqual([]);
  }, 180_000);

  it('when a board is made from the 10-way layout with 9 circuits, then the table shows 10 ways, way 10 Spare, and using it makes a 10th circuit that is saved', async () => {
    const { page } = await signedInOwnerPage(app, 'Fernhollow Test Electrical');
    const { id: boardId } = await api(page, 'POST', '/api/boards', { name: 'Hall consumer unit', template: 'split-load-10' });
    await page.goto(`/boards/${boardId}`);
    const circuitRows = page.locator('tbody tr[data-circuit-id]');
    const spareRows = page.locator('tbody tr.board-spare');
    await spareRows.first().waitFor();
    // The layout is named for its ten ways (as the chart and the way labels count them): nine circuits and one spare.
    expect(await circuitRows.count()).toBe(9);
    expect(await spareRows.count()).toBe(1);
    // In way order: the spare is the last line, numbered 10.
    expect(await page.locator('tbody tr').count()).toBe(10);
    expect(await page.locator('tbody tr').nth(9).locator('td').nth(0).textContent()).toBe('10');
    expect(await page.locator('tbody tr').nth(9).locator('td').nth(1).textContent()).toBe('Spare');
    expect(await page.locator('tbody tr').nth(8).locator('td[data-cell^="way-"] input').inputValue()).toBe('9');
    await page.getByRole('tab', { name: 'Circuits (9 + 1 spare)' }).waitFor();

    await page.getByRole('button', { name: 'Use spare way 10' }).click();
    await page.keyboard.type('Garden lights');
    expect(await spareRows.count()).toBe(0);
    expect(await circuitRows.count()).toBe(10);
    await page.getByTestId('save').click();
    await page.getByTestId('save-state').filter({ hasText: 'Saved · revision 2' }).waitFor();

    await page.reload();
    await page.locator('tbody tr[data-circuit-id]').nth(9).waitFor();
    expect(await circuitRows.count()).toBe(10);
    expect(await spareRows.count()).toBe(0);
    const saved = await (await page.request.get(`/api/boards/${boardId}/schedule`)).json();
    const tenth = saved.circuits.find((c: { way: number }) => c.way === 10);
    const spareDevice = saved.devices.find((d: { label: string }) => d.label === 'Spare');
    expect(tenth).toMatchObject({ label: 'Garden lights', deviceId: spareDevice.id });
    expect(await page.locator(`tr[data-circuit-id="${tenth.id}"] td[data-cell^="label-"] input`).inputValue()).toBe('Garden lights');
    expect(app.pageErrors).toEqual([]);
  }, 180_000);

  it('when a ring final is marked as grouped with two other circuits in its drawer, then the capacity finding appears beside that field', async () => {
    const { page } = await signedInOwnerPage(app, 'Fernhollow Test Electrical');
    const boardId = await boardWithCircuits(page, 2);
    await page.goto(`/boards/${boardId}`);
    await page.locator('td[data-cell="label-c1"] input').waitFor();
    // Way 1 is a 2.5 mm² ring on a B32 clipped direct: 27 A (Table 4D5, found) meets 433.1.204's 20 A.
    expect(await finding(page, 'ring-iz-below-20').count()).toBe(0);

    await page.getByRole('button', { name: 'Details of way 1' }).click();
    await page.getByLabel('Circuits grouped, this one included').fill('3');
    // 27 A × 0.70 for 3 circuits grouped (BS 7671 Table 4C1, from memory) = 18.9 A, below 20 A.
    await finding(page, 'ring-iz-below-20').waitFor();
    const beside = page.locator('[data-field="circuits.0.cable.groupedWith"]');
    await beside.getByText(/18\.9 A at method C with Cg 0\.70 for 3 circuits grouped/).waitFor();
    expect(app.pageErrors).toEqual([]);
  }, 180_000);

  it('when an installation condition is typed out of range, then the typed value stays with the schema message beside it until corrected', async () => {
    const { page } = await signedInOwnerPage(app, 'Fernhollow Test Electrical');
    const boardId = await boardWithCircuits(page, 2);
    await page.goto(`/boards/${boardId}`);
    await page.locator('td[data-cell="label-c1"] input').waitFor();
    await page.getByRole('button', { name: 'Details of way 1' }).click();

    // Each typed, then left (Tab): nothing is pulled back to the limit. The limits and messages are the schema's own.
    const cases = [
      ['Hottest air temperature along the route (°C)', 'cable.ambientC', '95', 'At most 90 °C'],
      ['Circuits grouped, this one included', 'cable.groupedWith', '0', 'Count this circuit too: at least 1'],
      ['Length surrounded by thermal insulation (mm)', 'cable.insulatedLengthMm', '-10', 'Length in insulation cannot be negative'],
    ] as const;
    for (const [label, field, typed, message] of cases) {
      const input = page.getByLabel(label);
      await input.fill(typed);
      await input.press('Tab');
      const beside = page.locator(`[data-field="circuits.0.${field}"]`);
      await beside.getByText(message).waitFor();
      expect(await input.inputValue()).toBe(typed);
    }
    if (process.env.WAYMARK_SHOTS) await page.screenshot({ path: `${process.env.WAYMARK_SHOTS}/editor-out-of-range.png` }); // for looking, not asserting
    // Saving is refused while they are wrong; nothing reaches the server, and the typed values are still there after.
    await page.keyboard.press('Escape');
    await page.locator('.ant-drawer-open').waitFor({ state: 'detached' });
    await page.getByTestId('save').click();
    expect((await (await page.request.get(`/api/boards/${boardId}/schedule`)).json()).revision).toBe(2);
    await page.getByRole('button', { name: 'Details of way 1' }).click();
    for (const [label, , typed] of cases) expect(await page.getByLabel(label).inputValue()).toBe(typed);

    // Corrected, the messages go and the board saves with the corrected values (rule findings may stay: they never block saving).
    const corrected = ['40', '2', '0'];
    for (const [i, [label, field, , message]] of cases.entries()) {
      await page.getByLabel(label).fill(corrected[i]!);
      await page.getByLabel(label).press('Tab');
      await expect.poll(() => page.locator(`[data-field="circuits.0.${field}"]`).getByText(message).count()).toBe(0);
      expect(await page.getByLabel(label).inputValue()).toBe(corrected[i]);
    }
    await page.keyboard.press('Escape');
    await page.getByTestId('save').click();
    await page.getByTestId('save-state').filter({ hasText: 'Saved · revision 3' }).waitFor();
    const saved = await (await page.request.get(`/api/boards/${boardId}/schedule`)).json();
    expect(saved.circuits[0].cable).toMatchObject({ ambientC: 40, groupedWith: 2, insulatedLengthMm: 0 });
    expect(app.pageErrors).toEqual([]);
  }, 180_000);

  it('when an AFDD with an RCBO built in is recorded, then its drawer takes IΔn and RCD type, its face shows them, and they are saved', async () => {
    const { page } = await signedInOwnerPage(app, 'Fernhollow Test Electrical');
    const boardId = await boardWithCircuits(page, 1);
    await page.goto(`/boards/${boardId}`);
    await page.getByRole('tab', { name: /DIN rows/ }).click();
    const faces30A = page.locator('.board-din-row svg text', { hasText: '30 mA A' });
    await faces30A.first().waitFor();
    const before = await faces30A.count(); // the fixture's RCBOs
    await page.getByRole('button', { name: 'Add device to row 1' }).click();
    await page.getByRole('menuitem', { name: 'AFDD' }).click();
    await page.getByRole('button', { name: 'Edit', exact: true }).click();
    await page.getByLabel('Rating (A)').fill('16');
    // 30 mA: BS 7671:2018+A2 411.3.3 (additional protection); type A: common practice for final circuits
    await page.getByLabel('IΔn (mA)').fill('30');
    await page.locator('.ant-drawer [data-field$=".rcdType"] .ant-select-selector').click();
    await page.locator('.ant-select-dropdown:not(.ant-select-dropdown-hidden) .ant-select-item-option[title="Type A"]').click();
    await page.getByTestId('afdd-rcbo-note').waitFor();
    await page.keyboard.press('Escape');
    await expect.poll(() => faces30A.count()).toBe(before + 1);

    await page.getByTestId('save').click();
    await page.getByTestId('save-state').filter({ hasText: 'Saved · revision 3' }).waitFor();
    const saved = await (await page.request.get(`/api/boards/${boardId}/schedule`)).json();
    expect(saved.devices.filter((d: { kind: string }) => d.kind === 'afdd')).toMatchObject([{ rating: 16, residualMa: 30, rcdType: 'A' }]);
    expect(app.pageErrors).toEqual([]);
  }, 180_000);

  it('when someone else saved meanwhile, then Save offers to re-apply my edit onto their copy, and both edits are kept', async () => {
    const { page } = await signedInOwnerPage(app, 'Fernhollow Test Electrical');
    const boardId = await boardWithCircuits(page, 3);
    await page.goto(`/boards/${boardId}`);
    const myLabel = page.locator('td[data-cell="label-c1"] input');
    await myLabel.fill('Hall sockets');

    // Another save lands first, on a different circuit.
    const theirs = await (await page.request.get(`/api/boards/${boardId}/schedule`)).json();
    theirs.circuits[2].label = 'Landing lights';
    const { id: _id, revision, updatedAt: _u, code: _c, siteId: _s, ...schedule } = theirs;
    await api(page, 'PUT', `/api/boards/${boardId}/schedule`, { ...schedule, baseRevision: revision });

    await page.getByTestId('save').click();
    await page.getByText('Someone else saved this board').waitFor();
    await page.getByRole('button', { name: 'Reload and re-apply my changes' }).click();
    await page.getByText('1 of your changes are now on the newer version').waitFor();
    await page.getByRole('button', { name: 'Review and save' }).click();
    expect(await page.locator('td[data-cell="label-c3"] input').inputValue()).toBe('Landing lights');
    expect(await myLabel.inputValue()).toBe('Hall sockets');
    await page.getByTestId('save').click();
    await page.getByTestId('save-state').filter({ hasText: 'Saved · revision 4' }).waitFor();

    const saved = await (await page.request.get(`/api/boards/${boardId}/schedule`)).json();
    expect(saved.circuits.map((c: { label: string }) => c.label)).toEqual(['Hall sockets', theirs.circuits[1].label, 'Landing lights']);
  }, 180_000);

  it('when a viewer opens a board, then everything is shown and nothing can be changed', async () => {
    const { page: ownerPage } = await signedInOwnerPage(app, 'Fernhollow Test Electrical');
    const boardId = await boardWithCircuits(ownerPage, 2);
    const me = await (await ownerPage.request.get('/api/auth/me')).json();
    const email = uniqueEmail('viewer');
    await app.database.db
      .insert(users)
      .values({ organisationId: me.organisation.id, email, name: 'Test Viewer', role: 'viewer', passwordHash: await hashPassword(TEST_PASSWORD) });
    const page = await app.newPage({ viewport: { width: 820, height: 1180 } });
    await api(page, 'POST', '/api/auth/login', { email, password: TEST_PASSWORD });

    await page.goto(`/boards/${boardId}`);
    const label = page.locator('td[data-cell="label-c1"] input');
    await label.waitFor();
    expect(await label.inputValue()).toBe(makeSchedule(2).circuits[0].label);
    expect(await label.isDisabled()).toBe(true);
    expect(await page.getByTestId('save').count()).toBe(0);
    expect(await page.getByRole('button', { name: 'Add circuit' }).count()).toBe(0);
    await page.getByText('Read only').waitFor();
    await page.locator('.board-findings').getByText('These checks help').waitFor();
  }, 180_000);

  it('when a board file is exported and imported through the screens, then the copy is identical; a bad circuit CSV is refused with its rows listed', async () => {
    const { page } = await signedInOwnerPage(app, 'Fernhollow Test Electrical');
    const boardId = await boardWithCircuits(page, 2);
    await page.goto(`/boards/${boardId}`);
    await page.locator('td[data-cell="label-c1"] input').waitFor();

    await page.getByRole('button', { name: 'More' }).click();
    const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('menuitem', { name: 'Export board file' }).click()]);
    const file = await download.path();
    const exported = JSON.parse(await readFile(file, 'utf8'));
    expect(exported).toMatchObject({ format: 2, kind: 'waymark-board' });

    await page.goto('/boards');
    await page.getByRole('button', { name: 'Import board file' }).click();
    await page.locator('input[aria-label="Board file"]').setInputFiles(file);
    await page.getByRole('button', { name: 'Import', exact: true }).click();
    await page.waitForURL((url) => /^\/boards\/\d+$/.test(url.pathname) && url.pathname !== `/boards/${boardId}`);
    const copyId = Number(new URL(page.url()).pathname.split('/').pop());
    const [original, copy] = await Promise.all([boardId, copyId].map(async (id) => (await page.request.get(`/api/boards/${id}/schedule`)).json()));
    expect({ board: copy.board, devices: copy.devices, circuits: copy.circuits }).toEqual({
      board: original.board,
      devices: original.devices,
      circuits: original.circuits,
    });

    // A CSV with two bad rows: nothing is imported and both rows are named (the header is row 1).
    await page.locator('td[data-cell="label-c1"] input').waitFor();
    await page.getByRole('button', { name: 'More' }).click();
    await page.getByRole('menuitem', { name: 'Import circuits (CSV)…' }).click();
    const csv = (text: string) => ({ name: 'circuits.csv', mimeType: 'text/csv', buffer: Buffer.from(text) });
    // The help speaks to the user (start from the export) and points at no developer document.
    const help = await page.locator('.ant-modal-content', { hasText: 'Import circuits from CSV' }).innerText();
    expect(help).toContain('More → Export circuits (CSV)');
    expect(help).not.toMatch(/developer/i);
    await page.getByTestId('csv-file').setInputFiles(csv('way,label,live_csa\n1,Kitchen sockets,thick\n2,,2.5\n'));
    await page.getByRole('button', { name: 'Import circuits' }).click();
    await page.locator('.board-faults [data-path="rows.2.live_csa"]').waitFor();
    await page.locator('.board-faults [data-path="rows.3.label"]').waitFor();
    expect((await (await page.request.get(`/api/boards/${copyId}/schedule`)).json()).revision).toBe(copy.revision);

    await page.getByTestId('csv-file').setInputFiles(csv('way,label\n1,Porch lights\n'));
    await page.getByRole('button', { name: 'Import circuits' }).click();
    await page.getByText('Circuits imported').waitFor();
    expect(await page.locator('tbody tr[data-circuit-id]').count()).toBe(1);
    expect(await page.locator('tbody tr[data-circuit-id] td[data-cell^="label-"] input').inputValue()).toBe('Porch lights');
  }, 180_000);
});
