import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Client, TestApp } from '../helpers/app.js';
import { createBoardWith, makeSchedule, startWithCast } from '../helpers/boards.js';
import { boardFileSchema } from '../../shared/schemas/schedule.js';
import { parseCsv } from '../../server/boards/csv.js';

let t: TestApp, owner: Client, viewer: Client, stranger: Client;
beforeAll(async () => ({ t, owner, viewer, stranger } = await startWithCast('Import Test Ltd', 'Far Away Electrical')));
afterAll(async () => {
  await t.close();
});

const withoutMeta = ({ board, devices, circuits }: any) => ({ board, devices, circuits });
const boardCount = async (c: Client) => (await c.get('/api/boards?pageSize=1').expect(200)).body.total as number;

/** A schedule with awkward text: quotes, commas, line breaks, formula-like labels, accents and Ω. */
function awkwardSchedule() {
  const s = makeSchedule(5, 'Böard "A", Ω');
  s.circuits[0].label = '=SUM(A1:A2)';
  s.circuits[1].description = 'Sockets, kitchen "island"\nand breakfast bar';
  s.circuits[2].locations = ['Hall', '+Landing', 'Café corner'];
  s.circuits[3].notes = '-3 dB? no: a note';
  s.circuits[4].measuredZs = null;
  s.circuits[4].cable.lengthM = 7.25;
  // installation conditions, one of them below zero (a number, not a formula)
  s.circuits[0].cable.groupedWith = 3;
  s.circuits[1].cable.ambientC = -5;
  s.circuits[2].cable.insulatedLengthMm = 250.5;
  s.circuits[2].cable.ambientC = 35;
  return s;
}

describe('board file export and import', () => {
  it('when a board is exported and imported, then the new board has an identical schedule', async () => {
    const schedule = awkwardSchedule();
    const { id } = await createBoardWith(owner, schedule);
    const exported = await viewer.get(`/api/boards/${id}/export`).expect(200);
    expect(exported.headers['content-disposition']).toMatch(/^attachment; filename="WM-[A-Z0-9]+-.*\.waymark\.json"$/);
    const file = boardFileSchema.parse(exported.body);
    expect(exported.body).toMatchObject({ format: 2, kind: 'waymark-board' });
    expect(Date.parse(exported.body.exportedAt)).not.toBeNaN();
    const imported = await owner.post('/api/boards/import', exported.body).expect(201);
    expect(imported.body.id).not.toBe(id);
    const [a, b] = await Promise.all([owner.get(`/api/boards/${id}/schedule`), owner.get(`/api/boards/${imported.body.id}/schedule`)]);
    expect(withoutMeta(b.body)).toEqual(withoutMeta(a.body));
    expect(withoutMeta(b.body)).toEqual(withoutMeta(file));
    expect(b.body.code).not.toBe(a.body.code);
    expect(b.body.revision).toBe(1);
  });

  it('when the wrapped form names a site, then the imported board is on that site', async () => {
    const { id } = await createBoardWith(owner, makeSchedule(2));
    const file = (await owner.get(`/api/boards/${id}/export`).expect(200)).body;
    const site = await owner.post('/api/sites', { reference: 'IMP-9' }).expect(201);
    const imported = await owner.post('/api/boards/import', { file, siteId: site.body.id }).expect(201);
    expect((await owner.get(`/api/boards/${imported.body.id}`).expect(200)).body.site.reference).toBe('IMP-9');
    const theirSite = await stranger.post('/api/sites', { reference: 'THEIRS' }).expect(201);
    const res = await owner.post('/api/boards/import', { file, siteId: theirSite.body.id }).expect(400);
    expect(Object.keys(res.body.error.fields)).toEqual(['siteId']);
  });

  it('when a board file has errors, then it is refused whole with every field listed and no board is made', async () => {
    const { id } = await createBoardWith(owner, makeSchedule(4));
    const file = (await owner.get(`/api/boards/${id}/export`).expect(200)).body;
    const before = await boardCount(owner);
    const bad = structuredClone(file);
    bad.format = 3; // formats 1 and 2 are readable; 3 is not
    bad.circuits[1].way = 0;
    bad.circuits[3].cable.liveCsa = -2.5;
    bad.devices[2].kind = 'fuse-wire';
    const res = await owner.post('/api/boards/import', bad).expect(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['circuits.1.way', 'circuits.3.cable.liveCsa', 'devices.2.kind', 'format']);
    const wrapped = await owner.post('/api/boards/import', { file: bad }).expect(400);
    expect(Object.keys(wrapped.body.error.fields)).toContain('file.circuits.1.way');
    for (const other of [{ ...file, kind: 'something-else' }, [], { file: 'text' }, { name: 'a spreadsheet export' }]) {
      const refused = await owner.post('/api/boards/import', other).expect(400);
      expect(refused.body.error.message).toMatch(/^This is not a Waymark board file/);
    }
    expect(await boardCount(owner)).toBe(before);
  });

  it('when a file links a sub-main to a board that is not ours, then 400 on that circuit and nothing is made', async () => {
    const theirs = await createBoardWith(stranger, makeSchedule(1));
    const { id } = await createBoardWith(owner, makeSchedule(2));
    const file = (await owner.get(`/api/boards/${id}/export`).expect(200)).body;
    file.circuits[1].kind = 'sub-main';
    file.circuits[1].feedsBoardId = theirs.id;
    const before = await boardCount(owner);
    const res = await owner.post('/api/boards/import', file).expect(400);
    expect(Object.keys(res.body.error.fields)).toEqual(['circuits.1.feedsBoardId']);
    expect(await boardCount(owner)).toBe(before);
  });

  it('when a viewer imports, then 403; another organisation exports, then 404', async () => {
    const { id } = await createBoardWith(owner, makeSchedule(1));
    const file = (await viewer.get(`/api/boards/${id}/export`).expect(200)).body;
    await viewer.post('/api/boards/import', file).expect(403);
    await stranger.get(`/api/boards/${id}/export`).expect(404);
  });
});

