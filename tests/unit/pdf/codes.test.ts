import jsQR from 'jsqr';
import { BinaryBitmap, Code128Reader, HybridBinarizer, RGBLuminanceSource } from '@zxing/library';
import { describe, expect, it } from 'vitest';
import { layoutOutput, LayoutError, renderOutput } from '../../../server/pdf/index.js';
import { qrMatrix, QR_QUIET_MODULES } from '../../../server/pdf/qr.js';
import type { Box, Item, ModulesItem } from '../../../server/pdf/model.js';
import { board, BOARD_URL, request } from './fixtures.js';
import { grow, luminance, rasterise } from './helpers.js';

const codesOf = (items: Item[], purpose: 'qr' | 'barcode') => items.filter((i): i is ModulesItem => i.kind === 'modules' && i.purpose === purpose);

function readQr(pdf: Uint8Array, area: Box, page = 1): string | null {
  const png = rasterise(pdf, 600, page, grow(area, 2)); // 600 dpi as a phone camera would resolve it
  return jsQR.default(new Uint8ClampedArray(png.data), png.width, png.height)?.data ?? null;
}

/** Code 128 read by zxing from the rendered bars; `turned` reads a vertical code (tape pages run lengthwise). */
function readBarcode(pdf: Uint8Array, area: Box, turned: boolean): string {
  const png = rasterise(pdf, 600, 1, grow(area, 1));
  let lum = luminance(png);
  let [w, h] = [png.width, png.height];
  if (turned) {
    const t = new Uint8ClampedArray(w * h);
    for (let y = 0; y < h; y++) for (let x = 0; x < w; x++) t[x * h + (h - 1 - y)] = lum[y * w + x];
    lum = t;
    [w, h] = [h, w];
  }
  return new Code128Reader().decode(new BinaryBitmap(new HybridBinarizer(new RGBLuminanceSource(lum, w, h)))).getText();
}

describe('QR codes and barcodes', () => {
  it('when the board URL is encoded, then the matrix is version 4 (17 + 4V modules a side) at error correction M', () => {
    expect(qrMatrix(BOARD_URL).size).toBe(17 + 4 * 4); // ISO/IEC 18004: version V has 17 + 4V modules; 48 bytes need version 4 at M
  });

  it('when a tag is printed on 24 mm tape, then jsQR reads the board URL and zxing reads the board code', async () => {
    const req = request('tag', 'tape-24');
    const layout = layoutOutput(req);
    const { pdf } = await renderOutput(req);
    expect(readQr(pdf, codesOf(layout.pages[0].items, 'qr')[0].area)).toBe(BOARD_URL);
    expect(readBarcode(pdf, codesOf(layout.pages[0].items, 'barcode')[0].area, true)).toBe(board.code);
  });

  it('when tags are tiled on A4, then the barcode reads across the page', async () => {
    const req = request('tag', 'a4', { copies: 2 });
    const layout = layoutOutput(req);
    const { pdf } = await renderOutput(req);
    expect(readBarcode(pdf, codesOf(layout.pages[0].items, 'barcode')[1].area, false)).toBe(board.code);
  });

  it('when the chart is printed, then its QR code reads as the board URL', async () => {
    const req = request('chart', 'a4');
    const layout = layoutOutput(req);
    const { pdf } = await renderOutput(req);
    expect(readQr(pdf, codesOf(layout.pages[0].items, 'qr')[0].area)).toBe(BOARD_URL);
  });

  it('when a code is drawn, then a quiet zone of 4 modules surrounds it and modules are at least 0.4 mm', () => {
    const layout = layoutOutput(request('tag', 'tape-24'));
    const qr = codesOf(layout.pages[0].items, 'qr')[0];
    const size = qrMatrix(BOARD_URL).size;
    const moduleMm = qr.area.w / (size + 2 * QR_QUIET_MODULES);
    expect(moduleMm).toBeGreaterThanOrEqual(0.4); // common practice: ~0.4 mm per module for a phone at hand distance
    const minX = Math.min(...qr.boxes.map((b) => b.x));
    const minY = Math.min(...qr.boxes.map((b) => b.y));
    expect(minX - qr.area.x).toBeCloseTo(4 * moduleMm, 6); // ISO/IEC 18004: quiet zone 4 modules
    expect(minY - qr.area.y).toBeCloseTo(4 * moduleMm, 6);
  });

  it('when the tape is too narrow for a readable QR code, then a LayoutError names the tape that would work', () => {
    // (33 + 8) modules × 0.4 mm = 16.4 mm: more than the 15 mm band of 18 mm tape. ISO/IEC 18004 quiet zone; 0.4 mm module: common practice
    expect(() => layoutOutput(request('tag', 'tape-12'))).toThrow(LayoutError);
    expect(() => layoutOutput(request('tag', 'tape-18'))).toThrow(/tape-24 or wider/);
  });

  it('when the board code has a character Code 128 cannot carry, then the tag prints without bars and says so', () => {
    const req = { ...request('tag', 'tape-24'), board: { ...board, code: 'WM-3F7K-Ω' } };
    const layout = layoutOutput(req);
    expect(codesOf(layout.pages[0].items, 'barcode')).toHaveLength(0);
    expect(layout.warnings.map((w) => w.code)).toContain('barcode-left-off');
  });

  it('when the board page is switched off, then the tag has no QR code and says why', () => {
    const req = { ...request('tag', 'tape-12'), board: { ...board, publicEnabled: false } };
    const layout = layoutOutput(req);
    expect(codesOf(layout.pages[0].items, 'qr')).toHaveLength(0);
    expect(layout.warnings.map((w) => w.code)).toContain('qr-left-off');
  });
});
