import { describe, expect, it } from 'vitest';
import { maxZs } from '../../../shared/rules/bs7671/index.js';
import { maxZsFor } from '../../../shared/rules/index.js';
import { circuitSchema, supplySchema } from '../../../shared/schemas/schedule.js';
import { findings, oneCircuit, withCode } from './fixtures.js';

// BS 7671:2018+A2 Table 41.3, maximum Zs (Ω) for BS EN 60898 breakers and RCBOs at 230 V, 0.4 s and 5 s (found)
const PUBLISHED: Record<'B' | 'C' | 'D', Array<[number, number]>> = {
  B: [
    [6, 7.28],
    [10, 4.37],
    [16, 2.73],
    [20, 2.19],
    [25, 1.75],
    [32, 1.37],
    [40, 1.09],
    [50, 0.87],
    [63, 0.69],
  ],
  C: [
    [6, 3.64],
    [10, 2.19],
    [16, 1.37],
    [20, 1.09],
    [25, 0.87],
    [32, 0.68],
    [40, 0.55],
    [50, 0.44],
    [63, 0.35],
  ],
  D: [
    [6, 1.82],
    [10, 1.09],
    [16, 0.68],
    [20, 0.55],
    [25, 0.44],
    [32, 0.34],
    [40, 0.27],
    [50, 0.22],
    [63, 0.17],
  ],
};

function limitOf(curve: 'B' | 'C' | 'D', rating: number, circuit: Parameters<typeof oneCircuit>[1] = {}) {
  const s = oneCircuit({ kind: 'mcb', curve, rating, residualMa: null }, circuit);
  return maxZs(s.devices[0], s.circuits[0]);
}

describe('Table 41.3 maximum Zs', () => {
  it.each(Object.entries(PUBLISHED).flatMap(([curve, rows]) => rows.map(([rating, value]) => [curve as 'B' | 'C' | 'D', rating, value] as const)))(
    'when the device is %s%i, then the maximum is the published %f Ω',
    (curve, rating, value) => {
      expect(limitOf(curve, rating)?.ohms).toBe(value);
      expect(limitOf(curve, rating)?.derived).toBe(false);
    },
  );

  it('when a rating is not printed in the table (B13), then the value comes from the table formula 0.95 × 230 / (5 × 13)', () => {
    const limit = limitOf('B', 13);
    expect(limit?.ohms).toBeCloseTo(3.36, 2); // 0.95 × 230 / 65 = 3.3615, Table 41.3 formula (found)
    expect(limit?.derived).toBe(true);
  });

  it('when the circuit is a final circuit up to 32 A, then 0.4 s applies; a sub-main and a 40 A fixed circuit take 5 s with the same value', () => {
    expect(limitOf('B', 32, { kind: 'radial' })?.seconds).toBe(0.4); // BS 7671 411.3.2.2 (from memory)
    expect(limitOf('B', 40, { kind: 'sub-main' })).toMatchObject({ seconds: 5, ohms: 1.09 }); // Table 41.3 covers 5 s too (found)
    expect(limitOf('B', 40, { kind: 'shower' })).toMatchObject({ seconds: 5, ohms: 1.09 }); // 411.3.2.3 (from memory)
    expect(limitOf('B', 40, { kind: 'radial', socketOutlets: true })?.seconds).toBe(0.4); // sockets up to 63 A: 0.4 s (from memory)
  });

  it('when nothing is measured, then the maximum is still available for the chart', () => {
    const s = oneCircuit({ kind: 'mcb', curve: 'B', rating: 6, residualMa: null }, { kind: 'lighting' });
    expect(maxZsFor(s, s.circuits[0])).toBe(7.28); // BS 7671:2018+A2 Table 41.3, B6
    expect(withCode(s, 'zs-over-max')).toEqual([]);
  });
});

