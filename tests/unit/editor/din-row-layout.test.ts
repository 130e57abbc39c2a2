import { describe, expect, it } from 'vitest';
import { deviceFace, dropPosition, layoutRow, MODULE_MM, RAIL_MM } from '../../../src/components/board/dinRowLayout.js';
import { deviceSchema } from '../../../shared/schemas/schedule.js';

const device = (id: string, modules: number, extra: Record<string, unknown> = {}) => deviceSchema.parse({ id, row: 1, kind: 'mcb', modules, ...extra });

describe('the DIN row picture', () => {
  it('when devices sit on a row, then each is drawn 17.5 mm per module, side by side', () => {
    expect(MODULE_MM).toBe(17.5); // DIN 43880: one module is 17.5 mm
    expect(RAIL_MM).toBe(35); // IEC 60715 top-hat rail, 35 mm
    const layout = layoutRow([device('a', 2), device('b', 1), device('c', 0.5)], 18);
    expect(layout.placed.map((p) => p.width)).toEqual([35, 17.5, 8.75]);
    expect(layout.placed[1].x - layout.placed[0].x).toBe(35);
    expect(layout.usedModules).toBe(3.5);
    expect(layout.capacityMm).toBe(315); // 18 × 17.5 mm
  });

  it('when the devices need more modules than the row has, then the drawing grows to show the overflow', () => {
    const layout = layoutRow(
      Array.from({ length: 5 }, (_, i) => device(`d${i}`, 1)),
      4,
    );
    expect(layout.usedModules).toBeGreaterThan(layout.capacityModules);
    expect(layout.widthMm - 2 * layout.placed[0].x).toBe(5 * 17.5);
  });

  it('when a device is dragged past its neighbour’s centre, then it lands after that neighbour', () => {
    const layout = layoutRow([device('a', 1), device('b', 1), device('c', 1)], 18);
    expect(dropPosition(layout, 'a', 17.5 * 0.4)).toBe(0); // not yet past b's centre
    expect(dropPosition(layout, 'a', 17.5 * 1.1)).toBe(1);
    expect(dropPosition(layout, 'c', -17.5 * 2)).toBe(0);
  });

  it('when a breaker or RCD is shown, then its face reads as the trade writes it', () => {
    expect(deviceFace(device('m', 1, { rating: 32, curve: 'B' }))).toEqual({ kind: 'MCB', main: 'B32', sub: '' });
    expect(deviceFace(deviceSchema.parse({ id: 'r', row: 1, kind: 'rcd', rating: 63, residualMa: 30, rcdType: 'A' }))).toEqual({
      kind: 'RCD',
      main: '63 A',
      sub: '30 mA A',
    });
    // A combined AFDD/RCBO shows its IΔn like an RCBO; a plain AFDD has none. 30 mA: BS 7671:2018+A2 411.3.3
    expect(deviceFace(deviceSchema.parse({ id: 'a', row: 1, kind: 'afdd', rating: 16, curve: 'B', residualMa: 30, rcdType: 'A' }))).toEqual({
      kind: 'AFDD',
      main: 'B16',
      sub: '30 mA A',
    });
    expect(deviceFace(deviceSchema.parse({ id: 'p', row: 1, kind: 'afdd', rating: 16, curve: 'B' }))).toEqual({ kind: 'AFDD', main: 'B16', sub: '' });
  });
});
