import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { organisationSchema } from '../../shared/schemas/organisation.js';
import { client, signupOwner, startTestApp, type TestApp } from '../helpers/app.js';
import { addMember } from '../helpers/accounts.js';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => {
  await t.close();
});

const settings = {
  name: 'Kernow Circuits Ltd',
  contactPhone: '01632 960 777',
  contactEmail: 'Office@Kernow-Circuits.example',
  printOffsetXMm: 1.5,
  printOffsetYMm: -0.75,
};

describe('organisation settings', () => {
  it('when a new organisation is read, then it has its name, empty contacts and zero print offsets', async () => {
    const owner = await signupOwner(t.app, 'Fresh Start Ltd');
    const res = await owner.get('/api/organisation').expect(200);
    expect(organisationSchema.parse(res.body)).toMatchObject({
      name: 'Fresh Start Ltd',
      contactPhone: '',
      contactEmail: '',
      printOffsetXMm: 0,
      printOffsetYMm: 0,
      revision: 1,
    });
  });

  it('when the owner saves settings, then every member reads them and me shows the new name', async () => {
    const owner = await signupOwner(t.app);
    const viewer = await addMember(t, owner, 'viewer');
    const saved = await owner.put('/api/organisation', { ...settings, baseRevision: 1 }).expect(200);
    expect(saved.body).toMatchObject({ ...settings, contactEmail: 'office@kernow-circuits.example', revision: 2 });
    const read = await viewer.get('/api/organisation').expect(200);
    expect(read.body).toEqual(saved.body);
    expect((await viewer.get('/api/auth/me').expect(200)).body.organisation.name).toBe('Kernow Circuits Ltd');
  });

  it('when the print offsets are left out, then they keep their values; an empty contact e-mail is allowed', async () => {
    const owner = await signupOwner(t.app);
    await owner.put('/api/organisation', { ...settings, baseRevision: 1 }).expect(200);
    const res = await owner.put('/api/organisation', { name: 'Renamed Ltd', contactPhone: '', contactEmail: '', baseRevision: 2 }).expect(200);
    expect(res.body).toMatchObject({ name: 'Renamed Ltd', contactEmail: '', printOffsetXMm: 1.5, printOffsetYMm: -0.75, revision: 3 });
  });

  it("when one organisation saves, then another organisation's settings and revision are untouched", async () => {
    const ownerA = await signupOwner(t.app, 'Alpha Ltd');
    const ownerB = await signupOwner(t.app, 'Beta Ltd');
    await ownerA.put('/api/organisation', { ...settings, baseRevision: 1 }).expect(200);
    expect((await ownerB.get('/api/organisation').expect(200)).body).toMatchObject({ name: 'Beta Ltd', contactPhone: '', revision: 1 });
    // The organisation is always the session's own: B's save at its own revision 1 is not stale because A moved on.
    await ownerB.put('/api/organisation', { name: 'Beta Two Ltd', contactPhone: '', contactEmail: '', baseRevision: 1 }).expect(200);
    expect((await ownerA.get('/api/organisation').expect(200)).body).toMatchObject({ name: settings.name, revision: 2 });
  });

  it('when two saves are made from the same revision, then one wins and the other is 409 stale with the current revision', async () => {
    const owner = await signupOwner(t.app, 'Racing Ltd');
    const [a, b] = await Promise.all(
      ['Saved By A Ltd', 'Saved By B Ltd'].map((name) =>
        owner.put('/api/organisation', { name, contactPhone: '', contactEmail: '', printOffsetXMm: name.includes('A') ? 1 : 2, baseRevision: 1 }),
      ),
    );
    expect([a.status, b.status].sort()).toEqual([200, 409]);
    const [won, lost] = a.status === 200 ? [a, b] : [b, a];
    expect(lost.body).toMatchObject({ error: { code: 'stale', fields: { baseRevision: expect.any(String) } }, revision: 2 });
    expect(lost.body.error.message).toMatch(/since you opened it/);
    const now = (await owner.get('/api/organisation').expect(200)).body;
    expect(now).toEqual(won.body);
    expect(now).toMatchObject({ name: won.body.name, printOffsetXMm: won.body.printOffsetXMm, revision: 2 });
    expect((await owner.get('/api/auth/me').expect(200)).body.organisation.name).toBe(won.body.name);
  });

  it('when a save has no baseRevision, then 400 on baseRevision and nothing is saved', async () => {
    const owner = await signupOwner(t.app, 'Unrevised Ltd');
    for (const baseRevision of [undefined, 0, -1, 2.5, 'latest']) {
      const res = await owner.put('/api/organisation', { ...settings, baseRevision }).expect(400);
      expect(res.body.error.fields.baseRevision, String(baseRevision)).toBe('baseRevision is required');
    }
    expect((await owner.get('/api/organisation').expect(200)).body).toMatchObject({ name: 'Unrevised Ltd', printOffsetXMm: 0, revision: 1 });
  });

  it('when the settings are bad, then 400 naming each field and nothing is saved', async () => {
    const owner = await signupOwner(t.app, 'Unchanged Ltd');
    const res = await owner
      .put('/api/organisation', {
        name: '',
        contactPhone: 'x'.repeat(41),
        contactEmail: 'not-mail',
        printOffsetXMm: 11,
        printOffsetYMm: '2',
        baseRevision: 1,
      })
      .expect(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['contactEmail', 'contactPhone', 'name', 'printOffsetXMm', 'printOffsetYMm']);
    const extra = await owner.put('/api/organisation', { ...settings, id: 99, baseRevision: 1 }).expect(400);
    expect(extra.body.error.fields).toBeDefined();
    expect((await owner.get('/api/organisation').expect(200)).body.name).toBe('Unchanged Ltd');
  });

  it('when an electrician or viewer saves, then 403; when signed out, read and save are 401', async () => {
    const owner = await signupOwner(t.app, 'Guarded Ltd');
    for (const role of ['electrician', 'viewer'] as const) {
      const member = await addMember(t, owner, role);
      await member.get('/api/organisation').expect(200);
      await member.put('/api/organisation', { ...settings, baseRevision: 1 }).expect(403);
    }
    const anonymous = await client(t.app);
    await anonymous.get('/api/organisation').expect(401);
    await anonymous.put('/api/organisation', settings).expect(401);
    expect((await owner.get('/api/organisation').expect(200)).body).toMatchObject({ name: 'Guarded Ltd', revision: 1 });
  });
});
