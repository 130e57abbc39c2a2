import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { PDFParse } from 'pdf-parse';
import { client, signupOwner, startTestApp, type Client, type TestApp } from '../helpers/app.js';
import { addMember, createBoardWith, makeSchedule } from '../helpers/boards.js';
import { getPdf, postBinary } from './print-support.js';
import type { Schedule } from '../../shared/schemas/schedule.js';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => {
  await t.close();
});

async function pdfText(pdf: Buffer): Promise<{ pages: string[]; all: string }> {
  const parser = new PDFParse({ data: new Uint8Array(pdf) });
  try {
    const pages = (await parser.getText()).pages.map((p) => p.text.replace(/\s+/g, ' '));
    return { pages, all: pages.join(' ') };
  } finally {
    await parser.destroy();
  }
}

async function ownerWithBoard() {
  const owner = await signupOwner(t.app);
  const schedule = makeSchedule(5);
  const board = await createBoardWith(owner, schedule);
  await owner.patch(`/api/boards/${board.id}/public`, { enabled: true }).expect(200); // a new board's page starts off; the tag then carries a QR code
  return { owner, id: board.id, revision: board.revision, schedule };
}

/** Saves a new revision with one way renamed, as an electrician editing the schedule would. */
async function renameWay(owner: Client, id: number, schedule: Schedule, baseRevision: number, way: number, label: string): Promise<Schedule> {
  const next = { ...schedule, circuits: schedule.circuits.map((c) => (c.way === way ? { ...c, label } : c)) };
  const saved = await owner.put(`/api/boards/${id}/schedule`, { ...next, baseRevision }).expect(200);
  expect(saved.body.revision).toBe(baseRevision + 1);
  return next;
}

describe('print records and history', () => {
  it('when the preview renders, nothing is recorded; a download (POST) is, with who, what, medium and revision', async () => {
    const { owner, id, revision } = await ownerWithBoard();
    await getPdf(owner, `/api/boards/${id}/pdf/chart?media=a4`).expect(200);
    await owner.get(`/api/boards/${id}/pdf/chart/warnings?media=a4`).expect(200);
    expect((await owner.get(`/api/boards/${id}/prints`).expect(200)).body.items).toEqual([]);

    await postBinary(owner, `/api/boards/${id}/pdf/chart?media=a5`).expect(200);
    await postBinary(owner, `/api/boards/${id}/pdf/flags?media=tape-12`).expect(200);
    const { items } = (await owner.get(`/api/boards/${id}/prints`).expect(200)).body;
    expect(items.map((p: { output: string; media: string; revision: number; userName: string }) => [p.output, p.media, p.revision, p.userName])).toEqual([
      ['flags', 'tape-12', revision, 'Test Owner'],
      ['chart', 'a5', revision, 'Test Owner'],
    ]);
    expect(Date.parse(items[0].createdAt)).toBeGreaterThan(Date.now() - 60_000);
  });

  it("when a viewer prints, then the print is recorded under the viewer's name", async () => {
    const { owner, id } = await ownerWithBoard();
    const viewer = await addMember(t, owner, 'viewer');
    await postBinary(viewer, `/api/boards/${id}/pdf/tag?media=tape-24`).expect(200);
    const { items } = (await viewer.get(`/api/boards/${id}/prints`).expect(200)).body;
    expect(items).toHaveLength(1);
    expect(items[0]).toMatchObject({ output: 'tag', media: 'tape-24', userName: 'Test viewer' });
  });

  it('when a print fails (bad option or too small a medium), then nothing is recorded', async () => {
    const { owner, id } = await ownerWithBoard();
    await owner.post(`/api/boards/${id}/pdf/tag?media=tape-6`).expect(422);
    await owner.post(`/api/boards/${id}/pdf/tag?copies=0`).expect(400);
    expect((await owner.get(`/api/boards/${id}/prints`).expect(200)).body.items).toEqual([]);
  });

  it('when another organisation asks for the history, then 404; signed out, 401', async () => {
    const { id } = await ownerWithBoard();
    const other = await signupOwner(t.app, 'Other Electrical');
    await other.get(`/api/boards/${id}/prints`).expect(404);
    await (await client(t.app)).get(`/api/boards/${id}/prints`).expect(401);
  });
});

describe('changed since a revision', () => {
  it('when one way is renamed, then flags changed since the earlier revision carry only that way', async () => {
    const { owner, id, revision, schedule } = await ownerWithBoard();
    await renameWay(owner, id, schedule, revision, 3, 'Workshop sockets');
    const res = await getPdf(owner, `/api/boards/${id}/pdf/flags?media=tape-24&changedSince=${revision}`).expect(200);
    const { pages, all } = await pdfText(res.body);
    const renamed = schedule.circuits.find((c) => c.way === 3)!;
    expect(pages).toHaveLength(renamed.legs);
    expect(all).toContain('Workshop sockets');
    for (const c of schedule.circuits) expect(all).not.toContain(c.label);
  });

  it('when one way is renamed, then way labels changed since carry that way and no other label', async () => {
    const { owner, id, revision, schedule } = await ownerWithBoard();
    await renameWay(owner, id, schedule, revision, 2, 'Porch lights');
    const res = await getPdf(owner, `/api/boards/${id}/pdf/way-labels?media=a4&changedSince=${revision}`).expect(200);
    const { all } = await pdfText(res.body);
    expect(all).toContain('Porch lights');
    for (const c of schedule.circuits) expect(all).not.toContain(c.label);
  });

  it('when asked since the first, empty revision, then every way counts as changed (they were all added)', async () => {
    const { owner, id, schedule } = await ownerWithBoard();
    const res = await getPdf(owner, `/api/boards/${id}/pdf/flags?media=tape-24&changedSince=1`).expect(200);
    expect((await pdfText(res.body)).pages).toHaveLength(schedule.circuits.reduce((n, c) => n + c.legs, 0));
  });

  it('when nothing changed since the revision, then 422 says so; a revision the board never had is 400 on changedSince', async () => {
    const { owner, id, revision } = await ownerWithBoard();
    const same = await owner.get(`/api/boards/${id}/pdf/flags?changedSince=${revision}`).expect(422);
    expect(same.body.error.message).toMatch(new RegExp(`since revision ${revision}`));
    const future = await owner.get(`/api/boards/${id}/pdf/way-labels?changedSince=${revision + 5}`).expect(400);
    expect(future.body.error.fields.changedSince).toMatch(/revision/);
    const chart = await owner.get(`/api/boards/${id}/pdf/chart?changedSince=1`).expect(400);
    expect(JSON.stringify(chart.body.error.fields)).toMatch(/changedSince/);
  });
});
