/**
 * The raster draw step, read back with tools that share no code with it: pngjs decodes the PNGs,
 * jsQR and zxing read the codes, pdf-parse reads the PDF drawn from the same layout.
 */
import jsQR from 'jsqr';
import { BinaryBitmap, Code128Reader, HybridBinarizer, RGBLuminanceSource } from '@zxing/library';
import { PNG } from 'pngjs';
import { describe, expect, it } from 'vitest';
import { renderOutput, resolveMedium } from '../../../../server/pdf/index.js';
import { rasterOutput, tapeBand } from '../../../../server/pdf/raster/index.js';
import type { Medium } from '../../../../server/pdf/types.js';
import type { ModulesItem } from '../../../../server/pdf/model.js';
import { board, BOARD_URL, request } from '../fixtures.js';
import { luminance, pdfText } from '../helpers.js';

const MM_PER_INCH = 25.4; // ISO 80000-1: 1 in = 25.4 mm exactly
const pixels = (mm: number, dpi: number) => Math.round((mm * dpi) / MM_PER_INCH);
const decode = (png: Buffer) => PNG.sync.read(png);

describe('image sizes', () => {
  it('when a 24 mm tag is drawn at 180, 203, 300 and 360 dpi, then each side is round(mm × dpi / 25.4) pixels', async () => {
    for (const dpi of [180, 203, 300, 360]) {
      // common practice: the usual tape printer head resolutions
      const { images, layout } = await rasterOutput(request('tag', 'tape-24'), dpi);
      const page = layout.pages[0];
      const png = decode(images[0].png);
      // A tape label runs along the image: as wide as the label is long, as high as the tape.
      expect(png.width).toBe(pixels(page.heightMm, dpi));
      expect(png.height).toBe(pixels(24, dpi)); // 24 mm tape // common practice
      expect([images[0].widthPx, images[0].heightPx]).toEqual([png.width, png.height]);
    }
  });

  it('when an A5 page is drawn at 203 dpi, then it is 148 × 210 mm in pixels, upright', async () => {
    const { images } = await rasterOutput(request('notices', 'a5'), 203);
    const png = decode(images[0].png);
    expect([png.width, png.height]).toEqual([pixels(148, 203), pixels(210, 203)]); // ISO 216 A5 148 × 210 mm
  });

  it('when an image is written, then it records its resolution in pixels per metre', async () => {
    const { images } = await rasterOutput(request('tag', 'tape-24'), 300);
    const png = images[0].png;
    const at = png.indexOf('pHYs', 0, 'latin1');
    expect(at).toBeGreaterThan(0);
    expect(png.readUInt32BE(at + 4)).toBe(Math.round((300 / MM_PER_INCH) * 1000)); // ISO/IEC 15948 11.3.5.3, unit 1 = metre
    expect(png[at + 12]).toBe(1);
  });
});

describe('ink', () => {
  it('when flags, a tag and a notice are drawn at 180 dpi, then every pixel is pure black or pure white, and some are black', async () => {
    for (const [output, media] of [
      ['flags', 'tape-12'],
      ['tag', 'tape-24'],
      ['notices', 'tape-24'],
    ] as const) {
      const { images } = await rasterOutput(request(output, media), 180);
      for (const img of images) {
        const png = decode(img.png);
        let black = 0;
        let other = 0;
        for (let i = 0; i < png.data.length; i += 4) {
          const [r, g, b] = [png.data[i], png.data[i + 1], png.data[i + 2]];
          if (r !== g || g !== b || (r !== 0 && r !== 255)) other++;
          else if (r === 0) black++;
        }
        expect(other).toBe(0);
        expect(black).toBeGreaterThan(100);
      }
    }
  });
});

describe('codes', () => {
  it('when the tag is drawn at 180 dpi, then jsQR reads the board URL and zxing reads the board code from the PNG', async () => {
    const { images, layout } = await rasterOutput(request('tag', 'tape-24'), 180);
    const png = decode(images[0].png);
    expect(jsQR.default(new Uint8ClampedArray(png.data), png.width, png.height)?.data).toBe(BOARD_URL); // ISO/IEC 18004 reader (jsQR)
    const bars = layout.pages[0].items.find((i) => i.kind === 'modules' && i.purpose === 'barcode') as ModulesItem;
    // The page's area in image pixels (the image is the page turned a quarter anticlockwise), with 1 mm round it.
    const crop = {
      x: pixels(bars.area.y - 1, 180),
      y: pixels(24 - bars.area.x - bars.area.w - 1, 180),
      w: pixels(bars.area.h + 2, 180),
      h: pixels(bars.area.w + 2, 180),
    };
    const lum = luminance(png);
    const part = new Uint8ClampedArray(crop.w * crop.h);
    for (let y = 0; y < crop.h; y++) for (let x = 0; x < crop.w; x++) part[y * crop.w + x] = lum[(crop.y + y) * png.width + crop.x + x];
    const bitmap = new BinaryBitmap(new HybridBinarizer(new RGBLuminanceSource(part, crop.w, crop.h)));
    expect(new Code128Reader().decode(bitmap).getText()).toBe(board.code); // ISO/IEC 15417 reader (zxing)
  });

  it('when the A4 chart is drawn at 180 dpi, then its QR code reads as the board URL', async () => {
    const { images } = await rasterOutput(request('chart', 'a4'), 180);
    const png = decode(images[0].png);
    expect(jsQR.default(new Uint8ClampedArray(png.data), png.width, png.height)?.data).toBe(BOARD_URL); // ISO/IEC 18004 reader (jsQR)
  });
});

describe('text', () => {
  it("when flags are drawn, then the layout's text that the images draw is the text pdf-parse reads from the PDF", async () => {
    const req = request('flags', 'tape-12');
    const { layout } = await rasterOutput(req, 180);
    const { pdf } = await renderOutput(req);
    const fromLayout = layout.pages.flatMap((p) => p.items.flatMap((i) => (i.kind === 'text' ? [i.text] : []))).join('');
    const fromPdf = await pdfText(pdf);
    const squash = (s: string) => s.replace(/\s+/g, '');
    expect(fromLayout.length).toBeGreaterThan(50);
    expect(squash(fromPdf).replace(/--\d+of\d+--/g, '')).toBe(squash(fromLayout));
  });
});

describe("a printer's band", () => {
  it('when a profile narrows 12 mm tape to an 8 mm band, then no black pixel lies in the margin rows and the band is used', async () => {
    const medium = resolveMedium('tape-12', undefined, { 12: { printableMm: 8, marginMm: 3 } }) as Extract<Medium, { kind: 'tape' }>;
    for (const dpi of [180, 360]) {
      const { images, layout } = await rasterOutput(request('flags', 'tape-12', {}, undefined, medium), dpi);
      images.forEach((img, n) => {
        const png = decode(img.png);
        const band = tapeBand(medium, layout.pages[n]);
        // Rows run across the tape from its far edge (the image is the page turned a quarter anticlockwise).
        const top = ((12 - band.x - band.w) * dpi) / MM_PER_INCH;
        const bottom = ((12 - band.x) * dpi) / MM_PER_INCH;
        let inBand = 0;
        for (let y = 0; y < png.height; y++) {
          const outside = y + 1 <= top || y >= bottom;
          for (let x = 0; x < png.width; x++) {
            const black = png.data[(y * png.width + x) * 4] === 0;
            if (black && outside) throw new Error(`black pixel at row ${y} outside the band ${top.toFixed(1)}–${bottom.toFixed(1)} (image ${n + 1})`);
            if (black) inBand++;
          }
        }
        expect(inBand).toBeGreaterThan(100);
      });
    }
  });
});
