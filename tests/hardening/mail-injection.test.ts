/**
 * Visitor and member text in outgoing mail: a report's name and contact, and names of people,
 * organisations and sites, cannot add lines of their own (such as a fake review link) to a message.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { simpleParser } from 'mailparser';
import type { ServerConfig } from '../../server/config.js';
import { client, startTestApp, uniqueEmail, waitForMail, TEST_PASSWORD, type TestApp } from '../helpers/app.js';
import { createBoard, signupMarkedOwner } from '../api/public-fixture.js';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp({ rateLimits: { reportsPerHour: 1000 } as ServerConfig['rateLimits'] });
});
afterAll(async () => {
  await t.close();
});

const FAKE = 'Review it in Waymark: http://evil.example/steal';

describe('text from visitors and members in outgoing mail', () => {
  it('when a report name carries a line break and a fake link, then it is refused with its field', async () => {
    const owner = await signupMarkedOwner(t.app);
    const board = await createBoard(owner, undefined, false);
    const visitor = await client(t.app);
    const res = await visitor
      .post(`/api/public/boards/${board.token}/reports`, {
        message: 'Way 3 feeds the shed',
        name: `Sam\r\n${FAKE}`,
        contact: `x\n${FAKE}`,
      })
      .expect(400);
    expect(Object.keys(res.body.error.fields)).toEqual(expect.arrayContaining(['name', 'contact']));
  });

  it('when a report message holds a fake link line, then the mail shows it quoted below the visitor label, never as a line of its own', async () => {
    const owner = await signupMarkedOwner(t.app);
    const board = await createBoard(owner, undefined, false);
    const visitor = await client(t.app);
    await visitor
      .post(`/api/public/boards/${board.token}/reports`, {
        message: `Please look\n${FAKE}`,
        name: FAKE,
        contact: '01632 960000',
      })
      .expect(202);
    const mail = await simpleParser((await waitForMail(t.database, owner.contactEmail)).raw);
    const lines = (mail.text ?? '').split('\n');
    const reviewLines = lines.filter((l) => l.startsWith('Review it in Waymark:'));
    expect(reviewLines).toHaveLength(1);
    expect(reviewLines[0]).not.toContain('evil.example');
    expect(lines).toContain(`> ${FAKE}`);
    expect(lines).toContain('Name (as the visitor wrote it):');
  });

  it('when a sign-up name or organisation has a control character, then 400 names the field', async () => {
    const c = await client(t.app);
    const res = await c
      .post('/api/auth/signup', {
        organisation: 'Ampere\nRow',
        name: 'Jo\u0007',
        email: uniqueEmail('ctl'),
        password: TEST_PASSWORD,
      })
      .expect(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['name', 'organisation']);
  });
});
