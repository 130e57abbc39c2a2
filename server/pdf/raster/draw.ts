/**
 * The only raster code that knows sharp (libvips, prebuilt binaries from npm): an SVG page in
 * printer pixels becomes a greyscale PNG holding only black and white, with its resolution recorded
 * (pHYs), so a phone app that reads it prints it at the size it was drawn for.
 */
import sharp from 'sharp';
import { crc32 } from 'node:zlib';
import { MM_PER_INCH } from './scale.js';

/** Coverage at or above which an anti-aliased pixel of text is inked (of 255). // common practice (half coverage) */
const THRESHOLD = 128;

/** Bytes of the PNG signature and the IHDR chunk, after which pHYs goes. // ISO/IEC 15948 (PNG) 5.2, 11.2.2 */
const AFTER_IHDR = 8 + 4 + 4 + 13 + 4;

/**
 * The image's resolution as a pHYs chunk (pixels per metre, unit 1 = metre). // ISO/IEC 15948 (PNG) 11.3.5.3
 * Written by hand: sharp records density only with an sRGB profile, which would turn the grey image into RGB.
 */
export function withResolution(png: Buffer, dpi: number): Buffer {
  const perMetre = Math.round((dpi / MM_PER_INCH) * 1000);
  const body = Buffer.alloc(4 + 9);
  body.write('pHYs', 0, 'latin1');
  body.writeUInt32BE(perMetre, 4);
  body.writeUInt32BE(perMetre, 8);
  body.writeUInt8(1, 12);
  const chunk = Buffer.alloc(4 + body.length + 4);
  chunk.writeUInt32BE(9, 0);
  body.copy(chunk, 4);
  chunk.writeUInt32BE(crc32(body), 4 + body.length);
  return Buffer.concat([png.subarray(0, AFTER_IHDR), chunk, png.subarray(AFTER_IHDR)]);
}

/**
 * The SVG as a PNG, turned `turn` degrees clockwise (tape labels are turned to run along the
 * image). Every pixel is 0 or 255: the threshold leaves no grey for a printer to dither into a fringe.
 */
export async function svgToPng(svg: string, dpi: number, turn: 0 | 270 = 0): Promise<Buffer> {
  const png = await sharp(Buffer.from(svg), { limitInputPixels: false })
    .flatten({ background: '#ffffff' })
    .threshold(THRESHOLD)
    .toColourspace('b-w')
    .rotate(turn)
    // 8-bit grey: sharp writes fewer bits only through a palette, which costs seconds on an A4 page for the same two colours.
    .png({ compressionLevel: 6 })
    .toBuffer();
  return withResolution(png, dpi);
}

/** Whether an embedded image (the contractor's logo) decodes; one that does not is left off, as in the PDF. */
export async function decodes(bytes: Uint8Array): Promise<boolean> {
  try {
    const meta = await sharp(bytes).metadata();
    return Boolean(meta.width && meta.height);
  } catch {
    return false;
  }
}
