import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { simpleParser } from 'mailparser';
import { client, linkToken, mailText, mailTo, signupOwner, startTestApp, TEST_PASSWORD, uniqueEmail, type TestApp } from '../helpers/app.js';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => {
  await t.close();
});

describe('sign up, sign in, me, sign out', () => {
  it('when a new contractor signs up, then they are signed in as the owner of a new organisation', async () => {
    const owner = await signupOwner(t.app, 'Signup Test Ltd');
    const me = await owner.get('/api/auth/me').expect(200);
    expect(me.body.user.role).toBe('owner');
    expect(me.body.user.email).toBe(owner.email);
    expect(me.body.organisation.name).toBe('Signup Test Ltd');
  });

  it('when signing in with the right password, then me answers; after sign-out it is 401', async () => {
    const owner = await signupOwner(t.app);
    const c = await client(t.app);
    await c.post('/api/auth/login', { email: owner.email, password: TEST_PASSWORD }).expect(200);
    await c.get('/api/auth/me').expect(200);
    await c.post('/api/auth/logout').expect(204);
    await c.get('/api/auth/me').expect(401);
  });

  it('when the password is wrong, then 401 with no hint which part was wrong', async () => {
    const owner = await signupOwner(t.app);
    const c = await client(t.app);
    const res = await c.post('/api/auth/login', { email: owner.email, password: 'wrong-password-123' }).expect(401);
    expect(res.body.error.message).toMatch(/e-mail or password/i);
  });

  it('when a write has no CSRF token, then 403', async () => {
    const res = await (
      await client(t.app)
    ).agent
      .post('/api/auth/signup')
      .send({ organisation: 'x', name: 'x', email: uniqueEmail(), password: TEST_PASSWORD });
    expect(res.status).toBe(403);
  });

  it('when sign-up input is bad, then 400 names each field', async () => {
    const c = await client(t.app);
    const res = await c.post('/api/auth/signup', { organisation: '', name: 'A', email: 'not-an-email', password: 'short' }).expect(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['email', 'organisation', 'password']);
  });

  it('when an unknown field is sent, then 400 rather than silently ignoring it', async () => {
    const c = await client(t.app);
    const res = await c.post('/api/auth/signup', { organisation: 'A', name: 'A', email: uniqueEmail(), password: TEST_PASSWORD, role: 'owner' }).expect(400);
    expect(res.body.error.fields).toBeDefined();
  });

  it('when the body is not JSON, then 400 not 500', async () => {
    const c = await client(t.app);
    const res = await c.agent.post('/api/auth/login').set('X-CSRF-Token', c.csrf).set('Content-Type', 'application/json').send('{"email":');
    expect(res.status).toBe(400);
  });

  it("when the e-mail is already registered, then the answer is the same as for a new address and the address's owner is told by mail", async () => {
    const owner = await signupOwner(t.app);
    const c = await client(t.app);
    const fresh = uniqueEmail('fresh');
    const taken = await c.post('/api/auth/signup', { organisation: 'B', name: 'B', email: owner.email, password: TEST_PASSWORD }).expect(202);
    const free = await c.post('/api/auth/signup', { organisation: 'B', name: 'B', email: fresh, password: TEST_PASSWORD }).expect(202);
    expect(Object.keys(taken.body)).toEqual(Object.keys(free.body));
    expect(taken.headers['set-cookie']).toBeUndefined();
    // The stranger is not signed in either way; the owner's mail says what happened and links no new account.
    await c.get('/api/auth/me').expect(401);
    const notice = await mailText(t.database, owner.email, 2);
    expect(notice.subject).toMatch(/already has a Waymark account/);
    expect(notice.text).not.toMatch(/\/signup\//);
    const link = await mailText(t.database, fresh);
    expect(link.text).toMatch(/\/signup\/[A-Za-z0-9_-]{43}/);
  });

  it('when a sign-up link is used twice, made up, or its address registered meanwhile, then 400 on the token and no second account', async () => {
    const c = await client(t.app);
    const email = uniqueEmail('twice');
    await c.post('/api/auth/signup', { organisation: 'Twice Ltd', name: 'Tam', email, password: TEST_PASSWORD }).expect(202);
    await c.post('/api/auth/signup', { organisation: 'Twice Again Ltd', name: 'Tam', email, password: TEST_PASSWORD }).expect(202);
    await mailText(t.database, email, 2);
    // The two links are mailed in the background, so either may arrive first: use whichever came last.
    const [newest, older] = await mailTo(t.database, email);
    const second = linkToken((await simpleParser(newest!.raw)).text ?? '', t.ctx.config.publicBaseUrl, 'signup');
    const first = linkToken((await simpleParser(older!.raw)).text ?? '', t.ctx.config.publicBaseUrl, 'signup');
    await c.post('/api/auth/signup/confirm', { token: second }).expect(201);
    expect(['Twice Ltd', 'Twice Again Ltd']).toContain((await c.get('/api/auth/me').expect(200)).body.organisation.name);
    const again = await (await client(t.app)).post('/api/auth/signup/confirm', { token: second }).expect(400);
    expect(again.body.error.fields.token).toBeTruthy();
    // The other link's address is registered now: it opens nothing.
    await (await client(t.app)).post('/api/auth/signup/confirm', { token: first }).expect(400);
    await (await client(t.app)).post('/api/auth/signup/confirm', { token: 'x'.repeat(43) }).expect(400);
  });
});
