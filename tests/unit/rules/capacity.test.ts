import { describe, expect, it } from 'vitest';
import { twinEarthIz } from '../../../shared/rules/bs7671/index.js';
import { findings, oneCircuit, withCode } from './fixtures.js';

type Method = '100' | '101' | '102' | '103' | 'C' | 'A' | 'B';
const te = (liveCsa: number, referenceMethod: Method) => ({ type: 'twin-earth' as const, liveCsa, cpcCsa: liveCsa >= 2.5 ? 1.5 : 1, referenceMethod });
const mcb = (rating: number) => ({ kind: 'mcb' as const, rating, curve: 'B' as const, residualMa: null });
const capacityFindings = (s: ReturnType<typeof oneCircuit>) =>
  findings(s).filter((f) => ['rating-over-iz', 'ring-iz-below-20', 'capacity-not-checked'].includes(f.code));

describe('Table 4D5 current-carrying capacity', () => {
  it('when looked up, then the found values of Table 4D5 come back', () => {
    expect(twinEarthIz(2.5, 'C')).toBe(27); // BS 7671 Table 4D5, 2.5 mm² method C (found)
    expect(twinEarthIz(2.5, 'A')).toBe(20); // BS 7671 Table 4D5, 2.5 mm² method A (found)
    expect(twinEarthIz(1.5, '103')).toBe(10); // BS 7671 Table 4D5, 1.5 mm² method 103 (found)
    expect(twinEarthIz(1, '101')).toBe(10.5); // BS 7671 Table 4D5, 1.0 mm² method 101 (found)
    expect(twinEarthIz(2.5, 'B')).toBeNull(); // Table 4D5 has no method B column (found)
  });
});

describe('In ≤ Iz (433.1.1)', () => {
  it('when 2.5 mm² twin-and-earth clipped direct (Iz 27 A) has a 25 A device, then it passes', () => {
    expect(capacityFindings(oneCircuit(mcb(25), { kind: 'radial', cable: te(2.5, 'C') }))).toEqual([]); // BS 7671 Table 4D5, 27 A (found)
  });

  it('when the same cable is a radial on a 32 A device, then an error names the values', () => {
    const [f] = withCode(oneCircuit(mcb(32), { way: 3, label: 'Garage', kind: 'radial', cable: te(2.5, 'C') }), 'rating-over-iz'); // 32 > 27 A, Table 4D5 (found)
    expect(f).toMatchObject({ severity: 'error', rule: 'BS 7671 433.1.1', ways: [3], field: 'circuits.0.cable.liveCsa' });
    expect(f.message).toBe('Way 3 (Garage): device rating 32 A (B32) exceeds the 27 A capacity of 2.5 mm² twin-and-earth at method C (Table 4D5)');
  });

  it('when 1.5 mm² lighting runs in an insulated stud wall (method 103, Iz 10 A), then B10 passes and B16 fails', () => {
    expect(withCode(oneCircuit(mcb(10), { kind: 'lighting', cable: te(1.5, '103') }), 'rating-over-iz')).toEqual([]); // Table 4D5 1.5 mm² 103: 10 A (found)
    expect(withCode(oneCircuit(mcb(16), { kind: 'lighting', cable: te(1.5, '103') }), 'rating-over-iz')).toHaveLength(1);
  });

  it('when 4 mm² is on a 32 A device, then clipped direct passes (37 A) and method 103 fails (17.5 A)', () => {
    expect(withCode(oneCircuit(mcb(32), { kind: 'radial', cable: te(4, 'C') }), 'rating-over-iz')).toEqual([]); // Table 4D5 4 mm² C: 37 A (from memory)
    expect(withCode(oneCircuit(mcb(32), { kind: 'radial', cable: te(4, '103') }), 'rating-over-iz')).toHaveLength(1); // Table 4D5 4 mm² 103: 17.5 A (from memory)
  });
});

describe('ring final circuits (433.1.204)', () => {
  it('when a 2.5 mm² ring is on a 32 A device clipped direct, then it is accepted though 32 A exceeds 27 A', () => {
    expect(capacityFindings(oneCircuit(mcb(32), { kind: 'ring', legs: 2, cable: te(2.5, 'C') }))).toEqual([]); // BS 7671 433.1.204 (partly)
  });

  it('when the ring is on a 30 A device, then it is the same recognised arrangement', () => {
    expect(withCode(oneCircuit({ ...mcb(30) }, { kind: 'ring', cable: te(2.5, 'C') }), 'ring-iz-below-20')).toEqual([]); // 433.1.204: 30 or 32 A (partly)
  });

  it('when the ring runs where Iz is exactly 20 A (method A), then it passes; below 20 A (method 103, 13.5 A) it fails', () => {
    expect(capacityFindings(oneCircuit(mcb(32), { kind: 'ring', cable: te(2.5, 'A') }))).toEqual([]); // Table 4D5 2.5 mm² A: 20 A (found); 433.1.204 Iz ≥ 20 A
    const [f] = withCode(oneCircuit(mcb(32), { kind: 'ring', cable: te(2.5, '103') }), 'ring-iz-below-20'); // Table 4D5 2.5 mm² 103: 13.5 A (from memory)
    expect(f).toMatchObject({ severity: 'error', rule: 'BS 7671 433.1.204', field: 'circuits.0.cable.referenceMethod' });
  });

  it('when a 2.5 mm² ring is on a 40 A device, then 433.1.204 does not apply and 40 > 27 A fails', () => {
    expect(withCode(oneCircuit(mcb(40), { kind: 'ring', cable: te(2.5, 'C') }), 'rating-over-iz')).toHaveLength(1);
  });
});

describe('cables that cannot be checked', () => {
  it('when the cable is SWA, then an info finding says it was not checked', () => {
    const [f] = withCode(oneCircuit(mcb(32), { kind: 'fixed-appliance', cable: { type: 'swa', liveCsa: 6, referenceMethod: 'C' } }), 'capacity-not-checked');
    expect(f).toMatchObject({ severity: 'info', field: 'circuits.0.cable.type' });
  });

  it('when twin-and-earth has no reference method, then the info points at the method field', () => {
    expect(withCode(oneCircuit(mcb(20), { kind: 'radial', cable: { type: 'twin-earth', liveCsa: 2.5 } }), 'capacity-not-checked')[0].field).toBe(
      'circuits.0.cable.referenceMethod',
    );
  });

  it('when twin-and-earth is given a method Table 4D5 does not list, then it is not checked rather than guessed', () => {
    expect(withCode(oneCircuit(mcb(20), { kind: 'radial', cable: te(2.5, 'B') }), 'capacity-not-checked')).toHaveLength(1);
  });

  it('when the circuit is on a plain RCD, then no capacity check runs and a warning says it has no overcurrent protection', () => {
    const s = oneCircuit({ kind: 'rcd', rating: 63, curve: null }, { kind: 'radial', cable: te(1, 'C') });
    expect(capacityFindings(s)).toEqual([]);
    expect(withCode(s, 'device-gives-no-overcurrent-protection')).toHaveLength(1);
  });
});
