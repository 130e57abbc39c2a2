import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { inflateRawSync } from 'node:zlib';
import { PDFParse } from 'pdf-parse';
import { client, signupOwner, startTestApp, type TestApp } from '../helpers/app.js';
import { addMember, createBoardWith, makeSchedule } from '../helpers/boards.js';
import { getBinary, postBinary } from './print-support.js';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => {
  await t.close();
});

/**
 * A small ZIP reader written from the format's published description (PKWARE APPNOTE.TXT 4.3):
 * find the end-of-central-directory record, walk the central directory, and inflate each entry
 * from its local header. Independent of the archiver that wrote the file.
 */
function readZip(zip: Buffer): Map<string, Buffer> {
  const eocd = zip.lastIndexOf(Buffer.from([0x50, 0x4b, 0x05, 0x06])); // APPNOTE 4.3.16 signature 0x06054b50
  if (eocd < 0) throw new Error('not a ZIP: no end of central directory');
  const count = zip.readUInt16LE(eocd + 10);
  let at = zip.readUInt32LE(eocd + 16);
  const files = new Map<string, Buffer>();
  for (let i = 0; i < count; i++) {
    if (zip.readUInt32LE(at) !== 0x02014b50) throw new Error('bad central directory entry'); // APPNOTE 4.3.12
    const method = zip.readUInt16LE(at + 10);
    const compressed = zip.readUInt32LE(at + 20);
    const size = zip.readUInt32LE(at + 24);
    const nameLength = zip.readUInt16LE(at + 28);
    const extraLength = zip.readUInt16LE(at + 30);
    const commentLength = zip.readUInt16LE(at + 32);
    const local = zip.readUInt32LE(at + 42);
    const name = zip.subarray(at + 46, at + 46 + nameLength).toString('utf8');
    if (zip.readUInt32LE(local) !== 0x04034b50) throw new Error('bad local header'); // APPNOTE 4.3.7
    const start = local + 30 + zip.readUInt16LE(local + 26) + zip.readUInt16LE(local + 28);
    const raw = zip.subarray(start, start + compressed);
    const data = method === 8 ? inflateRawSync(raw) : method === 0 ? Buffer.from(raw) : null; // 8 = deflate, 0 = stored
    if (!data || data.length !== size) throw new Error(`cannot read ${name}`);
    files.set(name, data);
    at += 46 + nameLength + extraLength + commentLength;
  }
  return files;
}

async function pdfText(pdf: Buffer): Promise<string> {
  const parser = new PDFParse({ data: new Uint8Array(pdf) });
  try {
    return (await parser.getText()).text.replace(/\s+/g, ' ');
  } finally {
    await parser.destroy();
  }
}

describe('the print pack', () => {
  it('when the pack is asked for, then one ZIP holds a PDF of each board output, named by output and medium', async () => {
    const owner = await signupOwner(t.app);
    const schedule = makeSchedule(4);
    const { id } = await createBoardWith(owner, schedule);
    const code = (await owner.get(`/api/boards/${id}`).expect(200)).body.code as string;
    const res = await getBinary(owner, `/api/boards/${id}/pack`).expect(200);
    expect(res.headers['content-type']).toBe('application/zip');
    expect(res.headers['content-disposition']).toMatch(new RegExp(`attachment; filename="${code}-pack-r\\d+\\.zip"`));

    const files = readZip(res.body);
    const pdfs = [...files.keys()].filter((n) => n.endsWith('.pdf'));
    expect(pdfs.map((n) => n.replace(`${code}-`, '').replace(/-(tape-\d+|a4|a5)(-landscape)?\.pdf$/, '')).sort()).toEqual([
      'chart',
      'flags',
      'notices',
      'tag',
      'way-labels',
    ]);
    for (const name of pdfs) {
      expect(name).toMatch(new RegExp(`^${code}-[a-z-]+-(tape-\\d+|a4|a5)\\.pdf$`));
      expect(files.get(name)!.subarray(0, 5).toString('latin1')).toBe('%PDF-'); // ISO 32000-1 7.5.2
    }
    const chart = await pdfText(files.get(pdfs.find((n) => n.includes('-chart-'))!)!);
    for (const c of schedule.circuits) expect(chart).toContain(c.label);
    expect(files.get('READ-ME.txt')!.toString('utf8')).toMatch(/isolate/i);
  });

  it('when a pack is made, then each file in it is recorded as a print', async () => {
    const owner = await signupOwner(t.app);
    const { id, revision } = await createBoardWith(owner, makeSchedule(2));
    await postBinary(owner, `/api/boards/${id}/pack`).expect(200);
    const { items } = (await owner.get(`/api/boards/${id}/prints`).expect(200)).body;
    expect(items.map((p: { output: string }) => p.output).sort()).toEqual(['chart', 'flags', 'notices', 'tag', 'way-labels']);
    expect(new Set(items.map((p: { revision: number }) => p.revision))).toEqual(new Set([revision]));
  });

  it("when a viewer asks, then the pack comes; another organisation's board is 404 and signed out is 401", async () => {
    const owner = await signupOwner(t.app);
    const { id } = await createBoardWith(owner, makeSchedule(2));
    const viewer = await addMember(t, owner, 'viewer');
    await getBinary(viewer, `/api/boards/${id}/pack`).expect(200);
    const other = await signupOwner(t.app, 'Other Electrical');
    await other.get(`/api/boards/${id}/pack`).expect(404);
    await (await client(t.app)).get(`/api/boards/${id}/pack`).expect(401);
    await owner.get('/api/boards/not-a-board/pack').expect(400);
  });
});
