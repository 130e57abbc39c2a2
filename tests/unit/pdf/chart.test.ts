import { describe, expect, it } from 'vitest';
import { layoutOutput, LayoutError, renderOutput } from '../../../server/pdf/index.js';
import { RED } from '../../../server/pdf/model.js';
import { PNG } from 'pngjs';
import { boardSchedule, contractor, maxZsByCircuit, request, tenCircuitBoard } from './fixtures.js';
import { pdfText, rasterise, runsOutside, textRuns } from './helpers.js';

describe('circuit chart', () => {
  it('when ten circuits print on A4 with findings asked for, then one page holds the header, every way, the findings and the caution', () => {
    const layout = layoutOutput(request('chart', 'a4', { showFindings: true }));
    expect(layout.pages).toHaveLength(1);
    const text = textRuns(layout)
      .map((r) => r.text)
      .join(' ');
    for (const part of [
      'Circuit chart',
      'Main consumer unit',
      'Brightwell & Daughters Electrical',
      'Supply: TN-C-S',
      'RCD 2',
      'Findings at revision 6',
      'Caution:',
    ])
      expect(text).toContain(part);
    expect(runsOutside(layout)).toEqual([]);
  });

  it('when a hundred circuits print, then the table runs over pages with its header row and the board named on each', async () => {
    const schedule = boardSchedule(100);
    const req = request('chart', 'a4', {}, schedule);
    const layout = layoutOutput(req);
    expect(layout.pages.length).toBeGreaterThan(3);
    layout.pages.forEach((page, i) => {
      const texts = page.items.filter((it) => it.kind === 'text').map((it) => (it.kind === 'text' ? it.text : ''));
      expect(texts.join(' ')).toContain('Max Zs');
      expect(texts.join(' ')).toContain(`page ${i + 1} of ${layout.pages.length}`);
      if (i > 0) expect(texts.join(' ')).toContain('(continued)');
    });
    expect(runsOutside(layout)).toEqual([]);
    const text = (await pdfText((await renderOutput(req)).pdf)).replace(/\s+/g, ' ');
    for (const c of schedule.circuits) expect(text).toContain(c.label);
  });

  it('when a description is long, then it wraps inside its cell and the row grows to hold it', () => {
    const schedule = tenCircuitBoard();
    schedule.circuits[3].description =
      'Cooker control unit beside the hob, with the oven spur behind the tall larder unit and a second switch by the back door for the hob extractor';
    const layout = layoutOutput(request('chart', 'a4', {}, schedule));
    const cooker = textRuns(layout).filter((r) => /hob|oven|larder|extractor/.test(r.text));
    expect(cooker.length).toBeGreaterThanOrEqual(3);
    expect(new Set(cooker.map((r) => r.cell.y)).size).toBe(1);
    expect(runsOutside(layout)).toEqual([]);
  });

  it('when the chart goes on A5, landscape or a board-door size, then it lays out within that page', () => {
    for (const media of ['a5', 'a4-landscape', 'a5-landscape', 'custom-250x180']) {
      const layout = layoutOutput(request('chart', media));
      expect(runsOutside(layout)).toEqual([]);
      expect(layout.pages[0].widthMm).toBe(
        request('chart', media).medium.kind === 'page' ? (request('chart', media).medium as { widthMm: number }).widthMm : 0,
      );
    }
  });

  it('when findings are switched off, or not asked for (the default: the door chart carries the schedule), then the chart leaves them out', () => {
    for (const options of [{ showFindings: false }, {}]) {
      const text = textRuns(layoutOutput(request('chart', 'a4', options)))
        .map((r) => r.text)
        .join(' ');
      expect(text).not.toContain('Findings at revision');
      expect(text).not.toContain('Zs was measured cold');
    }
  });

  it('when a measured Zs is above the maximum passed in, then it is marked', () => {
    const req = { ...request('chart', 'a4'), maxZsByCircuit: { c7: 0.3 } };
    const runs = textRuns(layoutOutput(req));
    expect(runs.find((r) => r.text === '0.38')?.color).toEqual(RED);
    expect(
      runs
        .filter((r) => r.color === RED)
        .map((r) => r.text)
        .join(' '),
    ).toBe('0.38 over max');
  });

  it('when a TT board has readings in the hundreds and thousands of ohms, then the header and Zs cells print them whole, inside every page size', () => {
    const schedule = tenCircuitBoard();
    schedule.board.supply = { ...schedule.board.supply, earthing: 'TT', ze: 1450.5 }; // within the schema's 2000 Ω cap
    schedule.circuits[0].measuredZs = 1850; // over 1667 Ω, BS 7671:2018+A2 Table 41.5 for 30 mA (50 V / 0.03 A, from memory)
    schedule.circuits[1].measuredZs = 1520;
    for (const media of ['a4', 'a5', 'a5-landscape']) {
      const req = { ...request('chart', media, {}, schedule), maxZsByCircuit: { ...maxZsByCircuit, c1: 1667, c2: 1667 } };
      const layout = layoutOutput(req);
      const runs = textRuns(layout);
      expect(runs.map((r) => r.text).join(' ')).toContain('Ze 1450.5 Ω');
      expect(
        runs
          .filter((r) => r.color === RED)
          .map((r) => r.text)
          .join(' '),
      ).toBe('1850 over max');
      expect(runs.some((r) => r.text === '1520')).toBe(true);
      expect(runs.filter((r) => r.text === '1667')).toHaveLength(2);
      expect(runsOutside(layout)).toEqual([]);
    }
  });

  it('when the contractor has a logo, then it is drawn in the header at its own proportions', async () => {
    const png = new PNG({ width: 40, height: 20 });
    for (let i = 0; i < png.data.length; i += 4) png.data.set([200, 20, 20, 255], i);
    const req = { ...request('chart', 'a4'), contractor: { ...contractor, logo: { bytes: new Uint8Array(PNG.sync.write(png)), mime: 'image/png' as const } } };
    const image = layoutOutput(req).pages[0].items.find((i) => i.kind === 'image');
    if (image?.kind !== 'image') throw new Error('no logo in the layout');
    expect(image.box.w / image.box.h).toBeCloseTo(2, 6);
    const result = await renderOutput(req);
    expect(result.warnings).toEqual([]);
    const px = rasterise(result.pdf, 72, 1, image.box);
    const red = Array.from({ length: px.width * px.height }, (_, i) => px.data[4 * i] > 150 && px.data[4 * i + 1] < 80).filter(Boolean).length;
    expect(red / (px.width * px.height)).toBeGreaterThan(0.8);
  });

  it('when the logo bytes are broken, then the chart still prints and says the logo was left off', async () => {
    const bad = new Uint8Array(64);
    bad.set([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13, 0x49, 0x48, 0x44, 0x52, 0, 0, 0, 40, 0, 0, 0, 20]);
    const result = await renderOutput({ ...request('chart', 'a4'), contractor: { ...contractor, logo: { bytes: bad, mime: 'image/png' } } });
    expect(result.warnings.map((w) => w.code)).toContain('logo-left-off');
  });

  it('when a thousand circuits print, then the table runs on over about ten times the continuation pages', () => {
    const hundred = layoutOutput(request('chart', 'a4', {}, boardSchedule(100))).pages.length;
    const thousand = layoutOutput(request('chart', 'a4', {}, boardSchedule(1000)));
    // The first page carries the header, so compare the pages after it.
    expect(thousand.pages.length - 1).toBeGreaterThanOrEqual(9 * (hundred - 1));
    expect(thousand.pages.length - 1).toBeLessThanOrEqual(11 * hundred);
    expect(runsOutside(thousand)).toEqual([]);
  });

  it('when the chart is asked for on tape or a page too small, then a LayoutError says what to choose', () => {
    expect(() => layoutOutput(request('chart', 'tape-24'))).toThrow(LayoutError);
    expect(() => layoutOutput(request('chart', 'custom-100x100'))).toThrow(/at least 120/);
  });
});
