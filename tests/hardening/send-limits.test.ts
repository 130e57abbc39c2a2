/** Mail sent on someone's behalf is limited per address and per organisation. */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { ServerConfig } from '../../server/config.js';
import { signupOwner, startTestApp, uniqueEmail, type TestApp } from '../helpers/app.js';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp({ rateLimits: { sendsPerHour: 3 } as ServerConfig['rateLimits'] });
});
afterAll(async () => {
  await t.close();
});

describe('limits on mail sent for a member', () => {
  it('when an owner sends more invitations an hour than the limit, then the next is 429 with Retry-After and no mail is sent', async () => {
    const owner = await signupOwner(t.app);
    for (let i = 0; i < 3; i++) await owner.post('/api/members/invitations', { email: uniqueEmail('inv'), role: 'viewer' }).expect(201);
    const over = await owner.post('/api/members/invitations', { email: uniqueEmail('inv'), role: 'viewer' }).expect(429);
    expect(over.headers['retry-after']).toBeDefined();
    expect(over.body.error.message).toMatch(/invitations/);
  });
});