describe('measured Zs against the maximum', () => {
  const b32 = (measuredZs: number, zsAtAmbient = false) =>
    oneCircuit({ kind: 'rcbo', curve: 'B', rating: 32 }, { way: 4, label: 'Kitchen sockets', kind: 'ring', socketOutlets: true, measuredZs, zsAtAmbient });

  it('when a B32 measures 1.36 Ω (max 1.37 Ω), then there is no Zs finding', () => {
    expect(findings(b32(1.36)).filter((f) => f.code.startsWith('zs-'))).toEqual([]); // BS 7671:2018+A2 Table 41.3, B32 1.37 Ω
  });

  it('when a B32 measures 1.38 Ω, then an error names the way, the values and the table', () => {
    const [f] = withCode(b32(1.38), 'zs-over-max'); // BS 7671:2018+A2 Table 41.3, B32 1.37 Ω
    expect(f).toMatchObject({ severity: 'error', rule: 'BS 7671 Table 41.3', ways: [4], field: 'circuits.0.measuredZs' });
    expect(f.message).toBe('Way 4 (Kitchen sockets): measured Zs 1.38 Ω exceeds the 1.37 Ω maximum for a B32 (Table 41.3, 0.4 s)');
  });

  it('when a cold reading is above 80 % of the maximum, then a rule-of-thumb warning; at or below 80 % nothing', () => {
    // IET guidance rule of thumb: 0.8 × 1.37 Ω = 1.096 Ω for a B32 (found in trade press)
    expect(withCode(b32(1.1, true), 'zs-over-rule-of-thumb')).toHaveLength(1);
    expect(withCode(b32(1.09, true), 'zs-over-rule-of-thumb')).toEqual([]);
    expect(withCode(b32(1.1, false), 'zs-over-rule-of-thumb')).toEqual([]);
    expect(withCode(b32(1.38, true), 'zs-over-rule-of-thumb')).toEqual([]); // over the maximum: the error alone
  });

  it('when a D16 measures 0.70 Ω, then it fails its 0.68 Ω maximum; a C16 at the same reading passes its 1.37 Ω', () => {
    const d16 = oneCircuit({ kind: 'mcb', curve: 'D', rating: 16, residualMa: null }, { kind: 'fixed-appliance', measuredZs: 0.7, zsAtAmbient: false });
    const c16 = oneCircuit({ kind: 'mcb', curve: 'C', rating: 16, residualMa: null }, { kind: 'fixed-appliance', measuredZs: 0.7, zsAtAmbient: false });
    expect(withCode(d16, 'zs-over-max')[0].message).toContain('0.68 Ω maximum for a D16'); // BS 7671:2018+A2 Table 41.3
    expect(withCode(c16, 'zs-over-max')).toEqual([]); // BS 7671:2018+A2 Table 41.3, C16 1.37 Ω
  });

  it('when the board is TT and the circuit has an RCD, then Table 41.5 (50 V / IΔn) applies instead', () => {
    const tt = (measuredZs: number) =>
      oneCircuit(
        { kind: 'rcbo', curve: 'B', rating: 32, residualMa: 1000 },
        { kind: 'radial', measuredZs, zsAtAmbient: false },
        { supply: { earthing: 'TT' } },
      );
    expect(maxZsFor(tt(1), tt(1).circuits[0])).toBe(50); // BS 7671 Table 41.5: 50 V / 1 A (from memory)
    expect(withCode(tt(49), 'zs-over-max')).toEqual([]);
    expect(withCode(tt(51), 'zs-over-max')[0]).toMatchObject({ rule: 'BS 7671 Table 41.5' });
    const tt30 = oneCircuit({}, { kind: 'radial', measuredZs: 150 }, { supply: { earthing: 'TT' } });
    expect(maxZsFor(tt30, tt30.circuits[0])).toBe(1667); // BS 7671 Table 41.5: 30 mA → 1667 Ω (from memory)
  });

  it('when a TT circuit has no RCD, then the breaker value of Table 41.3 still applies', () => {
    const s = oneCircuit(
      { kind: 'mcb', curve: 'B', rating: 32, residualMa: null },
      { kind: 'fixed-appliance', measuredZs: 21 },
      { supply: { earthing: 'TT' } },
    );
    expect(withCode(s, 'zs-over-max')[0]).toMatchObject({ rule: 'BS 7671 Table 41.3' }); // B32 1.37 Ω
  });

  it('when Zs is below the supply Ze, then a warning asks to check both readings, naming a parallel earth path as a cause', () => {
    // Zs is normally Ze + (R1+R2); bonded pipework in parallel with the cpc can bring it below Ze (common practice)
    const s = oneCircuit({}, { way: 3, label: 'Sockets', kind: 'radial', measuredZs: 0.2 }, { supply: { ze: 0.35 } });
    const [f] = withCode(s, 'zs-below-ze');
    expect(f).toMatchObject({ severity: 'warning', rule: 'Common practice', field: 'circuits.0.measuredZs' });
    expect(f.message).toBe(
      'Way 3 (Sockets): measured Zs 0.20 Ω is below Ze 0.35 Ω: check both readings; a parallel earth path through bonded pipework can cause this',
    );
    expect(f.message).not.toContain('wrong');
    expect(withCode(oneCircuit({}, { kind: 'radial', measuredZs: 0.5 }, { supply: { ze: 0.35 } }), 'zs-below-ze')).toEqual([]);
  });

  it('when a reading is recorded against a breaker with no curve, then it is reported as not checked', () => {
    const s = oneCircuit({ kind: 'mcb', curve: null, residualMa: null }, { kind: 'radial', measuredZs: 0.9 });
    expect(withCode(s, 'zs-not-checked')[0]).toMatchObject({ severity: 'info', field: 'circuits.0.measuredZs' });
  });
});

