import { describe, expect, it } from 'vitest';
import { EMPTY_READINGS, type CircuitReadings } from '../../../shared/schemas/survey.js';
import { judgeRcdTrip, judgeReadings, type ReadingContext } from '../../../shared/rules/bs7671/readings.js';
import { oneCircuit, withCode } from './fixtures.js';

const readings = (over: Partial<CircuitReadings>): CircuitReadings => ({ ...structuredClone(EMPTY_READINGS), ...over });
const ctx: ReadingContext = { ring: false, ze: null, behindRcd: false };
const codes = (r: CircuitReadings, c: Partial<ReadingContext> = {}) => judgeReadings(r, { ...ctx, ...c }).map((i) => i.code);

describe('insulation resistance (Table 64)', () => {
  // BS 7671:2018+A2 Table 64: 0.5 MΩ at 250 V, 1 MΩ at 500 V and at 1000 V (from memory; see docs/sources.md)
  it.each([
    [250, 0.49, 0.5],
    [500, 0.99, 1],
    [1000, 0.99, 1],
  ] as const)('when tested at %i V, then %f MΩ fails and %f MΩ passes', (testVoltage, fails, passes) => {
    expect(codes(readings({ insulation: { testVoltage, lineLine: null, lineEarth: fails, neutralEarth: null } }))).toContain('insulation-below-table-64');
    expect(codes(readings({ insulation: { testVoltage, lineLine: null, lineEarth: passes, neutralEarth: null } }))).not.toContain('insulation-below-table-64');
  });

  it('when readings have no test voltage, then Table 64 cannot be applied and the finding asks for it', () => {
    expect(codes(readings({ insulation: { testVoltage: null, lineLine: 200, lineEarth: 200, neutralEarth: 200 } }))).toEqual(['insulation-voltage-missing']);
  });

  it('when N–E passes Table 64 but is 1.5 MΩ on a circuit behind an RCD, then the warning says it will likely trip it', () => {
    const [low] = judgeReadings(readings({ insulation: { testVoltage: 500, lineLine: 200, lineEarth: 200, neutralEarth: 1.5 } }), { ...ctx, behindRcd: true });
    expect(low.code).toBe('insulation-low');
    expect(low.message).toMatch(/trip/);
  });
});

describe('ring end-to-end readings (common practice)', () => {
  it('when r1 and rn differ by 0.06 Ω, then they are flagged; by 0.05 Ω, not', () => {
    expect(codes(readings({ ring: { r1: 0.5, rn: 0.56, r2: null } }), { ring: true })).toContain('ring-ends-differ');
    expect(codes(readings({ ring: { r1: 0.5, rn: 0.55, r2: null } }), { ring: true })).not.toContain('ring-ends-differ');
  });

  it('when r2 is 1.67 × r1 on 2.5/1.5 mm² (0.5 and 0.835 Ω), then it passes; 1.2 × r1 is flagged; on 2.5/2.5 mm² the ratio is not expected', () => {
    // 2.5 / 1.5 = 1.667, the ratio of the conductors' csa (common practice)
    expect(codes(readings({ ring: { r1: 0.5, rn: 0.5, r2: 0.835 } }), { ring: true, liveCsa: 2.5, cpcCsa: 1.5 })).toEqual([]);
    expect(codes(readings({ ring: { r1: 0.5, rn: 0.5, r2: 0.6 } }), { ring: true, liveCsa: 2.5, cpcCsa: 1.5 })).toContain('ring-r2-ratio');
    expect(codes(readings({ ring: { r1: 0.5, rn: 0.5, r2: 0.6 } }), { ring: true, liveCsa: 2.5, cpcCsa: 2.5 })).not.toContain('ring-r2-ratio');
  });

  it('when R1+R2 is (r1 + r2) / 4, then it agrees: (0.5 + 0.83) / 4 = 0.3325 Ω', () => {
    expect(codes(readings({ ring: { r1: 0.5, rn: 0.5, r2: 0.83 }, r1PlusR2: 0.33 }), { ring: true })).toEqual([]);
    expect(codes(readings({ ring: { r1: 0.5, rn: 0.5, r2: 0.83 }, r1PlusR2: 0.45 }), { ring: true })).toContain('ring-r1r2-mismatch');
  });
});

describe('Zs against Ze + (R1+R2), polarity', () => {
  it('when Zs 0.75 Ω = Ze 0.35 + R1+R2 0.40, then nothing; Zs 1.2 Ω is flagged as a wrong reading or a parallel path', () => {
    expect(codes(readings({ r1PlusR2: 0.4, zs: 0.75 }), { ze: 0.35 })).toEqual([]);
    expect(codes(readings({ r1PlusR2: 0.4, zs: 1.2 }), { ze: 0.35 })).toEqual(['zs-cross-check']);
  });

  it('when polarity is recorded incorrect, then it is an error', () => {
    expect(codes(readings({ polarity: 'incorrect' }))).toEqual(['polarity-incorrect']);
  });

  it('when a new circuit has readings, then its findings point into circuits.N.readings and Zs at measuredZs', () => {
    const s = oneCircuit(
      {},
      {
        kind: 'radial',
        measuredZs: 1.0,
        readings: readings({ r1PlusR2: 0.2, insulation: { testVoltage: 500, lineLine: 0.8, lineEarth: 300, neutralEarth: 300 } }),
      },
      { supply: { ze: 0.35 } },
    );
    expect(withCode(s, 'insulation-below-table-64')[0].field).toBe('circuits.0.readings.insulation.lineLine');
    expect(withCode(s, 'zs-cross-check')[0].field).toBe('circuits.0.measuredZs');
  });
});

describe('RCD operating times (BS EN 61008-1 / 61009-1, general non-delay type)', () => {
  // 300 ms at IΔn and 40 ms at 5 × IΔn (BS EN 61008-1 / BS EN 61009-1, from memory; see docs/sources.md)
  it('when it trips in 300 ms at IΔn and 40 ms at 5 × IΔn, then it passes; 301 and 41 ms fail', () => {
    expect(judgeRcdTrip({ atRated: 300, atFiveTimes: 40 }, 30)).toEqual([]);
    expect(judgeRcdTrip({ atRated: 301, atFiveTimes: 41 }, 30).map((i) => i.code)).toEqual(['rcd-trip-slow', 'rcd-trip-slow-5x']);
  });

  it('when an RCBO on the board has a slow time recorded, then the finding points at devices.N.rcdTrip', () => {
    const s = oneCircuit({ rcdTrip: { atRated: 420, atFiveTimes: 20 } }, { kind: 'radial' });
    expect(withCode(s, 'rcd-trip-slow')[0].field).toBe('devices.0.rcdTrip.atRated');
  });
});
