/**
 * Members of each role for API tests, made through the real invitation flow (owner invites,
 * the link is read from the captured mail, the invitee accepts), and link reading for the
 * invitation and reset e-mails. Mail is decoded with mailparser, independently of the app.
 */
import type { Express } from 'express';
import request from 'supertest';
import type { Role } from '../../shared/schemas/auth.js';
import { client, linkToken, mailText, TEST_PASSWORD, uniqueEmail, type Client, type TestApp } from './app.js';

export { linkToken, mailText } from './app.js';

/** Invites an address as `owner` and returns the token from the e-mail it received. */
export async function inviteAndReadToken(t: TestApp, owner: Client, email: string, role: Role, count = 1): Promise<string> {
  await owner.post('/api/members/invitations', { email, role }).expect(201);
  const mail = await mailText(t.database, email, count);
  return linkToken(mail.text, t.ctx.config.publicBaseUrl, 'invite');
}

/** A signed-in member of the owner's organisation with the given role. */
export async function addMember(t: TestApp, owner: Client, role: Role, name = `Test ${role}`): Promise<Client & { email: string; id: number }> {
  const email = uniqueEmail(role);
  const token = await inviteAndReadToken(t, owner, email, role);
  const c = await client(t.app);
  const res = await c.post('/api/invitations/accept', { token, name, password: TEST_PASSWORD }).expect(201);
  return Object.assign(c, { email, id: res.body.id as number });
}

/** The cookie header a signed-in browser holds (session and CSRF cookies), to replay on another app instance. */
export async function sessionCookie(app: Express, email: string, password = TEST_PASSWORD): Promise<{ cookie: string; csrf: string }> {
  const pairs = (res: request.Response) => ([] as string[]).concat(res.headers['set-cookie'] ?? []).map((s) => s.split(';')[0]);
  const first = await request(app).get('/api/auth/csrf').expect(200);
  const csrfCookie = pairs(first);
  const res = await request(app)
    .post('/api/auth/login')
    .set('Cookie', csrfCookie.join('; '))
    .set('X-CSRF-Token', first.body.token)
    .send({ email, password })
    .expect(200);
  return { cookie: [...csrfCookie, ...pairs(res)].join('; '), csrf: first.body.token as string };
}
