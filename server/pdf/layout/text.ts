/**
 * Text as it may be drawn: well-formed, one line, no control characters. A stray newline or
 * lone surrogate in a label would otherwise break pdf-lib's drawing or the text's extraction.
 */

/** One-line printable text: lone surrogates become U+FFFD, controls spaces, format characters go, whitespace collapses. */
export function cleanText(raw: string): string {
  return raw
    .replace(/[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/g, '\uFFFD')
    .replace(/[\p{Cc}\p{Zl}\p{Zp}]/gu, ' ')
    .replace(/[\p{Cf}]/gu, '')
    .replace(/\s+/gu, ' ')
    .trim();
}

/** Split into code points (not UTF-16 units), so cutting never halves a character. */
export function codePoints(text: string): string[] {
  return Array.from(text);
}
