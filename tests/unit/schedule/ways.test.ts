/**
 * A spare way is a way: the way labels, the chart and the board page count the same ways, and each
 * lists the spare by its number. The PDFs are read back with pdf-parse, not our layout model.
 */
import { describe, expect, it } from 'vitest';
import { buildTemplate, scheduleTemplates } from '../../../shared/schedule/templates.js';
import { boardWays, spareWays, wayCount } from '../../../shared/schedule/ways.js';
import { toPublicBoard } from '../../../shared/public/board-page.js';
import { publicBoardSchema } from '../../../shared/schemas/public-board.js';
import { scheduleSchema } from '../../../shared/schemas/schedule.js';
import { renderOutput } from '../../../server/pdf/index.js';
import { request } from '../pdf/fixtures.js';
import { pdfText } from '../pdf/helpers.js';

const meta = {
  organisation: { name: 'Lanternfield Electrical', contactPhone: '', contactEmail: '' },
  hasLogo: false,
  revision: 1,
  revisionDate: '2026-01-05',
  nextInspectionOn: null,
};

describe('spare ways', () => {
  it('when a single-phase board is made from each starting layout, then it has as many ways as the layout is named for', () => {
    // On a three-phase board "12-way" counts triple-pole ways (12 × L1–L3), so only single-phase layouts compare by name.
    for (const t of scheduleTemplates.filter((t) => !t.name.startsWith('3-phase'))) {
      const ways = Number(/(\d+)-way/.exec(t.name)![1]);
      expect(wayCount(buildTemplate(t.id)), t.name).toBe(ways);
    }
  });

  it('when the 10-way layout has way 10 spare, then the chart and the way labels both print way 10 as Spare, and the board page lists ten ways', async () => {
    const schedule = buildTemplate('split-load-10');
    expect(spareWays(schedule).map((s) => s.wayText)).toEqual(['10']);
    const chart = (await pdfText((await renderOutput(request('chart', 'a4', {}, schedule))).pdf)).replace(/\s+/g, ' ');
    expect(chart).toMatch(/\b10 Spare B16\b/);
    const labels = (await pdfText((await renderOutput(request('way-labels', 'a4', {}, schedule))).pdf)).replace(/\s+/g, ' ');
    expect(labels).toMatch(/\b10 B16 Spare\b|\b10 Spare\b/);
    const page = publicBoardSchema.parse(toPublicBoard(schedule, meta));
    expect(page.ways.map((w) => w.wayText)).toEqual(['1', '2', '3', '4', '5', '6', '7', '8', '9', '10']);
    expect(page.ways[9]).toMatchObject({ label: 'Spare', spare: true, device: 'MCB B16', rcd: { kind: 'rcd', name: 'RCD 2' } });
  });

  it('when spare ways sit between circuits on two rows, then each takes the next number after the way before it, in way order', () => {
    const ways = boardWays(buildTemplate('dual-rcd-18')).map((w) => (w.kind === 'circuit' ? `${w.circuit.way}` : `${w.spare.wayText} spare`));
    expect(ways.slice(6, 10)).toEqual(['7', '8 spare', '9 spare', '10']);
    expect(ways.slice(-2)).toEqual(['17 spare', '18 spare']);
  });

  it('when a spare device comes before any circuit on the rail, then it is still a way, listed last with no number', () => {
    const schedule = scheduleSchema.parse({
      board: { name: 'Garage board', supply: { earthing: 'TT' } },
      devices: [
        { id: 'a', row: 1, kind: 'rcbo', rating: 16, curve: 'B', residualMa: 30 },
        { id: 'b', row: 1, kind: 'rcbo', rating: 20, curve: 'B', residualMa: 30 },
      ],
      circuits: [{ id: 'c1', way: 1, deviceId: 'b', label: 'Garage sockets', kind: 'radial', cable: { type: 'twin-earth' } }],
    });
    const ways = boardWays(schedule);
    expect(ways.map((w) => w.kind)).toEqual(['circuit', 'spare']);
    expect(toPublicBoard(schedule, meta).ways[1]).toMatchObject({ way: null, wayText: '', label: 'Spare' });
  });
});
