/**
 * The pixel size of an uploaded image, read from its header with sharp (libvips) before anything
 * decodes it, and the image stored downscaled to the size it is used at. A small file can declare a
 * huge image (an 8000 × 8000 PNG compresses to a couple of hundred kilobytes), and every print would
 * then decode it in full; so sizes are limited at upload and a logo is stored at its print size once.
 */
import sharp from 'sharp';
import { invalid } from '../errors.js';
import type { ImageMime } from './sniff.js';

/** Longest side an upload may declare, in pixels: well above any phone camera's photo. */
export const MAX_SIDE_PX = 6000;
/** Most pixels an upload may declare (24 MP): decoding that once at upload costs about 100 MB for a moment. */
export const MAX_PIXELS = 24_000_000;
/** Longest side a logo is stored at: the chart prints it at most about 40 mm wide, 600 px is 380 dpi there. */
export const LOGO_STORED_SIDE_PX = 600;
/** Longest side a photo is stored at: enough to read a device's markings on a phone screen. */
export const PHOTO_STORED_SIDE_PX = 2000;

export interface StoredUpload {
  mime: ImageMime;
  data: Buffer;
  width: number;
  height: number;
}

/** Reads the declared size, refuses zero or absurd ones with a 400 naming the limit, and stores at most `storedSide` on the longest side. */
export async function fitUpload(image: { mime: ImageMime; data: Buffer }, what: string, storedSide: number): Promise<StoredUpload> {
  const meta = await sharp(image.data, { limitInputPixels: false })
    .metadata()
    .catch(() => null);
  const width = meta?.width ?? 0;
  const height = meta?.height ?? 0;
  if (!width || !height) throw invalid(`The ${what} has no readable size; save it again as PNG or JPEG`, { file: 'The image header gives no width or height' });
  if (width > MAX_SIDE_PX || height > MAX_SIDE_PX || width * height > MAX_PIXELS) {
    throw invalid(`The ${what} is ${width} × ${height} pixels; at most ${MAX_SIDE_PX} pixels a side and ${MAX_PIXELS / 1_000_000} megapixels are accepted`, {
      file: `At most ${MAX_SIDE_PX} × ${MAX_SIDE_PX} pixels and ${MAX_PIXELS / 1_000_000} megapixels`,
    });
  }
  const pipeline = sharp(image.data, { limitInputPixels: MAX_PIXELS })
    .rotate()
    .resize({ width: storedSide, height: storedSide, fit: 'inside', withoutEnlargement: true });
  const out = await (image.mime === 'image/png' ? pipeline.png({ compressionLevel: 9 }) : pipeline.jpeg({ quality: 85 }))
    .toBuffer({ resolveWithObject: true })
    .catch(() => {
      throw invalid(`The ${what} could not be read; save it again as PNG or JPEG`, { file: 'The image data is damaged' });
    });
  return { mime: image.mime, data: out.data, width: out.info.width, height: out.info.height };
}
