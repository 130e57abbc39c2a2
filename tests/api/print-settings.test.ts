import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { PDFDocument } from 'pdf-lib';
import { signupOwner, startTestApp, type TestApp } from '../helpers/app.js';
import { addMember, createBoardWith, makeSchedule } from '../helpers/boards.js';
import { getPdf, inkBox, MM, pdfPages } from './print-support.js';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => {
  await t.close();
});

async function ownerWithBoard() {
  const owner = await signupOwner(t.app);
  const board = await createBoardWith(owner, makeSchedule(4));
  return { owner, id: board.id };
}

describe('sheet layouts and printer offsets in prints', () => {
  const sheet = {
    name: 'A4 21-up',
    pageWidthMm: 210,
    pageHeightMm: 297,
    labelWidthMm: 63.5,
    labelHeightMm: 38.1, // ISO 216 A4; 63.5 × 38.1 labels // common practice
    columns: 3,
    rows: 7,
    marginTopMm: 15.15,
    marginLeftMm: 7.25,
    gapXMm: 2.5,
    gapYMm: 0,
    cornerRadiusMm: 2,
  };

  it("when a stored sheet layout is the medium, then the page is the sheet's size; another organisation's layout is 404", async () => {
    const { owner, id } = await ownerWithBoard();
    const layout = await owner.post('/api/sheet-layouts', sheet).expect(201);
    const res = await getPdf(owner, `/api/boards/${id}/pdf/flags?media=sheet-${layout.body.id}`).expect(200);
    const page = (await PDFDocument.load(res.body)).getPage(0).getSize();
    expect([page.width, page.height].map((v) => +(v / MM).toFixed(2))).toEqual([210, 297]); // ISO 216 A4
    const other = await ownerWithBoard();
    await other.owner.get(`/api/boards/${other.id}/pdf/flags?media=sheet-${layout.body.id}`).expect(404);
  });

  it('when the printer offset is set, then it is kept and the same print comes out shifted', async () => {
    const { owner, id } = await ownerWithBoard();
    const before = await getPdf(owner, `/api/boards/${id}/pdf/calibration?media=a4`).expect(200);
    expect((await owner.get('/api/print-settings/offset').expect(200)).body).toEqual({ xMm: 0, yMm: 0, revision: 1 });
    const saved = await owner.put('/api/print-settings/offset', { xMm: 1.5, yMm: -2, baseRevision: 1 }).expect(200);
    expect(saved.body).toEqual({ xMm: 1.5, yMm: -2, revision: 2 });
    expect((await owner.get('/api/print-settings/offset').expect(200)).body).toEqual({ xMm: 1.5, yMm: -2, revision: 2 });
    const after = await getPdf(owner, `/api/boards/${id}/pdf/calibration?media=a4`).expect(200);
    const [a, b] = [inkBox(before.body), inkBox(after.body)];
    // 100 dpi: 1 mm = 100 / 25.4 px (ISO 32000-1 user unit 1/72 in); allow a pixel of rounding
    expect(Math.abs(b.left - a.left - (1.5 * 100) / 25.4)).toBeLessThanOrEqual(1.5);
    expect(Math.abs(b.top - a.top - (-2 * 100) / 25.4)).toBeLessThanOrEqual(1.5);
  });

  it('when the offset is out of range or a viewer sets it, then 400 with fields, or 403', async () => {
    const { owner } = await ownerWithBoard();
    const bad = await owner.put('/api/print-settings/offset', { xMm: 25, yMm: 'down' }).expect(400);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(['baseRevision', 'xMm', 'yMm']);
    expect(bad.body.error.fields.baseRevision).toBe('baseRevision is required');
    const viewer = await addMember(t, owner, 'viewer');
    await viewer.put('/api/print-settings/offset', { xMm: 3, yMm: 3, baseRevision: 1 }).expect(403);
    expect((await viewer.get('/api/print-settings/offset').expect(200)).body).toEqual({ xMm: 0, yMm: 0, revision: 1 });
  });

  it("when the offset and the organisation's settings are saved from the same revision, then the second is 409 stale and keeps nothing of its own", async () => {
    // The offset is a column of the organisation's row: one revision guards the whole row.
    const { owner } = await ownerWithBoard();
    const electrician = await addMember(t, owner, 'electrician');
    const { revision } = (await owner.get('/api/organisation').expect(200)).body;
    await electrician.put('/api/print-settings/offset', { xMm: 0.5, yMm: 0.5, baseRevision: revision }).expect(200);
    const lost = await owner
      .put('/api/organisation', {
        name: 'Overwriter Ltd',
        contactPhone: '',
        contactEmail: '',
        printOffsetXMm: 0,
        printOffsetYMm: 0,
        baseRevision: revision,
      })
      .expect(409);
    expect(lost.body).toMatchObject({ error: { code: 'stale' }, revision: revision + 1 });
    expect((await owner.get('/api/organisation').expect(200)).body).toMatchObject({
      name: 'Test Electrical',
      printOffsetXMm: 0.5,
      printOffsetYMm: 0.5,
      revision: revision + 1,
    });
    // And the other way round: a settings save moves the revision on, so an offset from before it is stale.
    await owner.put('/api/organisation', { name: 'Renamed Ltd', contactPhone: '', contactEmail: '', baseRevision: revision + 1 }).expect(200);
    const staleOffset = await electrician.put('/api/print-settings/offset', { xMm: 9, yMm: 9, baseRevision: revision + 1 }).expect(409);
    expect(staleOffset.body).toMatchObject({ error: { code: 'stale' }, revision: revision + 2 });
    expect((await owner.get('/api/print-settings/offset').expect(200)).body).toEqual({ xMm: 0.5, yMm: 0.5, revision: revision + 2 });
  });

  it('when the calibration page is asked for from the settings, then it prints with no board and carries a 100 mm ruler', async () => {
    const { owner } = await ownerWithBoard();
    const res = await getPdf(owner, '/api/print-settings/calibration?media=a5').expect(200);
    const page = (await PDFDocument.load(res.body)).getPage(0).getSize();
    expect(page.width).toBeCloseTo(419.53, 2); // ISO 216 A5 148 mm
    expect((await pdfPages(res.body)).join(' ')).toMatch(/100 mm/);
    await owner.get('/api/print-settings/calibration?media=b5').expect(400);
  });
});
