import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { PDFParse } from 'pdf-parse';
import { PDFDocument } from 'pdf-lib';
import type { Response } from 'superagent';
import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { PNG } from 'pngjs';
import { client, signupOwner, startTestApp, type Client, type TestApp } from '../helpers/app.js';
import { addMember, createBoardWith, makeSchedule } from '../helpers/boards.js';
import { scheduleSchema, type Schedule } from '../../shared/schemas/schedule.js';

let t: TestApp;
beforeAll(async () => { t = await startTestApp(); });
afterAll(async () => { await t.close(); });

/** Collects a binary body (supertest leaves unknown types unbuffered). */
const binary = (res: Response, done: (err: Error | null, body: Buffer) => void) => {
  const chunks: Buffer[] = [];
  res.on('data', (c: Buffer) => chunks.push(c));
  res.on('end', () => done(null, Buffer.concat(chunks)));
};
const getPdf = (c: Client, path: string) => c.get(path).buffer(true).parse(binary as never);

async function pdfPages(pdf: Buffer): Promise<string[]> {
  const parser = new PDFParse({ data: new Uint8Array(pdf) });
  try {
    return (await parser.getText()).pages.map((p) => p.text.replace(/\s+/g, ' '));
  } finally {
    await parser.destroy();
  }
}

