/**
 * A tape or thermal printer has one ink: every colour of the layout becomes pure black or pure white
 * before drawing, so the image holds no grey a printer would dither into a fringe. Dark colours (the
 * black, grey and red the layout uses) print; light ones (light-grey fills, safety yellow) do not.
 */
import type { Color } from '../model.js';

/** Relative luminance below which a colour prints as black. // common practice (mid-grey threshold) */
export const INK_THRESHOLD = 0.5;

/** Luminance of an sRGB colour with the Rec. 709 weights. // ITU-R BT.709 */
function luminance([r, g, b]: Color): number {
  return 0.2126 * r + 0.7152 * g + 0.0722 * b;
}

export function ink(color: Color): '#000' | '#fff' {
  return luminance(color) < INK_THRESHOLD ? '#000' : '#fff';
}
