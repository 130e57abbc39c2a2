import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { client, signupOwner, startTestApp, type Client, type TestApp } from '../helpers/app.js';
import { addMember, createBoardWith, makeSchedule } from '../helpers/boards.js';
import { boards } from '../../server/db/schema.js';
import { boardListResponseSchema, boardSummarySchema } from '../../shared/schemas/boards.js';

let t: TestApp;
let owner: Client;
let viewer: Client;
let electrician: Client;
let stranger: Client;
beforeAll(async () => {
  t = await startTestApp();
  owner = await signupOwner(t.app, 'Boards Test Ltd');
  viewer = await addMember(t, owner, 'viewer');
  electrician = await addMember(t, owner, 'electrician');
  stranger = await signupOwner(t.app, 'Other Contractor Ltd');
});
afterAll(async () => {
  await t.close();
});

describe('creating boards', () => {
  it('when an electrician creates an empty board, then it has a WM- code, a long public token and revision 1', async () => {
    const res = await electrician.post('/api/boards', { name: 'Main consumer unit', location: 'Garage, left of the side door' }).expect(201);
    const summary = boardSummarySchema.parse((await electrician.get(`/api/boards/${res.body.id}`).expect(200)).body);
    expect(summary.name).toBe('Main consumer unit');
    expect(summary.location).toBe('Garage, left of the side door');
    expect(summary.code).toMatch(/^WM-[2-9A-HJKMNP-TW-Z]{6}$/);
    // ≥ 128 random bits: base64url carries 6 bits a character, so at least 22 characters
    expect(summary.publicToken).toMatch(/^[A-Za-z0-9_-]{22,}$/);
    expect(summary.revision).toBe(1);
    expect(summary.publicEnabled).toBe(false); // a new board's page starts off
    const schedule = (await electrician.get(`/api/boards/${res.body.id}/schedule`).expect(200)).body;
    expect(schedule.circuits).toEqual([]);
    expect(schedule.revision).toBe(1);
  });

  it('when many boards are created, then their codes and tokens are all different', async () => {
    const ids = await Promise.all(
      Array.from({ length: 8 }, (_, i) =>
        owner
          .post('/api/boards', { name: `Board ${i}` })
          .expect(201)
          .then((r) => r.body.id),
      ),
    );
    const rows = await Promise.all(ids.map((id) => owner.get(`/api/boards/${id}`).then((r) => r.body)));
    expect(new Set(rows.map((r) => r.code)).size).toBe(8);
    expect(new Set(rows.map((r) => r.publicToken)).size).toBe(8);
  });

  it('when the body is bad, then 400 names each field', async () => {
    const res = await owner.post('/api/boards', { name: '', location: 5, colour: 'red' }).expect(400);
    // the unknown field is reported against the body itself
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['(body)', 'location', 'name']);
  });

  it('when the template is unknown or the site belongs to another organisation, then 400 on that field', async () => {
    const bad = await owner.post('/api/boards', { name: 'X', template: 'no-such-layout' }).expect(400);
    expect(bad.body.error.fields.template).toBeTruthy();
    const site = await stranger.post('/api/sites', { reference: 'THEIRS-1' }).expect(201);
    const res = await owner.post('/api/boards', { name: 'X', siteId: site.body.id }).expect(400);
    expect(res.body.error.fields.siteId).toBeTruthy();
  });

  it('when a viewer or a signed-out visitor creates a board, then 403 and 401', async () => {
    await viewer.post('/api/boards', { name: 'Nope' }).expect(403);
    const anonymous = await client(t.app);
    await anonymous.post('/api/boards', { name: 'Nope' }).expect(401);
    await anonymous.get('/api/boards').expect(401);
  });
});