describe('circuit CSV', () => {
  it('when the circuits are exported as CSV and imported unchanged, then the schedule is identical and no revision is made', async () => {
    const schedule = awkwardSchedule();
    const { id } = await createBoardWith(owner, schedule);
    const res = await viewer.get(`/api/boards/${id}/circuits.csv`).expect(200);
    expect(res.headers['content-type']).toMatch(/^text\/csv/);
    expect(res.headers['content-disposition']).toMatch(/^attachment; filename=".*-circuits\.csv"$/);
    const records = parseCsv(res.text);
    expect(records[0].slice(0, 5)).toEqual(['id', 'way', 'phase', 'device_id', 'label']);
    expect(records).toHaveLength(6);
    // a label that a spreadsheet would run as a formula is written as text
    expect(records[1][4]).toBe("'=SUM(A1:A2)");
    const back = await owner.post(`/api/boards/${id}/circuits/import-csv`, { csv: res.text, baseRevision: 2 }).expect(200);
    expect(back.body).toMatchObject({ revision: 2, changed: false });
    const read = (await owner.get(`/api/boards/${id}/schedule`).expect(200)).body;
    expect(withoutMeta(read)).toEqual(schedule);
  });

  it('when a spreadsheet with only some columns is imported, then rows match ways, keep other values, and new ways are added', async () => {
    const schedule = makeSchedule(3);
    const { id } = await createBoardWith(owner, schedule);
    const csv = 'Way,Label,Live_CSA,Locations\r\n1,Hall sockets,4,Hall; Stairs\r\n2,Landing lights,,Landing\r\n9,Shed radial,2.5,"Shed, rear"\r\n';
    const res = await owner.agent
      .post(`/api/boards/${id}/circuits/import-csv?baseRevision=2`)
      .set('X-CSRF-Token', owner.csrf)
      .set('Content-Type', 'text/csv')
      .send(csv)
      .expect(200);
    expect(res.body).toMatchObject({ revision: 3, changed: true });
    const { circuits } = (await owner.get(`/api/boards/${id}/schedule`).expect(200)).body;
    expect(circuits.map((c: any) => [c.id, c.way, c.label])).toEqual([
      ['c1', 1, 'Hall sockets'],
      ['c2', 2, 'Landing lights'],
      ['w9', 9, 'Shed radial'],
    ]);
    expect(circuits[0].cable).toMatchObject({ liveCsa: 4, cpcCsa: 1.5, referenceMethod: 'C' });
    expect(circuits[0].locations).toEqual(['Hall', 'Stairs']);
    expect(circuits[0].deviceId).toBe('d1');
    expect(circuits[1].cable.liveCsa).toBeNull();
    expect(circuits[2]).toMatchObject({ kind: 'other', deviceId: null, locations: ['Shed, rear'], legs: 1 });
  });

  it('when a file without the installation-condition columns is imported, then the board keeps its conditions; bad condition cells are refused', async () => {
    const schedule = makeSchedule(2);
    schedule.circuits[0].cable = { ...schedule.circuits[0].cable, ambientC: 35, groupedWith: 4, insulatedLengthMm: 100 };
    const { id } = await createBoardWith(owner, schedule);
    const records = parseCsv((await owner.get(`/api/boards/${id}/circuits.csv`).expect(200)).text);
    const dropped = ['ambient_c', 'grouped_with', 'insulated_length_mm'].map((name) => records[0].indexOf(name));
    expect(dropped.every((i) => i > 0)).toBe(true);
    const older = records.map((r) => r.filter((_, i) => !dropped.includes(i)));
    older[1][older[0].indexOf('label')] = 'Hall ring';
    older.push(older[0].map((name) => (({ way: '7', label: 'Porch lights' }) as Record<string, string>)[name] ?? ''));
    const res = await owner.post(`/api/boards/${id}/circuits/import-csv`, { csv: older.map((r) => r.join(',')).join('\n'), baseRevision: 2 }).expect(200);
    expect(res.body).toMatchObject({ revision: 3, changed: true });
    const { circuits } = (await owner.get(`/api/boards/${id}/schedule`).expect(200)).body;
    expect(circuits[0]).toMatchObject({ label: 'Hall ring', cable: { ambientC: 35, groupedWith: 4, insulatedLengthMm: 100 } });
    expect(circuits[2].cable).toMatchObject({ ambientC: null, groupedWith: null, insulatedLengthMm: null });

    const bad = await owner
      .post(`/api/boards/${id}/circuits/import-csv`, { csv: 'way,label,ambient_c,grouped_with,insulated_length_mm\n1,A,hot,2.5,-3\n', baseRevision: 3 })
      .expect(400);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(['rows.2.ambient_c', 'rows.2.grouped_with', 'rows.2.insulated_length_mm']);
  });

  it('when CSV rows are bad, then 400 lists rows.<n>.<column> and nothing is imported', async () => {
    const { id } = await createBoardWith(owner, makeSchedule(3));
    const before = (await owner.get(`/api/boards/${id}/schedule`).expect(200)).body;
    const csv = [
      'way,label,live_csa,kind,socket_outlets',
      '1,Fine row,2.5,ring,yes',
      '2,,2.5,radial,no',
      'two,Lights,lots,lighting,maybe',
      '4,Cooker,6,cooker',
    ].join('\n');
    const res = await owner.post(`/api/boards/${id}/circuits/import-csv`, { csv, baseRevision: 2 }).expect(400);
    expect(res.body.error.fields).toMatchObject({
      'rows.3.label': expect.any(String),
      'rows.4.way': expect.any(String),
      'rows.4.live_csa': expect.any(String),
      'rows.4.socket_outlets': expect.any(String),
      'rows.5': expect.stringMatching(/4 cells/),
    });
    expect(Object.keys(res.body.error.fields)).toHaveLength(5);
    const after = (await owner.get(`/api/boards/${id}/schedule`).expect(200)).body;
    expect(after).toEqual(before);
  });

  it('when the header is wrong or the file cannot be read, then 400 says which', async () => {
    const { id } = await createBoardWith(owner, makeSchedule(1));
    const header = await owner.post(`/api/boards/${id}/circuits/import-csv`, { csv: 'way,colour\n1,red\n', baseRevision: 2 }).expect(400);
    expect(header.body.error.fields).toMatchObject({ 'header.colour': expect.any(String), 'header.label': 'Missing column' });
    const twice = await owner.post(`/api/boards/${id}/circuits/import-csv`, { csv: 'id,way,label\nc1,1,A\nc1,2,B\n', baseRevision: 2 }).expect(400);
    expect(twice.body.error.fields).toEqual({ 'rows.3.id': 'The same circuit as row 2' });
    const quote = await owner.post(`/api/boards/${id}/circuits/import-csv`, { csv: 'way,label\n1,"never closed\n', baseRevision: 2 }).expect(400);
    expect(Object.keys(quote.body.error.fields)).toEqual(['rows.2']);
    const body = await owner.post(`/api/boards/${id}/circuits/import-csv`, { csv: 5 }).expect(400);
    expect(Object.keys(body.body.error.fields).sort()).toEqual(['baseRevision', 'csv']);
    const noBase = await owner.agent
      .post(`/api/boards/${id}/circuits/import-csv`)
      .set('X-CSRF-Token', owner.csrf)
      .set('Content-Type', 'text/csv')
      .send('way,label\n1,A\n')
      .expect(400);
    expect(Object.keys(noBase.body.error.fields)).toEqual(['baseRevision']);
  });

  it('when the CSV is based on an old revision, then 409 stale; a viewer gets 403', async () => {
    const { id } = await createBoardWith(owner, makeSchedule(2));
    const csv = (await owner.get(`/api/boards/${id}/circuits.csv`).expect(200)).text;
    const res = await owner.post(`/api/boards/${id}/circuits/import-csv`, { csv, baseRevision: 1 }).expect(409);
    expect(res.body).toMatchObject({ error: { code: 'stale' }, revision: 2 });
    await viewer.post(`/api/boards/${id}/circuits/import-csv`, { csv, baseRevision: 2 }).expect(403);
    await stranger.post(`/api/boards/${id}/circuits/import-csv`, { csv, baseRevision: 2 }).expect(404);
  });
});
