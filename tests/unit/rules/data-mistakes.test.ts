import { describe, expect, it } from 'vitest';
import { makeSchedule, oneCircuit, withCode } from './fixtures.js';

const rcbo = (id: string, extra: Record<string, unknown> = {}) => ({
  id,
  row: 1,
  kind: 'rcbo' as const,
  rating: 20,
  curve: 'B' as const,
  residualMa: 30,
  ...extra,
});

describe('ways', () => {
  it('when two circuits use way 3 on a single-phase board, then an error on the second one', () => {
    const s = makeSchedule({
      devices: [rcbo('a'), rcbo('b')],
      circuits: [
        { way: 3, deviceId: 'a', label: 'Hall' },
        { way: 3, deviceId: 'b', label: 'Loft' },
      ],
    });
    const [f] = withCode(s, 'way-used-twice');
    expect(f).toMatchObject({ severity: 'error', ways: [3], field: 'circuits.1.way' });
    expect(f.message).toBe('Way 3 (Loft): way 3 is already used by Hall');
  });

  it('when a three-phase board has way 4 on L1 and L2, then no clash; the same phase twice clashes', () => {
    const board = { phases: 3 as const };
    const ok = makeSchedule({
      board,
      devices: [rcbo('a'), rcbo('b')],
      circuits: [
        { way: 4, phase: 'L1', deviceId: 'a' },
        { way: 4, phase: 'L2', deviceId: 'b' },
      ],
    });
    expect(withCode(ok, 'way-used-twice')).toEqual([]);
    const bad = makeSchedule({
      board,
      devices: [rcbo('a'), rcbo('b')],
      circuits: [
        { way: 4, phase: 'L1', deviceId: 'a' },
        { way: 4, phase: 'L1', deviceId: 'b' },
      ],
    });
    expect(withCode(bad, 'way-used-twice')).toHaveLength(1);
  });

  it('when a three-phase circuit (no phase) takes way 1, then a single-phase circuit on way 1 L2 clashes with it', () => {
    const s = makeSchedule({
      board: { phases: 3 },
      devices: [rcbo('a', { poles: 3 }), rcbo('b')],
      circuits: [
        { way: 1, deviceId: 'a' },
        { way: 1, phase: 'L2', deviceId: 'b' },
      ],
    });
    expect(withCode(s, 'way-used-twice')).toHaveLength(1);
  });

  it('when two circuits share an id, then an error so the diff and the editor can tell them apart', () => {
    const s = makeSchedule({
      devices: [rcbo('a'), rcbo('b')],
      circuits: [
        { id: 'x', deviceId: 'a' },
        { id: 'x', deviceId: 'b' },
      ],
    });
    expect(withCode(s, 'circuit-id-twice')).toHaveLength(1);
  });
});

describe('devices named by circuits', () => {
  it('when a circuit names no device, then a warning; when it names an unknown one, then an error', () => {
    expect(withCode(makeSchedule({ circuits: [{ deviceId: null }] }), 'circuit-without-device')[0]).toMatchObject({
      severity: 'warning',
      field: 'circuits.0.deviceId',
    });
    expect(withCode(makeSchedule({ circuits: [{ deviceId: 'ghost' }] }), 'unknown-device')[0]).toMatchObject({
      severity: 'error',
      field: 'circuits.0.deviceId',
    });
  });
});

describe('rows', () => {
  it('when a row of 4 modules holds 2 + 1 + 1, then it fits; one more module is over capacity', () => {
    const devices = [{ id: 'm', row: 1, kind: 'main-switch' as const, modules: 2 }, rcbo('a'), rcbo('b')];
    expect(withCode(makeSchedule({ board: { modulesPerRow: 4 }, devices }), 'row-over-capacity')).toEqual([]);
    const [f] = withCode(makeSchedule({ board: { modulesPerRow: 4 }, devices: [...devices, rcbo('c')] }), 'row-over-capacity');
    expect(f).toMatchObject({ severity: 'error', field: 'devices.3.modules' });
  });

  it('when a device is on row 2 of a one-row board, then an error', () => {
    expect(withCode(makeSchedule({ board: { rows: 1 }, devices: [rcbo('a', { row: 2 })] }), 'device-beyond-rows')[0]).toMatchObject({
      severity: 'error',
      field: 'devices.0.row',
    });
  });

  it('when two devices share an id, then an error', () => {
    expect(withCode(makeSchedule({ devices: [rcbo('a'), rcbo('a')] }), 'device-id-twice')).toHaveLength(1);
  });
});

