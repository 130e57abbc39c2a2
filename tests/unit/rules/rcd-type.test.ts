import { describe, expect, it } from 'vitest';
import { makeSchedule, oneCircuit, withCode } from './fixtures.js';
import { waysText } from '../../../shared/rules/bs7671/index.js';

// BS 7671:2018+A2:2022 531.3.3 (from memory): Type AC RCDs only for fixed equipment whose load current is known to
// contain no DC components. Showers and immersion heaters are resistive heating loads (common practice).
const rcd = { id: 'r', row: 1, kind: 'rcd' as const, rating: 63, residualMa: 30, rcdType: 'AC' as const, label: 'RCD 1' };
const mcb = (id: string) => ({ id, row: 1, kind: 'mcb' as const, rating: 16, curve: 'B' as const });

describe('Type AC RCDs (531.3.3)', () => {
  it('when a Type AC RCD protects socket-outlets, then a warning on the RCD listing every way it covers', () => {
    const s = makeSchedule({
      devices: [rcd, mcb('a'), mcb('b'), mcb('c')], // position mode: the RCD covers the MCBs after it on the row
      circuits: [
        { way: 1, deviceId: 'a', kind: 'lighting' },
        { way: 2, deviceId: 'b', kind: 'ring' },
        { way: 3, deviceId: 'c', kind: 'radial', socketOutlets: true },
      ],
    });
    const found = withCode(s, 'rcd-type-ac');
    expect(found).toHaveLength(1);
    expect(found[0]).toMatchObject({ severity: 'warning', rule: 'BS 7671 531.3.3', ways: [1, 2, 3], field: 'devices.0.rcdType' });
    expect(found[0]!.message).toContain('RCD 1 (RCD 63 A 30 mA), Type AC: since A2:2022');
    expect(found[0]!.message).toContain('it protects socket-outlets (ways 2 and 3); fit Type A');
  });

  it('when a Type AC RCBO feeds a sub-main, then a warning: the board it feeds may have anything on it', () => {
    const [f] = withCode(oneCircuit({ rcdType: 'AC' }, { kind: 'sub-main' }), 'rcd-type-ac');
    expect(f).toMatchObject({ severity: 'warning', ways: [1], field: 'devices.0.rcdType' });
    expect(f!.message).toContain('it protects a sub-main (way 1)');
    // An unlabelled RCBO is named by its kind as well as its rating.
    expect(f!.message).toMatch(/^RCBO B32 30 mA, Type AC: /);
  });

  it('when a Type AC RCBO feeds only lighting, then a note to confirm the load has no DC components', () => {
    const [f] = withCode(oneCircuit({ rcdType: 'AC', rating: 6 }, { kind: 'lighting' }), 'rcd-type-ac');
    expect(f).toMatchObject({ severity: 'info', ways: [1] });
    expect(f!.message).toContain('confirm that for way 1 (LED drivers');
  });

  it('when a Type AC RCBO feeds a shower or immersion heater, or the device is Type A, then nothing', () => {
    expect(withCode(oneCircuit({ rcdType: 'AC', rating: 40 }, { kind: 'shower' }), 'rcd-type-ac')).toEqual([]);
    expect(withCode(oneCircuit({ rcdType: 'AC', rating: 16 }, { kind: 'immersion' }), 'rcd-type-ac')).toEqual([]);
    expect(withCode(oneCircuit({ rcdType: 'A' }, { kind: 'ring' }), 'rcd-type-ac')).toEqual([]);
    expect(withCode(oneCircuit({ rcdType: null }, { kind: 'ring' }), 'rcd-type-ac')).toEqual([]); // type not recorded: nothing to judge
  });
});

describe('ways in rule messages', () => {
  it('when one way is listed, then the singular; several, then the plural joined with "and"', () => {
    expect(waysText([1])).toBe('way 1');
    expect(waysText([1, 2, 3])).toBe('ways 1, 2 and 3');
    expect(waysText(['4 L1', '4 L2'], true)).toBe('Ways 4 L1 and 4 L2');
    expect(waysText([7], true)).toBe('Way 7');
    // and in a real message: one socket circuit without an AFDD (BS 7671 421.1.7, found)
    const [note] = withCode(oneCircuit({}, { kind: 'ring' }), 'afdd-recommended');
    expect(note!.message).toMatch(/^Way 1: /);
  });
});
