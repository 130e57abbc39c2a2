/**
 * The images route: the same labels as the PDF as PNGs for a tape printer's phone app, read back with
 * pngjs, jsQR and poppler (the PDF side), none of which share code with the raster draw step.
 */
import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import jsQR from 'jsqr';
import { PNG } from 'pngjs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signupOwner, startTestApp, type TestApp } from '../helpers/app.js';
import { addMember, createBoardWith, makeSchedule } from '../helpers/boards.js';
import { readZipEntries } from '../helpers/zip.js';
import { getBinary, postBinary } from './print-support.js';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => {
  await t.close();
});

const MM_PER_INCH = 25.4; // ISO 80000-1: 1 in = 25.4 mm exactly
const pixels = (mm: number, dpi: number) => Math.round((mm * dpi) / MM_PER_INCH);

async function ownerWithBoard(circuits = 4) {
  const owner = await signupOwner(t.app);
  const { id } = await createBoardWith(owner, makeSchedule(circuits));
  // The tag carries its QR code only while the board page is on.
  await owner.patch(`/api/boards/${id}/public`).send({ enabled: true }).expect(200);
  const summary = (await owner.get(`/api/boards/${id}`).expect(200)).body as { code: string; publicToken: string };
  return { owner, id, ...summary };
}

/** Black pixels of PDF page `page` as poppler renders it at `dpi` (grey below half counts as black). */
function pdfPageInk(pdf: Buffer, page: number, dpi: number): number {
  const dir = mkdtempSync(join(tmpdir(), 'waymark-images-'));
  try {
    writeFileSync(join(dir, 'in.pdf'), pdf);
    execFileSync('/usr/bin/pdftoppm', [
      '-r',
      String(dpi),
      '-f',
      String(page),
      '-l',
      String(page),
      '-singlefile',
      '-gray',
      '-png',
      join(dir, 'in.pdf'),
      join(dir, 'out'),
    ]);
    return ink(PNG.sync.read(readFileSync(join(dir, 'out.png'))));
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

function ink(png: PNG): number {
  let n = 0;
  for (let i = 0; i < png.data.length; i += 4) if (png.data[i] < 128) n++;
  return n;
}

describe('labels as images', () => {
  it("when the tag is asked for as an image, then one PNG comes back at the tape's size whose QR code opens the board page", async () => {
    const { owner, id, code, publicToken } = await ownerWithBoard();
    const res = await getBinary(owner, `/api/boards/${id}/image/tag?media=tape-24&dpi=180`).expect(200);
    expect(res.headers['content-type']).toBe('image/png');
    expect(res.headers['content-disposition']).toBe(`attachment; filename="${code}-tag-tape-24-180dpi.png"`);
    expect(res.headers['x-waymark-image-count']).toBe('1');
    const png = PNG.sync.read(res.body);
    expect(png.height).toBe(pixels(24, 180)); // 24 mm tape across the image // common practice
    const decoded = jsQR.default(new Uint8ClampedArray(png.data), png.width, png.height); // ISO/IEC 18004 reader (jsQR)
    expect(decoded?.data).toBe(`${t.ctx.config.publicBaseUrl}/b/${publicToken}`);
  });

  it('when several flags are asked for, then a ZIP holds one PNG a label, numbered in print order, each matching its PDF page', async () => {
    const { owner, id, code } = await ownerWithBoard(3);
    const dpi = 203; // common practice: a usual thermal head
    const zip = await getBinary(owner, `/api/boards/${id}/image/flags?media=tape-12&dpi=${dpi}`).expect(200);
    expect(zip.headers['content-type']).toBe('application/zip');
    const pdf = await getBinary(owner, `/api/boards/${id}/pdf/flags?media=tape-12`).expect(200);
    const pages = Number(pdf.headers['x-waymark-page-count']);
    const entries = readZipEntries(zip.body);
    expect(entries.map((e) => e.name)).toEqual(
      Array.from({ length: pages }, (_, i) => `${code}-flags-tape-12-${dpi}dpi-${String(i + 1).padStart(2, '0')}.png`),
    );
    expect(zip.headers['x-waymark-image-count']).toBe(String(pages));
    const inks = entries.map((e) => ink(PNG.sync.read(e.data)));
    const pdfInks = Array.from({ length: pages }, (_, i) => pdfPageInk(pdf.body, i + 1, dpi));
    // Image n is PDF page n: its ink is within a fifth of that page's, and where two pages' inks differ
    // clearly (their labels differ in length), the images differ the same way round.
    inks.forEach((n, i) => {
      expect(Math.abs(n - pdfInks[i]) / pdfInks[i]).toBeLessThan(0.2);
      pdfInks.forEach((p, j) => {
        if (Math.abs(p - pdfInks[i]) > 0.15 * pdfInks[i]) expect(Math.sign(inks[j] - n)).toBe(Math.sign(p - pdfInks[i]));
      });
    });
    expect(Math.max(...pdfInks) / Math.min(...pdfInks)).toBeGreaterThan(1.15);
    for (const e of entries) expect(PNG.sync.read(e.data).height).toBe(pixels(12, dpi)); // 12 mm tape // common practice
  });

  it('when a viewer asks, then the images come back; a GET never records, a POST does', async () => {
    const { owner, id } = await ownerWithBoard();
    const viewer = await addMember(t, owner, 'viewer');
    await getBinary(viewer, `/api/boards/${id}/image/tag?media=tape-24`).expect(200);
    const refused = await viewer.get(`/api/boards/${id}/image/tag?media=tape-24&record=1`).expect(400);
    expect(refused.body.error.fields.record).toBeTruthy();
    await postBinary(viewer, `/api/boards/${id}/image/tag?media=tape-24&dpi=300`).expect(200);
    const history = (await viewer.get(`/api/boards/${id}/prints`).expect(200)).body.items;
    expect(history).toHaveLength(1);
    expect(history[0]).toMatchObject({ output: 'tag', media: 'tape-24@300dpi' });
  });
});

describe('bad image requests', () => {
  it('when the medium, the resolution or the output is wrong, then 400 names the field', async () => {
    const { owner, id } = await ownerWithBoard();
    const cases: Array<[string, string]> = [
      [`/api/boards/${id}/image/tag?media=tape-99`, 'media'],
      [`/api/boards/${id}/image/tag?media=tape-24&dpi=50`, 'dpi'],
      [`/api/boards/${id}/image/tag?media=tape-24&dpi=2400`, 'dpi'],
      [`/api/boards/${id}/image/tag?media=tape-24&dpi=fine`, 'dpi'],
      [`/api/boards/${id}/image/tag?media=tape-24&dpi=180.5`, 'dpi'],
      [`/api/boards/${id}/image/poster?media=a4`, 'output'],
      [`/api/boards/${id}/image/tag?media=tape-24&colour=red`, ''],
    ];
    for (const [path, field] of cases) {
      const res = await owner.get(path).expect(400);
      if (field) expect(Object.keys(res.body.error.fields)).toContain(field);
      else expect(res.body.error.code).toBeTruthy();
    }
  });

  it("when another organisation's board is asked for, then 404", async () => {
    const { id } = await ownerWithBoard();
    const stranger = await signupOwner(t.app, 'Other Electrical');
    await stranger.get(`/api/boards/${id}/image/tag?media=tape-24`).expect(404);
  });

  it('when a print would make too many flags or too large an image, then 422 says what fits, before drawing', async () => {
    const owner = await signupOwner(t.app);
    const { id } = await createBoardWith(owner, makeSchedule(300));
    const work = await owner.get(`/api/boards/${id}/image/flags?media=tape-12&legs=8&bothEnds=true`).expect(422);
    expect(work.body.error.message).toMatch(/fewer ways|one end/);
    const many = await owner.get(`/api/boards/${id}/image/flags?media=tape-12`).expect(422);
    expect(many.body.error.message).toMatch(/at most 200 go in one: print fewer ways/);
    const started = performance.now();
    const huge = await owner.get(`/api/boards/${id}/image/chart?media=custom-2000x2000&dpi=600`).expect(422);
    expect(huge.body.error.fields.dpi).toMatch(/lower dpi/);
    expect(performance.now() - started).toBeLessThan(5000); // refused from the sizes, not after drawing 1.5 GP
  });
});

describe('the calibration image', () => {
  it('when the calibration page is asked for as an image on 12 mm tape, then one PNG 120 mm long comes back', async () => {
    const { owner } = await ownerWithBoard();
    const res = await getBinary(owner, `/api/print-settings/calibration/image?media=tape-12&dpi=360`).expect(200);
    const png = PNG.sync.read(res.body);
    expect([png.width, png.height]).toEqual([pixels(120, 360), pixels(12, 360)]); // 100 mm ruler + 10 mm each end; 12 mm tape
  });
});
