import { describe, expect, it } from 'vitest';
import { makeSchedule, oneCircuit, withCode } from './fixtures.js';

const mcb = (rating: number) => ({ kind: 'mcb' as const, rating, curve: 'B' as const, residualMa: null, rcdType: null });
const rcboWith = (residualMa: number | null) => ({ kind: 'rcbo' as const, rating: 20, curve: 'B' as const, residualMa });

describe('411.3.3 socket-outlets up to 32 A', () => {
  it('when a domestic socket radial on a B20 MCB has no RCD, then an error', () => {
    const [f] = withCode(oneCircuit(mcb(20), { way: 2, label: 'Bedroom sockets', kind: 'radial', socketOutlets: true }), 'sockets-need-rcd'); // BS 7671 411.3.3 (found)
    expect(f).toMatchObject({ severity: 'error', rule: 'BS 7671 411.3.3', ways: [2], field: 'circuits.0.deviceId' });
    expect(f.message).toBe('Way 2 (Bedroom sockets): socket-outlets up to 32 A need 30 mA RCD additional protection, but it has no RCD protection');
  });

  it('when a ring final (sockets by kind) has a 30 mA RCBO, then it passes', () => {
    expect(withCode(oneCircuit({ rating: 32 }, { kind: 'ring' }), 'sockets-need-rcd')).toEqual([]); // 30 mA, BS 7671 411.3.3 (found)
  });

  it('when the sockets sit behind a 30 mA RCD on a split-load row, then they pass; behind a 100 mA RCD they fail', () => {
    const board = (residualMa: number) =>
      makeSchedule({
        devices: [
          { id: 'rcd1', row: 1, kind: 'rcd', modules: 2, rating: 63, residualMa, rcdType: 'A' },
          { id: 'd1', row: 1, ...mcb(32) },
        ],
        circuits: [{ deviceId: 'd1', kind: 'ring' }],
      });
    expect(withCode(board(30), 'sockets-need-rcd')).toEqual([]); // 411.3.3: IΔn ≤ 30 mA (found)
    expect(withCode(board(100), 'sockets-need-rcd')[0].message).toContain('trips at 100 mA, more than 30 mA');
  });

  it('when the socket circuit is rated above 32 A, then 411.3.3 does not ask for an RCD', () => {
    expect(withCode(oneCircuit(mcb(40), { kind: 'radial', socketOutlets: true }), 'sockets-need-rcd')).toEqual([]); // 411.3.3 up to 32 A (found)
  });

  it('when the sockets are outside a dwelling, then a warning mentions the risk-assessment exception', () => {
    const [f] = withCode(oneCircuit(mcb(20), { kind: 'radial', socketOutlets: true }, { installationType: 'commercial' }), 'sockets-need-rcd');
    expect(f.severity).toBe('warning');
    expect(f.message).toContain('documented risk assessment'); // BS 7671 411.3.3 risk-assessment exception (from memory)
  });

  it("when the RCBO's IΔn is not recorded, then a warning that 30 mA protection cannot be confirmed", () => {
    const [f] = withCode(oneCircuit(rcboWith(null), { kind: 'radial', socketOutlets: true }), 'sockets-need-rcd');
    expect(f.severity).toBe('warning');
  });
});

describe('411.3.4 domestic lighting', () => {
  it('when a domestic lighting circuit is on an MCB without RCD, then an error; with a 30 mA RCBO it passes', () => {
    expect(withCode(oneCircuit(mcb(6), { kind: 'lighting' }), 'lighting-needs-rcd')[0]).toMatchObject({ severity: 'error', rule: 'BS 7671 411.3.4' }); // (found)
    expect(withCode(oneCircuit({ rating: 6 }, { kind: 'lighting' }), 'lighting-needs-rcd')).toEqual([]);
  });

  it('when the lighting is in a commercial unit, then 411.3.4 does not apply', () => {
    expect(withCode(oneCircuit(mcb(10), { kind: 'lighting' }, { installationType: 'commercial' }), 'lighting-needs-rcd')).toEqual([]); // 411.3.4: domestic premises (found)
  });

  it('when the installation is rented domestic or an HMO, then it is a dwelling too', () => {
    expect(withCode(oneCircuit(mcb(6), { kind: 'lighting' }, { installationType: 'hmo' }), 'lighting-needs-rcd')).toHaveLength(1);
    expect(withCode(oneCircuit(mcb(6), { kind: 'lighting' }, { installationType: 'rented-domestic' }), 'lighting-needs-rcd')).toHaveLength(1);
  });
});

describe('522.6.202/203 cables concealed in walls', () => {
  it('when an immersion cable is concealed in a wall on an MCB alone, then an error', () => {
    expect(withCode(oneCircuit(mcb(16), { kind: 'immersion', concealedInWall: true }), 'concealed-cable-needs-rcd')[0]).toMatchObject({
      severity: 'error',
      rule: 'BS 7671 522.6.202/203',
    }); // (found)
  });

  it('when the concealed cable has a 30 mA RCBO, or is SWA with earthed armour, then it passes', () => {
    expect(withCode(oneCircuit({ rating: 16 }, { kind: 'immersion', concealedInWall: true }), 'concealed-cable-needs-rcd')).toEqual([]);
    expect(withCode(oneCircuit(mcb(16), { kind: 'immersion', concealedInWall: true, cable: { type: 'swa' } }), 'concealed-cable-needs-rcd')).toEqual([]); // 522.6.204 earthed armour (from memory)
  });

  it('when the cable is not concealed, then nothing is asked of a fixed circuit', () => {
    expect(withCode(oneCircuit(mcb(16), { kind: 'immersion' }), 'concealed-cable-needs-rcd')).toEqual([]);
  });
});
