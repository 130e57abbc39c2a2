import { afterAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { signupOwner, startTestApp, type TestApp } from '../helpers/app.js';
import { addMember, sessionCookie } from '../helpers/accounts.js';

const started: TestApp[] = [];
async function app(): Promise<TestApp> {
  const t = await startTestApp();
  started.push(t);
  return t;
}
afterAll(async () => {
  await Promise.all(started.map((t) => t.close().catch(() => {})));
});

describe('sessions live in MariaDB', () => {
  it('when the app restarts, then a cookie from before the restart is still signed in', async () => {
    const first = await app();
    const owner = await signupOwner(first.app, 'Restart Ltd');
    const { cookie } = await sessionCookie(first.app, owner.email);
    await request(first.app).get('/api/auth/me').set('Cookie', cookie).expect(200);
    await first.close();
    started.splice(started.indexOf(first), 1);

    const second = await app();
    const me = await request(second.app).get('/api/auth/me').set('Cookie', cookie).expect(200);
    expect(me.body.user.email).toBe(owner.email);
    expect(me.body.organisation.name).toBe('Restart Ltd');
  });

  it('when two app instances share the database, then a session from A works on B, writes included', async () => {
    const a = await app();
    const b = await app();
    const owner = await signupOwner(a.app, 'Two Instances Ltd');
    const { cookie, csrf } = await sessionCookie(a.app, owner.email);
    await request(b.app).get('/api/auth/me').set('Cookie', cookie).expect(200);
    const saved = await request(b.app)
      .put('/api/organisation')
      .set('Cookie', cookie)
      .set('X-CSRF-Token', csrf)
      .send({ name: 'Renamed On B Ltd', contactPhone: '', contactEmail: '', baseRevision: 1 })
      .expect(200); // a new organisation is at revision 1
    expect(saved.body.name).toBe('Renamed On B Ltd');
    const me = await request(a.app).get('/api/auth/me').set('Cookie', cookie).expect(200);
    expect(me.body.organisation.name).toBe('Renamed On B Ltd');
  });

  it('when a member is signed out on A, then the same cookie is signed out on B too', async () => {
    const a = await app();
    const b = await app();
    const owner = await signupOwner(a.app);
    const { cookie, csrf } = await sessionCookie(a.app, owner.email);
    await request(a.app).post('/api/auth/logout').set('Cookie', cookie).set('X-CSRF-Token', csrf).expect(204);
    await request(b.app).get('/api/auth/me').set('Cookie', cookie).expect(401);
  });

  it("when an owner disables a member on A, then the member's session on B answers 401 on its next request", async () => {
    const a = await app();
    const b = await app();
    const owner = await signupOwner(a.app);
    const viewer = await addMember(a, owner, 'viewer');
    const { cookie } = await sessionCookie(b.app, viewer.email);
    await request(b.app).get('/api/members').set('Cookie', cookie).expect(200);
    await owner.patch(`/api/members/${viewer.id}`, { disabled: true }).expect(200);
    await request(b.app).get('/api/members').set('Cookie', cookie).expect(401);
    await request(b.app).get('/api/auth/me').set('Cookie', cookie).expect(401);
  });

  it('when a cookie is forged or unknown, then 401', async () => {
    const a = await app();
    await request(a.app).get('/api/auth/me').set('Cookie', 'waymark.sid=s%3Anot-a-session.forgedsignature').expect(401);
  });
});