describe('listing and searching boards', () => {
  it('when boards are listed, then each item has the summary fields and paging totals add up', async () => {
    const c = await signupOwner(t.app, 'Paging Ltd');
    for (let i = 1; i <= 5; i++) await c.post('/api/boards', { name: `Paged board ${i}` }).expect(201);
    const first = boardListResponseSchema.parse((await c.get('/api/boards?page=1&pageSize=2').expect(200)).body);
    const third = boardListResponseSchema.parse((await c.get('/api/boards?page=3&pageSize=2').expect(200)).body);
    expect(first.total).toBe(5);
    expect(first.items).toHaveLength(2);
    expect(third.items).toHaveLength(1);
    expect(first.items[0]).toMatchObject({ name: 'Paged board 5', circuitCount: 0, revision: 1, siteId: null, siteReference: null });
  });

  it("when searching by a word of a way's location, then the board is found, and other organisations' boards never are", async () => {
    const schedule = makeSchedule(3, 'Workshop board');
    schedule.circuits[1].locations = ['Potting shed'];
    const { id } = await createBoardWith(owner, schedule);
    const found = (await owner.get('/api/boards?q=potting').expect(200)).body;
    expect(found.items.map((b: any) => b.id)).toEqual([id]);
    expect(found.items[0].circuitCount).toBe(3);
    expect((await stranger.get('/api/boards?q=potting').expect(200)).body.total).toBe(0);
  });

  it('when searching by site reference or client, board name or way label, then the board is found', async () => {
    const site = await owner.post('/api/sites', { reference: 'QX-4471', clientName: 'Ottoline Marchbank' }).expect(201);
    const schedule = makeSchedule(2, 'Stable block board');
    schedule.circuits[0].label = 'Tack room heater';
    const { id } = await createBoardWith(owner, schedule, site.body.id);
    for (const q of ['qx-4471', 'Marchbank', 'stable block', 'tack room']) {
      const items = (await owner.get(`/api/boards?q=${encodeURIComponent(q)}`).expect(200)).body.items;
      expect(
        items.map((b: any) => b.id),
        q,
      ).toContain(id);
    }
    const bySite = (await owner.get(`/api/boards?siteId=${site.body.id}`).expect(200)).body;
    expect(bySite.items).toHaveLength(1);
    expect(bySite.items[0].siteReference).toBe('QX-4471');
  });

  it('when the search holds LIKE wildcards, then they are taken literally', async () => {
    const res = (await owner.get('/api/boards?q=%25').expect(200)).body;
    expect(res.total).toBe(0);
  });

  it('when the query is bad, then 400 names the parameter', async () => {
    const res = await owner.get('/api/boards?page=0&pageSize=1000&deleted=maybe').expect(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['deleted', 'page', 'pageSize']);
  });
});

describe('reading, moving and the public page switch', () => {
  it('when another organisation asks for a board by id, then 404 on every route', async () => {
    const { id } = await createBoardWith(owner);
    for (const path of ['', '/schedule', '/check', '/revisions', '/revisions/1', '/diff?from=1&to=2', '/export', '/circuits.csv']) {
      await stranger.get(`/api/boards/${id}${path}`).expect(404);
    }
    await stranger.patch(`/api/boards/${id}`, { siteId: null }).expect(404);
    await stranger.delete(`/api/boards/${id}`).expect(404);
    await stranger.post(`/api/boards/${id}/restore`).expect(404);
    await stranger.post(`/api/boards/${id}/duplicate`).expect(404);
    await stranger.put(`/api/boards/${id}/schedule`, { ...makeSchedule(1), baseRevision: 2 }).expect(404);
    await stranger.post(`/api/boards/${id}/token/rotate`).expect(404);
    await stranger.patch(`/api/boards/${id}/public`, { enabled: false }).expect(404);
  });

  it('when the id or revision number is not a number, then 400 names the parameter', async () => {
    const res = await owner.get('/api/boards/abc').expect(400);
    expect(res.body.error.fields.id).toBeTruthy();
    expect((await owner.delete('/api/boards/-4').expect(400)).body.error.fields.id).toBeTruthy();
    const { id } = await createBoardWith(owner, makeSchedule(1));
    expect((await owner.get(`/api/boards/${id}/revisions/first`).expect(400)).body.error.fields.number).toBeTruthy();
  });

  it('when signed out, then every board route answers 401', async () => {
    const { id } = await createBoardWith(owner, makeSchedule(1));
    const anonymous = await client(t.app);
    const routes: Array<[method: 'get' | 'post' | 'put' | 'patch' | 'delete', path: string]> = [
      ['get', ''],
      ['get', '/schedule'],
      ['put', '/schedule'],
      ['patch', ''],
      ['delete', ''],
      ['post', '/restore'],
      ['post', '/duplicate'],
      ['get', '/check'],
      ['get', '/revisions'],
      ['get', '/revisions/1'],
      ['get', '/diff?from=1&to=2'],
      ['get', '/export'],
      ['get', '/circuits.csv'],
      ['post', '/circuits/import-csv'],
      ['post', '/token/rotate'],
      ['patch', '/public'],
    ];
    for (const [method, path] of routes) {
      const res = await anonymous[method](`/api/boards/${id}${path}`);
      expect(res.status, `${method} ${path}`).toBe(401);
    }
    await anonymous.post('/api/boards/import', {}).expect(401);
  });

  it('when a board is moved to a site and back, then the summary and the site page follow', async () => {
    const { id } = await createBoardWith(owner);
    const site = await owner.post('/api/sites', { reference: 'MOVE-1' }).expect(201);
    await electrician.patch(`/api/boards/${id}`, { siteId: site.body.id }).expect(204);
    expect((await owner.get(`/api/boards/${id}`).expect(200)).body.site).toMatchObject({ id: site.body.id, reference: 'MOVE-1' });
    expect((await owner.get(`/api/sites/${site.body.id}`).expect(200)).body.boards.map((b: any) => b.id)).toEqual([id]);
    await owner.patch(`/api/boards/${id}`, { siteId: null }).expect(204);
    expect((await owner.get(`/api/boards/${id}`).expect(200)).body.site).toBeNull();
    const bad = await owner.patch(`/api/boards/${id}`, { siteId: 'x', name: 'y' }).expect(400);
    expect(bad.body.error.fields.siteId).toBeTruthy();
    await viewer.patch(`/api/boards/${id}`, { siteId: null }).expect(403);
  });

  it('when the token is rotated or the page switched off, then the board keeps the new values; viewers may not', async () => {
    const { id } = await createBoardWith(owner);
    const before = (await owner.get(`/api/boards/${id}`).expect(200)).body.publicToken;
    const rotated = (await electrician.post(`/api/boards/${id}/token/rotate`).expect(200)).body.publicToken;
    expect(rotated).not.toBe(before);
    expect((await owner.get(`/api/boards/${id}`).expect(200)).body.publicToken).toBe(rotated);
    expect((await electrician.patch(`/api/boards/${id}/public`, { enabled: false }).expect(200)).body).toEqual({ publicEnabled: false });
    expect((await owner.get(`/api/boards/${id}`).expect(200)).body.publicEnabled).toBe(false);
    const bad = await owner.patch(`/api/boards/${id}/public`, { enabled: 'no' }).expect(400);
    expect(bad.body.error.fields.enabled).toBeTruthy();
    await viewer.post(`/api/boards/${id}/token/rotate`).expect(403);
    await viewer.patch(`/api/boards/${id}/public`, { enabled: true }).expect(403);
  });
});

