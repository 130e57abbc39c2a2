import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Client, TestApp } from '../helpers/app.js';
import { createBoardWith, makeSchedule, startWithCast } from '../helpers/boards.js';
import { scheduleResponseSchema } from '../../shared/schemas/schedule.js';
import { diffResponseSchema, revisionListResponseSchema, revisionSnapshotSchema, staleResponseSchema } from '../../shared/schemas/boards.js';

let t: TestApp, owner: Client, viewer: Client, stranger: Client;
beforeAll(async () => ({ t, owner, viewer, stranger } = await startWithCast('Schedule Test Ltd', 'Elsewhere Electrical')));
afterAll(async () => {
  await t.close();
});

const withoutMeta = ({ board, devices, circuits }: any) => ({ board, devices, circuits });

describe('reading and saving a schedule', () => {
  it('when what GET answered is sent back to PUT as it is, then it saves, and its read-only members are ignored', async () => {
    const { id } = await createBoardWith(owner, makeSchedule(3));
    const read = (await owner.get(`/api/boards/${id}/schedule`).expect(200)).body;
    read.circuits[0].label = 'Kitchen sockets';
    const res = await owner.put(`/api/boards/${id}/schedule`, { ...read, baseRevision: read.revision, code: 'WM-FORGED', siteId: 999999, id: 1 }).expect(200);
    expect(res.body.revision).toBe(read.revision + 1);
    const after = (await owner.get(`/api/boards/${id}/schedule`).expect(200)).body;
    expect(after.circuits[0].label).toBe('Kitchen sockets');
    expect([after.id, after.code, after.siteId]).toEqual([id, read.code, read.siteId]);
  });

  it('when a schedule is saved, then it reads back identically with the next revision and a summary', async () => {
    const schedule = makeSchedule(6);
    const { id, revision } = await createBoardWith(owner, schedule);
    expect(revision).toBe(2);
    const read = scheduleResponseSchema.parse((await owner.get(`/api/boards/${id}/schedule`).expect(200)).body);
    expect(withoutMeta(read)).toEqual(schedule);
    expect(read.revision).toBe(2);
    expect(read.code).toMatch(/^WM-/);

    const changed = structuredClone(schedule);
    changed.circuits[2].label = 'Garage sockets';
    const res = await owner.put(`/api/boards/${id}/schedule`, { ...changed, baseRevision: 2 }).expect(200);
    expect(res.body).toMatchObject({ revision: 3, changed: true });
    expect(res.body.summary.length).toBeGreaterThan(0);
    const summary = (await owner.get(`/api/boards/${id}`).expect(200)).body;
    expect(summary.revision).toBe(3);
  });

  it('when a save changes nothing, then no revision is made', async () => {
    const schedule = makeSchedule(3);
    const { id } = await createBoardWith(owner, schedule);
    const res = await owner.put(`/api/boards/${id}/schedule`, { ...schedule, baseRevision: 2 }).expect(200);
    expect(res.body).toMatchObject({ revision: 2, changed: false });
    const history = revisionListResponseSchema.parse((await owner.get(`/api/boards/${id}/revisions`).expect(200)).body);
    expect(history.items.map((r) => r.number)).toEqual([2, 1]);
  });

  it('when the board name changes in the schedule, then the list shows the new name', async () => {
    const schedule = makeSchedule(1, 'Old name');
    const { id } = await createBoardWith(owner, schedule);
    schedule.board.name = 'Renamed consumer unit';
    await owner.put(`/api/boards/${id}/schedule`, { ...schedule, baseRevision: 2 }).expect(200);
    const items = (await owner.get('/api/boards?q=renamed').expect(200)).body.items;
    expect(items.map((b: any) => b.name)).toEqual(['Renamed consumer unit']);
  });

  it('when the save is based on an old revision, then 409 stale with the current revision, and nothing changes', async () => {
    const schedule = makeSchedule(2);
    const { id } = await createBoardWith(owner, schedule);
    const newer = structuredClone(schedule);
    newer.circuits[0].label = 'First save wins';
    await owner.put(`/api/boards/${id}/schedule`, { ...newer, baseRevision: 2 }).expect(200);
    const late = structuredClone(schedule);
    late.circuits[0].label = 'Second save loses';
    const res = await owner.put(`/api/boards/${id}/schedule`, { ...late, baseRevision: 2 }).expect(409);
    const body = staleResponseSchema.parse(res.body);
    expect(body.revision).toBe(3);
    expect(body.error.code).toBe('stale');
    const read = (await owner.get(`/api/boards/${id}/schedule`).expect(200)).body;
    expect(read.circuits[0].label).toBe('First save wins');
  });

  it('when 20 saves race from the same base revision, then exactly one wins, nineteen get 409, and the history has no gaps', async () => {
    const schedule = makeSchedule(5);
    const { id } = await createBoardWith(owner, schedule);
    const results = await Promise.all(
      Array.from({ length: 20 }, (_, i) => {
        const edit = structuredClone(schedule);
        edit.circuits[0].label = `Racing edit ${i + 1}`;
        return owner.put(`/api/boards/${id}/schedule`, { ...edit, baseRevision: 2 });
      }),
    );
    const statuses = results.map((r) => r.status);
    expect(statuses.filter((s) => s === 200)).toHaveLength(1);
    expect(statuses.filter((s) => s === 409)).toHaveLength(19);
    for (const r of results.filter((x) => x.status === 409)) expect(r.body.revision).toBe(3);
    const winner = results.find((r) => r.status === 200)!;
    const history = (await owner.get(`/api/boards/${id}/revisions`).expect(200)).body.items.map((r: any) => r.number);
    expect(history).toEqual([3, 2, 1]);
    const read = (await owner.get(`/api/boards/${id}/schedule`).expect(200)).body;
    expect(winner.body.revision).toBe(read.revision);
    const snapshot = (await owner.get(`/api/boards/${id}/revisions/3`).expect(200)).body;
    expect(snapshot.schedule.circuits[0].label).toBe(read.circuits[0].label);
  });

  it('when the schedule is bad, then 400 lists each field path and nothing is saved', async () => {
    const schedule = makeSchedule(5);
    const { id } = await createBoardWith(owner, schedule);
    const bad: any = structuredClone(schedule);
    bad.circuits[3].label = 'x'.repeat(25); // SHORT_LABEL_MAX is 24
    bad.board.phases = 2;
    bad.devices[1].modules = 1.3;
    bad.colour = 'red';
    const res = await owner.put(`/api/boards/${id}/schedule`, bad).expect(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['(body)', 'baseRevision', 'board.phases', 'circuits.3.label', 'devices.1.modules']);
    expect((await owner.get(`/api/boards/${id}`).expect(200)).body.revision).toBe(2);
    await owner.put(`/api/boards/${id}/schedule`, 'not an object').set('Content-Type', 'application/json').expect(400);
  });

  it("when a sub-main feeds another organisation's board or itself, then 400 on that circuit's feedsBoardId; its own board is fine", async () => {
    const sub = await createBoardWith(owner, makeSchedule(2, 'Garden studio board'));
    const theirs = await createBoardWith(stranger, makeSchedule(1));
    const main = makeSchedule(3);
    const { id } = await createBoardWith(owner, main);
    main.circuits[2].kind = 'sub-main';
    main.circuits[2].feedsBoardId = theirs.id;
    const res = await owner.put(`/api/boards/${id}/schedule`, { ...main, baseRevision: 2 }).expect(400);
    expect(Object.keys(res.body.error.fields)).toEqual(['circuits.2.feedsBoardId']);
    main.circuits[2].feedsBoardId = id;
    expect((await owner.put(`/api/boards/${id}/schedule`, { ...main, baseRevision: 2 }).expect(400)).body.error.fields['circuits.2.feedsBoardId']).toMatch(
      /itself/,
    );
    main.circuits[2].feedsBoardId = sub.id;
    await owner.put(`/api/boards/${id}/schedule`, { ...main, baseRevision: 2 }).expect(200);
  });

  it('when a circuit names a device that does not exist, then the save succeeds and the check reports it', async () => {
    const schedule = makeSchedule(2);
    const { id } = await createBoardWith(owner, schedule);
    schedule.circuits[1].deviceId = 'no-such-device';
    await owner.put(`/api/boards/${id}/schedule`, { ...schedule, baseRevision: 2 }).expect(200);
    const findings = (await owner.get(`/api/boards/${id}/check`).expect(200)).body.findings;
    expect(findings.some((f: any) => f.ways.includes(2) && f.severity === 'error')).toBe(true);
  });

  it('when a viewer reads, then the schedule and check answer; when the viewer saves, then 403', async () => {
    const schedule = makeSchedule(2);
    const { id } = await createBoardWith(owner, schedule);
    await viewer.get(`/api/boards/${id}/schedule`).expect(200);
    await viewer.get(`/api/boards/${id}/check`).expect(200);
    await viewer.put(`/api/boards/${id}/schedule`, { ...schedule, baseRevision: 2 }).expect(403);
  });
});

