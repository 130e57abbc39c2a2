import { describe, expect, it } from 'vitest';
import { ambientFactor, groupingFactor, insulationFactor } from '../../../shared/rules/bs7671/correction-factors.js';
import { cableSchema } from '../../../shared/schemas/schedule.js';
import { oneCircuit, withCode } from './fixtures.js';

type Method = '100' | '101' | '102' | '103' | 'C' | 'A';
interface Conditions {
  ambientC?: number;
  groupedWith?: number;
  insulatedLengthMm?: number;
}
const te = (liveCsa: number, referenceMethod: Method, conditions: Conditions = {}) => ({
  type: 'twin-earth' as const,
  liveCsa,
  cpcCsa: liveCsa >= 2.5 ? 1.5 : 1,
  referenceMethod,
  ...conditions,
});
const mcb = (rating: number) => ({ kind: 'mcb' as const, rating, curve: 'B' as const, residualMa: null });
const radial = (rating: number, cable: ReturnType<typeof te>) => oneCircuit(mcb(rating), { way: 3, label: 'Garage', kind: 'radial', cable });
const ring = (cable: ReturnType<typeof te>) => oneCircuit(mcb(32), { way: 4, label: 'Kitchen', kind: 'ring', legs: 2, cable });

describe('the factor tables', () => {
  it('when Table 4B1 is read for 70 °C thermoplastic, then Ca falls with the heat and stops at 60 °C', () => {
    expect(ambientFactor(30)).toBe(1); // BS 7671 Table 4B1, the tables' reference ambient (from memory)
    expect(ambientFactor(25)).toBe(1.03); // BS 7671 Table 4B1, 70 °C thermoplastic, 25 °C (from memory)
    expect(ambientFactor(35)).toBe(0.94); // BS 7671 Table 4B1, 35 °C (from memory)
    expect(ambientFactor(40)).toBe(0.87); // BS 7671 Table 4B1, 40 °C (from memory)
    expect(ambientFactor(50)).toBe(0.71); // BS 7671 Table 4B1, 50 °C (from memory)
    expect(ambientFactor(60)).toBe(0.5); // BS 7671 Table 4B1, 60 °C (from memory)
    expect(ambientFactor(61)).toBeNull(); // BS 7671 Table 4B1 has no 70 °C thermoplastic value above 60 °C (from memory)
  });

  it('when an ambient falls between tabulated points, then the hotter point is read; below 25 °C no more than 1.03', () => {
    expect(ambientFactor(32)).toBe(0.94); // between 30 and 35 °C: 35 °C's 0.94 is the safer (Table 4B1, from memory)
    expect(ambientFactor(27)).toBe(1); // between 25 and 30 °C: 30 °C's 1.00 (Table 4B1, from memory)
    expect(ambientFactor(5)).toBe(1.03); // our table starts at 25 °C: no more credit than 1.03 (Table 4B1, from memory)
  });

  it('when Table 4C1 row 1 (bunched or enclosed) is read, then Cg comes back by the number grouped', () => {
    expect(groupingFactor(1)).toBe(1); // BS 7671 Table 4C1 item 1, one circuit (from memory)
    expect(groupingFactor(2)).toBe(0.8); // BS 7671 Table 4C1 item 1, 2 circuits (from memory)
    expect(groupingFactor(3)).toBe(0.7); // BS 7671 Table 4C1 item 1, 3 circuits (from memory)
    expect(groupingFactor(4)).toBe(0.65); // BS 7671 Table 4C1 item 1, 4 circuits (from memory)
    expect(groupingFactor(6)).toBe(0.57); // BS 7671 Table 4C1 item 1, 6 circuits (from memory)
    expect(groupingFactor(9)).toBe(0.5); // BS 7671 Table 4C1 item 1, 9 circuits (from memory)
    expect(groupingFactor(20)).toBe(0.38); // BS 7671 Table 4C1 item 1, 20 circuits (from memory)
  });

  it('when the number grouped falls between columns, then the larger group is read; above 20 there is no value', () => {
    expect(groupingFactor(10)).toBe(0.45); // between 9 and 12: 12's 0.45 is the safer (Table 4C1, from memory)
    expect(groupingFactor(13)).toBe(0.41); // between 12 and 16: 16's 0.41 (Table 4C1, from memory)
    expect(groupingFactor(21)).toBeNull(); // Table 4C1 stops at 20 (from memory)
  });

  it('when Table 52.2 is read, then Ci falls with the length in insulation, to 0.5 from 0.5 m (523.9)', () => {
    expect(insulationFactor(0, 2.5)).toBe(1); // no insulation, no factor
    expect(insulationFactor(50, 2.5)).toBe(0.88); // BS 7671 Table 52.2, 50 mm (from memory)
    expect(insulationFactor(100, 2.5)).toBe(0.78); // BS 7671 Table 52.2, 100 mm (from memory)
    expect(insulationFactor(200, 2.5)).toBe(0.63); // BS 7671 Table 52.2, 200 mm (from memory)
    expect(insulationFactor(400, 2.5)).toBe(0.51); // BS 7671 Table 52.2, 400 mm (from memory)
    expect(insulationFactor(500, 2.5)).toBe(0.5); // BS 7671 523.9, 0.5 m or more: 0.5 of method C (from memory)
    expect(insulationFactor(3000, 1.5)).toBe(0.5); // BS 7671 523.9 (from memory)
  });

  it('when a length falls between rows or the cable is larger than 10 mm², then the safer factor is read', () => {
    expect(insulationFactor(30, 2.5)).toBe(0.88); // under 50 mm: 50 mm's 0.88 (Table 52.2, from memory)
    expect(insulationFactor(150, 2.5)).toBe(0.63); // between 100 and 200 mm: 200 mm's 0.63 (Table 52.2, from memory)
    expect(insulationFactor(450, 2.5)).toBe(0.5); // between 400 mm and 0.5 m: 523.9's 0.5 (from memory)
    expect(insulationFactor(100, 16)).toBe(0.5); // Table 52.2 covers up to 10 mm²; 523.9's 0.5 otherwise (from memory)
  });
});

