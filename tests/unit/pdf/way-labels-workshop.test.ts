import { describe, expect, it } from 'vitest';
import { layoutOutput, renderOutput } from '../../../server/pdf/index.js';
import { demoSites } from '../../../server/seed/demo-data.js';
import { scheduleSchema, type Schedule } from '../../../shared/schemas/schedule.js';
import { request } from './fixtures.js';
import { pdfText, runsOutside, textRuns } from './helpers.js';

/** The demo's three-phase workshop board: row 2 is six one-module 30 mA RCBOs on 4 L1 … 5 L3. */
function workshop(): Schedule {
  const b = demoSites.flatMap((s) => s.boards).find((x) => x.schedule.board.name === 'Workshop distribution board')!;
  return scheduleSchema.parse(b.schedule);
}

describe('way labels on the workshop board', () => {
  it('when row 2 prints on A4, then every RCBO cell keeps its rating and 30 mA, nothing spills and nothing is cut', async () => {
    const req = request('way-labels', 'a4', {}, workshop());
    const layout = layoutOutput(req);
    // "B20 30 mA" beside "4 L1" takes two lines, so the whole row does, and the print says so.
    expect(layout.warnings.map((w) => w.code)).toEqual(['device-text-wrapped']);
    expect(runsOutside(layout)).toEqual([]);
    const text = (await pdfText((await renderOutput(req)).pdf)).replace(/\s+/g, ' ');
    for (const rating of ['B20', 'B32', 'B10', 'B6', 'B16']) expect(text).toContain(rating); // the demo's RCBO ratings (our scenario)
    expect(text.match(/30 mA/g)).toHaveLength(6); // six 30 mA RCBOs on row 2 (our scenario)
  });

  it('when row 2 prints on tape-24, then its turned cells set their labels at one size', () => {
    const all = textRuns(layoutOutput(request('way-labels', 'tape-24', {}, workshop())));
    const upright = all.find((r) => r.text === 'Dust extractor')!.rotation; // a three-module cell, set along the tape
    const runs = all.filter((r) => r.rotation !== upright && r.face === 'bold' && !/^\d/.test(r.text));
    expect(runs.length).toBeGreaterThanOrEqual(6);
    const sizes = new Set(runs.map((r) => r.sizePt));
    expect([...sizes]).toHaveLength(1); // one size a row, as the upright cells (our layout rule)
    expect([...sizes][0]).toBeGreaterThanOrEqual(5); // tape minimum for way labels, 5 pt (server/pdf README, common practice)
  });

  it('when a device text cannot be set even on two lines, then the print warns instead of dropping it', () => {
    const s = workshop();
    const d = s.devices.find((x) => x.id === 'w4L1')!;
    d.label = '';
    d.residualMa = 300;
    d.rating = 125;
    d.curve = 'C'; // "C125 300 mA": too wide for a 9 mm cell
    const layout = layoutOutput(request('way-labels', 'a4', { pitchMm: 9 }, s));
    expect(layout.warnings.some((w) => w.code === 'text-cut' && /C125 300 mA/.test(w.message))).toBe(true);
  });
});
