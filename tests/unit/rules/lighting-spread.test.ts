import { describe, expect, it } from 'vitest';
import { makeSchedule, withCode } from './fixtures.js';

const rcd = (id: string) => ({ id, row: 1, kind: 'rcd' as const, modules: 2, rating: 63, residualMa: 30, rcdType: 'A' as const });
const mcb = (id: string, rating = 6) => ({ id, row: 1, kind: 'mcb' as const, rating, curve: 'B' as const });
const rcbo = (id: string) => ({ id, row: 1, kind: 'rcbo' as const, rating: 6, curve: 'B' as const, residualMa: 30 });
const lights = (way: number, deviceId: string, locations: string[] = []) => ({ way, deviceId, kind: 'lighting' as const, label: `Lights ${way}`, locations });
const most = (s: ReturnType<typeof makeSchedule>) => withCode(s, 'lighting-behind-one-rcd');
const area = (s: ReturnType<typeof makeSchedule>) => withCode(s, 'area-lighting-behind-one-rcd');

// The thresholds (more than half of the lighting; an area's every lighting circuit) are our own reading of
// BS 7671 314.1 (i) and (iii): minimise inconvenience, allow for the failure of a single circuit (common practice).
describe('most of the lighting behind one RCD (BS 7671 314.1, 314.2)', () => {
  it('when both lighting circuits follow RCD 1 on a split-load row, then a warning names them, the count and the RCD', () => {
    const s = makeSchedule({
      devices: [rcd('r1'), mcb('a'), mcb('b'), mcb('s', 32), rcd('r2'), mcb('t', 32)],
      circuits: [lights(1, 'a'), lights(2, 'b'), { way: 3, deviceId: 's', kind: 'ring' }, { way: 4, deviceId: 't', kind: 'ring' }],
    });
    const [f] = most(s);
    expect(f).toMatchObject({ severity: 'warning', rule: 'BS 7671 314.1, 314.2', ways: [1, 2], field: 'circuits.0.deviceId' });
    expect(f.message).toBe(
      'All 2 lighting circuits (ways 1 and 2) are behind RCD 1 with 1 other circuit: one trip of RCD 1 leaves all of the lighting dark; spread lighting across RCDs or use RCBOs (BS 7671 314.1, 314.2)',
    );
  });

  it('when three of four lighting circuits share RCD 2, then it warns with 3 of 4 (this passed silently before)', () => {
    const s = makeSchedule({
      devices: [rcd('r1'), mcb('a'), mcb('s', 32), rcd('r2'), mcb('b'), mcb('c'), mcb('d')],
      circuits: [lights(1, 'a'), { way: 2, deviceId: 's', kind: 'ring' }, lights(3, 'b'), lights(4, 'c'), lights(5, 'd')],
    });
    const [f] = most(s);
    expect(f).toMatchObject({ ways: [3, 4, 5], field: 'circuits.2.deviceId' });
    expect(f.message).toBe(
      '3 of 4 lighting circuits (ways 3, 4 and 5) are behind RCD 2: one trip of RCD 2 leaves most of the lighting dark; spread lighting across RCDs or use RCBOs (BS 7671 314.1, 314.2)',
    );
  });

  it('when exactly half of the lighting shares an RCD, then no warning: half is not most', () => {
    const s = makeSchedule({
      devices: [rcd('r1'), mcb('a'), mcb('b'), rcd('r2'), mcb('c'), mcb('d')],
      circuits: [lights(1, 'a'), lights(2, 'b'), lights(3, 'c'), lights(4, 'd')],
    });
    expect(most(s)).toEqual([]);
  });

  it('when the only lighting circuit shares its RCD with sockets, then it warns; alone on its RCD, it does not', () => {
    const shared = makeSchedule({ devices: [rcd('r1'), mcb('a'), mcb('s', 32)], circuits: [lights(1, 'a'), { way: 2, deviceId: 's', kind: 'ring' }] });
    expect(most(shared)[0]?.message).toMatch(/^The only lighting circuit \(way 1\) is behind RCD 1 with 1 other circuit: /);
    // A fault elsewhere cannot trip an RCD that protects only this circuit.
    const alone = makeSchedule({
      devices: [rcd('r1'), mcb('a'), rcd('r2'), mcb('s', 32)],
      circuits: [lights(1, 'a'), { way: 2, deviceId: 's', kind: 'ring' }],
    });
    expect(most(alone)).toEqual([]);
  });

  it('when each lighting circuit has its own RCBO, then no warning', () => {
    const s = makeSchedule({ devices: [rcbo('a'), rcbo('b')], circuits: [lights(1, 'a', ['Hall']), lights(2, 'b', ['Hall'])] });
    expect([...most(s), ...area(s)]).toEqual([]);
  });
});

describe('an area left dark by one RCD (BS 7671 314.1, 314.2)', () => {
  // Lighting spread 2 + 2 over two RCDs, so "most of the lighting" stays quiet and only areas are judged.
  const board = (locations: string[][]) =>
    makeSchedule({
      devices: [rcd('r1'), mcb('a'), mcb('b'), rcd('r2'), mcb('c'), mcb('d')],
      circuits: [lights(1, 'a', locations[0]), lights(2, 'b', locations[1]), lights(3, 'c', locations[2]), lights(4, 'd', locations[3])],
    });

  it('when both circuits lighting the kitchen are behind RCD 1, then a warning names the ways, the area and the RCD', () => {
    const s = board([['Kitchen'], ['kitchen ', 'Utility'], ['Hall'], ['Landing']]);
    expect(most(s)).toEqual([]);
    const [f] = area(s);
    expect(f).toMatchObject({ severity: 'warning', rule: 'BS 7671 314.1, 314.2', ways: [1, 2], field: 'circuits.0.deviceId' });
    expect(f.message).toBe(
      'Ways 1 and 2, all the lighting of Kitchen, are behind RCD 1: one trip of RCD 1 leaves Kitchen dark; put one of them on another RCD or use RCBOs (BS 7671 314.1, 314.2)',
    );
  });

  it('when an area is lit from both RCDs, then no warning', () => {
    expect(area(board([['Kitchen'], ['Hall'], ['Kitchen'], ['Hall']]))).toEqual([]);
  });

  it('when each area has one lighting circuit, then no warning: that circuit failing darkens it whatever its RCD', () => {
    expect(area(board([['Kitchen'], ['Hall'], ['Lounge'], ['Landing']]))).toEqual([]);
  });

  it('when two areas are dark behind RCD 2, then one warning lists both', () => {
    const [f, extra] = area(board([['Hall'], ['Kitchen'], ['Upstairs', 'Loft'], ['Upstairs', 'Loft']]));
    expect(extra).toBeUndefined();
    expect(f.ways).toEqual([3, 4]);
    expect(f.message).toContain('all the lighting of Upstairs and Loft, are behind RCD 2: one trip of RCD 2 leaves Upstairs and Loft dark');
  });

  it('when most of the lighting is behind one RCD, then its areas are not listed again in a second warning', () => {
    const s = makeSchedule({
      devices: [rcd('r1'), mcb('a'), mcb('b'), mcb('c')],
      circuits: [lights(1, 'a', ['Kitchen']), lights(2, 'b', ['Kitchen']), lights(3, 'c', ['Hall'])],
    });
    expect(most(s)).toHaveLength(1);
    expect(area(s)).toEqual([]);
  });
});
