import { describe, expect, it } from 'vitest';
import { makeSchedule, oneCircuit, withCode } from './fixtures.js';

// BS 7671 434.5.1 (from memory): a device's breaking capacity must be at least the prospective fault current
// where it is installed, unless a device upstream backs it up. A consumer unit to BS EN 61439-3 commonly carries a
// 16 kA conditional short-circuit rating (from memory / common practice); 6 kA is the usual domestic Icn (common practice).
const breaker = (id: string, breakingCapacityKa: number | null, extra: Record<string, unknown> = {}) => ({
  id,
  row: 1,
  kind: 'mcb' as const,
  rating: 20,
  curve: 'B' as const,
  breakingCapacityKa,
  ...extra,
});

describe('breaking capacity against the prospective fault current (434.5.1)', () => {
  it('when 6 kA RCBOs sit on a board with 6.4 kA PFC, then one warning naming the ways and the conditional rating', () => {
    const s = makeSchedule({
      board: { phases: 3, supply: { pfcKa: 6.4 } }, // the audit's workshop case: 6 kA devices, 6.4 kA PFC
      devices: [breaker('a', 10), breaker('b', 6, { kind: 'rcbo', residualMa: 30 }), breaker('c', 6, { kind: 'rcbo', residualMa: 30 })],
      circuits: [
        { way: 1, deviceId: 'a' },
        { way: 2, phase: 'L2', deviceId: 'c' },
        { way: 2, phase: 'L1', deviceId: 'b' },
      ],
    });
    const found = withCode(s, 'breaking-capacity-below-pfc');
    expect(found).toHaveLength(1);
    expect(found[0]).toMatchObject({ severity: 'warning', rule: 'BS 7671 434.5.1', ways: [2], field: 'board.supply.pfcKa' });
    expect(found[0]!.message).toContain('6.4 kA prospective fault current at the board is above the breaking capacity of 6 kA devices on ways 2 L1 and 2 L2.');
    expect(found[0]!.message).toContain('conditional short-circuit rating (commonly 16 kA)'); // BS EN 61439-3 consumer units (from memory)
    expect(found[0]!.message).not.toContain('way 1'); // the 10 kA MCB is above 6.4 kA
  });

  it('when capacities differ, then each is listed in rising order, one device in the singular', () => {
    const s = makeSchedule({
      board: { supply: { pfcKa: 12 } },
      devices: [breaker('a', 10), breaker('b', 6), breaker('c', 6), breaker('d', 6, { label: 'Spare' })],
      circuits: [
        { way: 1, deviceId: 'a' },
        { way: 2, deviceId: 'b' },
        { way: 3, deviceId: 'c' },
      ],
    });
    const [f] = withCode(s, 'breaking-capacity-below-pfc');
    expect(f!.ways).toEqual([1, 2, 3]);
    expect(f!.message).toContain('breaking capacity of 6 kA devices on ways 2 and 3, and Spare (B20, no circuit); 10 kA device on way 1.');
  });

  it('when the PFC is above 16 kA, then the warning says the common conditional rating would not cover it', () => {
    const [f] = withCode(oneCircuit({ breakingCapacityKa: 10 }, {}, { supply: { pfcKa: 18 } }), 'breaking-capacity-below-pfc');
    expect(f!.severity).toBe('warning'); // an assembly may still be rated higher: confirm, not condemn
    expect(f!.message).toContain('the common 16 kA would not cover 18 kA'); // 16 kA: from memory / common practice
  });

  it('when the capacity equals or exceeds the PFC, or no PFC is recorded, then nothing', () => {
    expect(withCode(oneCircuit({ breakingCapacityKa: 6 }, {}, { supply: { pfcKa: 6 } }), 'breaking-capacity-below-pfc')).toEqual([]); // "not less than" (434.5.1)
    expect(withCode(oneCircuit({ breakingCapacityKa: 6 }, {}), 'breaking-capacity-below-pfc')).toEqual([]);
    // an RCD without overcurrent protection is not a 434.5.1 device
    const rcd = makeSchedule({
      board: { supply: { pfcKa: 9 } },
      devices: [{ id: 'r', row: 1, kind: 'rcd', rating: 63, residualMa: 30, breakingCapacityKa: 6 }],
      circuits: [],
    });
    expect(withCode(rcd, 'breaking-capacity-below-pfc')).toEqual([]);
  });

  it('when the PFC is above 6 kA and some capacities are not recorded, then one note listing them, pointing at the first', () => {
    const s = makeSchedule({
      board: { supply: { pfcKa: 7.5 } },
      devices: [breaker('a', 10), breaker('b', null), breaker('c', null)],
      circuits: [
        { way: 1, deviceId: 'a' },
        { way: 2, deviceId: 'b' },
        { way: 3, deviceId: 'c' },
      ],
    });
    const notes = withCode(s, 'breaking-capacity-not-recorded');
    expect(notes).toHaveLength(1);
    expect(notes[0]).toMatchObject({ severity: 'info', ways: [2, 3], field: 'devices.1.breakingCapacityKa' });
    expect(notes[0]!.message).toBe(
      "The 7.5 kA prospective fault current is above the 6 kA usual for domestic breakers, but no breaking capacity is recorded for the devices on ways 2 and 3: record each device's Icn so it can be checked",
    );
  });

  it('when the PFC is 6 kA or less, then unrecorded capacities make no note (6 kA is the usual domestic rating)', () => {
    expect(withCode(oneCircuit({ breakingCapacityKa: null }, {}, { supply: { pfcKa: 6 } }), 'breaking-capacity-not-recorded')).toEqual([]); // common practice
    expect(withCode(oneCircuit({ breakingCapacityKa: null }, {}, { supply: { pfcKa: 6.1 } }), 'breaking-capacity-not-recorded')).toHaveLength(1);
  });
});
