import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { client, type Client, type TestApp } from '../helpers/app.js';
import { createBoardWith, makeSchedule, startWithCast } from '../helpers/boards.js';
import { siteDetailSchema, siteListResponseSchema, siteSchema } from '../../shared/schemas/site.js';

let t: TestApp, owner: Client, viewer: Client, stranger: Client;
beforeAll(async () => ({ t, owner, viewer, stranger } = await startWithCast('Sites Test Ltd', 'Neighbouring Sparks')));
afterAll(async () => {
  await t.close();
});

const fullSite = {
  reference: 'JOB-2291',
  clientName: 'Perpetua Oakhanger',
  address: '14 Larkspur Row\nWendlebury Parva',
  clientEmail: 'Perpetua@Client.Example',
  clientPhone: '01632 960 771',
  notes: 'Key with the neighbour at number 12',
};

describe('sites', () => {
  it('when a site is created, then it reads back with every field, its boards and a board count', async () => {
    const created = await owner.post('/api/sites', fullSite).expect(201);
    const { id: boardId } = await createBoardWith(owner, makeSchedule(2, 'Kitchen board'), created.body.id);
    const site = siteDetailSchema.parse((await viewer.get(`/api/sites/${created.body.id}`).expect(200)).body);
    expect(site).toMatchObject({ ...fullSite, clientEmail: 'perpetua@client.example', boardCount: 1 });
    expect(site.boards.map((b) => [b.id, b.name, b.circuitCount])).toEqual([[boardId, 'Kitchen board', 2]]);
    const list = siteListResponseSchema.parse((await viewer.get('/api/sites').expect(200)).body);
    expect(list.items.find((s) => s.id === created.body.id)?.boardCount).toBe(1);
  });

  it('when only a reference is given, then the other fields are empty', async () => {
    const created = await owner.post('/api/sites', { reference: 'MINIMAL-1' }).expect(201);
    const site = siteSchema.parse((await owner.get(`/api/sites/${created.body.id}`).expect(200)).body);
    expect(site).toMatchObject({ reference: 'MINIMAL-1', clientName: '', address: '', clientEmail: '', clientPhone: '', notes: '' });
  });

  it('when a site is replaced with PUT, then every field takes the new value and the revision goes up by one', async () => {
    const created = await owner.post('/api/sites', fullSite).expect(201);
    expect(created.body.revision).toBe(1);
    const res = await owner.put(`/api/sites/${created.body.id}`, { reference: 'JOB-2291A', address: 'Unit 3, Teasel Yard', baseRevision: 1 }).expect(200);
    expect(res.body).toMatchObject({ reference: 'JOB-2291A', address: 'Unit 3, Teasel Yard', clientName: '', notes: '', revision: 2 });
    expect((await viewer.get(`/api/sites/${created.body.id}`).expect(200)).body.revision).toBe(2);
  });

  it('when two saves are made from the same revision, then one wins and the other is 409 stale with the current revision', async () => {
    const {
      body: { id },
    } = await owner.post('/api/sites', fullSite).expect(201);
    const [a, b] = await Promise.all([
      owner.put(`/api/sites/${id}`, { ...fullSite, clientName: 'Saved by A', baseRevision: 1 }),
      owner.put(`/api/sites/${id}`, { ...fullSite, clientName: 'Saved by B', baseRevision: 1 }),
    ]);
    expect([a.status, b.status].sort()).toEqual([200, 409]);
    const [won, lost] = a.status === 200 ? [a, b] : [b, a];
    expect(lost.body).toMatchObject({ error: { code: 'stale', fields: { baseRevision: expect.any(String) } }, revision: 2 });
    expect(lost.body.error.message).toMatch(/since you opened it/);
    const now = (await owner.get(`/api/sites/${id}`).expect(200)).body;
    expect(now).toMatchObject({ clientName: won.body.clientName, revision: 2 });
    // The loser saves again from the revision it was told: that one goes through.
    await owner.put(`/api/sites/${id}`, { ...fullSite, clientName: 'Saved by the loser', baseRevision: lost.body.revision }).expect(200);
  });

  it('when a PUT has no baseRevision, then 400 on baseRevision and nothing is saved', async () => {
    const {
      body: { id },
    } = await owner.post('/api/sites', fullSite).expect(201);
    for (const baseRevision of [undefined, 0, 1.5, '1']) {
      const res = await owner.put(`/api/sites/${id}`, { ...fullSite, clientName: 'Not saved', baseRevision }).expect(400);
      expect(res.body.error.fields.baseRevision, String(baseRevision)).toBe('baseRevision is required');
    }
    expect((await owner.get(`/api/sites/${id}`).expect(200)).body).toMatchObject({ clientName: fullSite.clientName, revision: 1 });
  });

  it('when the list is searched, then the query matches reference, client or address', async () => {
    const created = await owner.post('/api/sites', { reference: 'SRCH-77', clientName: 'Hepzibah Tallow', address: 'Quillet Lane' }).expect(201);
    for (const q of ['srch-77', 'tallow', 'quillet']) {
      expect(
        (await owner.get(`/api/sites?q=${q}`).expect(200)).body.items.map((s: any) => s.id),
        q,
      ).toEqual([created.body.id]);
    }
    expect((await stranger.get('/api/sites?q=tallow').expect(200)).body.items).toEqual([]);
  });

  it('when the input is bad, then 400 names each field', async () => {
    const res = await owner.post('/api/sites', { reference: '', clientEmail: 'not-an-email', clientPhone: 'x'.repeat(41), extra: 1 }).expect(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['(body)', 'clientEmail', 'clientPhone', 'reference']);
    await owner.put('/api/sites/abc', fullSite).expect(400);
  });

  it('when another organisation uses a site id, then 404 on read, replace and delete', async () => {
    const created = await owner.post('/api/sites', fullSite).expect(201);
    await stranger.get(`/api/sites/${created.body.id}`).expect(404);
    await stranger.put(`/api/sites/${created.body.id}`, { ...fullSite, baseRevision: 1 }).expect(404);
    await stranger.delete(`/api/sites/${created.body.id}`).expect(404);
    expect((await owner.get(`/api/sites/${created.body.id}`).expect(200)).body).toMatchObject({ reference: 'JOB-2291', revision: 1 });
  });

  it('when a viewer writes or a visitor is signed out, then 403 and 401', async () => {
    const created = await owner.post('/api/sites', fullSite).expect(201);
    await viewer.post('/api/sites', fullSite).expect(403);
    await viewer.put(`/api/sites/${created.body.id}`, { ...fullSite, baseRevision: 1 }).expect(403);
    await viewer.delete(`/api/sites/${created.body.id}`).expect(403);
    const anonymous = await client(t.app);
    await anonymous.get('/api/sites').expect(401);
    await anonymous.get(`/api/sites/${created.body.id}`).expect(401);
  });

  it('when a site still has boards, then it is kept (409); once they are deleted, it can go', async () => {
    const created = await owner.post('/api/sites', { reference: 'DEL-1' }).expect(201);
    const { id: boardId } = await createBoardWith(owner, makeSchedule(1), created.body.id);
    await owner.delete(`/api/sites/${created.body.id}`).expect(409);
    await owner.delete(`/api/boards/${boardId}`).expect(204);
    await owner.delete(`/api/sites/${created.body.id}`).expect(204);
    await owner.get(`/api/sites/${created.body.id}`).expect(404);
    await owner.post(`/api/boards/${boardId}/restore`).expect(204);
    expect((await owner.get(`/api/boards/${boardId}`).expect(200)).body.site).toBeNull();
  });
});
