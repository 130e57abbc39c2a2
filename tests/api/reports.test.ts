import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { simpleParser } from 'mailparser';
import { reports } from '../../server/db/schema.js';
import type { ServerConfig } from '../../server/config.js';
import { reportListSchema } from '../../shared/schemas/reports.js';
import { client, mailText, mailTo, startTestApp, waitForMail, type TestApp } from '../helpers/app.js';
import { addMember } from '../helpers/accounts.js';
import { createBoard, signupMarkedOwner } from './public-fixture.js';
import { demoSites } from '../../server/seed/demo-data.js';

/** A demo board's schedule, as stored by the seed. */
const demoBoard = (key: string) => demoSites.flatMap((s) => s.boards).find((b) => b.key === key)!.schedule;

let t: TestApp;
// This file sends many reports from one address; the limits themselves are tested at the end.
beforeAll(async () => {
  t = await startTestApp({ rateLimits: { reportsPerHour: 1000 } as ServerConfig['rateLimits'] });
});
afterAll(async () => {
  await t.close();
});

const storedReports = (boardId: number) => t.database.db.select().from(reports).where(eq(reports.boardId, boardId));

describe('discrepancy reports from the board page', () => {
  it('when a visitor reports a discrepancy, then it is stored, e-mailed to the contact address and listed for members', async () => {
    const owner = await signupMarkedOwner(t.app);
    const board = await createBoard(owner, undefined, false);
    const visitor = await client(t.app);
    const res = await visitor
      .post(`/api/public/boards/${board.token}/reports`, {
        message: 'This also feeds the shed lights',
        way: 3,
        name: 'Ffion Marsh',
        contact: '01632 960777',
        website: '',
      })
      .expect(202);
    expect(res.body).toEqual({ received: true });

    const raw = await waitForMail(t.database, owner.contactEmail);
    const mail = await simpleParser(raw.raw);
    expect(mail.subject).toContain('Hallway consumer unit');
    expect(mail.text).toContain('This also feeds the shed lights');
    expect(mail.text).toContain('Way: 3');
    expect(mail.text).toContain('Name (as the visitor wrote it):\n> Ffion Marsh');
    expect(mail.text).toContain('Contact (as the visitor wrote it):\n> 01632 960777');
    expect(mail.text).toContain(`http://waymark.test/boards/${board.id}/page`);

    const list = reportListSchema.parse((await owner.get(`/api/boards/${board.id}/reports`).expect(200)).body);
    expect(list.items).toHaveLength(1);
    expect(list.items[0]).toMatchObject({
      message: 'Way 3: This also feeds the shed lights',
      reporterName: 'Ffion Marsh',
      reporterContact: '01632 960777',
      status: 'open',
    });
    expect((await owner.get(`/api/boards/${board.id}/sharing`).expect(200)).body.openReports).toBe(1);

    // A visitor who already began with the way is not repeated.
    await visitor.post(`/api/public/boards/${board.token}/reports`, { message: 'way 3 has no label', way: 3 }).expect(202);
    const after = reportListSchema.parse((await owner.get(`/api/boards/${board.id}/reports`).expect(200)).body);
    expect(after.items[0].message).toBe('way 3 has no label');
  });

  it('when the organisation has no contact address, then the report goes to its owners', async () => {
    const owner = await signupMarkedOwner(t.app, false);
    const board = await createBoard(owner, undefined, false);
    await (await client(t.app)).post(`/api/public/boards/${board.token}/reports`, { message: 'Way 1 label has worn off' }).expect(202);
    const mail = await simpleParser((await mailText(t.database, owner.email, 2)).row.raw); // after the sign-up link
    expect(mail.text).toContain('Way 1 label has worn off');
    expect(mail.text).toContain('They left no name or contact details.');
  });

  it('when the honeypot field is filled, then 202 and nothing is stored or sent', async () => {
    const owner = await signupMarkedOwner(t.app);
    const board = await createBoard(owner, undefined, false);
    const res = await (
      await client(t.app)
    )
      .post(`/api/public/boards/${board.token}/reports`, { message: 'Buy cheap watches', website: 'http://spam.example' })
      .expect(202);
    expect(res.body).toEqual({ received: true });
    // A real report afterwards proves mail is flowing, so the absence of the first one is meaningful.
    await (await client(t.app)).post(`/api/public/boards/${board.token}/reports`, { message: 'Real report' }).expect(202);
    await waitForMail(t.database, owner.contactEmail);
    const messages = await mailTo(t.database, owner.contactEmail);
    expect(messages).toHaveLength(1);
    expect(messages[0].raw).not.toContain('cheap watches');
    expect((await storedReports(board.id)).map((r) => r.message)).toEqual(['Real report']);
  });

  it('when the report is empty, too long, names a way the board lacks or has unknown fields, then 400 with the field and nothing stored', async () => {
    const owner = await signupMarkedOwner(t.app);
    const board = await createBoard(owner, undefined, false);
    const visitor = await client(t.app);
    const path = `/api/public/boards/${board.token}/reports`;
    expect((await visitor.post(path, { message: '   ' }).expect(400)).body.error.fields.message).toBeTruthy();
    expect((await visitor.post(path, { message: 'x'.repeat(1001) }).expect(400)).body.error.fields.message).toMatch(/1000/);
    expect((await visitor.post(path, { message: 'ok', way: 42 }).expect(400)).body.error.fields.way).toMatch(/No way 42/);
    expect((await visitor.post(path, { message: 'ok', way: 'three' }).expect(400)).body.error.fields.way).toBeTruthy();
    expect((await visitor.post(path, { message: 'ok', boardId: 1 }).expect(400)).body.error.fields).toBeDefined();
    expect(await storedReports(board.id)).toEqual([]);
  });

  it('when a visitor names one phase of a way on a three-phase board, then it is accepted, stored and mailed as "4 L2"; a phase the way lacks is 400', async () => {
    const owner = await signupMarkedOwner(t.app);
    const board = await createBoard(owner, demoBoard('workshop'), false);
    const visitor = await client(t.app);
    const path = `/api/public/boards/${board.token}/reports`;
    // The workshop's way 4 is three single-phase RCBOs, 4 L1 to 4 L3 (our demo data).
    await visitor.post(path, { message: 'Bench sockets are now on the other wall', way: 4, phase: 'L2' }).expect(202);
    const mail = await simpleParser((await waitForMail(t.database, owner.contactEmail)).raw);
    expect(mail.text).toContain('Way: 4 L2');
    expect((await storedReports(board.id)).map((r) => r.message)).toEqual(['Way 4 L2: Bench sockets are now on the other wall']);
    // A visitor who began with the way and phase is not repeated; a way without a phase is still fine.
    await visitor.post(path, { message: 'Way 4 L3 label is faded', way: 4, phase: 'L3' }).expect(202);
    await visitor.post(path, { message: 'Not sure which phase', way: 4 }).expect(202);
    expect((await storedReports(board.id)).map((r) => r.message).sort()).toEqual([
      'Way 4 L2: Bench sockets are now on the other wall',
      'Way 4 L3 label is faded',
      'Way 4: Not sure which phase',
    ]);
    // Way 3 is a three-phase circuit (no single phase of it is a way), so "3 L2" is no way of this board.
    expect((await visitor.post(path, { message: 'ok', way: 3, phase: 'L2' }).expect(400)).body.error.fields.phase).toMatch(/No way 3 L2/);
    expect((await visitor.post(path, { message: 'ok', way: 4, phase: 'L4' }).expect(400)).body.error.fields.phase).toBeTruthy();
    expect((await visitor.post(path, { message: 'ok', phase: 'L1' }).expect(400)).body.error.fields.phase).toMatch(/way number/);
    expect(await storedReports(board.id)).toHaveLength(3);
  });

  it('when the write carries no CSRF token, then 403; when the page is off, then 404', async () => {
    const owner = await signupMarkedOwner(t.app);
    const board = await createBoard(owner, undefined, false);
    const visitor = await client(t.app);
    await visitor.agent.post(`/api/public/boards/${board.token}/reports`).send({ message: 'hello' }).expect(403);
    await owner.patch(`/api/boards/${board.id}/public`, { enabled: false }).expect(200);
    await visitor.post(`/api/public/boards/${board.token}/reports`, { message: 'hello' }).expect(404);
    expect(await storedReports(board.id)).toEqual([]);
  });

  it('when an electrician accepts and dismisses reports, then each is marked with who and when; a viewer may read but not resolve', async () => {
    const owner = await signupMarkedOwner(t.app);
    const board = await createBoard(owner, undefined, false);
    for (const message of ['first', 'second']) await (await client(t.app)).post(`/api/public/boards/${board.token}/reports`, { message }).expect(202);
    const electrician = await addMember(t, owner, 'electrician', 'Rhodri Vance');
    const viewer = await addMember(t, owner, 'viewer');
    const items = reportListSchema.parse((await viewer.get(`/api/boards/${board.id}/reports`).expect(200)).body).items;
    const [second, first] = items;
    expect([first.message, second.message]).toEqual(['first', 'second']);
    await viewer.patch(`/api/boards/${board.id}/reports/${first.id}`, { status: 'accepted' }).expect(403);
    const accepted = await electrician.patch(`/api/boards/${board.id}/reports/${first.id}`, { status: 'accepted' }).expect(200);
    expect(accepted.body).toMatchObject({ status: 'accepted', resolvedByName: 'Rhodri Vance' });
    expect(accepted.body.resolvedAt).toBeTruthy();
    await electrician.patch(`/api/boards/${board.id}/reports/${second.id}`, { status: 'dismissed' }).expect(200);
    const after = (await owner.get(`/api/boards/${board.id}/reports`).expect(200)).body.items.map((r: { status: string }) => r.status).sort();
    expect(after).toEqual(['accepted', 'dismissed']);
    expect((await electrician.patch(`/api/boards/${board.id}/reports/${first.id}`, { status: 'open' }).expect(400)).body.error.fields.status).toBeTruthy();
  });

  it('when reports are open, then the boards list, the site and the board say how many; each names its way for the editor; accepting one counts it off', async () => {
    const owner = await signupMarkedOwner(t.app);
    const board = await createBoard(owner); // on a site
    const quiet = await createBoard(owner, undefined, false);
    const visitor = await client(t.app);
    await visitor.post(`/api/public/boards/${board.token}/reports`, { message: 'Labelled kitchen, feeds the utility', way: 2 }).expect(202);
    await visitor.post(`/api/public/boards/${board.token}/reports`, { message: 'The porch light is on no way I can find' }).expect(202);
    const listed = (await owner.get('/api/boards').expect(200)).body.items as Array<{ id: number; openReports: number; siteId: number }>;
    expect(listed.find((b) => b.id === board.id)?.openReports).toBe(2);
    expect(listed.find((b) => b.id === quiet.id)?.openReports).toBe(0);
    expect((await owner.get(`/api/boards/${board.id}`).expect(200)).body.openReports).toBe(2);
    const siteId = listed.find((b) => b.id === board.id)!.siteId;
    const site = (await owner.get(`/api/sites/${siteId}`).expect(200)).body as { boards: Array<{ id: number; openReports: number }> };
    expect(site.boards.find((b) => b.id === board.id)?.openReports).toBe(2);

    const items = reportListSchema.parse((await owner.get(`/api/boards/${board.id}/reports`).expect(200)).body).items;
    expect(items.map((r) => r.way).sort()).toEqual(['2', null].sort());
    await owner.patch(`/api/boards/${board.id}/reports/${items.find((r) => r.way === '2')!.id}`, { status: 'accepted' }).expect(200);
    expect((await owner.get(`/api/boards/${board.id}`).expect(200)).body.openReports).toBe(1);
  });

  it('when a visitor names a spare way (the board page lists spares), then the report is taken and names that way', async () => {
    const owner = await signupMarkedOwner(t.app);
    const board = await createBoard(owner, demoBoard('workshop'), false); // 5 L3 is the workshop's spare way (our demo data)
    await (
      await client(t.app)
    )
      .post(`/api/public/boards/${board.token}/reports`, { message: 'This one is not spare: it feeds the compressor', way: 5, phase: 'L3' })
      .expect(202);
    const items = reportListSchema.parse((await owner.get(`/api/boards/${board.id}/reports`).expect(200)).body).items;
    expect(items[0]).toMatchObject({ way: '5 L3', message: 'Way 5 L3: This one is not spare: it feeds the compressor' });
  });

  it('when another organisation asks for the reports or resolves one, then 404; signed out 401', async () => {
    const owner = await signupMarkedOwner(t.app);
    const board = await createBoard(owner, undefined, false);
    await (await client(t.app)).post(`/api/public/boards/${board.token}/reports`, { message: 'theirs' }).expect(202);
    const [report] = await storedReports(board.id);
    const other = await signupMarkedOwner(t.app);
    const otherBoard = await createBoard(other, undefined, false);
    await other.get(`/api/boards/${board.id}/reports`).expect(404);
    await other.patch(`/api/boards/${board.id}/reports/${report.id}`, { status: 'dismissed' }).expect(404);
    // Their own board id with our report id: still not found.
    await other.patch(`/api/boards/${otherBoard.id}/reports/${report.id}`, { status: 'dismissed' }).expect(404);
    await (await client(t.app)).get(`/api/boards/${board.id}/reports`).expect(401);
    expect((await storedReports(board.id))[0].status).toBe('open');
  });
});

