import { describe, expect, it } from 'vitest';
import { dropPosition } from '../../../src/components/board/dinRowLayout.js';
import { layoutRow } from '../../../shared/schedule/din-rows.js';
import { deviceSchema } from '../../../shared/schemas/schedule.js';

const device = (id: string, modules: number) => deviceSchema.parse({ id, row: 1, kind: 'mcb', modules });

// The picture's geometry (17.5 mm modules, the rail, device faces) is tested with the board's rows in tests/unit/schedule/din-rows.test.ts.
describe('reordering on the editor’s DIN row picture', () => {
  it('when a device is dragged past its neighbour’s centre, then it lands after that neighbour', () => {
    const layout = layoutRow([device('a', 1), device('b', 1), device('c', 1)], 18);
    expect(dropPosition(layout, 'a', 17.5 * 0.4)).toBe(0); // not yet past b's centre (DIN 43880: 17.5 mm modules)
    expect(dropPosition(layout, 'a', 17.5 * 1.1)).toBe(1);
    expect(dropPosition(layout, 'c', -17.5 * 2)).toBe(0);
  });

  it('when a two-module device is dragged by less than half its neighbour, then it stays put', () => {
    const layout = layoutRow([device('rcd', 2), device('b', 1)], 18);
    expect(dropPosition(layout, 'rcd', 8)).toBe(0); // its centre moves from 23.5 to 31.5 mm, b's centre is at 49.75 mm (6 mm margin + 35 + 8.75)
    expect(dropPosition(layout, 'rcd', 27)).toBe(1); // 50.5 mm, just past b's centre
    expect(dropPosition(layout, 'missing', 100)).toBe(0);
  });
});
