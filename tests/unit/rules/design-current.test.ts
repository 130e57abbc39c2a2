import { describe, expect, it } from 'vitest';
import { circuitSchema } from '../../../shared/schemas/schedule.js';
import { findings, oneCircuit, withCode } from './fixtures.js';

const te = (liveCsa: number, referenceMethod: 'C' | 'A' | '103') => ({ type: 'twin-earth' as const, liveCsa, cpcCsa: 1.5, referenceMethod });
const mcb = (rating: number) => ({ kind: 'mcb' as const, rating, curve: 'B' as const, residualMa: null });

describe('the design current field', () => {
  const circuit = { id: 'c1', way: 1, label: 'Garage' };

  it('when a circuit has no design current, then it parses without one, as documents saved before the field did', () => {
    expect(circuitSchema.parse(circuit).designCurrent).toBeUndefined();
    expect(circuitSchema.parse({ ...circuit, designCurrent: null }).designCurrent).toBeNull();
    expect(circuitSchema.parse({ ...circuit, designCurrent: 13.5 }).designCurrent).toBe(13.5);
  });

  it('when Ib is zero, negative, over 4000 A or not a number, then the schema refuses it on designCurrent', () => {
    for (const designCurrent of [0, -2, 4001, '16']) {
      const parsed = circuitSchema.safeParse({ ...circuit, designCurrent });
      expect(parsed.success).toBe(false);
      expect(parsed.error?.issues[0]?.path).toEqual(['designCurrent']);
    }
  });
});

describe('Ib ≤ In (BS 7671 433.1.1)', () => {
  it('when Ib equals In, then it passes; when Ib is above In, then an error on designCurrent names both', () => {
    expect(withCode(oneCircuit(mcb(20), { kind: 'radial', designCurrent: 20, cable: te(2.5, 'C') }), 'design-current-over-rating')).toEqual([]); // 433.1.1: Ib ≤ In
    const [f] = withCode(
      oneCircuit(mcb(16), { way: 4, label: 'Workshop', kind: 'radial', designCurrent: 18, cable: te(2.5, 'C') }),
      'design-current-over-rating',
    );
    expect(f).toMatchObject({ severity: 'error', rule: 'BS 7671 433.1.1', ways: [4], field: 'circuits.0.designCurrent' });
    expect(f.message).toBe(
      'Way 4 (Workshop): design current Ib 18 A recorded exceeds the device rating 16 A (B16); Ib ≤ In ≤ Iz needs a device of at least 18 A on a cable to match, or a smaller load',
    );
  });

  it('when Ib is above In on a cable the rules do not tabulate, then Ib ≤ In is still checked', () => {
    const s = oneCircuit(mcb(32), { kind: 'sub-main', designCurrent: 40, cable: { type: 'swa', liveCsa: 10, referenceMethod: 'C' } });
    expect(withCode(s, 'design-current-over-rating')).toHaveLength(1); // 40 A > 32 A, 433.1.1
    expect(withCode(s, 'capacity-not-checked')).toHaveLength(1);
  });

  it('when there is no overcurrent device, then Ib ≤ In is not judged', () => {
    const s = oneCircuit({ kind: 'rcd', rating: 63, curve: null }, { kind: 'radial', designCurrent: 80, cable: te(2.5, 'C') });
    expect(withCode(s, 'design-current-over-rating')).toEqual([]);
  });

  it('when Ib is within In and In ≤ Iz, then no capacity finding at all', () => {
    // Table 4D5 2.5 mm² method C: 27 A (found); Ib 13 A ≤ In 20 A ≤ Iz 27 A
    const codes = findings(oneCircuit(mcb(20), { kind: 'radial', designCurrent: 13, cable: te(2.5, 'C') })).map((f) => f.code);
    expect(codes).not.toContain('design-current-over-rating');
    expect(codes).not.toContain('rating-over-iz');
  });
});

describe('In ≤ Iz with Ib recorded', () => {
  it('when In is above Iz but Ib fits the cable, then the error says which ratings would meet Ib ≤ In ≤ Iz', () => {
    // Table 4D5 2.5 mm² method C: 27 A (found); B32 > 27 A; Ib 20 A ≤ 27 A
    const [f] = withCode(oneCircuit(mcb(32), { way: 3, label: 'Garage', kind: 'radial', designCurrent: 20, cable: te(2.5, 'C') }), 'rating-over-iz');
    expect(f.message).toBe(
      'Way 3 (Garage): device rating 32 A (B32) exceeds the 27 A capacity of 2.5 mm² twin-and-earth at method C (Table 4D5); with Ib 20 A recorded, a device rated from 20 A up to 27 A would meet Ib ≤ In ≤ Iz',
    );
  });

  it('when Ib itself is above Iz, then the error says a larger cable is needed', () => {
    // Table 4D5 1.5 mm² method 103: 10 A (found); B16 and Ib 12 A both above it
    const [f] = withCode(oneCircuit(mcb(16), { kind: 'lighting', designCurrent: 12, cable: te(1.5, '103') }), 'rating-over-iz');
    expect(f.message).toContain('; Ib 12 A recorded is itself above 10 A, so a larger cable is needed');
  });
});
