import { describe, expect, it } from 'vitest';
import { layoutOutput, renderOutput } from '../../../server/pdf/index.js';
import { rcdLines } from '../../../server/pdf/layout/chart/header.js';
import { supplyVoltages, supplyVoltageShortText } from '../../../shared/schedule/voltage.js';
import type { Schedule } from '../../../shared/schemas/schedule.js';
import { request, tenCircuitBoard } from './fixtures.js';
import { pdfText, textRuns } from './helpers.js';

const squash = (t: string) => t.replace(/\s+/g, ' ');

function threePhase(nominalVoltage: number): Schedule {
  const s = tenCircuitBoard();
  s.board.phases = 3;
  s.board.supply.nominalVoltage = nominalVoltage;
  return s;
}

describe('one reading of the supply voltage', () => {
  it('when a board records its voltage, then U0 and U between phases follow the usual pairs', () => {
    // BS EN 60038 / BS 7671 Appendix 2: 230/400 V (from memory)
    expect(supplyVoltages(3, 230)).toEqual({ toEarth: 230, betweenPhases: 400 });
    // a three-phase board recorded 400 V means 400 V between phases, 230 V to earth (shared/public reading)
    expect(supplyVoltages(3, 400)).toEqual({ toEarth: 230, betweenPhases: 400 });
    // √3 × 240 = 415.7 V, quoted as 415 V (common practice)
    expect(supplyVoltages(3, 240)).toEqual({ toEarth: 240, betweenPhases: 415 });
    expect(supplyVoltages(3, 415)).toEqual({ toEarth: 240, betweenPhases: 415 });
    expect(supplyVoltages(1, 230)).toEqual({ toEarth: 230, betweenPhases: null });
    expect(supplyVoltageShortText(3, 400)).toBe('400/230 V three-phase');
  });

  for (const recorded of [230, 400]) {
    it(`when a three-phase board recorded as ${recorded} V prints its voltage notice, then it says 400 V, never 690`, async () => {
      const text = squash(await pdfText((await renderOutput(request('notices', 'a4', { kinds: 'voltage' }, threePhase(recorded)))).pdf));
      expect(text).toContain('Danger: 400 volts'); // 230/400 V: BS EN 60038 (from memory)
      expect(text).toContain('400/230 V');
      expect(text).not.toMatch(/690|692/);
    });

    it(`when a three-phase board recorded as ${recorded} V prints its chart, then the supply reads 400/230 V`, async () => {
      const text = squash(await pdfText((await renderOutput(request('chart', 'a4', {}, threePhase(recorded)))).pdf));
      expect(text).toContain('400/230 V three-phase'); // BS EN 60038 (from memory)
      expect(text).not.toMatch(/690/);
    });
  }

  it('when a three-phase board is on 240 V, then the notice says 415 V, not 420', () => {
    const runs = textRuns(layoutOutput(request('notices', 'a4', { kinds: 'voltage' }, threePhase(240))))
      .map((r) => r.text)
      .join(' ');
    expect(runs).toContain('Danger: 415 volts'); // √3 × 240 = 415.7, quoted 415 V (common practice)
    expect(runs).not.toContain('420');
  });
});

describe('chart wording and warnings', () => {
  it('when one way is on an RCBO, then the chart says "way 9", not "ways 9"', () => {
    const s = tenCircuitBoard();
    s.circuits = s.circuits.filter((c) => c.deviceId !== 'd10');
    const line = rcdLines(s).find((l) => l.startsWith('RCBOs'));
    expect(line).toBe('RCBOs (own residual-current protection): way 9'); // English singular (common practice)
    expect(rcdLines(tenCircuitBoard()).find((l) => l.startsWith('RCBOs'))).toBe('RCBOs (own residual-current protection): ways 9 and 10');
  });

  it('when the next inspection date has passed, then the chart prints with a warning naming the date', () => {
    const past = { ...request('chart', 'a4', { showFindings: false }), today: '2031-01-05' }; // fixture's next date is 10 Feb 2030
    const w = layoutOutput(past).warnings.find((x) => x.code === 'inspection-overdue');
    expect(w?.label).toBe('Circuit chart');
    expect(w?.message).toContain('10 Feb 2030');
    expect(layoutOutput({ ...past, today: '2029-12-31' }).warnings.filter((x) => x.code === 'inspection-overdue')).toEqual([]);
  });
});

describe('thin tape notices', () => {
  it('when the 400 V notice goes on tape-12, then its wording is as large as the other notices there', () => {
    const sizes = (kinds: string) => textRuns(layoutOutput(request('notices', 'tape-12', { kinds }, threePhase(400)))).map((r) => r.sizePt);
    const voltage = Math.min(...sizes('voltage'));
    expect(voltage).toBeGreaterThan(6); // above the 6 pt notice floor (NOTICE_MIN_PT, from memory)
    expect(voltage).toBeCloseTo(Math.min(...sizes('inspection')), 1);
  });

  it('when notices go on tape-6, then the refusal names tape-6 as too thin and tape-9 as what works, once', () => {
    expect(() => layoutOutput(request('notices', 'tape-6', { kinds: 'inspection' }))).toThrow(
      'Periodic inspection and testing notice cannot set its wording in at least 6 pt on tape-6: use tape-9 or wider, or a sheet',
    ); // tape-6 prints about 4 mm: common practice
  });
});