describe('In ≤ Iz × Ca × Cg × Ci (433.1.1)', () => {
  it('when 2.5 mm² clipped direct on a B20 is grouped with two others, then 27 × 0.70 = 18.9 A fails at the grouping field', () => {
    const [f] = withCode(radial(20, te(2.5, 'C', { groupedWith: 3 })), 'rating-over-iz'); // Table 4D5 2.5 mm² C 27 A (found) × Table 4C1 0.70 (from memory)
    expect(f).toMatchObject({ severity: 'error', rule: 'BS 7671 433.1.1', ways: [3], field: 'circuits.0.cable.groupedWith' });
    expect(f.message).toBe(
      'Way 3 (Garage): device rating 20 A (B20) exceeds the 18.9 A capacity of 2.5 mm² twin-and-earth at method C ' +
        'with Cg 0.70 for 3 circuits grouped (Table 4C1), from 27 A in Table 4D5',
    );
  });

  it('when the same cable is grouped with one other, then 27 × 0.80 = 21.6 A carries the B20', () => {
    expect(withCode(radial(20, te(2.5, 'C', { groupedWith: 2 })), 'rating-over-iz')).toEqual([]); // Table 4D5 27 A (found) × Table 4C1 0.80 (from memory)
  });

  it('when the ambient is 35 °C, then a B25 passes on 25.38 A; at 40 °C, 23.49 A fails at the ambient field', () => {
    expect(withCode(radial(25, te(2.5, 'C', { ambientC: 35 })), 'rating-over-iz')).toEqual([]); // 27 A (Table 4D5, found) × 0.94 (Table 4B1, from memory)
    const [f] = withCode(radial(25, te(2.5, 'C', { ambientC: 40 })), 'rating-over-iz'); // 27 A × 0.87 (Table 4B1, from memory) = 23.49 A
    expect(f.field).toBe('circuits.0.cable.ambientC');
    // Messages print the corrected Iz rounded down to 0.1 A, so 23.49 A reads 23.4 A.
    expect(f.message).toContain('23.4 A capacity of 2.5 mm² twin-and-earth at method C with Ca 0.87 for 40 °C ambient (Table 4B1)');
  });

  it('when a clipped run passes through insulation, then 100 mm (21.06 A) carries a B20 and 200 mm (17.01 A) does not', () => {
    expect(withCode(radial(20, te(2.5, 'C', { insulatedLengthMm: 100 })), 'rating-over-iz')).toEqual([]); // 27 A (found) × Table 52.2 0.78 (from memory)
    const [f] = withCode(radial(20, te(2.5, 'C', { insulatedLengthMm: 200 })), 'rating-over-iz'); // 27 A × Table 52.2 0.63 (from memory)
    expect(f.field).toBe('circuits.0.cable.insulatedLengthMm');
    expect(f.message).toContain('17 A capacity');
    expect(f.message).toContain('Ci 0.63 for 200 mm in thermal insulation (Table 52.2)');
  });

  it('when every condition is recorded, then the factors multiply and the message names each', () => {
    const [f] = withCode(radial(20, te(2.5, 'C', { ambientC: 35, groupedWith: 2, insulatedLengthMm: 100 })), 'rating-over-iz');
    // 27 A (Table 4D5, found) × 0.94 (Table 4B1) × 0.80 (Table 4C1) × 0.78 (Table 52.2), all from memory = 15.84 A
    expect(f.message).toContain(
      'exceeds the 15.8 A capacity of 2.5 mm² twin-and-earth at method C with Ca 0.94 for 35 °C ambient (Table 4B1), ' +
        'Cg 0.80 for 2 circuits grouped (Table 4C1) and Ci 0.78 for 100 mm in thermal insulation (Table 52.2), from 27 A in Table 4D5',
    );
    expect(f.field).toBe('circuits.0.cable.insulatedLengthMm'); // the factor that lowers Iz most: Ci 0.78 against Cg 0.80 and Ca 0.94
  });

  it('when the cable fails even on its tabulated Iz, then the finding stays on the csa and still names the factors', () => {
    const [f] = withCode(radial(32, te(2.5, 'C', { groupedWith: 3 })), 'rating-over-iz'); // 32 A > 27 A (Table 4D5, found) before any factor
    expect(f.field).toBe('circuits.0.cable.liveCsa');
    expect(f.message).toContain('18.9 A capacity');
  });

  it('when conditions are recorded as neutral (30 °C, alone, no insulation), then the message is the uncorrected one', () => {
    const [f] = withCode(radial(32, te(2.5, 'C', { ambientC: 30, groupedWith: 1, insulatedLengthMm: 0 })), 'rating-over-iz');
    expect(f.message).toBe('Way 3 (Garage): device rating 32 A (B32) exceeds the 27 A capacity of 2.5 mm² twin-and-earth at method C (Table 4D5)'); // Table 4D5 (found)
  });

  it('when a cold ambient is recorded, then Ca is no more than 1.03 (27.81 A), so a B32 still fails', () => {
    const [f] = withCode(radial(32, te(2.5, 'C', { ambientC: 10 })), 'rating-over-iz'); // 27 A (found) × 1.03 (Table 4B1 at 25 °C, from memory)
    expect(f.message).toContain('27.8 A capacity');
  });
});