describe('report rate limits', () => {
  it('when one address sends more reports than the hourly limit, then 429; and a board takes at most three times that from many addresses', async () => {
    const limited = await startTestApp({ trustProxy: 1, rateLimits: { reportsPerHour: 2 } as ServerConfig['rateLimits'] });
    try {
      const owner = await signupMarkedOwner(limited.app);
      const board = await createBoard(owner, undefined, false);
      const visitor = await client(limited.app);
      const send = (ip: string) => visitor.post(`/api/public/boards/${board.token}/reports`, { message: `from ${ip}` }).set('X-Forwarded-For', ip);
      await send('203.0.113.1').expect(202);
      await send('203.0.113.1').expect(202);
      const res = await send('203.0.113.1').expect(429);
      expect(Number(res.headers['retry-after'])).toBeGreaterThan(0);
      for (const ip of ['203.0.113.2', '203.0.113.2', '203.0.113.3', '203.0.113.3']) await send(ip).expect(202);
      // Six reports on this board in the hour (2 × 3): a fresh address is refused too.
      await send('203.0.113.9').expect(429);
      const stored = await limited.database.db.select().from(reports).where(eq(reports.boardId, board.id));
      expect(stored).toHaveLength(6);
    } finally {
      await limited.close();
    }
  });
});
