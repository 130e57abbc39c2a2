import { describe, expect, it } from 'vitest';
import { layoutOutput, LayoutError, renderOutput } from '../../../server/pdf/index.js';
import { NOTICE_MIN_PT } from '../../../server/pdf/layout/notices.js';
import { runBox, type LayoutDoc, type TextRun } from '../../../server/pdf/model.js';
import type { Schedule } from '../../../shared/schemas/schedule.js';
import { request, tenCircuitBoard } from './fixtures.js';
import { luminance, pageSizesPt, pdfText, PT_PER_MM, rasterise, runsOutside, textRuns } from './helpers.js';

const ALL = 'inspection,rcd-test,mixed-colours,alternative-supply,voltage,earthing';
/** Where to isolate each source: invented for the test, long enough to need room. */
const WHERE =
  '4 kWp PV array on the south roof, isolator and inverter in the loft beside the hatch; 5 kWh battery in the garage with its own isolator on the wall by the door';

function busyBoard(): Schedule {
  const s = tenCircuitBoard();
  s.board.mixedWiringColours = true;
  s.board.phases = 3;
  s.board.alternativeSupply = { present: true, kinds: ['pv', 'battery'], description: WHERE };
  return s;
}

const squash = (t: string) => t.replace(/\s+/g, ' ');
const pageRuns = (layout: LayoutDoc, i: number) => layout.pages[i].items.filter((it): it is TextRun => it.kind === 'text');

