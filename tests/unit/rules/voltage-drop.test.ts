import { describe, expect, it } from 'vitest';
import { estimatedVoltageDrop } from '../../../shared/rules/bs7671/index.js';
import { oneCircuit, withCode } from './fixtures.js';

const te = (liveCsa: number, lengthM: number) => ({ type: 'twin-earth' as const, liveCsa, cpcCsa: 1, referenceMethod: 'C' as const, lengthM });
const mcb = (rating: number) => ({ kind: 'mcb' as const, rating, curve: 'B' as const, residualMa: null });

describe('voltage drop estimate (BS 7671 525, Appendix 4 Table 4Ab)', () => {
  it('when 1.5 mm² carries 6 A over 20 m, then the drop is 29 mV/A/m × 6 A × 20 m = 3.48 V', () => {
    const s = oneCircuit(mcb(6), { kind: 'lighting', cable: te(1.5, 20) });
    expect(estimatedVoltageDrop({ circuit: s.circuits[0], device: s.devices[0] })).toBeCloseTo(3.48, 6); // Table 4D5 1.5 mm²: 29 mV/A/m (found)
  });

  it('when a B6 lighting circuit in 1.5 mm² is 39 m, then it is within 3 % of 230 V (6.9 V); at 40 m it is over', () => {
    // 29 mV/A/m (Table 4D5, found) × 6 A: 39 m → 6.79 V, 40 m → 6.96 V; limit 3 % lighting, public supply (BS 7671 Appendix 4 6.4, found; Table 4Ab, from memory)
    expect(withCode(oneCircuit(mcb(6), { kind: 'lighting', cable: te(1.5, 39) }), 'voltage-drop-over-limit')).toEqual([]);
    const [f] = withCode(oneCircuit(mcb(6), { way: 5, label: 'Loft lights', kind: 'lighting', cable: te(1.5, 40) }), 'voltage-drop-over-limit');
    expect(f).toMatchObject({ severity: 'warning', rule: 'BS 7671 525, Appendix 4 Table 4Ab', field: 'circuits.0.cable.lengthM' });
    expect(f.message).toBe(
      'Way 5 (Loft lights): estimated voltage drop 6.96 V (3.03 %) exceeds the 3 % limit for lighting from a public supply (6.9 V; BS 7671 525, Appendix 4 Table 4Ab); 40 m of 1.5 mm² at the device rating 6 A, no design current recorded: 29 mV/A/m × 6 A × 40 m (Table 4D5)',
    );
  });

  it('when a B20 radial in 2.5 mm² is 31 m, then within 5 % (11.5 V); at 32 m it is over', () => {
    // 18 mV/A/m (Table 4D5, from memory) × 20 A: 31 m → 11.16 V, 32 m → 11.52 V; limit 5 % other uses, public supply (Appendix 4 6.4, found; Table 4Ab, from memory)
    expect(withCode(oneCircuit(mcb(20), { kind: 'radial', cable: te(2.5, 31) }), 'voltage-drop-over-limit')).toEqual([]);
    expect(withCode(oneCircuit(mcb(20), { kind: 'radial', cable: te(2.5, 32) }), 'voltage-drop-over-limit')).toHaveLength(1);
  });

  it('when a 2.5 mm² ring on 32 A is 79 m round, then its load at the midpoint keeps it within 5 %; at 80 m it is over', () => {
    // ring: a quarter of a radial's drop (common practice): 18 × 32 × 79 / 4000 = 11.38 V, × 80 m = 11.52 V
    expect(withCode(oneCircuit(mcb(32), { kind: 'ring', cable: te(2.5, 79) }), 'voltage-drop-over-limit')).toEqual([]);
    expect(withCode(oneCircuit(mcb(32), { kind: 'ring', cable: te(2.5, 80) }), 'voltage-drop-over-limit')).toHaveLength(1);
  });

  it('when the ring is over, then the message states the quarter length it was worked on, so a hand check agrees', () => {
    // 18 mV/A/m (Table 4D5, from memory) × 32 A × 80 m / 4 (ring load at its midpoint, common practice) = 11.52 V > 11.5 V (5 % of 230 V)
    const [f] = withCode(oneCircuit(mcb(32), { way: 2, label: 'Sockets', kind: 'ring', cable: te(2.5, 80) }), 'voltage-drop-over-limit');
    expect(f.message).toBe(
      'Way 2 (Sockets): estimated voltage drop 11.52 V (5.01 %) exceeds the 5 % limit for this use from a public supply (11.5 V; BS 7671 525, Appendix 4 Table 4Ab); 80 m round the ring of 2.5 mm² at the device rating 32 A, no design current recorded, worked on 20 m, a quarter of that (load taken at the midpoint, half the current in each leg): 18 mV/A/m × 32 A × 20 m (Table 4D5)',
    );
  });

  it('when the nominal voltage is 240 V, then the limit follows it (5 % = 12 V)', () => {
    expect(withCode(oneCircuit(mcb(20), { kind: 'radial', cable: te(2.5, 32) }, { supply: { nominalVoltage: 240 } }), 'voltage-drop-over-limit')).toEqual([]); // 11.52 V < 12 V
  });

  it('when a three-phase board records 400 V between phases, then each circuit is judged against 230 V to earth, as at 230 V', () => {
    // 18 mV/A/m (Table 4D5, from memory) × 20 A × 32 m = 11.52 V > 5 % of U0 230 V = 11.5 V; 230/400 V (BS EN 60038, from memory)
    for (const nominalVoltage of [230, 400]) {
      const [f] = withCode(
        oneCircuit(mcb(20), { kind: 'radial', phase: 'L1', cable: te(2.5, 32) }, { phases: 3, supply: { nominalVoltage } }),
        'voltage-drop-over-limit',
      );
      expect(f?.message).toContain('exceeds the 5 % limit for this use from a public supply (11.5 V; BS 7671 525, Appendix 4 Table 4Ab)');
    }
  });

  it('when the length or a tabulated cable is missing, then no estimate is made', () => {
    const noLength = oneCircuit(mcb(20), { kind: 'radial', cable: { type: 'twin-earth', liveCsa: 2.5 } });
    expect(estimatedVoltageDrop({ circuit: noLength.circuits[0], device: noLength.devices[0] })).toBeNull();
    const swa = oneCircuit(mcb(32), { kind: 'sub-main', cable: { type: 'swa', liveCsa: 6, lengthM: 300 } });
    expect(withCode(swa, 'voltage-drop-over-limit')).toEqual([]);
  });
});

