/**
 * Code 128 bars for the board tag, from jsbarcode's own encoder run without a canvas (an object
 * target gives the bar pattern as a string of 1s and 0s), drawn as vector rectangles.
 */
import JsBarcode from 'jsbarcode';
import { BLACK, WHITE, type Box, type Item } from './model.js';

/** Quiet zone each side, in narrow-bar widths. // ISO/IEC 15417 (10X) */
export const CODE128_QUIET_X = 10;
/** Narrowest bar a 203 dpi thermal or office printer renders cleanly (mm). // common practice */
export const CODE128_MIN_X_MM = 0.25;

/** The bar pattern for `text` ("1" = a dark module), or '' when Code 128 cannot carry it (non-ASCII). */
export function code128Pattern(text: string): string {
  const target: { encodings?: Array<{ data: string }> } = {};
  try {
    JsBarcode(target, text, { format: 'CODE128' });
  } catch {
    return '';
  }
  return (target.encodings ?? []).map((e) => e.data).join('');
}

/** Width (mm) of the code with its quiet zones at a narrow-bar width of `xMm`. */
export function code128WidthMm(text: string, xMm: number): number {
  return (code128Pattern(text).length + 2 * CODE128_QUIET_X) * xMm;
}

/** Bars for `text` with quiet zones, centred in `box` at narrow-bar width `xMm`. */
export function barcodeItems(text: string, box: Box, xMm: number): Item[] {
  const pattern = code128Pattern(text);
  const width = (pattern.length + 2 * CODE128_QUIET_X) * xMm;
  const area: Box = { x: box.x + (box.w - width) / 2, y: box.y, w: width, h: box.h };
  const boxes: Box[] = [];
  let i = 0;
  while (i < pattern.length) {
    if (pattern[i] !== '1') {
      i++;
      continue;
    }
    const start = i;
    while (i < pattern.length && pattern[i] === '1') i++;
    boxes.push({ x: area.x + (CODE128_QUIET_X + start) * xMm, y: area.y, w: (i - start) * xMm, h: area.h });
  }
  return [
    { kind: 'rect', box: area, fill: WHITE },
    { kind: 'modules', purpose: 'barcode', area, boxes, color: BLACK },
  ];
}