describe('TT readings above 200 Ω', () => {
  const tt = (ze: number | null, measuredZs: number | null = null) =>
    oneCircuit({}, { kind: 'radial', measuredZs, zsAtAmbient: false }, { supply: { earthing: 'TT', ze } });

  it('when a TT board records Ze 1500 Ω and a circuit Zs 1600 Ω, then the schema takes both and the 30 mA RCD passes Table 41.5', () => {
    const s = tt(1500, 1600); // parsed by the real schema: the cap is 2000 Ω
    expect(s.board.supply.ze).toBe(1500);
    expect(s.circuits[0].measuredZs).toBe(1600);
    expect(withCode(s, 'zs-over-max')).toEqual([]); // BS 7671:2018+A2 Table 41.5: 50 V / 0.03 A = 1667 Ω (from memory)
    expect(withCode(tt(1500, 1700), 'zs-over-max')[0]).toMatchObject({ rule: 'BS 7671 Table 41.5' });
  });

  it('when Ze or Zs is over 2000 Ω, then the schema refuses it with a message naming the cap', () => {
    const supply = supplySchema.safeParse({ earthing: 'TT', ze: 2500 });
    expect(supply.success).toBe(false);
    expect(supply.error?.issues[0]).toMatchObject({ path: ['ze'], message: 'Ze is at most 2000 Ω: check the decimal point' });
    expect(supplySchema.safeParse({ earthing: 'TT', ze: 2000 }).success).toBe(true);
    const zs = circuitSchema.safeParse({ id: 'c1', way: 1, label: 'A', measuredZs: 2001 });
    expect(zs.error?.issues[0]).toMatchObject({ path: ['measuredZs'], message: 'Zs is at most 2000 Ω: check the decimal point' });
  });

  it("when a TT board's Ze (the electrode) is over 200 Ω, then a warning on the Ze field; at 200 Ω, or on TN, nothing", () => {
    // An electrode above 200 Ω may be unstable as the soil dries or freezes: IET Guidance Note 3 / On-Site Guide (from memory)
    const [f] = withCode(tt(210), 'tt-electrode-may-be-unstable');
    expect(f).toMatchObject({ severity: 'warning', rule: 'IET Guidance Note 3', field: 'board.supply.ze', ways: [] });
    expect(f.message).toContain('Ze 210.00 Ω is above 200 Ω');
    expect(f.message).toContain('drying or freezing');
    expect(withCode(tt(200), 'tt-electrode-may-be-unstable')).toEqual([]);
    expect(withCode(tt(null), 'tt-electrode-may-be-unstable')).toEqual([]);
    const tn = oneCircuit({}, { kind: 'radial' }, { supply: { earthing: 'TN-S', ze: 250 } });
    expect(withCode(tn, 'tt-electrode-may-be-unstable')).toEqual([]);
  });
});
