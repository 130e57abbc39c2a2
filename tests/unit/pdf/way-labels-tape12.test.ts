/**
 * Way labels on 12 mm tape (9 mm printable band): every cell of a strip carries its device text, all
 * at one size. Text is read back from the PDF by pdf-parse; sizes and cells come from the layout.
 */
import { describe, expect, it } from 'vitest';
import { layoutOutput, renderOutput } from '../../../server/pdf/index.js';
import { deviceShortText } from '../../../shared/schedule/derive.js';
import { demoSites } from '../../../server/seed/demo-data.js';
import { scheduleSchema, type Schedule } from '../../../shared/schemas/schedule.js';
import { boardSchedule, request } from './fixtures.js';
import { pdfText, runsOutside, textRuns } from './helpers.js';

const TAPE_MIN_PT = 5; // tape minimum for way labels (server/pdf README, common practice)

/** The demo's three-phase workshop board: row 2 is six one-module 30 mA RCBOs on 4 L1 … 5 L3 (our scenario). */
function workshop(): Schedule {
  const b = demoSites.flatMap((s) => s.boards).find((x) => x.schedule.board.name === 'Workshop distribution board')!;
  return scheduleSchema.parse(b.schedule);
}

/** Each RCBO's device text, as the label should print it ("B20 30 mA"). */
const rcboTexts = (s: Schedule, row: number) => s.devices.filter((d) => d.row === row && d.kind === 'rcbo').map(deviceShortText);

const occurrences = (text: string, word: string) => text.split(word).length - 1;

describe('way labels on 12 mm tape', () => {
  for (const [name, schedule, row] of [
    ['the workshop board, row 2 (three-phase way numbers "4 L1")', workshop(), 2],
    ['an 18-way row of RCBOs (ways 1 to 18)', boardSchedule(18), 1],
  ] as const) {
    it(`when ${name} prints, then every cell has its device text, all at one size, and nothing is cut`, async () => {
      const req = request('way-labels', 'tape-12', {}, schedule);
      const expected = rcboTexts(schedule, row);
      expect(expected.length).toBeGreaterThanOrEqual(6);

      const text = (await pdfText((await renderOutput(req)).pdf)).replace(/\s+/g, ' ');
      for (const t of new Set(expected)) expect(occurrences(text, t)).toBe(expected.filter((e) => e === t).length);

      const layout = layoutOutput(req);
      expect(runsOutside(layout)).toEqual([]);
      expect(layout.warnings.filter((w) => w.code === 'text-cut' && /mA/.test(w.message))).toEqual([]);
      const deviceRuns = textRuns(layout).filter((r) => expected.includes(r.text));
      expect(deviceRuns).toHaveLength(expected.length);
      const sizes = new Set(deviceRuns.map((r) => r.sizePt));
      expect(sizes.size).toBe(1); // one size a strip (our layout rule)
      expect([...sizes][0]).toBeGreaterThanOrEqual(TAPE_MIN_PT);
      // Each device text sits in its own cell: no two share a cell box.
      expect(new Set(deviceRuns.map((r) => `${r.cell.x.toFixed(3)},${r.cell.y.toFixed(3)}`)).size).toBe(expected.length);
    });
  }

  it('when only a changed way is reprinted, then its device text has the size the whole strip uses', () => {
    const s = workshop();
    const whole = textRuns(layoutOutput(request('way-labels', 'tape-12', {}, s))).find((r) => r.text === 'B20 30 mA')!;
    const way = s.circuits.find((c) => c.deviceId === s.devices.find((d) => d.row === 2 && d.kind === 'rcbo')!.id)!.way;
    const one = textRuns(layoutOutput({ ...request('way-labels', 'tape-12', {}, s), onlyWays: [way] })).find((r) => r.text === 'B20 30 mA')!;
    expect(one.sizePt).toBe(whole.sizePt);
  });
});
