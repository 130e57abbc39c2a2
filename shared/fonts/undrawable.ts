/**
 * Which characters of a text the bundled fonts cannot draw, known without reading a font: the
 * editor warns while the user types and the print engine warns and draws a substitute, both from
 * the one generated table (`coverage.ts`), so the two always agree.
 */
import { FACE_COVERAGE } from './coverage.js';

export type PrintFace = keyof typeof FACE_COVERAGE;
const ALL_FACES = Object.keys(FACE_COVERAGE) as PrintFace[];

/** What prints in place of a character no bundled face has: a hollow square, which every DejaVu face draws. */
export const SUBSTITUTE = '\u25a1';

/**
 * Characters that never reach the page as glyphs, so they are not reported: spaces and line breaks
 * (set as spaces), controls and format characters such as the zero-width joiner (dropped before
 * drawing) and variation selectors (which only choose a glyph's style, e.g. an emoji's colour form).
 */
const NOT_DRAWN = /^[\p{Cc}\p{Cf}\p{Z}\uFE00-\uFE0F\u{E0100}-\u{E01EF}]$/u;

/** Whether a character is dropped or set as a space before drawing (see `NOT_DRAWN`). */
export function isNotDrawn(ch: string): boolean {
  return NOT_DRAWN.test(ch);
}

/** U+FFFD marks text already broken on the way in (a bad encoding, a lone surrogate): printed, it would read as a fault, so it is never drawn as it is. */
const REPLACEMENT_CHARACTER = 0xfffd;

/** Whether `face` has a glyph for the code point: binary search over the face's ranges. */
export function faceHasGlyph(face: PrintFace, cp: number): boolean {
  const ranges = FACE_COVERAGE[face];
  let lo = 0;
  let hi = ranges.length / 2 - 1;
  while (lo <= hi) {
    const mid = (lo + hi) >> 1;
    if (cp < ranges[2 * mid]) hi = mid - 1;
    else if (cp > ranges[2 * mid + 1]) lo = mid + 1;
    else return true;
  }
  return false;
}

/**
 * The distinct characters of `text` (by code point, in order of first appearance) that one of
 * `faces` has no glyph for; by default every face, since one text can print in several (a way's
 * label is bold on its flag and regular on the chart). A lone surrogate and U+FFFD count as undrawable.
 */
export function undrawableCharacters(text: string, faces: readonly PrintFace[] = ALL_FACES): string[] {
  const found: string[] = [];
  for (const ch of new Set(Array.from(text))) {
    if (isNotDrawn(ch)) continue;
    const cp = ch.codePointAt(0)!;
    if (cp === REPLACEMENT_CHARACTER || faces.some((face) => !faceHasGlyph(face, cp))) found.push(ch);
  }
  return found;
}

/** `"配" (U+914D), "電" (U+96FB)`: each character and its code point, so a reader can tell look-alikes apart. */
export function describeCharacters(chars: readonly string[]): string {
  return chars.map((ch) => `"${ch}" (U+${ch.codePointAt(0)!.toString(16).toUpperCase().padStart(4, '0')})`).join(', ');
}

/** The sentence both the editor and the print warnings use, or null when every character prints. */
export function undrawableMessage(what: string, text: string, faces?: readonly PrintFace[]): string | null {
  return charactersMessage(what, undrawableCharacters(text, faces));
}

/** The same sentence for characters already found (the print engine finds them as it lays text out). */
export function charactersMessage(what: string, chars: readonly string[]): string | null {
  if (!chars.length) return null;
  return `${what}: ${describeCharacters(chars)} cannot be drawn with the printing fonts and will print as ${SUBSTITUTE}`;
}