describe('rule checks', () => {
  it('when a circuit records its installation conditions, then they read back and the check corrects Iz for them; bad ones are 400 by path', async () => {
    const schedule = makeSchedule(2);
    const legacy: any = structuredClone(schedule);
    for (const c of legacy.circuits) {
      delete c.cable.ambientC;
      delete c.cable.groupedWith;
      delete c.cable.insulatedLengthMm;
    }
    const { id } = await createBoardWith(owner, legacy); // a client that knows nothing of the conditions still saves
    const before = (await owner.get(`/api/boards/${id}/schedule`).expect(200)).body;
    expect(before.circuits[0].cable).toMatchObject({ ambientC: null, groupedWith: null, insulatedLengthMm: null });
    expect((await owner.get(`/api/boards/${id}/check`).expect(200)).body.findings.some((f: any) => f.code === 'ring-iz-below-20')).toBe(false);

    const grouped = structuredClone(schedule);
    grouped.circuits[0].cable.groupedWith = 3; // way 1: 2.5 mm² ring on a B32, clipped direct
    await owner.put(`/api/boards/${id}/schedule`, { ...grouped, baseRevision: 2 }).expect(200);
    expect(withoutMeta((await owner.get(`/api/boards/${id}/schedule`).expect(200)).body)).toEqual(grouped);
    const { findings } = (await owner.get(`/api/boards/${id}/check`).expect(200)).body;
    // 27 A (BS 7671 Table 4D5, found) × 0.70 (Table 4C1, 3 grouped, from memory) = 18.9 A < 20 A (433.1.204, partly)
    expect(findings.filter((f: any) => f.code === 'ring-iz-below-20')).toMatchObject([{ ways: [1], field: 'circuits.0.cable.groupedWith' }]);

    const bad: any = structuredClone(grouped);
    bad.circuits[0].cable.groupedWith = 0;
    bad.circuits[1].cable.ambientC = 'warm';
    bad.circuits[1].cable.insulatedLengthMm = -1;
    const res = await owner.put(`/api/boards/${id}/schedule`, { ...bad, baseRevision: 3 }).expect(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual([
      'circuits.0.cable.groupedWith',
      'circuits.1.cable.ambientC',
      'circuits.1.cable.insulatedLengthMm',
    ]);
  });

  it('when a measured Zs is over the Table 41.3 maximum, then the check names the way and the rule', async () => {
    const schedule = makeSchedule(4);
    schedule.circuits[0].measuredZs = 1.52; // over 1.37 Ω for a B32 // BS 7671:2018+A2 Table 41.3
    schedule.circuits[3].measuredZs = 1.2; // under 1.37 Ω for a B32 // BS 7671:2018+A2 Table 41.3
    schedule.circuits[3].zsAtAmbient = false;
    const { id } = await createBoardWith(owner, schedule);
    const { findings } = (await owner.get(`/api/boards/${id}/check`).expect(200)).body;
    for (const f of findings) {
      expect(['error', 'warning', 'info']).toContain(f.severity);
      expect(typeof f.rule).toBe('string');
      expect(Array.isArray(f.ways)).toBe(true);
      expect(typeof f.message).toBe('string');
    }
    const zs = findings.filter((f: any) => /41\.3/.test(f.rule) && f.severity !== 'info');
    expect(zs.map((f: any) => f.ways)).toContainEqual([1]);
    expect(zs.some((f: any) => f.ways.includes(4))).toBe(false);
  });
});

describe('revisions and diffs', () => {
  it('when two revisions are compared, then the diff lists the change; a snapshot is the schedule as saved', async () => {
    const schedule = makeSchedule(3);
    const { id } = await createBoardWith(owner, schedule);
    const changed = structuredClone(schedule);
    changed.circuits[1].label = 'Studio lights';
    await owner.put(`/api/boards/${id}/schedule`, { ...changed, baseRevision: 2 }).expect(200);
    const history = (await viewer.get(`/api/boards/${id}/revisions`).expect(200)).body.items;
    expect(history[0]).toMatchObject({ number: 3, authorName: 'Test Owner' });
    expect(history.at(-1)).toMatchObject({ number: 1, summary: 'Created' });
    const snapshot = revisionSnapshotSchema.parse((await viewer.get(`/api/boards/${id}/revisions/2`).expect(200)).body);
    expect(snapshot.schedule).toEqual(schedule);
    const diff = diffResponseSchema.parse((await viewer.get(`/api/boards/${id}/diff?from=2&to=3`).expect(200)).body);
    expect(diff.changes.length).toBeGreaterThan(0);
    expect(diff.changes.some((c) => c.path.includes('label') && c.after === 'Studio lights')).toBe(true);
    expect(diff.summary).toMatch(/Studio lights/);
    const none = (await viewer.get(`/api/boards/${id}/diff?from=3&to=3`).expect(200)).body;
    expect(none.changes).toEqual([]);
  });

  it('when a revision does not exist or the query is bad, then 404 and 400', async () => {
    const { id } = await createBoardWith(owner);
    await owner.get(`/api/boards/${id}/revisions/9`).expect(404);
    await owner.get(`/api/boards/${id}/diff?from=1&to=9`).expect(404);
    const res = await owner.get(`/api/boards/${id}/diff?from=x`).expect(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['from', 'to']);
  });
});

describe('cost of a board read', () => {
  it('when a board has 10 or 1000 circuits, then reading its schedule costs the same number of SQL queries', async () => {
    const small = await createBoardWith(owner, makeSchedule(10));
    const large = await createBoardWith(owner, makeSchedule(1000));
    const count = async (id: number, n: number) => {
      const before = t.database.queryCount();
      const res = await owner.get(`/api/boards/${id}/schedule`).expect(200);
      expect(res.body.circuits).toHaveLength(n);
      return t.database.queryCount() - before;
    };
    const at10 = await count(small.id, 10);
    const at1000 = await count(large.id, 1000);
    expect(at10).toBeGreaterThan(0);
    expect(at1000).toBe(at10);
  });
});
