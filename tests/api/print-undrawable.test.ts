/**
 * A stored board whose labels hold characters the printing fonts cannot draw: the PDF's warnings
 * header, the print page's `/warnings` answer and the tape images all name the characters and the
 * label, and the PDF itself carries the visible substitute (read back by pdf-parse).
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signupOwner, startTestApp, type TestApp } from '../helpers/app.js';
import { createBoardWith, makeSchedule } from '../helpers/boards.js';
import type { PrintWarning } from '../../shared/schemas/print.js';
import { getBinary, getPdf, pdfPages } from './print-support.js';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => {
  await t.close();
});

async function boardWithLabel(label: string) {
  const owner = await signupOwner(t.app);
  const schedule = makeSchedule(3);
  schedule.circuits[1].label = label;
  const board = await createBoardWith(owner, schedule);
  return { owner, id: board.id, way: schedule.circuits[1].way };
}

const undrawable = (warnings: PrintWarning[]) => warnings.filter((w) => w.code === 'undrawable-characters');
const fromHeader = (header: string) => JSON.parse(decodeURIComponent(header)) as PrintWarning[];

describe('labels the printing fonts cannot draw', () => {
  it('when a label holds 配電, then the PDF header and the /warnings answer name both characters and the way, and the PDF shows □□', async () => {
    const { owner, id, way } = await boardWithLabel('配電 board');
    const pdf = await getPdf(owner, `/api/boards/${id}/pdf/way-labels?media=tape-12`).expect(200);
    const header = undrawable(fromHeader(pdf.headers['x-waymark-warnings']));
    expect(header).toHaveLength(1);
    expect(header[0].label).toBe(`Way ${way} label`);
    expect(header[0].message).toContain('"配" (U+914D)'); // Unicode code chart CJK Unified Ideographs
    expect(header[0].message).toContain('"電" (U+96FB)');
    const text = (await pdfPages(pdf.body)).join(' ');
    expect(text).toContain('□□');
    expect(text).not.toContain('\ufffd');

    const checked = await owner.get(`/api/boards/${id}/pdf/chart/warnings?media=a4`).expect(200);
    expect(undrawable(checked.body.warnings).map((w: PrintWarning) => w.label)).toEqual([`Way ${way} label`]);
  });

  it('when the same board is drawn as tape images, then the images answer carries the same warning', async () => {
    const { owner, id, way } = await boardWithLabel('Lights 💡');
    const res = await getBinary(owner, `/api/boards/${id}/image/way-labels?media=tape-12&dpi=180`).expect(200);
    const warning = undrawable(fromHeader(res.headers['x-waymark-warnings']))[0];
    expect(warning.label).toBe(`Way ${way} label`);
    expect(warning.message).toContain('"💡" (U+1F4A1)'); // Unicode code chart Miscellaneous Symbols and Pictographs
  });

  it('when a label is Hebrew with an English word, then it prints without such a warning and the English word extracts forwards', async () => {
    const { owner, id } = await boardWithLabel('מטבח Boiler');
    const pdf = await getPdf(owner, `/api/boards/${id}/pdf/flags?media=a4`).expect(200);
    expect(undrawable(fromHeader(pdf.headers['x-waymark-warnings']))).toEqual([]);
    const text = (await pdfPages(pdf.body)).join(' ');
    expect(text).toContain('Boiler');
    expect(text).not.toContain('relioB');
  });
});