describe('voltage drop at the design current Ib when recorded', () => {
  it('when a B6 lighting circuit records Ib 2 A, then the drop is worked at 2 A, not at the 6 A rating', () => {
    // 29 mV/A/m (Table 4D5 1.5 mm², found) × 2 A × 20 m = 1.16 V; at the rating it would be × 6 A = 3.48 V
    const s = oneCircuit(mcb(6), { kind: 'lighting', designCurrent: 2, cable: te(1.5, 20) });
    expect(estimatedVoltageDrop({ circuit: s.circuits[0], device: s.devices[0] })).toBeCloseTo(1.16, 6);
  });

  it('when the 40 m lighting run records Ib 2 A, then the warning at the rating goes away; at 120 m it says the Ib used', () => {
    // 29 mV/A/m (Table 4D5, found) × 2 A × 40 m = 2.32 V, within 6.9 V (3 % of 230 V, Appendix 4 6.4, found)
    expect(withCode(oneCircuit(mcb(6), { kind: 'lighting', designCurrent: 2, cable: te(1.5, 40) }), 'voltage-drop-over-limit')).toEqual([]);
    // 29 × 2 × 120 / 1000 = 6.96 V (3.03 %) > 6.9 V
    const [f] = withCode(
      oneCircuit(mcb(6), { way: 5, label: 'Yard lights', kind: 'lighting', designCurrent: 2, cable: te(1.5, 120) }),
      'voltage-drop-over-limit',
    );
    expect(f.message).toBe(
      'Way 5 (Yard lights): estimated voltage drop 6.96 V (3.03 %) exceeds the 3 % limit for lighting from a public supply (6.9 V; BS 7671 525, Appendix 4 Table 4Ab); 120 m of 1.5 mm² at Ib 2 A recorded: 29 mV/A/m × 2 A × 120 m (Table 4D5)',
    );
  });

  it('when a ring records Ib 26 A, then the drop is on a quarter of the length at 26 A and the message says so', () => {
    // 18 mV/A/m (Table 4D5 2.5 mm², from memory) × 26 A × 100 m / 4 (common practice) = 11.7 V > 11.5 V
    const [f] = withCode(oneCircuit(mcb(32), { way: 3, label: 'Ring', kind: 'ring', designCurrent: 26, cable: te(2.5, 100) }), 'voltage-drop-over-limit');
    expect(f.message).toContain('100 m round the ring of 2.5 mm² at Ib 26 A recorded, worked on 25 m, a quarter of that');
    expect(f.message).toContain('18 mV/A/m × 26 A × 25 m (Table 4D5)');
    // 18 × 26 × 98 / 4000 = 11.47 V, within 11.5 V
    expect(withCode(oneCircuit(mcb(32), { kind: 'ring', designCurrent: 26, cable: te(2.5, 98) }), 'voltage-drop-over-limit')).toEqual([]);
  });

  it('when Ib is recorded but no device is named, then the drop is still worked at Ib', () => {
    // 18 mV/A/m (Table 4D5, from memory) × 10 A × 20 m = 3.6 V
    const s = oneCircuit(mcb(20), { kind: 'radial', designCurrent: 10, deviceId: null, cable: te(2.5, 20) });
    expect(estimatedVoltageDrop({ circuit: s.circuits[0], device: null })).toBeCloseTo(3.6, 6);
  });
});
