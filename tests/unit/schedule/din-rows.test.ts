import { describe, expect, it } from 'vitest';
import { deviceFace, DEVICE_MM, HEAD_MM, layoutRow, layoutRows, MARGIN_MM, MODULE_MM, RAIL_MM, ROW_GAP_MM } from '../../../shared/schedule/din-rows.js';
import { deviceSchema } from '../../../shared/schemas/schedule.js';

const device = (id: string, modules: number, extra: Record<string, unknown> = {}) => deviceSchema.parse({ id, row: 1, kind: 'mcb', modules, ...extra });

describe('the DIN row geometry the editor and the board page share', () => {
  it('when devices sit on a row, then each is drawn 17.5 mm per module, side by side', () => {
    expect(MODULE_MM).toBe(17.5); // DIN 43880: one module is 17.5 mm
    expect(RAIL_MM).toBe(35); // IEC 60715 top-hat rail, 35 mm
    const layout = layoutRow([device('a', 2), device('b', 1), device('c', 0.5)], 18);
    expect(layout.placed.map((p) => p.width)).toEqual([35, 17.5, 8.75]);
    expect(layout.placed.map((p) => p.x)).toEqual([6, 41, 58.5]); // 6 mm margin, then 35 and 17.5 mm along
    expect(layout.usedModules).toBe(3.5);
    expect(layout.capacityMm).toBe(315); // 18 × 17.5 mm
    expect(layout.widthMm).toBe(327); // 315 + two 6 mm margins
  });

  it('when the devices need more modules than the row has, then the drawing grows to show the overflow', () => {
    const layout = layoutRow(
      Array.from({ length: 5 }, (_, i) => device(`d${i}`, 1)),
      4,
    );
    expect(layout.usedModules).toBeGreaterThan(layout.capacityModules);
    expect(layout.widthMm - 2 * layout.placed[0].x).toBe(5 * 17.5);
  });

  it('when only widths are known (the board page’s devices), then a row lays out the same as the editor’s', () => {
    const editor = layoutRow([device('a', 2), device('b', 1)], 12);
    const page = layoutRow([{ modules: 2 }, { modules: 1 }], 12);
    expect(page.placed.map((p) => [p.x, p.width])).toEqual(editor.placed.map((p) => [p.x, p.width]));
    expect([page.widthMm, page.heightMm]).toEqual([editor.widthMm, editor.heightMm]);
  });

  it('when a board has several rows, then they stack top first, one row height plus the gap apart, as wide as the widest', () => {
    const board = layoutRows([[{ modules: 2 }], [], Array.from({ length: 14 }, () => ({ modules: 1 }))], 12);
    const rowHeight = HEAD_MM + DEVICE_MM + MARGIN_MM;
    expect(board.rows.map((r) => r.y)).toEqual([0, rowHeight + ROW_GAP_MM, 2 * (rowHeight + ROW_GAP_MM)]);
    expect(board.heightMm).toBe(3 * rowHeight + 2 * ROW_GAP_MM);
    expect(board.widthMm).toBe(14 * 17.5 + 2 * MARGIN_MM); // the third row overflows its 12 modules
    expect(board.rows[1].layout.placed).toEqual([]);
    expect(layoutRows([], 18)).toEqual({ rows: [], widthMm: 327, heightMm: 0 });
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
    expect(deviceFace(deviceSchema.parse({ id: 'b', row: 1, kind: 'blank' }))).toEqual({ kind: '', main: '', sub: '' });
  });
});