describe('thermal insulation against the reference method', () => {
  it('when a method A cable has 100 mm in insulation, then method C × 0.78 = 21.06 A is above method A’s 20 A, which still governs', () => {
    expect(withCode(radial(20, te(2.5, 'A', { insulatedLengthMm: 100 })), 'rating-over-iz')).toEqual([]); // Table 4D5 A 20 A, C 27 A (found); Table 52.2 0.78 (from memory)
  });

  it('when a method A cable has 400 mm in insulation, then 27 × 0.51 = 13.77 A governs and the message says it is worked from method C', () => {
    const [f] = withCode(radial(16, te(2.5, 'A', { insulatedLengthMm: 400 })), 'rating-over-iz'); // Table 4D5 C 27 A (found) × Table 52.2 0.51 (from memory)
    expect(f.field).toBe('circuits.0.cable.insulatedLengthMm');
    expect(f.message).toContain('13.7 A capacity of 2.5 mm² twin-and-earth at method C where it is in insulation (method A elsewhere) with Ci 0.51');
  });

  it('when a method 103 cable (already surrounded by insulation) has 1 m in insulation recorded, then it is not derated twice', () => {
    // Table 4D5 1.5 mm² 103 is 10 A (found), the same as 0.5 (523.9, from memory) × 20 A at method C (found)
    expect(withCode(oneCircuit(mcb(10), { kind: 'lighting', cable: te(1.5, '103', { insulatedLengthMm: 1000 }) }), 'rating-over-iz')).toEqual([]);
  });

  it('when a 16 mm² cable has 100 mm in insulation, then 523.9’s 0.5 is used and named, as Table 52.2 stops at 10 mm²', () => {
    const [f] = withCode(radial(63, te(16, 'C', { insulatedLengthMm: 100 })), 'rating-over-iz'); // Table 4D5 16 mm² C 85 A × 0.5 = 42.5 A (from memory)
    expect(f.message).toContain('42.5 A capacity');
    expect(f.message).toContain('Ci 0.50 for 100 mm in thermal insulation (523.9)');
  });
});