/** Left and top edge (px) of the ink on page 1, rendered at 100 dpi by poppler's pdftoppm (independent of pdf-lib). */
function inkBox(pdf: Buffer): { left: number; top: number } {
  const dir = mkdtempSync(join(tmpdir(), 'waymark-ink-'));
  try {
    writeFileSync(join(dir, 'in.pdf'), pdf);
    execFileSync('/usr/bin/pdftoppm', ['-r', '100', '-f', '1', '-l', '1', '-singlefile', '-png', join(dir, 'in.pdf'), join(dir, 'out')]);
    const png = PNG.sync.read(readFileSync(join(dir, 'out.png')));
    let left = png.width;
    let top = png.height;
    for (let y = 0; y < png.height; y++) {
      for (let x = 0; x < png.width; x++) {
        const i = (y * png.width + x) * 4;
        if (png.data[i] < 128 && png.data[i + 1] < 128 && png.data[i + 2] < 128) { left = Math.min(left, x); top = Math.min(top, y); }
      }
    }
    return { left, top };
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

const MM = 72 / 25.4; // ISO 32000-1 8.3.2.1: 1/72 inch user unit

async function ownerWithBoard(schedule: Schedule = makeSchedule(6)) {
  const owner = await signupOwner(t.app);
  const board = await createBoardWith(owner, schedule);
  const summary = await owner.get(`/api/boards/${board.id}`).expect(200);
  return { owner, id: board.id, code: summary.body.code as string, schedule };
}

describe('printing each output of a stored board', () => {
  it('when each output is asked for, then a PDF comes back, named by board code, output and medium', async () => {
    const { owner, id, code } = await ownerWithBoard();
    const cases = [['flags', 'tape-12'], ['way-labels', 'tape-12'], ['chart', 'a4'], ['notices', 'a4'], ['tag', 'tape-24'], ['calibration', 'a4']];
    for (const [output, media] of cases) {
      const res = await getPdf(owner, `/api/boards/${id}/pdf/${output}?media=${media}`).expect(200);
      expect(res.headers['content-type']).toBe('application/pdf');
      expect(res.headers['content-disposition']).toBe(`inline; filename="${code}-${output}-${media}.pdf"`);
      expect((res.body as Buffer).subarray(0, 5).toString('latin1')).toBe('%PDF-'); // ISO 32000-1 7.5.2 file header
      expect(Array.isArray(JSON.parse(decodeURIComponent(res.headers['x-waymark-warnings'])))).toBe(true);
      expect(Number(res.headers['x-waymark-page-count'])).toBeGreaterThan(0);
    }
  });

  it('when the chart is printed, then its text holds every way number beside its label, on an ISO 216 A4 page', async () => {
    const { owner, id, schedule } = await ownerWithBoard();
    const res = await getPdf(owner, `/api/boards/${id}/pdf/chart?media=a4`).expect(200);
    const text = (await pdfPages(res.body)).join(' ');
    for (const c of schedule.circuits) expect(text).toMatch(new RegExp(`(^| )${c.way} ${c.label}( |$)`));
    // makeSchedule: B32 RCBOs on rings and radials, B6 on lighting
    expect(text).toContain('1.37'); // BS 7671:2018+A2 Table 41.3, B32 at 0.4 s
    expect(text).toContain('7.28'); // BS 7671:2018+A2 Table 41.3, B6 at 0.4 s
    const page = (await PDFDocument.load(res.body)).getPage(0).getSize();
    expect(page.width).toBeCloseTo(595.28, 2); // ISO 216 A4 210 mm
    expect(page.height).toBeCloseTo(841.89, 2); // ISO 216 A4 297 mm
  });

  it('when flags are printed page per flag on tape, then every page carries its way number and label and is the tape wide', async () => {
    const { owner, id, schedule } = await ownerWithBoard();
    const res = await getPdf(owner, `/api/boards/${id}/pdf/flags?media=tape-24`).expect(200);
    const pages = await pdfPages(res.body);
    const legs = schedule.circuits.reduce((n, c) => n + c.legs, 0);
    expect(pages).toHaveLength(legs);
    for (const c of schedule.circuits) {
      const own = pages.filter((p) => p.includes(c.label));
      expect(own).toHaveLength(c.legs);
      for (const p of own) expect(p).toMatch(new RegExp(`\\b${c.way}\\b`));
    }
    const doc = await PDFDocument.load(res.body);
    for (const p of doc.getPages()) expect(p.getWidth() / MM).toBeCloseTo(24, 6); // tape width in mm, exactly // common practice 24 mm tape
  });

  it('when way labels are printed, then the strip carries every circuit label', async () => {
    const { owner, id, schedule } = await ownerWithBoard();
    const res = await getPdf(owner, `/api/boards/${id}/pdf/way-labels?media=a4`).expect(200);
    const text = (await pdfPages(res.body)).join(' ');
    for (const c of schedule.circuits) expect(text.replace(/ /g, '')).toContain(c.label.replace(/ /g, ''));
  });

  it('when a label cannot fit, then the warnings name it, in the header and in the warnings call alike', async () => {
    const base = makeSchedule(3);
    const schedule = scheduleSchema.parse({ ...base, circuits: base.circuits.map((c, i) => (i === 0 ? { ...c, label: 'W'.repeat(24) } : c)) });
    const { owner, id } = await ownerWithBoard(schedule);
    const res = await getPdf(owner, `/api/boards/${id}/pdf/way-labels?media=tape-6`).expect(200);
    const header = JSON.parse(decodeURIComponent(res.headers['x-waymark-warnings']));
    expect(header.some((w: { message: string }) => w.message.includes('W'.repeat(10)))).toBe(true);
    const check = await owner.get(`/api/boards/${id}/pdf/way-labels/warnings?media=tape-6`).expect(200);
    expect(check.body).toEqual({ warnings: header, pageCount: Number(res.headers['x-waymark-page-count']) });
  });
});

describe('bad print requests', () => {
  it('when the medium, an option or the output is wrong, then 400 names each field', async () => {
    const { owner, id } = await ownerWithBoard();
    const media = await owner.get(`/api/boards/${id}/pdf/chart?media=letter`).expect(400);
    expect(media.body.error.fields.media).toMatch(/medium/i);
    const options = await owner.get(`/api/boards/${id}/pdf/way-labels?pitchMm=wide&maxLengthMm=10`).expect(400);
    expect(Object.keys(options.body.error.fields).sort()).toEqual(['maxLengthMm', 'pitchMm']);
    const unknown = await owner.get(`/api/boards/${id}/pdf/chart?colour=red`).expect(400);
    expect(JSON.stringify(unknown.body.error.fields)).toMatch(/colour/);
    const output = await owner.get(`/api/boards/${id}/pdf/stickers`).expect(400);
    expect(output.body.error.fields.output).toBeTruthy();
    const record = await owner.get(`/api/boards/${id}/pdf/chart?record=yes`).expect(400);
    expect(record.body.error.fields.record).toBeTruthy();
    const twice = await owner.get(`/api/boards/${id}/pdf/chart?media=a4&media=a5`).expect(400);
    expect(twice.body.error.fields.media).toBeTruthy();
  });

  it('when the tape is too narrow for a readable QR code, then 422 says which tape would work', async () => {
    const { owner, id } = await ownerWithBoard();
    const res = await owner.get(`/api/boards/${id}/pdf/tag?media=tape-6`).expect(422);
    // ISO/IEC 18004 quiet zone of 4 modules at ≥ 0.4 mm a module cannot fit the 6 mm tape's band
    expect(res.body.error.message).toMatch(/tape-\d+/);
    expect(res.body.error.fields.media).toBe(res.body.error.message);
  });
});

describe('who may print', () => {
  it('when a viewer prints, then it works: viewers read and print', async () => {
    const { owner, id } = await ownerWithBoard();
    const viewer = await addMember(t, owner, 'viewer');
    await getPdf(viewer, `/api/boards/${id}/pdf/chart`).expect(200);
    await viewer.get(`/api/boards/${id}/pdf/flags/warnings`).expect(200);
  });

  it('when signed out, then 401; another organisation or an unknown board, then 404', async () => {
    const { id } = await ownerWithBoard();
    await (await client(t.app)).get(`/api/boards/${id}/pdf/chart`).expect(401);
    const other = await signupOwner(t.app, 'Other Electrical');
    await other.get(`/api/boards/${id}/pdf/chart`).expect(404);
    await other.get(`/api/boards/${id}/pdf/chart/warnings`).expect(404);
    await other.get('/api/boards/2147483000/pdf/chart').expect(404);
  });

  it('when a board is deleted, then it no longer prints', async () => {
    const { owner, id } = await ownerWithBoard();
    await owner.delete(`/api/boards/${id}`).expect(204);
    await owner.get(`/api/boards/${id}/pdf/chart`).expect(404);
  });
});

describe('sheet layouts and printer offsets in prints', () => {
  const sheet = {
    name: 'A4 21-up', pageWidthMm: 210, pageHeightMm: 297, labelWidthMm: 63.5, labelHeightMm: 38.1, // ISO 216 A4; 63.5 × 38.1 labels // common practice
    columns: 3, rows: 7, marginTopMm: 15.15, marginLeftMm: 7.25, gapXMm: 2.5, gapYMm: 0, cornerRadiusMm: 2,
  };

  it("when a stored sheet layout is the medium, then the page is the sheet's size; another organisation's layout is 404", async () => {
    const { owner, id } = await ownerWithBoard();
    const layout = await owner.post('/api/sheet-layouts', sheet).expect(201);
    const res = await getPdf(owner, `/api/boards/${id}/pdf/flags?media=sheet-${layout.body.id}`).expect(200);
    const page = (await PDFDocument.load(res.body)).getPage(0).getSize();
    expect([page.width, page.height].map((v) => +(v / MM).toFixed(2))).toEqual([210, 297]); // ISO 216 A4
    const other = await ownerWithBoard();
    await other.owner.get(`/api/boards/${other.id}/pdf/flags?media=sheet-${layout.body.id}`).expect(404);
  });

  it('when the printer offset is set, then it is kept and the same print comes out shifted', async () => {
    const { owner, id } = await ownerWithBoard();
    const before = await getPdf(owner, `/api/boards/${id}/pdf/calibration?media=a4`).expect(200);
    const saved = await owner.put('/api/print-settings/offset', { xMm: 1.5, yMm: -2 }).expect(200);
    expect(saved.body).toEqual({ xMm: 1.5, yMm: -2 });
    expect((await owner.get('/api/print-settings/offset').expect(200)).body).toEqual({ xMm: 1.5, yMm: -2 });
    const after = await getPdf(owner, `/api/boards/${id}/pdf/calibration?media=a4`).expect(200);
    const [a, b] = [inkBox(before.body), inkBox(after.body)];
    // 100 dpi: 1 mm = 100 / 25.4 px (ISO 32000-1 user unit 1/72 in); allow a pixel of rounding
    expect(Math.abs((b.left - a.left) - 1.5 * 100 / 25.4)).toBeLessThanOrEqual(1.5);
    expect(Math.abs((b.top - a.top) - -2 * 100 / 25.4)).toBeLessThanOrEqual(1.5);
  });

  it('when the offset is out of range or a viewer sets it, then 400 with fields, or 403', async () => {
    const { owner } = await ownerWithBoard();
    const bad = await owner.put('/api/print-settings/offset', { xMm: 25, yMm: 'down' }).expect(400);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(['xMm', 'yMm']);
    const viewer = await addMember(t, owner, 'viewer');
    await viewer.put('/api/print-settings/offset', { xMm: 0, yMm: 0 }).expect(403);
    await viewer.get('/api/print-settings/offset').expect(200);
  });

  it('when the calibration page is asked for from the settings, then it prints with no board and carries a 100 mm ruler', async () => {
    const { owner } = await ownerWithBoard();
    const res = await getPdf(owner, '/api/print-settings/calibration?media=a5').expect(200);
    const page = (await PDFDocument.load(res.body)).getPage(0).getSize();
    expect(page.width).toBeCloseTo(419.53, 2); // ISO 216 A5 148 mm
    expect((await pdfPages(res.body)).join(' ')).toMatch(/100 mm/);
    await owner.get('/api/print-settings/calibration?media=b5').expect(400);
  });
});
