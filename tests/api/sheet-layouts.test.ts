import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { client, signupOwner, startTestApp, type TestApp } from '../helpers/app.js';
import { addMember } from '../helpers/boards.js';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => {
  await t.close();
});

/** 21 labels on an A4 sheet: 210 × 297 mm page // ISO 216; 3 × 7 labels of 63.5 × 38.1 mm // common practice */
const a4TwentyOne = {
  name: 'A4 21-up',
  pageWidthMm: 210,
  pageHeightMm: 297,
  labelWidthMm: 63.5,
  labelHeightMm: 38.1,
  columns: 3,
  rows: 7,
  marginTopMm: 15.15,
  marginLeftMm: 7.25,
  gapXMm: 2.5,
  gapYMm: 0,
  cornerRadiusMm: 2,
};

describe('sheet layouts', () => {
  it('when an owner stores a layout, then it is listed and read back with its id', async () => {
    const owner = await signupOwner(t.app);
    const created = await owner.post('/api/sheet-layouts', a4TwentyOne).expect(201);
    expect(created.body).toEqual({ id: expect.any(Number), ...a4TwentyOne, revision: 1 });
    const list = await owner.get('/api/sheet-layouts').expect(200);
    expect(list.body.items).toEqual([created.body]);
    const one = await owner.get(`/api/sheet-layouts/${created.body.id}`).expect(200);
    expect(one.body.labelWidthMm).toBe(63.5);
  });

  it('when the gaps and corner radius are left out, then they default to zero', async () => {
    const owner = await signupOwner(t.app);
    const { gapXMm: _x, gapYMm: _y, cornerRadiusMm: _r, ...bare } = a4TwentyOne;
    const res = await owner.post('/api/sheet-layouts', { ...bare, marginLeftMm: 10 }).expect(201);
    expect([res.body.gapXMm, res.body.gapYMm, res.body.cornerRadiusMm]).toEqual([0, 0, 0]);
  });

  it('when the labels do not fit across or down the page, then 400 names columns and rows', async () => {
    const owner = await signupOwner(t.app);
    // 4 × 63.5 mm = 254 mm is wider than A4's 210 mm // ISO 216
    const res = await owner.post('/api/sheet-layouts', { ...a4TwentyOne, columns: 4, rows: 8 }).expect(400);
    expect(res.body.error.fields.columns).toMatch(/across/);
  });

  it('when fields are missing, mistyped or unknown, then 400 lists each field path', async () => {
    const owner = await signupOwner(t.app);
    const res = await owner.post('/api/sheet-layouts', { ...a4TwentyOne, name: '', labelWidthMm: 'wide', colour: 'red' }).expect(400);
    expect(Object.keys(res.body.error.fields)).toEqual(expect.arrayContaining(['name', 'labelWidthMm']));
    const unknown = await owner.post('/api/sheet-layouts', { ...a4TwentyOne, colour: 'red' }).expect(400);
    expect(JSON.stringify(unknown.body.error.fields)).toMatch(/colour/);
  });

  it('when a layout is replaced and then deleted, then reads follow and a second delete is 404', async () => {
    const owner = await signupOwner(t.app);
    const { body } = await owner.post('/api/sheet-layouts', a4TwentyOne).expect(201);
    const put = await owner.put(`/api/sheet-layouts/${body.id}`, { ...a4TwentyOne, name: 'Renamed', rows: 6, baseRevision: 1 }).expect(200);
    expect(put.body).toMatchObject({ id: body.id, name: 'Renamed', rows: 6, revision: 2 });
    // A save that changes nothing still counts as a save: the row is found and its revision goes up.
    const again = await owner.put(`/api/sheet-layouts/${body.id}`, { ...a4TwentyOne, name: 'Renamed', rows: 6, baseRevision: 2 }).expect(200);
    expect(again.body.revision).toBe(3);
    await owner.delete(`/api/sheet-layouts/${body.id}`).expect(204);
    await owner.get(`/api/sheet-layouts/${body.id}`).expect(404);
    await owner.delete(`/api/sheet-layouts/${body.id}`).expect(404);
  });

  it('when two saves are made from the same revision, then one wins and the other is 409 stale with the current revision', async () => {
    const owner = await signupOwner(t.app);
    const electrician = await addMember(t, owner, 'electrician');
    const {
      body: { id },
    } = await owner.post('/api/sheet-layouts', a4TwentyOne).expect(201);
    const [a, b] = await Promise.all([
      owner.put(`/api/sheet-layouts/${id}`, { ...a4TwentyOne, name: 'Saved by the owner', rows: 6, baseRevision: 1 }),
      electrician.put(`/api/sheet-layouts/${id}`, { ...a4TwentyOne, name: 'Saved by the electrician', rows: 5, baseRevision: 1 }),
    ]);
    expect([a.status, b.status].sort()).toEqual([200, 409]);
    const [won, lost] = a.status === 200 ? [a, b] : [b, a];
    expect(lost.body).toMatchObject({ error: { code: 'stale', fields: { baseRevision: expect.any(String) } }, revision: 2 });
    expect(lost.body.error.message).toMatch(/since you opened it/);
    const now = (await owner.get(`/api/sheet-layouts/${id}`).expect(200)).body;
    expect(now).toEqual(won.body);
    expect(now).toMatchObject({ rows: won.body.rows, revision: 2 });
  });

  it('when a PUT has no baseRevision, then 400 on baseRevision and nothing is saved; the fit checks still apply', async () => {
    const owner = await signupOwner(t.app);
    const {
      body: { id },
    } = await owner.post('/api/sheet-layouts', a4TwentyOne).expect(201);
    for (const baseRevision of [undefined, 0, 1.5, null]) {
      const res = await owner.put(`/api/sheet-layouts/${id}`, { ...a4TwentyOne, name: 'Not saved', baseRevision }).expect(400);
      expect(res.body.error.fields.baseRevision, String(baseRevision)).toBe('baseRevision is required');
    }
    // 4 × 63.5 mm = 254 mm is wider than A4's 210 mm // ISO 216
    const wide = await owner.put(`/api/sheet-layouts/${id}`, { ...a4TwentyOne, columns: 4, baseRevision: 1 }).expect(400);
    expect(wide.body.error.fields.columns).toMatch(/across/);
    expect((await owner.get(`/api/sheet-layouts/${id}`).expect(200)).body).toMatchObject({ name: a4TwentyOne.name, columns: 3, revision: 1 });
  });

  it('when an electrician writes, then it works; a viewer reads but every write is 403', async () => {
    const owner = await signupOwner(t.app);
    const electrician = await addMember(t, owner, 'electrician');
    const viewer = await addMember(t, owner, 'viewer');
    const { body } = await electrician.post('/api/sheet-layouts', a4TwentyOne).expect(201);
    expect((await viewer.get('/api/sheet-layouts').expect(200)).body.items).toHaveLength(1);
    await viewer.post('/api/sheet-layouts', a4TwentyOne).expect(403);
    await viewer.put(`/api/sheet-layouts/${body.id}`, { ...a4TwentyOne, baseRevision: 1 }).expect(403);
    await viewer.delete(`/api/sheet-layouts/${body.id}`).expect(403);
  });

  it('when signed out, then 401', async () => {
    const anonymous = await client(t.app);
    await anonymous.get('/api/sheet-layouts').expect(401);
    await anonymous.post('/api/sheet-layouts', a4TwentyOne).expect(401);
  });

  it("when another organisation's layout id is used, then 404 and it is left unchanged", async () => {
    const owner = await signupOwner(t.app);
    const other = await signupOwner(t.app, 'Other Electrical');
    const { body } = await owner.post('/api/sheet-layouts', a4TwentyOne).expect(201);
    await other.get(`/api/sheet-layouts/${body.id}`).expect(404);
    await other.put(`/api/sheet-layouts/${body.id}`, { ...a4TwentyOne, name: 'Taken', baseRevision: 1 }).expect(404);
    await other.delete(`/api/sheet-layouts/${body.id}`).expect(404);
    expect((await other.get('/api/sheet-layouts').expect(200)).body.items).toEqual([]);
    expect((await owner.get(`/api/sheet-layouts/${body.id}`).expect(200)).body).toMatchObject({ name: a4TwentyOne.name, revision: 1 });
  });

  it('when the id is not a number, then 400 names it', async () => {
    const owner = await signupOwner(t.app);
    const res = await owner.get('/api/sheet-layouts/abc').expect(400);
    expect(res.body.error.fields.id).toBeTruthy();
  });
});