describe('ring finals under their conditions (433.1.204)', () => {
  it('when a 2.5 mm² ring clipped direct is grouped with one other, then 21.6 A meets the 20 A it needs', () => {
    expect(withCode(ring(te(2.5, 'C', { groupedWith: 2 })), 'ring-iz-below-20')).toEqual([]); // 27 A (Table 4D5, found) × 0.80 (Table 4C1, from memory); 433.1.204 (partly)
  });

  it('when it is grouped with two others, then 18.9 A is below 20 A and the finding points at the grouping', () => {
    const [f] = withCode(ring(te(2.5, 'C', { groupedWith: 3 })), 'ring-iz-below-20'); // 27 A × 0.70 (Table 4C1, from memory) < 20 A (433.1.204, partly)
    expect(f).toMatchObject({ severity: 'error', rule: 'BS 7671 433.1.204', field: 'circuits.0.cable.groupedWith' });
    expect(f.message).toBe(
      'Way 4 (Kitchen): a 2.5 mm² ring final on a B32 needs Iz of at least 20 A under its installation conditions, ' +
        'but it has 18.9 A at method C with Cg 0.70 for 3 circuits grouped (Table 4C1), from 27 A in Table 4D5',
    );
  });

  it('when a ring at method A (exactly 20 A) runs in a 35 °C loft, then 18.8 A fails at the ambient field', () => {
    const [f] = withCode(ring(te(2.5, 'A', { ambientC: 35 })), 'ring-iz-below-20'); // 20 A (Table 4D5 A, found) × 0.94 (Table 4B1, from memory)
    expect(f.field).toBe('circuits.0.cable.ambientC');
  });
});

describe('conditions the tables do not cover', () => {
  it('when the ambient is above 60 °C, then an error says the cable is not for that heat', () => {
    const [f] = withCode(radial(16, te(2.5, 'C', { ambientC: 65 })), 'ambient-over-cable-limit'); // Table 4B1: no 70 °C thermoplastic value above 60 °C (from memory)
    expect(f).toMatchObject({ severity: 'error', field: 'circuits.0.cable.ambientC' });
    expect(withCode(radial(16, te(2.5, 'C', { ambientC: 65 })), 'rating-over-iz')).toEqual([]);
  });

  it('when more than 20 circuits are grouped, then capacity is not checked rather than guessed', () => {
    const [f] = withCode(radial(6, te(2.5, 'C', { groupedWith: 24 })), 'capacity-not-checked'); // Table 4C1 stops at 20 (from memory)
    expect(f).toMatchObject({ severity: 'info', field: 'circuits.0.cable.groupedWith' });
  });
});

describe('the installation conditions in the schedule', () => {
  it('when a cable saved before the conditions existed is parsed, then each condition is null', () => {
    const cable = cableSchema.parse({ type: 'twin-earth', liveCsa: 2.5, cpcCsa: 1.5, referenceMethod: 'C', lengthM: 12, diameterMm: null });
    expect(cable).toMatchObject({ ambientC: null, groupedWith: null, insulatedLengthMm: null });
  });

  it('when a condition is out of range or of the wrong kind, then the schema says which and why', () => {
    const result = cableSchema.safeParse({ ambientC: 120, groupedWith: 0.5, insulatedLengthMm: -10 });
    expect(result.success).toBe(false);
    const messages = Object.fromEntries(result.error!.issues.map((i) => [i.path.join('.'), i.message]));
    expect(messages).toEqual({ ambientC: 'At most 90 °C', groupedWith: 'Whole circuits only', insulatedLengthMm: 'Length in insulation cannot be negative' });
    expect(cableSchema.safeParse({ groupedWith: 0 }).error?.issues[0].message).toBe('Count this circuit too: at least 1');
    expect(cableSchema.safeParse({ ambientC: 'hot' }).error?.issues[0].message).toBe('Ambient temperature must be a number');
  });
});
