import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { publicBoardSchema } from '../../shared/schemas/public-board.js';
import { GENERAL_CAUTIONS, THREE_PHASE_CAUTION } from '../../shared/public/cautions.js';
import { demoSites } from '../../server/seed/demo-data.js';
import type { ServerConfig } from '../../server/config.js';
import { putAtCurrentRevision, startTestApp, type TestApp } from '../helpers/app.js';
import { createBoard, markedSite, PRIVATE_MARK, signupMarkedOwner } from './public-fixture.js';
import { BOARD_PAGE_CACHE_CONTROL } from '../../server/public/caching.js';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => {
  await t.close();
});

/** Every key anywhere in a JSON value. */
function keysOf(value: unknown, out = new Set<string>()): Set<string> {
  if (Array.isArray(value)) value.forEach((v) => keysOf(v, out));
  else if (value && typeof value === 'object')
    for (const [k, v] of Object.entries(value)) {
      out.add(k);
      keysOf(v, out);
    }
  return out;
}

describe('the public board page data', () => {
  it('when a board with every private field filled is read by token, then no private value appears anywhere in the JSON', async () => {
    const owner = await signupMarkedOwner(t.app);
    const board = await createBoard(owner);
    // The markers are really stored: members see them.
    const stored = JSON.stringify((await owner.get(`/api/boards/${board.id}/schedule`).expect(200)).body).toLowerCase();
    expect(stored.split(PRIVATE_MARK).length - 1).toBeGreaterThanOrEqual(10);
    const res = await request(t.app).get(`/api/public/boards/${board.token}`).expect(200);
    const text = JSON.stringify(res.body).toLowerCase();
    expect(text).not.toContain(PRIVATE_MARK);
    for (const value of Object.values(markedSite)) expect(text).not.toContain(value.toLowerCase());
    expect(text).not.toContain(owner.email.toLowerCase());
    const keys = keysOf(res.body);
    for (const internal of [
      'id',
      'deviceId',
      'boardId',
      'organisationId',
      'siteId',
      'feedsBoardId',
      'protectedBy',
      'privateNotes',
      'previousReference',
      'code',
      'publicToken',
    ]) {
      expect(keys.has(internal), `key ${internal}`).toBe(false);
    }
    expect(res.headers['cache-control']).toBe(BOARD_PAGE_CACHE_CONTROL);
    expect(res.headers['set-cookie']).toBeUndefined();
  });

  it('when read, then it carries the board, the contractor contact, the ways with device and RCD, and what each RCD protects', async () => {
    const owner = await signupMarkedOwner(t.app);
    const board = await createBoard(owner);
    const page = publicBoardSchema.parse((await request(t.app).get(`/api/public/boards/${board.token}`).expect(200)).body);
    expect(page.board).toEqual({ name: 'Hallway consumer unit', location: 'Under the stairs', phases: 1 });
    expect(page.contractor).toEqual({ name: 'Lanternfield Electrical', phone: '01632 960123', email: owner.contactEmail, hasLogo: false });
    expect(page.ways.map((w) => [w.wayText, w.label, w.device])).toEqual([
      ['1', 'Kitchen sockets', 'MCB B32'],
      ['2', 'Lights downstairs', 'MCB B6'],
      ['3', 'Garage sockets', 'MCB B16'],
      ['4', 'Garden studio', 'RCBO B40 30 mA'],
    ]);
    expect(page.ways[2].locations).toEqual(['Garage']);
    expect(page.ways.map((w) => w.rcd)).toEqual([
      { kind: 'rcd', name: 'RCD 1', residualMa: 30 },
      { kind: 'rcd', name: 'RCD 1', residualMa: 30 },
      { kind: 'rcd', name: 'RCD 2', residualMa: 30 },
      { kind: 'rcbo', residualMa: 30 },
    ]);
    expect(page.rcdGroups.map((g) => [g.name, g.device, g.ways.map((w) => w.wayText)])).toEqual([
      ['RCD 1', 'RCD 63 A 30 mA', ['1', '2']],
      ['RCD 2', 'RCD 63 A 30 mA', ['3']],
    ]);
    // Only the circuit note marked public is shown.
    expect(page.ways.map((w) => w.notes)).toEqual(['', 'Junction box in the loft above the landing', '', '']);
    expect(page.publicNotes).toBe('Spare fuses are in the drawer by the back door.');
    expect(page.supply).toMatchObject({ earthing: 'TN-C-S', nominalVoltage: 230, ze: 0.28, mainSwitchRating: 100 });
    expect(page.revision.number).toBe(board.revision);
    expect(page.revision.date).toMatch(/^\d{4}-\d{2}-\d{2}$/);
    expect(page.inspection.lastOn).toBe('2024-03-11');
    // IET Guidance Note 3: domestic installations, 10 years (found in secondary sources; see docs/sources.md).
    expect(page.inspection.nextOn).toBe('2034-03-11');
    for (const caution of GENERAL_CAUTIONS) expect(page.cautions).toContain(caution);
  });

  it('when a three-phase board is read, then it carries the 400 V caution, 400/230 V and its past recommended inspection date', async () => {
    const owner = await signupMarkedOwner(t.app);
    const workshop = demoSites[1].boards[0].schedule;
    const board = await createBoard(owner, workshop, false);
    const page = publicBoardSchema.parse((await request(t.app).get(`/api/public/boards/${board.token}`).expect(200)).body);
    expect(page.board.phases).toBe(3);
    // BS 7671 514.10.1 (found): a warning where more than 230 V to earth would not normally be expected.
    expect(page.cautions).toContain(THREE_PHASE_CAUTION);
    // IEC 60038 nominal 230/400 V (from memory).
    expect(page.supply).toMatchObject({ nominalVoltage: 230, betweenPhasesVoltage: 400, voltageText: '400/230 V (three-phase, 230 V to earth)' });
    // IET Guidance Note 3 (found in secondary sources; see docs/sources.md): industrial, 3 years from 8 November 2022. "Overdue" is the browser's call.
    expect(page.inspection).toEqual({ lastOn: '2022-11-08', nextOn: '2025-11-08' });
    // 5 L3 is the workshop's spare way: a spare way is listed like any other.
    expect(page.ways.map((w) => w.wayText)).toEqual(['1', '2', '3', '4 L1', '4 L2', '4 L3', '5 L1', '5 L2', '5 L3']);
  });

  it('when the board is switched from one phase to three, then the next read shows the 400 V caution (the projection is rebuilt)', async () => {
    const owner = await signupMarkedOwner(t.app);
    const board = await createBoard(owner, undefined, false);
    const before = (await request(t.app).get(`/api/public/boards/${board.token}`).expect(200)).body;
    expect(before.cautions).not.toContain(THREE_PHASE_CAUTION);
    const { id: _i, revision, updatedAt: _u, code: _c, siteId: _s, ...schedule } = (await owner.get(`/api/boards/${board.id}/schedule`).expect(200)).body;
    await owner.put(`/api/boards/${board.id}/schedule`, { ...schedule, board: { ...schedule.board, phases: 3 }, baseRevision: revision }).expect(200);
    const after = (await request(t.app).get(`/api/public/boards/${board.token}`).expect(200)).body;
    expect(after.cautions).toContain(THREE_PHASE_CAUTION);
    expect(after.supply.voltageText).toBe('400/230 V (three-phase, 230 V to earth)');
  });

  it("when a way is a sub-main linked to another board, then the page flags it without naming the other board's id", async () => {
    const owner = await signupMarkedOwner(t.app);
    const studio = await createBoard(owner, demoSites[0].boards[1].schedule, false);
    const main = demoSites[0].boards[0].schedule;
    const linked = { ...main, circuits: main.circuits.map((c) => (c.kind === 'sub-main' ? { ...c, feedsBoardId: studio.id } : c)) };
    const board = await createBoard(owner, linked, false);
    const body = (await request(t.app).get(`/api/public/boards/${board.token}`).expect(200)).body;
    const page = publicBoardSchema.parse(body);
    expect(page.ways.filter((w) => w.feedsAnotherBoard).map((w) => [w.wayText, w.label])).toEqual([['8', 'Garden studio']]);
    expect(keysOf(body).has('feedsBoardId')).toBe(false);
  });

  it('when the schedule or the contractor contact changes after the page was read, then the next read shows the change', async () => {
    const owner = await signupMarkedOwner(t.app);
    const board = await createBoard(owner);
    await request(t.app).get(`/api/public/boards/${board.token}`).expect(200);
    const current = (await owner.get(`/api/boards/${board.id}/schedule`).expect(200)).body;
    const { id: _i, revision, updatedAt: _u, code: _c, siteId: _s, ...schedule } = current;
    schedule.circuits[0].label = 'Renamed way';
    await owner.put(`/api/boards/${board.id}/schedule`, { ...schedule, baseRevision: revision }).expect(200);
    await putAtCurrentRevision(owner, '/api/organisation', { name: 'Lanternfield Electrical', contactPhone: '01632 960999', contactEmail: owner.contactEmail });
    const after = (await request(t.app).get(`/api/public/boards/${board.token}`).expect(200)).body;
    expect(JSON.stringify(after.ways)).toContain('Renamed way');
    expect(JSON.stringify(after)).toContain('01632 960999');
  });

  it('when the token is rotated, then the old one answers 404 and the new one the page', async () => {
    const owner = await signupMarkedOwner(t.app);
    const board = await createBoard(owner, undefined, false);
    await request(t.app).get(`/api/public/boards/${board.token}`).expect(200);
    await owner.post(`/api/boards/${board.id}/token/rotate`).expect(200);
    const old = await request(t.app).get(`/api/public/boards/${board.token}`).expect(404);
    expect(old.body).toEqual({ error: { code: 'not_found', message: 'Not found' } });
    const fresh = (await owner.get(`/api/boards/${board.id}`).expect(200)).body.publicToken as string;
    expect(fresh).not.toBe(board.token);
    await request(t.app).get(`/api/public/boards/${fresh}`).expect(200);
  });

  it('when the page is switched off, then 404 until it is switched on again', async () => {
    const owner = await signupMarkedOwner(t.app);
    const board = await createBoard(owner, undefined, false);
    await owner.patch(`/api/boards/${board.id}/public`, { enabled: false }).expect(200);
    const off = await request(t.app).get(`/api/public/boards/${board.token}`).expect(404);
    expect(off.body).toEqual({ error: { code: 'not_found', message: 'Not found' } });
    await owner.patch(`/api/boards/${board.id}/public`, { enabled: true }).expect(200);
    await request(t.app).get(`/api/public/boards/${board.token}`).expect(200);
  });

  it('when a board is created, imported or duplicated, then its page is off (404) until someone switches it on', async () => {
    const owner = await signupMarkedOwner(t.app);
    const created = (await owner.post('/api/boards', { name: 'Garage board', template: 'split-load-10' }).expect(201)).body.id as number;
    const copy = (await owner.post(`/api/boards/${created}/duplicate`).expect(201)).body.id as number;
    for (const id of [created, copy]) {
      const summary = (await owner.get(`/api/boards/${id}`).expect(200)).body;
      expect(summary.publicEnabled).toBe(false);
      await request(t.app).get(`/api/public/boards/${summary.publicToken}`).expect(404);
    }
    await owner.patch(`/api/boards/${created}/public`, { enabled: true }).expect(200);
    const token = (await owner.get(`/api/boards/${created}`).expect(200)).body.publicToken as string;
    await request(t.app).get(`/api/public/boards/${token}`).expect(200);
  });

  it('when the board is deleted, then its page answers 404', async () => {
    const owner = await signupMarkedOwner(t.app);
    const board = await createBoard(owner, undefined, false);
    await owner.delete(`/api/boards/${board.id}`).expect(204);
    await request(t.app).get(`/api/public/boards/${board.token}`).expect(404);
  });

  it('when the token is unknown or not even token-shaped, then the same plain 404', async () => {
    for (const token of ['A'.repeat(32), 'short', '..%2F..%2Fetc', "x' OR 1=1 --"]) {
      const res = await request(t.app)
        .get(`/api/public/boards/${encodeURIComponent(token)}`)
        .expect(404);
      expect(res.body).toEqual({ error: { code: 'not_found', message: 'Not found' } });
    }
  });

  it('when members read the sharing state, then they get the page link and its state; another organisation gets 404', async () => {
    const owner = await signupMarkedOwner(t.app);
    const board = await createBoard(owner, undefined, false);
    const res = await owner.get(`/api/boards/${board.id}/sharing`).expect(200);
    expect(res.body).toMatchObject({ boardId: board.id, publicEnabled: true, publicUrl: `http://waymark.test/b/${board.token}`, openReports: 0 });
    const other = await signupMarkedOwner(t.app);
    await other.get(`/api/boards/${board.id}/sharing`).expect(404);
    await request(t.app).get(`/api/boards/${board.id}/sharing`).expect(401);
  });
});

describe('public rate limit', () => {
  it('when one address asks more often than the per-minute limit, then 429 with Retry-After', async () => {
    const limited = await startTestApp({ rateLimits: { publicPerMinute: 3 } as ServerConfig['rateLimits'] });
    try {
      const owner = await signupMarkedOwner(limited.app);
      const board = await createBoard(owner, undefined, false);
      for (let i = 0; i < 3; i++) await request(limited.app).get(`/api/public/boards/${board.token}`).expect(200);
      const res = await request(limited.app).get(`/api/public/boards/${board.token}`).expect(429);
      expect(Number(res.headers['retry-after'])).toBeGreaterThan(0);
      expect(res.body.error.code).toBe('rate_limited');
      // Unknown tokens count too, so guessing is limited as well.
      await request(limited.app)
        .get(`/api/public/boards/${'B'.repeat(32)}`)
        .expect(429);
    } finally {
      await limited.close();
    }
  });
});
