import { describe, expect, it } from 'vitest';
import { typeMetrics } from '../../../server/pdf/fonts.js';
import { abbreviateDeviceText, chooseDeviceFit, deviceFitWarnings, type DeviceCell } from '../../../server/pdf/layout/way-device-text.js';

const tm = typeMetrics();
const TAPE_MIN_PT = 5; // tape minimum for way labels (server/pdf README, common practice)
const limits = { maxPt: 9, minPt: TAPE_MIN_PT, gapMm: 0.4, lineSpacing: 1.2 };
const WAY_MM = 3; // room the way number keeps

/** A cell whose top line holds `device` on one line at exactly `onePt`, with room for two lines of `twoPt`. */
function cell(name: string, device: string, onePt: number, twoLineHeightMm = 2): DeviceCell {
  return {
    name,
    device,
    lineWidthMm: WAY_MM + limits.gapMm + tm.measure(device, 'regular', onePt) + 1e-6,
    wayWidthMm: WAY_MM,
    oneLineHeightMm: 10,
    twoLineHeightMm,
  };
}

describe('the device text fit of a way-label strip', () => {
  it('when every cell fits one line, then all take the size of the tightest cell', () => {
    const fit = chooseDeviceFit([cell('way 1', 'B16 30 mA', 8), cell('way 2', 'B32 30 mA', 6.5), cell('way 3', '', 3)], limits, tm);
    expect(fit.kind).toBe('one-line');
    expect(fit.sizePt).toBe(6.5);
    expect(fit.cells.map((c) => c.lines)).toEqual([['B16 30 mA'], ['B32 30 mA'], []]);
    expect(deviceFitWarnings('Row 1 way labels', [], fit)).toEqual([]);
  });

  it('when one cell cannot hold one line at the minimum, then every cell goes to two lines at one size, and the warning names that cell', () => {
    const cells = [cell('way 1', 'B16 30 mA', 8, 6), cell('way 10', 'B20 30 mA', 4, 6)];
    const fit = chooseDeviceFit(cells, limits, tm);
    expect(fit.kind).toBe('two-lines');
    expect(fit.cells.map((c) => c.lines)).toEqual([
      ['B16', '30 mA'],
      ['B20', '30 mA'],
    ]);
    expect(fit.sizePt).toBeGreaterThanOrEqual(TAPE_MIN_PT);
    expect(fit.forcedBy).toEqual(['way 10']);
    const [w] = deviceFitWarnings('Row 1 way labels', cells, fit);
    expect(w.code).toBe('device-text-wrapped');
    expect(w.message).toContain('way 10');
    expect(w.message).toContain(`${fit.sizePt} pt`);
  });

  it('when two lines do not fit either, then every cell prints the defined abbreviation, and the warning says what became what', () => {
    // Room for "B20 30mA" at 5 pt on one line but not "B20 30 mA"; too low for two lines.
    const tight: DeviceCell = { ...cell('way 4 L1', 'B20 30 mA', 4.9, 1), lineWidthMm: WAY_MM + 0.4 + tm.measure('B20 30mA', 'regular', 5) + 1e-6 };
    const cells = [cell('way 3', 'B6 30 mA', 9, 1), tight];
    const fit = chooseDeviceFit(cells, limits, tm);
    expect(fit.kind).toBe('abbreviated');
    expect(fit.sizePt).toBe(5);
    expect(fit.cells.map((c) => c.lines)).toEqual([['B6 30mA'], ['B20 30mA']]);
    const [w] = deviceFitWarnings('Row 2 way labels', cells, fit);
    expect(w.code).toBe('device-text-abbreviated');
    expect(w.message).toContain('"B20 30 mA" → "B20 30mA"');
    expect(w.message).toContain('"B6 30 mA" → "B6 30mA"');
    expect(w.message).toContain('way 4 L1');
  });

  it('when not even the abbreviation fits a cell, then only that cell is cut, the others keep it whole, and the warning names the cut cell', () => {
    const cells = [cell('way 1', 'B6 30 mA', 9, 1), { ...cell('way 2', 'C125 300 mA', 2, 1) }];
    const fit = chooseDeviceFit(cells, limits, tm);
    expect(fit.kind).toBe('cut');
    expect(fit.sizePt).toBe(TAPE_MIN_PT);
    expect(fit.cells[0]).toEqual({ lines: ['B6 30mA'], cut: false });
    expect(fit.cells[1].cut).toBe(true);
    expect(fit.cells[1].lines[0] ?? '').toMatch(/…$/);
    const cut = deviceFitWarnings('Row 1 way labels', cells, fit).find((w) => w.code === 'text-cut')!;
    expect(cut.message).toContain('way 2 "C125 300 mA"');
    expect(cut.message).not.toContain('way 1 "');
  });

  it('when a device text is abbreviated, then units close up and the rating, curve and residual current stay', () => {
    expect(abbreviateDeviceText('B16 30 mA')).toBe('B16 30mA');
    expect(abbreviateDeviceText('AFDD B16 30 mA')).toBe('AFDD B16 30mA');
    expect(abbreviateDeviceText('Isolator 40 A')).toBe('Isol. 40A');
    expect(abbreviateDeviceText('B32')).toBe('B32');
  });
});
