import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { memberListSchema, memberSchema } from '../../shared/schemas/members.js';
import { client, signupOwner, startTestApp, TEST_PASSWORD, type TestApp } from '../helpers/app.js';
import { addMember } from '../helpers/accounts.js';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => {
  await t.close();
});

async function ownerId(owner: Awaited<ReturnType<typeof signupOwner>>): Promise<number> {
  return (await owner.get('/api/auth/me').expect(200)).body.user.id;
}

describe('the members list', () => {
  it('when any member asks, then they see everyone in their own organisation only, without password hashes', async () => {
    const owner = await signupOwner(t.app, 'List Ltd');
    const electrician = await addMember(t, owner, 'electrician', 'Ellis Polglase');
    const viewer = await addMember(t, owner, 'viewer', 'Vera Kitto');
    await signupOwner(t.app, 'Someone Else Ltd');
    for (const who of [owner, electrician, viewer]) {
      const res = await who.get('/api/members').expect(200);
      const { members } = memberListSchema.parse(res.body);
      expect(members.map((m) => m.email).sort()).toEqual([owner.email, electrician.email, viewer.email].sort());
      expect(JSON.stringify(res.body)).not.toMatch(/passwordHash|\$2[aby]\$/);
    }
    const { members } = memberListSchema.parse((await viewer.get('/api/members')).body);
    expect(members.find((m) => m.email === electrician.email)).toMatchObject({ name: 'Ellis Polglase', role: 'electrician', disabled: false });
  });

  it('when signed out, then 401', async () => {
    await (await client(t.app)).get('/api/members').expect(401);
  });
});