describe('cable and device values', () => {
  it('when the cpc is larger than the live conductors, then a warning that they may be swapped', () => {
    expect(withCode(oneCircuit({}, { cable: { liveCsa: 1.5, cpcCsa: 2.5 } }), 'cpc-larger-than-live')[0]).toMatchObject({
      severity: 'warning',
      field: 'circuits.0.cable.cpcCsa',
    });
    expect(withCode(oneCircuit({}, { cable: { liveCsa: 2.5, cpcCsa: 1.5 } }), 'cpc-larger-than-live')).toEqual([]);
  });

  it('when SWA or singles record a cpc larger than the live cores, then no warning: armour or a separate cpc may be larger', () => {
    expect(withCode(oneCircuit({}, { cable: { type: 'swa', liveCsa: 2.5, cpcCsa: 16 } }), 'cpc-larger-than-live')).toEqual([]); // armour as cpc (common practice)
    expect(withCode(oneCircuit({}, { cable: { type: 'singles-conduit', liveCsa: 2.5, cpcCsa: 4 } }), 'cpc-larger-than-live')).toEqual([]);
  });

  it('when twin-and-earth has a live csa but no cpc csa, then a note to record it, with the usual size', () => {
    const [f] = withCode(oneCircuit({}, { cable: { liveCsa: 2.5, cpcCsa: null } }), 'cpc-not-recorded');
    expect(f).toMatchObject({ severity: 'info', field: 'circuits.0.cable.cpcCsa', ways: [1] });
    expect(f!.message).toContain('2.5 mm² twin-and-earth usually has 1.5 mm²'); // BS 6004 6242Y 2.5/1.5 (from memory)
    expect(f!.message).toContain('adiabatic check (543.1.3)'); // BS 7671 543.1.3 (from memory)
    expect(withCode(oneCircuit({}, { cable: { liveCsa: 2.5, cpcCsa: 1.5 } }), 'cpc-not-recorded')).toEqual([]);
    expect(withCode(oneCircuit({}, { cable: { liveCsa: null, cpcCsa: null } }), 'cpc-not-recorded')).toEqual([]); // blank cable: "record the live csa" comes first
    expect(withCode(oneCircuit({}, { cable: { type: 'swa', liveCsa: 4, cpcCsa: null } }), 'cpc-not-recorded')).toEqual([]); // armour as cpc: no cpc core to record
  });

  it('when a breaker is 33 A, then no breaker is made in it; 32 A and 13 A are made', () => {
    expect(withCode(oneCircuit({ kind: 'mcb', rating: 33, residualMa: null }, {}), 'rating-not-made')[0]).toMatchObject({
      severity: 'warning',
      field: 'devices.0.rating',
      ways: [1],
    });
    expect(withCode(oneCircuit({ kind: 'mcb', rating: 32, residualMa: null }, {}), 'rating-not-made')).toEqual([]); // BS EN 60898-1 preferred values (from memory)
    expect(withCode(oneCircuit({ kind: 'mcb', rating: 13, residualMa: null }, {}), 'rating-not-made')).toEqual([]); // BS EN 60898-1 preferred values (from memory)
  });

  it('when an RCBO or RCD has no IΔn, then a warning on residualMa', () => {
    expect(withCode(oneCircuit({ residualMa: null }, {}), 'rcd-without-residual')[0].field).toBe('devices.0.residualMa');
    expect(withCode(makeSchedule({ devices: [{ id: 'r', row: 1, kind: 'rcd', modules: 2 }] }), 'rcd-without-residual')).toHaveLength(1);
  });

  it('when an MCB has no curve, then a warning so its maximum Zs can be found', () => {
    expect(withCode(oneCircuit({ kind: 'mcb', curve: null, residualMa: null }, {}), 'breaker-without-curve')[0].field).toBe('devices.0.curve');
  });

  it('when a final circuit names a board it feeds, then a warning; a sub-main may', () => {
    expect(withCode(oneCircuit({}, { kind: 'radial', feedsBoardId: 7 }), 'feeds-board-on-final-circuit')[0].field).toBe('circuits.0.feedsBoardId');
    expect(withCode(oneCircuit({}, { kind: 'sub-main', feedsBoardId: 7 }), 'feeds-board-on-final-circuit')).toEqual([]);
  });

  it('when a manual RCD link names a device that is not an RCD, then a warning on protectedBy', () => {
    const s = makeSchedule({ board: { rcdMode: 'manual' }, devices: [{ id: 'm', row: 1, kind: 'mcb', rating: 20, curve: 'B', protectedBy: 'nope' }] });
    expect(withCode(s, 'protected-by-not-rcd')[0].field).toBe('devices.0.protectedBy');
  });
});
