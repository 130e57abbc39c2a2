import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { PDFDocument, PDFName, PDFRawStream } from 'pdf-lib';
import { PNG } from 'pngjs';
import jsQR from 'jsqr';
import { client, signupOwner, startTestApp, type TestApp } from '../helpers/app.js';
import { addMember, createBoardWith, makeSchedule } from '../helpers/boards.js';
import { scheduleSchema, type Schedule } from '../../shared/schemas/schedule.js';
import { files } from '../../server/db/schema.js';
import { getPdf, MM, pdfPages, renderPage } from './print-support.js';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => {
  await t.close();
});

/** A board whose page is switched on (a new board's starts off), so its tag and chart carry the QR code. */
async function ownerWithBoard(schedule: Schedule = makeSchedule(6)) {
  const owner = await signupOwner(t.app);
  const board = await createBoardWith(owner, schedule);
  await owner.patch(`/api/boards/${board.id}/public`, { enabled: true }).expect(200);
  const summary = await owner.get(`/api/boards/${board.id}`).expect(200);
  return { owner, id: board.id, code: summary.body.code as string, schedule };
}

describe('printing each output of a stored board', () => {
  it('when each output is asked for, then a PDF comes back, named by board code, output and medium', async () => {
    const { owner, id, code } = await ownerWithBoard();
    const cases = [
      ['flags', 'tape-12'],
      ['way-labels', 'tape-12'],
      ['chart', 'a4'],
      ['notices', 'a4'],
      ['tag', 'tape-24'],
      ['calibration', 'a4'],
    ];
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

  it('when a new board tag is printed before its page is switched on, then the warning says the QR code was left off and how to get it', async () => {
    const owner = await signupOwner(t.app);
    const { id } = await createBoardWith(owner, makeSchedule(3));
    const off = await owner.get(`/api/boards/${id}/pdf/tag/warnings?media=tape-24`).expect(200);
    expect(off.body.warnings).toContainEqual(
      expect.objectContaining({ code: 'qr-left-off', message: expect.stringContaining('switch the page on under Sharing') }),
    );
    await owner.patch(`/api/boards/${id}/public`, { enabled: true }).expect(200);
    const on = await owner.get(`/api/boards/${id}/pdf/tag/warnings?media=tape-24`).expect(200);
    expect(on.body.warnings.map((w: { code: string }) => w.code)).not.toContain('qr-left-off');
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

  it('when the next inspection is already past, then the notices print with a warning naming the inspection notice', async () => {
    const base = makeSchedule(3);
    const schedule = scheduleSchema.parse({ ...base, board: { ...base.board, lastInspectionOn: '2012-03-01', inspectionIntervalMonths: 12 } }); // due 1 Mar 2013: long past
    const { owner, id } = await ownerWithBoard(schedule);
    const check = await owner.get(`/api/boards/${id}/pdf/notices/warnings?media=a4&kinds=inspection`).expect(200);
    expect(check.body.warnings).toEqual([expect.objectContaining({ code: 'inspection-overdue', label: 'Periodic inspection and testing notice' })]);
  });

  it('when the alternative-supply notice cannot show where to isolate on the chosen label, then the print is refused with 422, not cut', async () => {
    const base = makeSchedule(3);
    const where = 'PV isolator and inverter in the loft beside the hatch; battery isolator on the garage wall by the door';
    const schedule = scheduleSchema.parse({
      ...base,
      board: { ...base.board, alternativeSupply: { present: true, kinds: ['pv', 'battery'], description: where } },
    });
    const { owner, id } = await ownerWithBoard(schedule);
    const res = await owner.get(`/api/boards/${id}/pdf/notices?media=custom-40x20&kinds=alternative-supply`).expect(422);
    expect(JSON.stringify(res.body)).toMatch(/alternative-supply notice/);
    const ok = await getPdf(owner, `/api/boards/${id}/pdf/notices?media=a4&kinds=alternative-supply`).expect(200);
    expect((await pdfPages(ok.body)).join(' ')).toContain(where);
  });

  it('when there are very many warnings, then the header stays short and says how many more the warnings call lists', async () => {
    const base = makeSchedule(80);
    const schedule = scheduleSchema.parse({ ...base, circuits: base.circuits.map((c) => ({ ...c, label: `${'W'.repeat(20)}${c.way}`.slice(0, 24) })) });
    const { owner, id } = await ownerWithBoard(schedule);
    const res = await getPdf(owner, `/api/boards/${id}/pdf/flags?media=tape-6`).expect(200);
    expect(res.headers['x-waymark-warnings'].length).toBeLessThanOrEqual(6000);
    const header = JSON.parse(decodeURIComponent(res.headers['x-waymark-warnings']));
    const { warnings } = (await owner.get(`/api/boards/${id}/pdf/flags/warnings?media=tape-6`).expect(200)).body;
    expect(warnings.length).toBeGreaterThan(header.length);
    expect(header.at(-1)).toEqual({ code: 'more-warnings', message: `${warnings.length - header.length + 1} more warnings: see the warnings list` });
  });
});

/** Image XObjects in a PDF (ISO 32000-1 8.9.5: a stream whose /Subtype is /Image). */
async function imageCount(pdf: Buffer): Promise<number> {
  const doc = await PDFDocument.load(pdf);
  return doc.context.enumerateIndirectObjects().filter(([, o]) => o instanceof PDFRawStream && o.dict.get(PDFName.of('Subtype')) === PDFName.of('Image'))
    .length;
}

describe('the board tag', () => {
  it("when the tag is printed, then its QR code, read by an independent decoder, opens this board's public page", async () => {
    const { owner, id } = await ownerWithBoard();
    const { publicToken } = (await owner.get(`/api/boards/${id}`).expect(200)).body;
    const res = await getPdf(owner, `/api/boards/${id}/pdf/tag?media=tape-24`).expect(200);
    const png = renderPage(res.body, 600);
    const decoded = jsQR.default(new Uint8ClampedArray(png.data), png.width, png.height); // ISO/IEC 18004 reader (jsQR)
    expect(decoded?.data).toBe(`${t.ctx.config.publicBaseUrl}/b/${publicToken}`);
  });
});

describe("the contractor's logo", () => {
  it('when the organisation has uploaded a logo, then the chart carries it as an image', async () => {
    const { owner, id } = await ownerWithBoard();
    const without = await getPdf(owner, `/api/boards/${id}/pdf/chart`).expect(200);
    expect(await imageCount(without.body)).toBe(0);
    const png = new PNG({ width: 40, height: 20 });
    png.data.fill(0x80);
    const data = PNG.sync.write(png, { colorType: 2 }); // RGB without alpha, so no soft mask image beside it
    const me = await owner.get('/api/auth/me').expect(200);
    await t.database.db.insert(files).values({ organisationId: me.body.organisation.id, kind: 'logo', mime: 'image/png', size: data.length, data });
    const withLogo = await getPdf(owner, `/api/boards/${id}/pdf/chart`).expect(200);
    expect(await imageCount(withLogo.body)).toBe(1);
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