describe('changing a member', () => {
  it("when the owner changes a member's role, then it answers the updated member and the new role applies at once", async () => {
    const owner = await signupOwner(t.app);
    const viewer = await addMember(t, owner, 'viewer');
    const res = await owner.patch(`/api/members/${viewer.id}`, { role: 'electrician' }).expect(200);
    expect(memberSchema.parse(res.body)).toMatchObject({ id: viewer.id, role: 'electrician', disabled: false });
    expect((await viewer.get('/api/auth/me').expect(200)).body.user.role).toBe('electrician');
  });

  it('when the owner disables a member, then their open session answers 401 on its next request and they cannot sign in', async () => {
    const owner = await signupOwner(t.app);
    const electrician = await addMember(t, owner, 'electrician');
    await electrician.get('/api/members').expect(200);
    const res = await owner.patch(`/api/members/${electrician.id}`, { disabled: true }).expect(200);
    expect(res.body.disabled).toBe(true);
    await electrician.get('/api/auth/me').expect(401);
    await electrician.get('/api/members').expect(401);
    await (await client(t.app)).post('/api/auth/login', { email: electrician.email, password: TEST_PASSWORD }).expect(401);
  });

  it('when the owner enables a member again, then they can sign in again', async () => {
    const owner = await signupOwner(t.app);
    const viewer = await addMember(t, owner, 'viewer');
    await owner.patch(`/api/members/${viewer.id}`, { disabled: true }).expect(200);
    await owner.patch(`/api/members/${viewer.id}`, { disabled: false }).expect(200);
    await (await client(t.app)).post('/api/auth/login', { email: viewer.email, password: TEST_PASSWORD }).expect(200);
  });

  it('when the only owner demotes or disables themselves, then 409 with a clear message and nothing changes', async () => {
    const owner = await signupOwner(t.app);
    const id = await ownerId(owner);
    const demote = await owner.patch(`/api/members/${id}`, { role: 'electrician' }).expect(409);
    expect(demote.body.error.message).toMatch(/at least one active owner/);
    expect(demote.body.error.fields.role).toBeTruthy();
    const disable = await owner.patch(`/api/members/${id}`, { disabled: true }).expect(409);
    expect(disable.body.error.fields.disabled).toBeTruthy();
    expect((await owner.get('/api/auth/me').expect(200)).body.user.role).toBe('owner');
  });

  it('when there is a second active owner, then the first may step down, and the second becomes the protected one', async () => {
    const first = await signupOwner(t.app);
    const firstId = await ownerId(first);
    const second = await addMember(t, first, 'owner');
    await first.patch(`/api/members/${firstId}`, { role: 'viewer' }).expect(200);
    await second.patch(`/api/members/${second.id}`, { disabled: true }).expect(409);
    await second.patch(`/api/members/${second.id}`, { role: 'electrician' }).expect(409);
  });

  it('when the other owner is disabled, then they do not count and the last active owner is still protected', async () => {
    const first = await signupOwner(t.app);
    const firstId = await ownerId(first);
    const second = await addMember(t, first, 'owner');
    await first.patch(`/api/members/${second.id}`, { disabled: true }).expect(200);
    await first.patch(`/api/members/${firstId}`, { role: 'viewer' }).expect(409);
  });

  it('when two owners demote each other at the same moment, then one change wins and one owner remains', async () => {
    const first = await signupOwner(t.app);
    const firstId = await ownerId(first);
    const second = await addMember(t, first, 'owner');
    const answers = await Promise.all([
      first.patch(`/api/members/${second.id}`, { role: 'electrician' }),
      second.patch(`/api/members/${firstId}`, { role: 'electrician' }),
    ]);
    // The loser is refused either by the last-owner check (409) or, if it was already demoted
    // when its request arrived, by the role check (403).
    const [won, lost] = answers.map((r) => r.status).sort();
    expect(won).toBe(200);
    expect([403, 409]).toContain(lost);
    const { members } = memberListSchema.parse((await first.get('/api/members').expect(200)).body);
    expect(members.filter((m) => m.role === 'owner' && !m.disabled)).toHaveLength(1);
  });

  it("when an owner changes another organisation's member, then 404 and that member is unchanged", async () => {
    const ownerA = await signupOwner(t.app);
    const ownerB = await signupOwner(t.app);
    const viewerB = await addMember(t, ownerB, 'viewer');
    await ownerA.patch(`/api/members/${viewerB.id}`, { role: 'owner' }).expect(404);
    await ownerA.patch(`/api/members/${viewerB.id}`, { disabled: true }).expect(404);
    expect((await viewerB.get('/api/auth/me').expect(200)).body.user.role).toBe('viewer');
  });

  it('when an electrician or a viewer tries, then 403; when signed out, then 401', async () => {
    const owner = await signupOwner(t.app);
    const id = await ownerId(owner);
    const electrician = await addMember(t, owner, 'electrician');
    const viewer = await addMember(t, owner, 'viewer');
    await electrician.patch(`/api/members/${electrician.id}`, { role: 'owner' }).expect(403);
    await viewer.patch(`/api/members/${id}`, { disabled: true }).expect(403);
    await (await client(t.app)).patch(`/api/members/${viewer.id}`, { role: 'owner' }).expect(401);
    expect((await viewer.get('/api/auth/me').expect(200)).body.user.role).toBe('viewer');
  });

  it('when the change is bad, then 400 naming the fields', async () => {
    const owner = await signupOwner(t.app);
    const viewer = await addMember(t, owner, 'viewer');
    const bad = await owner.patch(`/api/members/${viewer.id}`, { role: 'boss', disabled: 'yes' }).expect(400);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(['disabled', 'role']);
    const extra = await owner.patch(`/api/members/${viewer.id}`, { role: 'viewer', email: 'x@example.test' }).expect(400);
    expect(extra.body.error.fields).toBeDefined();
    const empty = await owner.patch(`/api/members/${viewer.id}`, {}).expect(400);
    expect(empty.body.error.fields['(body)']).toMatch(/role|disabled/);
    const id = await owner.patch('/api/members/not-a-number', { role: 'viewer' }).expect(400);
    expect(id.body.error.fields.id).toBeTruthy();
  });
});