describe('soft delete, restore and duplicate', () => {
  it('when an electrician deletes a board, then it leaves the list, lists as deleted, and only the owner restores it', async () => {
    const { id } = await createBoardWith(owner);
    await viewer.delete(`/api/boards/${id}`).expect(403);
    await electrician.delete(`/api/boards/${id}`).expect(204);
    await owner.get(`/api/boards/${id}/schedule`).expect(404);
    expect((await owner.get('/api/boards?pageSize=100').expect(200)).body.items.map((b: any) => b.id)).not.toContain(id);
    const deleted = (await owner.get('/api/boards?deleted=true&pageSize=100').expect(200)).body.items;
    expect(deleted.find((b: any) => b.id === id)?.deletedAt).toBeTruthy();
    await electrician.post(`/api/boards/${id}/restore`).expect(403);
    await owner.post(`/api/boards/${id}/restore`).expect(204);
    const schedule = (await owner.get(`/api/boards/${id}/schedule`).expect(200)).body;
    expect(schedule.circuits).toHaveLength(10);
    await owner.post(`/api/boards/${id}/restore`).expect(409);
  });

  it('when a board is deleted, then saving, moving, duplicating or exporting it answers 404', async () => {
    const { id } = await createBoardWith(owner, makeSchedule(2));
    await owner.delete(`/api/boards/${id}`).expect(204);
    await owner.put(`/api/boards/${id}/schedule`, { ...makeSchedule(2), baseRevision: 2 }).expect(404);
    await owner.patch(`/api/boards/${id}`, { siteId: null }).expect(404);
    await owner.post(`/api/boards/${id}/duplicate`).expect(404);
    await owner.get(`/api/boards/${id}/export`).expect(404);
    await owner.get(`/api/boards/${id}/revisions`).expect(404);
    await owner.delete(`/api/boards/${id}`).expect(404);
  });

  it('when a board was deleted more than 30 days ago, then it can no longer be restored', async () => {
    const { id } = await createBoardWith(owner);
    await owner.delete(`/api/boards/${id}`).expect(204);
    await t.database.db
      .update(boards)
      .set({ deletedAt: new Date(Date.now() - 31 * 24 * 3600 * 1000) })
      .where(eq(boards.id, id));
    const res = await owner.post(`/api/boards/${id}/restore`).expect(409);
    expect(res.body.error.message).toMatch(/30 days/);
    await t.database.db
      .update(boards)
      .set({ deletedAt: new Date(Date.now() - 29 * 24 * 3600 * 1000) })
      .where(eq(boards.id, id));
    await owner.post(`/api/boards/${id}/restore`).expect(204);
  });

  it('when a board is duplicated, then the copy has the same schedule, its own code and a history of its own', async () => {
    const { id } = await createBoardWith(owner, makeSchedule(4, 'Flat 2 board'));
    const copy = await electrician.post(`/api/boards/${id}/duplicate`).expect(201);
    const [a, b] = await Promise.all([owner.get(`/api/boards/${id}/schedule`), owner.get(`/api/boards/${copy.body.id}/schedule`)]);
    expect(b.body.board.name).toBe('Flat 2 board (copy)');
    expect(b.body.circuits).toEqual(a.body.circuits);
    expect(b.body.devices).toEqual(a.body.devices);
    expect(b.body.code).not.toBe(a.body.code);
    expect(b.body.revision).toBe(1);
    const history = (await owner.get(`/api/boards/${copy.body.id}/revisions`).expect(200)).body.items;
    expect(history).toHaveLength(1);
    expect(history[0].summary).toContain(a.body.code);
    await viewer.post(`/api/boards/${id}/duplicate`).expect(403);
  });
});
