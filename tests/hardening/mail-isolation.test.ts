/**
 * The captured-mail page shows an owner only their own organisation's mail. Replays the take-over:
 * a stranger signs up, asks for a password reset of another organisation's owner, and tries to read
 * the reset link from the captured mail.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { checkProductionMail, configFromEnv, demoWanted } from '../../server/config.js';
import { client, mailText, signupOwner, startTestApp, uniqueEmail, waitForMail, type TestApp } from '../helpers/app.js';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp({ devMail: true });
});
afterAll(async () => {
  await t.close();
});

describe('captured mail between organisations', () => {
  it("when a stranger asks for a reset of another organisation's owner, then the stranger never sees that mail, its owner does", async () => {
    const victim = await signupOwner(t.app, 'Victim Electrical (test)');
    const stranger = await signupOwner(t.app, 'Stranger Electrical (test)');
    await (await client(t.app)).post('/api/auth/forgot', { email: victim.email }).expect(204);
    const reset = (await mailText(t.database, victim.email, 2)).row; // the sign-up link came first

    const listed = await stranger.get('/api/dev/mail').expect(200);
    expect(listed.body.messages.map((m: { id: number }) => m.id)).not.toContain(reset.id);
    const filtered = await stranger.get(`/api/dev/mail?to=${encodeURIComponent(victim.email)}`).expect(200);
    expect(filtered.body.messages).toEqual([]);
    // Walk every id up to the newest: none of another organisation's messages opens.
    for (let id = Math.max(1, reset.id - 20); id <= reset.id; id++) {
      const res = await stranger.get(`/api/dev/mail/${id}`);
      if (res.status === 200) expect(res.body.to).not.toContain(victim.email);
      else expect(res.status).toBe(404);
    }
    await stranger.get(`/api/dev/mail/${reset.id}`).expect(404);

    const own = await victim.get('/api/dev/mail').expect(200);
    expect(own.body.messages.map((m: { id: number }) => m.id)).toContain(reset.id);
    const opened = await victim.get(`/api/dev/mail/${reset.id}`).expect(200);
    expect(opened.body.text).toContain('/reset/');
  });

  it('when an owner invites someone, then only the inviting organisation sees the invitation', async () => {
    const a = await signupOwner(t.app, 'Inviting Electrical (test)');
    const b = await signupOwner(t.app, 'Other Electrical (test)');
    const invitee = uniqueEmail('invitee');
    await a.post('/api/members/invitations', { email: invitee, role: 'viewer' }).expect(201);
    const mail = await waitForMail(t.database, invitee);
    await b.get(`/api/dev/mail/${mail.id}`).expect(404);
    await a.get(`/api/dev/mail/${mail.id}`).expect(200);
  });
});

describe('production mode', () => {
  const base = { DATABASE_URL: 'mysql://x@127.0.0.1/x', SESSION_SECRET: 's' };
  it('when NODE_ENV is production without a mail relay, then the app refuses to start and says why', () => {
    expect(() => checkProductionMail({ NODE_ENV: 'production' })).toThrow(/SMTP_HOST/);
    expect(() => configFromEnv({ ...base, NODE_ENV: 'production' })).toThrow(/SMTP_HOST/);
  });

  it('when NODE_ENV is production with a relay, then captured mail is off even if asked for', () => {
    const config = configFromEnv({ ...base, NODE_ENV: 'production', SMTP_HOST: 'relay.example', WAYMARK_DEV_MAIL: 'on' }, { devMail: true });
    expect(config.devMail).toBe(false);
  });

  it('when NODE_ENV is production, then the demo is off unless WAYMARK_DEMO=on', () => {
    expect(demoWanted({ NODE_ENV: 'production' })).toBe(false);
    expect(demoWanted({ NODE_ENV: 'production', WAYMARK_DEMO: 'on' })).toBe(true);
    expect(demoWanted({})).toBe(true);
    expect(demoWanted({ WAYMARK_DEMO: 'off' })).toBe(false);
  });
});
