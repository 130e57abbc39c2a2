import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import request from 'supertest';
import { invitations, users } from '../../server/db/schema.js';
import { hashToken } from '../../server/auth/passwords.js';
import { client, signupOwner, startTestApp, TEST_PASSWORD, uniqueEmail, type TestApp } from '../helpers/app.js';
import { addMember, inviteAndReadToken, linkToken, mailText } from '../helpers/accounts.js';
import { isoDay, shortDate } from '../../shared/rules/dates.js';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => {
  await t.close();
});

const DAY_MS = 24 * 3600 * 1000;

describe('inviting a member', () => {
  it('when the owner invites an address, then it gets an e-mail with a one-time link valid 7 days, stored only as a hash', async () => {
    const owner = await signupOwner(t.app, 'Invite Mail Ltd');
    const email = uniqueEmail('invitee');
    const before = Date.now();
    const res = await owner.post('/api/members/invitations', { email: email.toUpperCase(), role: 'electrician' }).expect(201);
    expect(res.body).toMatchObject({ email, role: 'electrician', invitedBy: 'Test Owner' });

    const mail = await mailText(t.database, email);
    expect(mail.subject).toContain('Invite Mail Ltd');
    expect(mail.text).toContain('electrician');
    const token = linkToken(mail.text, 'http://waymark.test', 'invite');
    expect(token.length).toBeGreaterThanOrEqual(43); // 32 random bytes in base64url

    const [row] = await t.database.db.select().from(invitations).where(eq(invitations.id, res.body.id));
    expect(row.tokenHash).toBe(hashToken(token));
    expect(row.tokenHash).not.toContain(token);
    const lifetime = row.expiresAt.getTime() - before;
    expect(lifetime).toBeGreaterThan(7 * DAY_MS - 60_000); // link valid 7 days
    expect(lifetime).toBeLessThanOrEqual(7 * DAY_MS + 60_000);
    // The mail says when the link lapses, as "10 Dec 2026, 13:04 UTC" (the day only here: the stored time may be rounded to the second).
    expect(mail.text).toContain(`${shortDate(isoDay(row.expiresAt))}, `);
  });

  it('when the invitee opens the link, then it shows the address, role and organisation and nothing more', async () => {
    const owner = await signupOwner(t.app, 'Link Info Ltd');
    const email = uniqueEmail('invitee');
    const token = await inviteAndReadToken(t, owner, email, 'viewer');
    const res = await request(t.app).get(`/api/invitations/${token}`).expect(200);
    expect(Object.keys(res.body).sort()).toEqual(['email', 'expiresAt', 'organisation', 'role']);
    expect(res.body).toMatchObject({ email, role: 'viewer', organisation: { name: 'Link Info Ltd' } });
  });

  it('when the invitee accepts, then they are signed in as a member of that organisation with that role', async () => {
    const owner = await signupOwner(t.app, 'Accept Ltd');
    const email = uniqueEmail('invitee');
    const token = await inviteAndReadToken(t, owner, email, 'electrician');
    const invitee = await client(t.app);
    await invitee.post('/api/invitations/accept', { token, name: 'Nia Trevelyan', password: TEST_PASSWORD }).expect(201);
    const me = await invitee.get('/api/auth/me').expect(200);
    expect(me.body.user).toMatchObject({ email, name: 'Nia Trevelyan', role: 'electrician' });
    expect(me.body.organisation.name).toBe('Accept Ltd');

    const fresh = await client(t.app);
    await fresh.post('/api/auth/login', { email, password: TEST_PASSWORD }).expect(200);
    const [user] = await t.database.db.select().from(users).where(eq(users.email, email));
    expect(Number(user.passwordHash.split('$')[2])).toBeGreaterThanOrEqual(10); // issue 2: bcrypt cost at least 10
  });

  it('when a link is used a second time, then it is refused and no second account appears', async () => {
    const owner = await signupOwner(t.app);
    const email = uniqueEmail('invitee');
    const token = await inviteAndReadToken(t, owner, email, 'viewer');
    await (await client(t.app)).post('/api/invitations/accept', { token, name: 'First', password: TEST_PASSWORD }).expect(201);
    const again = await (await client(t.app)).post('/api/invitations/accept', { token, name: 'Second', password: TEST_PASSWORD }).expect(400);
    expect(again.body.error.fields.token).toBeTruthy();
    await request(t.app).get(`/api/invitations/${token}`).expect(404);
    expect(await t.database.db.select().from(users).where(eq(users.email, email))).toHaveLength(1);
  });

  it('when two people accept the same link at once, then exactly one account is made', async () => {
    const owner = await signupOwner(t.app);
    const email = uniqueEmail('invitee');
    const token = await inviteAndReadToken(t, owner, email, 'viewer');
    const [a, b] = [await client(t.app), await client(t.app)];
    const answers = await Promise.all([
      a.post('/api/invitations/accept', { token, name: 'A', password: TEST_PASSWORD }),
      b.post('/api/invitations/accept', { token, name: 'B', password: TEST_PASSWORD }),
    ]);
    expect(answers.map((r) => r.status).sort()).toEqual([201, 400]);
    expect(await t.database.db.select().from(users).where(eq(users.email, email))).toHaveLength(1);
  });

  it('when a link has expired, then opening and accepting it are both refused', async () => {
    const owner = await signupOwner(t.app);
    const email = uniqueEmail('invitee');
    const token = await inviteAndReadToken(t, owner, email, 'viewer');
    await t.database.db
      .update(invitations)
      .set({ expiresAt: new Date(Date.now() - 1000) })
      .where(eq(invitations.tokenHash, hashToken(token)));
    await request(t.app).get(`/api/invitations/${token}`).expect(404);
    await (await client(t.app)).post('/api/invitations/accept', { token, name: 'Late', password: TEST_PASSWORD }).expect(400);
    expect(await t.database.db.select().from(users).where(eq(users.email, email))).toHaveLength(0);
  });

  it('when a link is unknown, then 404; when it is not even token-shaped, then 400 naming the token', async () => {
    await request(t.app)
      .get(`/api/invitations/${'x'.repeat(43)}`)
      .expect(404);
    const res = await request(t.app).get('/api/invitations/short').expect(400);
    expect(res.body.error.fields.token).toBeTruthy();
  });

  it('when the same address is invited twice, then only the newest link works', async () => {
    const owner = await signupOwner(t.app);
    const email = uniqueEmail('invitee');
    const first = await inviteAndReadToken(t, owner, email, 'viewer', 1);
    const second = await inviteAndReadToken(t, owner, email, 'electrician', 2);
    expect(second).not.toBe(first);
    await request(t.app).get(`/api/invitations/${first}`).expect(404);
    const info = await request(t.app).get(`/api/invitations/${second}`).expect(200);
    expect(info.body.role).toBe('electrician');
    const list = await owner.get('/api/members/invitations').expect(200);
    expect(list.body.invitations).toHaveLength(1);
  });

  it('when the address has an account in another organisation, then the answer is as for a new address, and its owner is mailed a note, not a link', async () => {
    const owner = await signupOwner(t.app);
    const other = await signupOwner(t.app);
    const taken = await owner.post('/api/members/invitations', { email: other.email, role: 'viewer' }).expect(201);
    const free = await owner.post('/api/members/invitations', { email: uniqueEmail('free'), role: 'viewer' }).expect(201);
    expect(Object.keys(taken.body).sort()).toEqual(Object.keys(free.body).sort());
    expect((await owner.get('/api/members/invitations').expect(200)).body.invitations).toHaveLength(2);
    const notice = await mailText(t.database, other.email, 2);
    expect(notice.text).toMatch(/already has an account/);
    expect(notice.text).not.toMatch(/\/invite\//);
  });

  it('when the address is already a member of the same organisation, then 409: the owner can see the members list anyway', async () => {
    const owner = await signupOwner(t.app);
    const res = await owner.post('/api/members/invitations', { email: owner.email, role: 'viewer' }).expect(409);
    expect(res.body.error.fields.email).toBeTruthy();
    expect(await t.database.db.select().from(invitations).where(eq(invitations.email, owner.email))).toHaveLength(0);
  });

  it('when the invite body is bad, then 400 names each field', async () => {
    const owner = await signupOwner(t.app);
    const res = await owner.post('/api/members/invitations', { email: 'nope', role: 'apprentice' }).expect(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['email', 'role']);
    const extra = await owner.post('/api/members/invitations', { email: uniqueEmail(), role: 'viewer', organisationId: 1 }).expect(400);
    expect(extra.body.error.fields).toBeDefined();
  });

  it('when the accept body is bad, then 400 names each field', async () => {
    const c = await client(t.app);
    const res = await c.post('/api/invitations/accept', { token: 'short', name: '', password: 'short' }).expect(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['name', 'password', 'token']);
  });
});

describe('pending invitations', () => {
  it('when the owner lists them, then pending ones show and accepted ones do not', async () => {
    const owner = await signupOwner(t.app);
    const pendingEmail = uniqueEmail('pending');
    await owner.post('/api/members/invitations', { email: pendingEmail, role: 'viewer' }).expect(201);
    await addMember(t, owner, 'electrician');
    const res = await owner.get('/api/members/invitations').expect(200);
    expect(res.body.invitations.map((i: { email: string }) => i.email)).toEqual([pendingEmail]);
    expect(res.body.invitations[0]).toMatchObject({ role: 'viewer', invitedBy: 'Test Owner' });
  });

  it('when the owner revokes one, then its link stops working and it leaves the list', async () => {
    const owner = await signupOwner(t.app);
    const email = uniqueEmail('revoked');
    const token = await inviteAndReadToken(t, owner, email, 'viewer');
    const [{ id }] = (await owner.get('/api/members/invitations').expect(200)).body.invitations;
    await owner.delete(`/api/members/invitations/${id}`).expect(204);
    await request(t.app).get(`/api/invitations/${token}`).expect(404);
    expect((await owner.get('/api/members/invitations').expect(200)).body.invitations).toEqual([]);
    await owner.delete(`/api/members/invitations/${id}`).expect(404);
  });

  it("when an owner revokes another organisation's invitation, then 404 and it still works", async () => {
    const ownerA = await signupOwner(t.app);
    const ownerB = await signupOwner(t.app);
    const email = uniqueEmail('b-invitee');
    const token = await inviteAndReadToken(t, ownerB, email, 'viewer');
    const [{ id }] = (await ownerB.get('/api/members/invitations').expect(200)).body.invitations;
    await ownerA.delete(`/api/members/invitations/${id}`).expect(404);
    expect((await ownerA.get('/api/members/invitations').expect(200)).body.invitations).toEqual([]);
    await request(t.app).get(`/api/invitations/${token}`).expect(200);
  });

  it('when the invitation id is not a number, then 400 naming it', async () => {
    const owner = await signupOwner(t.app);
    const res = await owner.delete('/api/members/invitations/abc').expect(400);
    expect(res.body.error.fields.id).toBeTruthy();
  });
});

describe('who may manage invitations', () => {
  it('when an electrician or a viewer tries, then 403; when signed out, then 401', async () => {
    const owner = await signupOwner(t.app);
    const { id } = (await owner.post('/api/members/invitations', { email: uniqueEmail(), role: 'viewer' }).expect(201)).body;
    for (const role of ['electrician', 'viewer'] as const) {
      const member = await addMember(t, owner, role);
      await member.get('/api/members/invitations').expect(403);
      await member.post('/api/members/invitations', { email: uniqueEmail(), role: 'viewer' }).expect(403);
      await member.delete(`/api/members/invitations/${id}`).expect(403);
    }
    const anonymous = await client(t.app);
    await anonymous.get('/api/members/invitations').expect(401);
    await anonymous.post('/api/members/invitations', { email: uniqueEmail(), role: 'viewer' }).expect(401);
    await anonymous.delete(`/api/members/invitations/${id}`).expect(401);
    const left = (await owner.get('/api/members/invitations').expect(200)).body.invitations;
    expect(left.map((i: { id: number }) => i.id)).toEqual([id]);
  });

  it('when accepting without the CSRF header, then 403', async () => {
    const owner = await signupOwner(t.app);
    const token = await inviteAndReadToken(t, owner, uniqueEmail(), 'viewer');
    const c = await client(t.app);
    await c.agent.post('/api/invitations/accept').send({ token, name: 'X', password: TEST_PASSWORD }).expect(403);
  });
});

describe('when the mail relay is down', () => {
  let down: TestApp;
  // Port 1 on loopback: nothing listens there, so every connection is refused.
  beforeAll(async () => {
    down = await startTestApp({ smtp: { host: '127.0.0.1', port: 1, from: 'Waymark <no-reply@waymark.test>' } });
  });
  afterAll(async () => {
    await down.close();
  });

  it('when an invitation cannot be mailed, then 503 with a plain message and no invitation is left behind', async () => {
    const owner = await signupOwner(down.app);
    const res = await owner.post('/api/members/invitations', { email: uniqueEmail('unreachable'), role: 'viewer' }).expect(503);
    expect(res.body.error.message).toMatch(/could not be sent/);
    expect((await owner.get('/api/members/invitations').expect(200)).body.invitations).toEqual([]);
  });

  it('when a reset mail cannot be sent, then the answer is still 204', async () => {
    const owner = await signupOwner(down.app);
    await (await client(down.app)).post('/api/auth/forgot', { email: owner.email }).expect(204);
  });
});
