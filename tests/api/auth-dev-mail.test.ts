import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { capturedMailListSchema, capturedMailMessageSchema } from '../../shared/schemas/dev-mail.js';
import { client, signupOwner, startTestApp, uniqueEmail, waitForMail, type TestApp } from '../helpers/app.js';
import { addMember } from '../helpers/accounts.js';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp({ devMail: true });
});
afterAll(async () => {
  await t.close();
});

describe('dev-only captured mail, when it is on', () => {
  it('when an owner lists mail to an address, then they see id, recipient, subject and time, newest first', async () => {
    const owner = await signupOwner(t.app, 'Mailbox Ltd');
    const email = uniqueEmail('invitee');
    await owner.post('/api/members/invitations', { email, role: 'viewer' }).expect(201);
    await owner.post('/api/members/invitations', { email, role: 'electrician' }).expect(201);
    const res = await owner.get(`/api/dev/mail?to=${encodeURIComponent(email)}`).expect(200);
    const { messages } = capturedMailListSchema.parse(res.body);
    expect(messages).toHaveLength(2);
    expect(messages[0].id).toBeGreaterThan(messages[1].id);
    expect(messages[0]).toMatchObject({ to: email, subject: 'Test Owner has invited you to Mailbox Ltd on Waymark' });
    expect(Object.keys(messages[0]).sort()).toEqual(['createdAt', 'id', 'subject', 'to']);
  });

  it('when an owner opens a message, then its text is decoded, link and non-ASCII characters intact', async () => {
    const owner = await signupOwner(t.app);
    const to = uniqueEmail('reader');
    // Non-ASCII text and a long line make nodemailer encode the body (quoted-printable or base64).
    const text = `Zs measured 1.12 Ω on way 3 — under the 1.37 Ω limit. ${'Long line of notes '.repeat(8)}\nhttp://waymark.test/invite/${'t'.repeat(43)}`;
    const organisationId = (await owner.get('/api/auth/me').expect(200)).body.organisation.id as number;
    await t.ctx.mailer.send({
      to,
      organisationId,
      subject: 'Café test ½',
      text,
      attachments: [{ filename: 'chart.pdf', content: Buffer.from('%PDF-1.7\n'), contentType: 'application/pdf' }],
    });
    const row = await waitForMail(t.database, to);
    const res = await owner.get(`/api/dev/mail/${row.id}`).expect(200);
    const message = capturedMailMessageSchema.parse(res.body);
    expect(message.subject).toBe('Café test ½');
    // The list's subject is decoded from the encoded header as well, not stored as =?UTF-8?…?= text.
    const list = capturedMailListSchema.parse((await owner.get(`/api/dev/mail?to=${encodeURIComponent(to)}`).expect(200)).body);
    expect(list.messages[0]!.subject).toBe('Café test ½');
    expect(message.text).toBe(text);
    expect(message.from).toContain('no-reply@waymark.test');
    expect(message.attachments).toEqual([{ filename: 'chart.pdf', contentType: 'application/pdf', size: 9 }]);
  });

  it('when an electrician or viewer asks, then 403; when signed out, then 401', async () => {
    const owner = await signupOwner(t.app);
    const row = await (async () => {
      const email = uniqueEmail('x');
      await owner.post('/api/members/invitations', { email, role: 'viewer' }).expect(201);
      return waitForMail(t.database, email);
    })();
    for (const role of ['electrician', 'viewer'] as const) {
      const member = await addMember(t, owner, role);
      await member.get('/api/dev/mail').expect(403);
      await member.get(`/api/dev/mail/${row.id}`).expect(403);
    }
    await (await client(t.app)).get('/api/dev/mail').expect(401);
    await (await client(t.app)).get(`/api/dev/mail/${row.id}`).expect(401);
  });

  it('when the id is unknown, then 404; when it or the query is malformed, then 400 naming it', async () => {
    const owner = await signupOwner(t.app);
    await owner.get('/api/dev/mail/2147483000').expect(404);
    const id = await owner.get('/api/dev/mail/abc').expect(400);
    expect(id.body.error.fields.id).toBeTruthy();
    const query = await owner.get('/api/dev/mail?to=a&to=b').expect(400);
    expect(query.body.error.fields.to).toBeTruthy();
    const unknown = await owner.get('/api/dev/mail?limit=5').expect(400);
    expect(unknown.body.error.fields).toBeDefined();
  });

  it('when the filter holds LIKE wildcards, then they match literally', async () => {
    const owner = await signupOwner(t.app);
    const res = await owner.get('/api/dev/mail?to=%25').expect(200);
    expect(res.body.messages).toEqual([]);
  });
});

describe('dev-only captured mail, when it is off', () => {
  let off: TestApp;
  beforeAll(async () => {
    off = await startTestApp({ devMail: false });
  });
  afterAll(async () => {
    await off.close();
  });

  it('when even an owner asks, then 404 as if the route did not exist; signed out too', async () => {
    const owner = await signupOwner(off.app);
    await owner.get('/api/dev/mail').expect(404);
    await owner.get('/api/dev/mail/1').expect(404);
    await (await client(off.app)).get('/api/dev/mail').expect(404);
  });
});
