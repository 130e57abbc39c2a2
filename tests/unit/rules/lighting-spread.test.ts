import { describe, expect, it } from 'vitest';
import { makeSchedule, withCode } from './fixtures.js';

const rcd = (id: string) => ({ id, row: 1, kind: 'rcd' as const, modules: 2, rating: 63, residualMa: 30, rcdType: 'A' as const });
const mcb = (id: string, rating = 6) => ({ id, row: 1, kind: 'mcb' as const, rating, curve: 'B' as const });

describe('lighting all behind one RCD (common practice)', () => {
  it('when both lighting circuits follow RCD 1 on a split-load row, then a warning names them and the RCD', () => {
    const s = makeSchedule({
      devices: [rcd('r1'), mcb('a'), mcb('b'), mcb('s', 32), rcd('r2'), mcb('t', 32)],
      circuits: [
        { way: 1, deviceId: 'a', kind: 'lighting' },
        { way: 2, deviceId: 'b', kind: 'lighting' },
        { way: 3, deviceId: 's', kind: 'ring' },
        { way: 4, deviceId: 't', kind: 'ring' },
      ],
    });
    const [f] = withCode(s, 'lighting-behind-one-rcd');
    expect(f).toMatchObject({ severity: 'warning', rule: 'Common practice', ways: [1, 2] });
    expect(f.message).toBe(
      'All 2 lighting circuits are behind RCD 1 with 1 other circuit: a single trip leaves the premises dark; spread lighting across RCDs or use RCBOs',
    );
  });

  it('when lighting is spread across two RCDs, then no warning', () => {
    const s = makeSchedule({
      devices: [rcd('r1'), mcb('a'), rcd('r2'), mcb('b')],
      circuits: [
        { way: 1, deviceId: 'a', kind: 'lighting' },
        { way: 2, deviceId: 'b', kind: 'lighting' },
      ],
    });
    expect(withCode(s, 'lighting-behind-one-rcd')).toEqual([]);
  });

  it('when each lighting circuit has its own RCBO, then no warning', () => {
    const rcbo = (id: string) => ({ id, row: 1, kind: 'rcbo' as const, rating: 6, curve: 'B' as const, residualMa: 30 });
    const s = makeSchedule({
      devices: [rcbo('a'), rcbo('b')],
      circuits: [
        { deviceId: 'a', kind: 'lighting' },
        { deviceId: 'b', kind: 'lighting' },
      ],
    });
    expect(withCode(s, 'lighting-behind-one-rcd')).toEqual([]);
  });
});