describe('notices fit their wording', () => {
  it('when every notice goes on tape-24, then each is as long as its wording (not a fixed metre), nothing is cut and the title is the largest type', async () => {
    const req = request('notices', 'tape-24', { kinds: ALL, earthingCount: 1 }, busyBoard());
    const layout = layoutOutput(req);
    expect(layout.warnings).toEqual([]);
    expect(runsOutside(layout)).toEqual([]);
    const result = await renderOutput(req);
    const sizes = pageSizesPt(result.pdf);
    expect(sizes).toHaveLength(6);
    for (const s of sizes) {
      expect(s.w / PT_PER_MM).toBeCloseTo(24, 1); // tape-24 is 24 mm wide
      // Short of the 1000 mm maximum label length (common practice); the RCD notice's prescribed wording (514.12.2, ~330 characters) is the longest.
      expect(s.h / PT_PER_MM).toBeLessThan(600);
      expect(s.h / PT_PER_MM).toBeGreaterThan(60);
    }
    layout.pages.forEach((_, i) => {
      const runs = pageRuns(layout, i);
      const titleSize = runs[0].sizePt; // the title is set first
      for (const r of runs) {
        expect(r.sizePt).toBeGreaterThanOrEqual(NOTICE_MIN_PT - 1e-9);
        expect(r.sizePt).toBeLessThanOrEqual(titleSize + 1e-9);
      }
    });
    const text = squash(await pdfText(result.pdf));
    for (const reg of ['514.12.1', '514.12.2', '514.14.1', '514.15.1', '514.10.1', '514.13.1']) expect(text).toContain(`BS 7671 ${reg}`); // BS 7671 Section 514
    expect(text).toContain('Date of last inspection: 10 Feb 2025'); // BS 7671 514.12.1 (from memory)
    expect(text).toContain('Recommended date of next inspection: 10 Feb 2030'); // BS 7671 514.12.1 (from memory)
  });

  it('when tape-24 notices are rendered, then the regulation reference at the far end is inked inside the label', async () => {
    const req = request('notices', 'tape-24', { kinds: 'alternative-supply' }, busyBoard());
    const layout = layoutOutput(req);
    const reg = pageRuns(layout, 0).find((r) => r.text === 'BS 7671 514.15.1')!; // BS 7671 514.15.1
    expect(reg).toBeDefined();
    const box = runBox(reg);
    expect(box.y + box.h).toBeLessThanOrEqual(layout.pages[0].heightMm);
    const png = rasterise((await renderOutput(req)).pdf, 300, 1, box);
    expect([...luminance(png)].filter((v) => v < 100).length).toBeGreaterThan(20);
  });

  it('when the alternative-supply notice has a long "where to isolate" note, then on A4 it is set whole and at least 6 pt', async () => {
    const req = request('notices', 'a4', { kinds: 'alternative-supply' }, busyBoard());
    const layout = layoutOutput(req);
    expect(layout.warnings).toEqual([]);
    expect(runsOutside(layout)).toEqual([]);
    for (const r of textRuns(layout)) expect(r.sizePt).toBeGreaterThanOrEqual(NOTICE_MIN_PT - 1e-9);
    expect(squash(await pdfText((await renderOutput(req)).pdf))).toContain(WHERE);
  });

  it('when an even longer note needs more room on a sheet, then the notice grows rather than cuts', () => {
    const s = busyBoard();
    s.board.alternativeSupply.description = `${WHERE}. ${WHERE}. ${WHERE}. ${WHERE.toUpperCase()}`.slice(0, 500);
    const layout = layoutOutput(request('notices', 'a4', { kinds: 'alternative-supply' }, s));
    expect(layout.warnings).toEqual([]);
    const frame = layout.pages[0].items.find((i) => i.kind === 'rect' && i.dashMm);
    expect(frame && frame.kind === 'rect' && frame.box.h).toBeGreaterThan(58); // grown past the 120 × 58 mm tile
    expect(
      squash(
        textRuns(layout)
          .map((r) => r.text)
          .join(' '),
      ),
    ).toContain(s.board.alternativeSupply.description.slice(-40));
    for (const r of textRuns(layout)) expect(r.sizePt).toBeGreaterThanOrEqual(NOTICE_MIN_PT - 1e-9);
  });

  it('when the alternative-supply notice goes on thin tape, then the note is never cut: the notice is longer', async () => {
    const req = request('notices', 'tape-12', { kinds: 'alternative-supply' }, busyBoard());
    const layout = layoutOutput(req);
    expect(layout.warnings).toEqual([]);
    expect(runsOutside(layout)).toEqual([]);
    expect(squash(await pdfText((await renderOutput(req)).pdf))).toContain(WHERE);
  });

  it('when the alternative-supply notice cannot carry its note legibly on the label, then the print is refused naming the notice', () => {
    const run = () => layoutOutput(request('notices', 'custom-40x20', { kinds: 'alternative-supply' }, busyBoard()));
    expect(run).toThrow(LayoutError);
    expect(run).toThrow(/alternative-supply notice \(BS 7671 514\.15\.1\).*6 pt/);
  });

  it('when notices go on tape-6, then they are refused: two lines of 6 pt do not fit its band', () => {
    expect(() => layoutOutput(request('notices', 'tape-6', { kinds: 'inspection' }))).toThrow(/tape-9 or wider/); // tape-6 prints about 4 mm: common practice
  });

  it('when the mixed-colours notice prints, then its "Older" and "Current" lines are one size', () => {
    const runs = textRuns(layoutOutput(request('notices', 'a4', { kinds: 'mixed-colours' }, busyBoard())));
    const older = runs.find((r) => r.text.startsWith('Older:'))!;
    const current = runs.find((r) => r.text.startsWith('Current:'))!;
    expect(older.sizePt).toBe(current.sizePt);
    expect(older.face).toBe(current.face);
  });

  it('when a three-phase board prints its voltage notice, then the supply reads 400/230 V', async () => {
    const text = squash(await pdfText((await renderOutput(request('notices', 'a4', { kinds: 'voltage' }, busyBoard()))).pdf));
    expect(text).toContain('400/230 V'); // 230 V × √3 ≈ 400 V line to line (BS 7671 Appendix 2 / common practice)
    expect(text).toContain('Danger: 400 volts');
  });

  it('when the next inspection date has already passed, then the print warns, naming the inspection notice', () => {
    const past = { ...request('notices', 'a4', { kinds: 'inspection' }), today: '2031-01-05' }; // fixture's next date is 10 Feb 2030
    const warning = layoutOutput(past).warnings.find((w) => w.code === 'inspection-overdue');
    expect(warning?.label).toBe('Periodic inspection and testing notice');
    expect(warning?.message).toContain('10 Feb 2030');
    const future = { ...request('notices', 'a4', { kinds: 'inspection' }), today: '2029-12-31' };
    expect(layoutOutput(future).warnings).toEqual([]);
  });
});
