import { describe, expect, it } from 'vitest';
import { CHECKS_CAUTION, checkSchedule, DEFAULT_RULE_SET_ID, getRuleSet, maxZsByCircuit, maxZsFor, ruleSets } from '../../../shared/rules/index.js';
import { makeSchedule, TODAY } from './fixtures.js';

const messy = () =>
  makeSchedule({
    board: { lastInspectionOn: null, installedOn: null },
    devices: [
      { id: 'a', row: 1, kind: 'mcb', rating: 32, curve: 'B' },
      { id: 'b', row: 1, kind: 'mcb', rating: 6, curve: 'C' },
    ],
    circuits: [
      { way: 2, deviceId: 'a', kind: 'radial', socketOutlets: true, measuredZs: 1.2, cable: { liveCsa: 2.5, cpcCsa: 1.5, referenceMethod: 'C' } },
      { way: 1, deviceId: 'b', kind: 'lighting' },
    ],
  });

describe('rule set registry', () => {
  it('when no id is given, then the BS 7671:2018+A2 rule set runs', () => {
    expect(DEFAULT_RULE_SET_ID).toBe('bs7671-2018-a2');
    expect([...ruleSets.keys()]).toContain('bs7671-2018-a2');
    expect(checkSchedule(messy(), { today: TODAY })).toEqual(checkSchedule(messy(), { today: TODAY }, 'bs7671-2018-a2'));
  });

  it('when an unknown rule set is asked for, then it throws naming the known ones', () => {
    expect(() => getRuleSet('nowhere-1999')).toThrow(/bs7671-2018-a2/);
  });

  it('when findings come back, then errors come first, then warnings, then info, each in way order', () => {
    const severities = checkSchedule(messy(), { today: TODAY }).map((f) => f.severity);
    expect(severities.length).toBeGreaterThan(3);
    expect(severities).toEqual([...severities].sort((a, b) => ['error', 'warning', 'info'].indexOf(a) - ['error', 'warning', 'info'].indexOf(b)));
    const errors = checkSchedule(messy(), { today: TODAY }).filter((f) => f.severity === 'error');
    expect(errors.map((f) => f.ways[0])).toEqual([1, 2, 2]);
  });

  it('when the chart asks for max Zs by circuit, then each circuit id maps to its Table 41.3 value', () => {
    const s = messy();
    expect(maxZsByCircuit(s)).toEqual({ c1: 1.37, c2: 3.64 }); // BS 7671:2018+A2 Table 41.3: B32 1.37 Ω, C6 3.64 Ω
    expect(maxZsFor(s, s.circuits[1])).toBe(3.64);
  });

  it('when findings are shown, then the caution says the checks do not replace judgement', () => {
    expect(CHECKS_CAUTION).toMatch(/do not replace the judgement/);
  });
});
