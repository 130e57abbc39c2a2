/**
 * Millimetres to printer pixels. An image is exactly round(mm × dpi / 25.4) pixels a side, so a
 * label printed from it at the printer's resolution comes out at the size the layout gave it.
 */

/** Millimetres per inch. // ISO 80000-1 (1 in = 25.4 mm exactly) */
export const MM_PER_INCH = 25.4;

/** Resolutions the print page offers: the usual tape and label printer heads. // common practice */
export const COMMON_DPI = [180, 203, 300, 360] as const;

/** Pixels for a length of `mm` at `dpi`. */
export function pixelsFor(mm: number, dpi: number): number {
  return Math.round((mm * dpi) / MM_PER_INCH);
}

/** Pixels per millimetre at `dpi` (positions are scaled by this, sizes rounded once by `pixelsFor`). */
export function pixelsPerMm(dpi: number): number {
  return dpi / MM_PER_INCH;
}

/**
 * Largest single image (pixels): an A4 page at 360 dpi is 12.5 MP; past this a request costs the
 * server's one thread seconds and the phone app memory it may not have.
 */
export const MAX_IMAGE_PIXELS = 40_000_000;
/** Largest total of pixels one request draws (every label together). */
export const MAX_REQUEST_PIXELS = 120_000_000;
/**
 * Most images one request draws. Each costs tens of milliseconds (a PDF page costs far less), so a print
 * the PDF route takes whole (2,000 flags) goes to a phone in parts; a phone app prints a few at a time anyway.
 */
export const MAX_IMAGES_PER_REQUEST = 200;
