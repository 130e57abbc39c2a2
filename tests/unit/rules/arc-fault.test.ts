import { describe, expect, it } from 'vitest';
import { makeSchedule, oneCircuit, withCode } from './fixtures.js';

// BS 7671:2018+A2:2022 421.1.7: AFDDs to BS EN 62606 required on single-phase socket-outlet final circuits up to
// 32 A in HMOs (among other building types), recommended elsewhere (found).
const afdd = { kind: 'afdd' as const, rating: 32, curve: 'B' as const, residualMa: 30, rcdType: 'A' as const };

describe('421.1.7 arc fault detection on socket-outlet circuits', () => {
  it('when an HMO ring final is on an RCBO, then a warning on that way naming BS EN 62606', () => {
    const [f, ...rest] = withCode(oneCircuit({}, { way: 3, label: 'Landing sockets', kind: 'ring' }, { installationType: 'hmo' }), 'sockets-need-afdd');
    expect(rest).toEqual([]);
    expect(f).toMatchObject({ severity: 'warning', rule: 'BS 7671 421.1.7', ways: [3], field: 'circuits.0.deviceId' });
    expect(f!.message).toBe(
      'Way 3 (Landing sockets): in a house in multiple occupation, socket-outlet circuits up to 32 A need an AFDD (BS EN 62606); its device is not one',
    );
  });

  it('when the HMO socket circuit is on a combined AFDD, then nothing', () => {
    const s = oneCircuit(afdd, { kind: 'radial', socketOutlets: true }, { installationType: 'hmo' });
    expect([...withCode(s, 'sockets-need-afdd'), ...withCode(s, 'afdd-recommended')]).toEqual([]);
  });

  it('when the circuit is above 32 A, three-phase, or supplies no socket-outlets, then 421.1.7 does not apply', () => {
    const hmo = { installationType: 'hmo' as const };
    expect(withCode(oneCircuit({ rating: 40 }, { kind: 'radial', socketOutlets: true }, hmo), 'sockets-need-afdd')).toEqual([]); // up to 32 A
    expect(withCode(oneCircuit({ kind: 'mcb', poles: 3, rating: 32 }, { kind: 'radial', socketOutlets: true }, hmo), 'sockets-need-afdd')).toEqual([]); // single-phase only
    expect(withCode(oneCircuit({ rating: 6 }, { kind: 'lighting' }, hmo), 'sockets-need-afdd')).toEqual([]); // socket-outlets only
  });

  it('when a house has socket circuits without AFDDs, then one note for the board listing the ways', () => {
    const s = makeSchedule({
      devices: [
        { id: 'd1', row: 1, kind: 'rcbo', rating: 32, curve: 'B', residualMa: 30 },
        { id: 'd2', row: 1, kind: 'rcbo', rating: 20, curve: 'B', residualMa: 30 },
        { id: 'd3', row: 1, ...afdd },
      ],
      circuits: [
        { deviceId: 'd1', kind: 'ring' },
        { deviceId: 'd3', kind: 'ring' },
        { deviceId: 'd2', kind: 'radial', socketOutlets: true },
      ],
    });
    expect(withCode(s, 'sockets-need-afdd')).toEqual([]);
    const notes = withCode(s, 'afdd-recommended');
    expect(notes).toHaveLength(1);
    expect(notes[0]).toMatchObject({ severity: 'info', ways: [1, 3], field: 'circuits.0.deviceId' });
    expect(notes[0]!.message).toBe('Ways 1 and 3: AFDDs (BS EN 62606) are recommended for socket-outlet circuits up to 32 A');
  });
});

describe('a combined AFDD/RCBO', () => {
  it('when a domestic socket circuit is on an AFDD with 30 mA IΔn, then it counts as 30 mA RCD protection and as an AFDD', () => {
    const s = oneCircuit(afdd, { kind: 'ring' });
    // 411.3.3: 30 mA additional protection (found); 421.1.7: AFDD (found).
    expect([...withCode(s, 'sockets-need-rcd'), ...withCode(s, 'afdd-recommended')]).toEqual([]);
  });

  it('when the AFDD records no IΔn, then it is not taken as RCD protection', () => {
    const s = oneCircuit({ ...afdd, residualMa: null, rcdType: null }, { kind: 'ring' });
    expect(withCode(s, 'sockets-need-rcd')).toHaveLength(1); // 411.3.3 (found)
  });
});

describe('ways of a three-phase board in the recommendation', () => {
  it('when socket circuits sit on phases of one way, then the note names each as printed, "4 L1 and 4 L2"', () => {
    const s = makeSchedule({
      board: { phases: 3 },
      devices: [
        { id: 'd1', row: 1, kind: 'rcbo', rating: 20, curve: 'B', residualMa: 30 },
        { id: 'd2', row: 1, kind: 'rcbo', rating: 20, curve: 'B', residualMa: 30 },
      ],
      circuits: [
        { way: 4, phase: 'L2', deviceId: 'd2', kind: 'radial', socketOutlets: true },
        { way: 4, phase: 'L1', deviceId: 'd1', kind: 'radial', socketOutlets: true },
      ],
    });
    const [note] = withCode(s, 'afdd-recommended');
    expect(note!.message).toBe('Ways 4 L1 and 4 L2: AFDDs (BS EN 62606) are recommended for socket-outlet circuits up to 32 A');
  });
});
