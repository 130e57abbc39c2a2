import { describe, expect, it } from 'vitest';
import { fuseMaxZs } from '../../../shared/rules/bs7671/index.js';
import { oneCircuit, withCode } from './fixtures.js';

const TE = (liveCsa: number, cpcCsa: number) => ({ type: 'twin-earth' as const, liveCsa, cpcCsa, referenceMethod: 'C' as const, lengthM: 10 });
const fuse = (fuseStandard: 'BS 3036' | 'BS 88-2' | 'BS 88-3' | 'BS 1362', rating: number) => ({
  kind: 'fuse' as const,
  fuseStandard,
  rating,
  curve: null,
  residualMa: null,
  rcdType: null,
});

describe('fuses: maximum Zs', () => {
  // BS 7671:2018 Table 41.2, 0.4 s, BS 3036 semi-enclosed fuses (from memory; see docs/sources.md)
  it.each([
    [5, 9.1],
    [15, 2.43],
    [20, 1.68],
    [30, 1.04],
  ])('when a %i A BS 3036 fuse must disconnect in 0.4 s, then the maximum is %f Ω (Table 41.2)', (rating, ohms) => {
    expect(fuseMaxZs('BS 3036', rating, 0.4)).toMatchObject({ ohms, table: 'Table 41.2', seconds: 0.4 });
  });

  // BS 7671:2018 Table 41.4, 5 s, BS 3036 (from memory; see docs/sources.md)
  it.each([
    [30, 2.64],
    [45, 1.59],
    [60, 1.11],
  ])('when a %i A BS 3036 fuse may take 5 s, then the maximum is %f Ω (Table 41.4)', (rating, ohms) => {
    expect(fuseMaxZs('BS 3036', rating, 5)).toMatchObject({ ohms, table: 'Table 41.4', seconds: 5 });
  });

  it('when a 0.4 s limit is tabulated higher for a longer time, then the 5 s limit is the larger (a fuse blows later on less current)', () => {
    for (const rating of [5, 15, 20, 30]) expect(fuseMaxZs('BS 3036', rating, 5)!.ohms).toBeGreaterThan(fuseMaxZs('BS 3036', rating, 0.4)!.ohms);
  });

  it('when a ring on a 30 A BS 3036 reads 1.2 Ω, then the finding names Table 41.2 and 0.4 s; a cooker on 45 A reading 1.2 Ω passes its 5 s limit', () => {
    const ring = oneCircuit(fuse('BS 3036', 30), { kind: 'ring', socketOutlets: true, cable: TE(2.5, 1.5), measuredZs: 1.2 });
    const [over] = withCode(ring, 'zs-over-max');
    expect(over.rule).toBe('BS 7671 Table 41.2');
    expect(over.message).toMatch(/1\.04 Ω maximum for a 30 A BS 3036 fuse \(Table 41\.2, 0\.4 s\)/);
    // 411.3.2.3: a fixed final circuit above 32 A may take 5 s (from memory)
    const cooker = oneCircuit(fuse('BS 3036', 45), { kind: 'cooker', cable: TE(10, 4), measuredZs: 1.2 });
    expect(withCode(cooker, 'zs-over-max')).toEqual([]);
  });

  it('when a fuse has no standard recorded, then Zs is reported unchecked, not judged against a breaker table', () => {
    const s = oneCircuit({ kind: 'fuse', rating: 30, curve: null, residualMa: null, rcdType: null }, { kind: 'radial', measuredZs: 0.5 });
    expect(withCode(s, 'zs-not-checked')[0].message).toMatch(/standard and rating/);
    expect(withCode(s, 'device-gives-no-overcurrent-protection')).toEqual([]);
  });
});

describe('fuses: overload (433.1.202, In ≤ 0.725 × Iz)', () => {
  it('when a 20 A BS 3036 protects 2.5 mm² clipped direct (Iz 27 A), then 0.725 × 27 = 19.5 A is too little and the message says 0.725', () => {
    // BS 7671 Table 4D5: 2.5 mm² twin-and-earth, method C, 27 A (found); 0.725 from 433.1.202 (from memory)
    const s = oneCircuit(fuse('BS 3036', 20), { kind: 'radial', cable: TE(2.5, 1.5) });
    const [f] = withCode(s, 'rating-over-0725-iz');
    expect(f.message).toContain('0.725');
    expect(f.message).toContain('19.5 A');
    expect(f.rule).toBe('BS 7671 433.1.202');
  });

  it('when a 15 A BS 3036 protects 2.5 mm² (0.725 × 27 = 19.6 A), then it passes; a 15 A BS 88-3 on 1.5 mm² (Iz 20 A) passes 433.1.1 without the factor', () => {
    expect(withCode(oneCircuit(fuse('BS 3036', 15), { kind: 'radial', cable: TE(2.5, 1.5) }), 'rating-over-0725-iz')).toEqual([]);
    const cartridge = oneCircuit(fuse('BS 88-3', 16), { kind: 'radial', cable: TE(1.5, 1) });
    expect(withCode(cartridge, 'rating-over-0725-iz')).toEqual([]);
    expect(withCode(cartridge, 'rating-over-iz')).toEqual([]);
  });

  it('when a 2.5 mm² ring is on a 30 A BS 3036, then the ring arrangement of 433.1.204 does not apply and 0.725 × Iz is checked', () => {
    const ring = oneCircuit(fuse('BS 3036', 30), { kind: 'ring', socketOutlets: true, cable: TE(2.5, 1.5) });
    expect(withCode(ring, 'rating-over-0725-iz')).toHaveLength(1);
    // A BS 88-3 30 A is not made; the 32 A ring on BS 88-3 is the 433.1.204 arrangement (from memory)
    const cartridgeRing = oneCircuit(fuse('BS 88-3', 32), { kind: 'ring', socketOutlets: true, cable: TE(2.5, 1.5) });
    expect(withCode(cartridgeRing, 'rating-over-iz')).toEqual([]);
    expect(withCode(cartridgeRing, 'ring-iz-below-20')).toEqual([]);
  });
});
