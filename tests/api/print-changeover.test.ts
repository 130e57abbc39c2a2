import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Client, TestApp } from '../helpers/app.js';
import { createBoardWith, makeSchedule, startWithCast } from '../helpers/boards.js';
import { bungalowBoard } from '../../server/seed/demo-bungalow.js';
import { getBinary, getPdf, pdfPages, postBinary } from './print-support.js';

let t: TestApp, owner: Client, stranger: Client;
beforeAll(async () => ({ t, owner, stranger } = await startWithCast('Changeover Print Test Ltd', 'Elsewhere Electrical')));
afterAll(async () => t.close());

/** File names in a ZIP's central directory, walked as PKWARE APPNOTE.TXT 4.3.12 and 4.3.16 lay it out. */
function zipNames(zip: Buffer): string[] {
  const eocd = zip.lastIndexOf(Buffer.from([0x50, 0x4b, 0x05, 0x06])); // APPNOTE 4.3.16 signature 0x06054b50
  const names: string[] = [];
  for (let i = 0, at = zip.readUInt32LE(eocd + 16); i < zip.readUInt16LE(eocd + 10); i++) {
    const [nameLength, extraLength, commentLength] = [zip.readUInt16LE(at + 28), zip.readUInt16LE(at + 30), zip.readUInt16LE(at + 32)];
    names.push(zip.subarray(at + 46, at + 46 + nameLength).toString('utf8'));
    at += 46 + nameLength + extraLength + commentLength;
  }
  return names;
}

describe('printing the changeover schedule', () => {
  it('when a board with a survey is printed, then the changeover schedule comes back as a PDF with each old way and its verdict', async () => {
    const { id } = await createBoardWith(owner, bungalowBoard.schedule);
    const res = await getPdf(owner, `/api/boards/${id}/pdf/changeover?media=a4`).expect(200);
    expect(res.headers['content-type']).toBe('application/pdf');
    expect(res.headers['content-disposition']).toMatch(/-changeover-a4\.pdf"$/);
    const text = (await pdfPages(res.body)).join(' ');
    for (const part of ['Changeover schedule', 'Fuse 1 (red dot)', 'Fuse 2', 'Way 3 Sockets front', '30 A BS 3036', 'Isolate the supply and prove dead'])
      expect(text).toContain(part);
    expect(text).toMatch(/Fix before ?changeover/);
    await getPdf(owner, `/api/boards/${id}/pdf/changeover?media=a5-landscape&showReadings=false`).expect(200);
  });

  it('when a board has no survey, then 400 names the survey field; the warnings call answers the same', async () => {
    const { id } = await createBoardWith(owner, makeSchedule(2));
    const res = await owner.get(`/api/boards/${id}/pdf/changeover?media=a4`).expect(400);
    expect(res.body.error.fields.survey).toMatch(/This board has no survey of an old board/);
    const warnings = await owner.get(`/api/boards/${id}/pdf/changeover/warnings?media=a4`).expect(400);
    expect(warnings.body.error.fields.survey).toMatch(/no survey/);
  });

  it('when the medium is tape or an option is unknown, then it is refused naming the field', async () => {
    const { id } = await createBoardWith(owner, bungalowBoard.schedule);
    const tape = await owner.get(`/api/boards/${id}/pdf/changeover?media=tape-24`).expect(422);
    expect(tape.body.error.fields.media).toMatch(/use a4 or a5/);
    const bad = await owner.get(`/api/boards/${id}/pdf/changeover?media=a4&showReadings=maybe`).expect(400);
    expect(Object.keys(bad.body.error.fields)).toContain('showReadings');
  });

  it("when another organisation's board is asked for, then 404", async () => {
    const { id } = await createBoardWith(owner, bungalowBoard.schedule);
    await stranger.get(`/api/boards/${id}/pdf/changeover?media=a4`).expect(404);
  });

  it('when printed by POST, then it is in the history; the pack of a surveyed board holds it', async () => {
    const { id } = await createBoardWith(owner, bungalowBoard.schedule);
    await postBinary(owner, `/api/boards/${id}/pdf/changeover?media=a5`).expect(200);
    const { items } = (await owner.get(`/api/boards/${id}/prints`).expect(200)).body;
    expect(items.map((p: { output: string; media: string }) => `${p.output} ${p.media}`)).toEqual(['changeover a5']);
    const pack = await getBinary(owner, `/api/boards/${id}/pack`).expect(200);
    expect(zipNames(pack.body).filter((n) => n.endsWith('-changeover-a4.pdf'))).toHaveLength(1);
  });

  it('when flags are asked for at junction boxes, then one flag names the box, the old way and the new way', async () => {
    const { id } = await createBoardWith(owner, bungalowBoard.schedule);
    const res = await getPdf(owner, `/api/boards/${id}/pdf/flags?media=tape-24&at=junction-boxes`).expect(200);
    expect(res.headers['x-waymark-page-count']).toBe('1');
    const text = (await pdfPages(res.body)).join(' ');
    for (const part of ['JB1', 'Fuse 1', 'Way 3']) expect(text).toContain(part);
    await owner.get(`/api/boards/${id}/pdf/flags?media=tape-24&at=everywhere`).expect(400);
  });
});
