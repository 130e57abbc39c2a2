import { describe, expect, it } from 'vitest';
import { layoutOutput, renderOutput } from '../../../server/pdf/index.js';
import { request } from './fixtures.js';
import { luminance, rasterise } from './helpers.js';

const DPI = 300;
const mmToPx = (mm: number) => (mm / 25.4) * DPI;

/** Dark pixel columns along the page at `rowMm` from the top (only a thin band is rendered). */
function darkColumns(pdf: Uint8Array, rowMm: number): number[] {
  const png = rasterise(pdf, DPI, 1, { x: 0, y: rowMm - 0.5, w: 210, h: 1 });
  const lum = luminance(png);
  const y = Math.floor(png.height / 2);
  const cols: number[] = [];
  for (let x = 0; x < png.width; x++) if (lum[y * png.width + x] < 128) cols.push(x);
  return cols;
}

describe('calibration page', () => {
  it('when printed on A4, then the rendered ruler spans exactly 100 mm between its first and last tick', async () => {
    const req = request('calibration', 'a4');
    const { pdf } = await renderOutput(req);
    const cols = darkColumns(pdf, 24 + 1); // just under the ruler's baseline at 24 mm, through the ticks
    const span = cols[cols.length - 1] - cols[0];
    expect(Math.abs(span - mmToPx(100))).toBeLessThanOrEqual(2); // 100 mm at 300 dpi = 1181 px, within the width of a tick line
    expect(Math.abs(cols[0] - mmToPx(55))).toBeLessThanOrEqual(2); // centred: (210 − 100) / 2 = 55 mm, ISO 216 A4 width
  });

  it('when a printer offset is set, then everything drawn moves by it', async () => {
    const plain = darkColumns((await renderOutput(request('calibration', 'a4'))).pdf, 25);
    const moved = darkColumns((await renderOutput({ ...request('calibration', 'a4'), offset: { xMm: 2, yMm: 0 } })).pdf, 25);
    expect(Math.abs(moved[0] - plain[0] - mmToPx(2))).toBeLessThanOrEqual(1);
  });

  it('when printed on tape, then the ruler runs along the tape, 100 mm long with crosshairs 5 mm beyond each end', () => {
    const layout = layoutOutput(request('calibration', 'tape-12'));
    expect(layout.pages).toHaveLength(1);
    expect(layout.pages[0]).toMatchObject({ widthMm: 12, heightMm: 120 });
    const ticks = layout.pages[0].items.filter((i) => i.kind === 'line' && i.lineMm === 0.1 && Math.abs(i.from.y - i.to.y) < 1e-9);
    const ys = [...new Set(ticks.map((t) => (t.kind === 'line' ? Number(t.from.y.toFixed(6)) : 0)))].sort((a, b) => a - b);
    expect(ys).toEqual([5, ...Array.from({ length: 101 }, (_, mm) => 10 + mm), 115]); // a tick every mm over 100 mm, crosshairs at 5 and 115 mm
  });

  it('when printed for a die-cut sheet, then every label is outlined', () => {
    const sheet = {
      name: 'Die-cut 2 × 5',
      pageWidthMm: 210,
      pageHeightMm: 297,
      labelWidthMm: 99,
      labelHeightMm: 57,
      columns: 2,
      rows: 5,
      marginTopMm: 6,
      marginLeftMm: 4.5,
      gapXMm: 3,
      gapYMm: 0,
      cornerRadiusMm: 0,
    };
    const layout = layoutOutput({ ...request('calibration', 'a4'), medium: { kind: 'sheet', id: 'sheet-1', layout: sheet } });
    expect(layout.pages[0].items.filter((i) => i.kind === 'rect')).toHaveLength(10);
  });
});
