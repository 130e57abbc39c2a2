/**
 * The DejaVu Sans faces, read from `fonts/` once per process. Layout measures with fontkit
 * metrics parsed once (cached advance widths per code point); drawing embeds the same bytes
 * as a subset per document. Measuring exactly as pdf-lib encodes keeps fitted text in its cell.
 */
import { LRUCache } from 'lru-cache';
import { readFileSync } from 'node:fs';
import fontkit from '@pdf-lib/fontkit';
import { MM_PER_PT, type FontFace, type TypeMetrics } from './model.js';
import { directionalRuns } from './bidi.js';
import { SUBSTITUTE, isNotDrawn } from '../../shared/fonts/undrawable.js';

type FontkitFont = ReturnType<typeof fontkit.create>;

const FILES: Record<FontFace, string> = {
  regular: 'DejaVuSans.ttf',
  bold: 'DejaVuSans-Bold.ttf',
  condensed: 'DejaVuSansCondensed.ttf',
  'condensed-bold': 'DejaVuSansCondensed-Bold.ttf',
};
const FONT_DIR = new URL('../../fonts/', import.meta.url);

const bytesByFace = new Map<FontFace, Uint8Array>();
const parsedByBytes = new Map<Uint8Array, FontkitFont>();

/** The face's file bytes, read on first use and kept (the same array every time). */
export function fontBytes(face: FontFace): Uint8Array {
  let bytes = bytesByFace.get(face);
  if (!bytes) {
    bytes = new Uint8Array(readFileSync(new URL(FILES[face], FONT_DIR)));
    bytesByFace.set(face, bytes);
  }
  return bytes;
}

/**
 * A fontkit that parses each font file once per process. pdf-lib calls `create` for every
 * embedding; parsing DejaVu costs tens of milliseconds, so labels share one parsed font and
 * only the per-document subset is new.
 */
export const cachingFontkit = {
  create(bytes: Uint8Array, postscriptName?: string): FontkitFont {
    let font = parsedByBytes.get(bytes);
    if (!font) {
      font = withLayoutCache(fontkit.create(bytes, postscriptName));
      parsedByBytes.set(bytes, font);
    }
    return font;
  },
};

const LAYOUT_CACHE_MAX = 20000;

type GlyphRun = ReturnType<FontkitFont['layout']>;
type Features = Parameters<FontkitFont['layout']>[1];
/** fontkit's `layout` also takes script, language and direction after the features; its typings stop at the features. */
type DirectedLayout = (text: string, features: Features, script: undefined, language: undefined, direction: 'ltr' | 'rtl') => GlyphRun;

/**
 * One line's glyphs in the order they are seen on the page: each directional run (bidi.ts) shaped on
 * its own, right-to-left runs in their direction so fontkit joins Arabic on the logical order and then
 * reverses them. fontkit alone would reverse the whole line when it begins in Hebrew or Arabic.
 */
function layoutLine(font: FontkitFont, text: string, features: Features): GlyphRun {
  const runs = directionalRuns(text);
  if (runs.length === 1 && !runs[0].rtl) return font.layout(text, features);
  const directed = font.layout.bind(font) as DirectedLayout;
  const parts = runs.map((r) => directed(r.text, features, undefined, undefined, r.rtl ? 'rtl' : 'ltr'));
  const line = parts[0];
  line.glyphs = parts.flatMap((p) => p.glyphs);
  line.positions = parts.flatMap((p) => p.positions);
  return line;
}

/**
 * The font with `layout` in visual order (`layoutLine`) and remembered per string. pdf-lib shapes
 * every drawn run with fontkit; a board's labels repeat across flags, strips and every live-preview
 * render, so the same glyph runs are reused instead of shaped again. Glyph runs are only read, never changed.
 */
function withLayoutCache(font: FontkitFont): FontkitFont {
  const runs = new LRUCache<string, GlyphRun>({ max: LAYOUT_CACHE_MAX });
  const layout = (text: string, features?: Features) => {
    if (features !== undefined) return layoutLine(font, text, features);
    let run = runs.get(text);
    if (!run) {
      run = layoutLine(font, text, undefined);
      runs.set(text, run);
    }
    return run;
  };
  return new Proxy(font, { get: (target, key) => (key === 'layout' ? layout : Reflect.get(target, key, target)) });
}

function parsed(face: FontFace): FontkitFont {
  return cachingFontkit.create(fontBytes(face));
}

/** Code points drawn glyph by glyph with no shaping: Latin, Greek, punctuation, super/subscripts, currency, symbols, maths. */
export function isSimple(cp: number): boolean {
  return cp < 0x0300 || (cp >= 0x0370 && cp < 0x0400) || (cp >= 0x2000 && cp < 0x2300 && (cp < 0x20d0 || cp > 0x20ff));
}

const advanceCache = new Map<FontFace, Map<number, number>>();
/** Most recent widths and printable texts kept (least recently used go first). */
const SHAPED_CACHE_MAX = 5000;
const shapedCache = new LRUCache<string, number>({ max: SHAPED_CACHE_MAX });

function advance(font: FontkitFont, cp: number, cache: Map<number, number>): number {
  let a = cache.get(cp);
  if (a === undefined) {
    a = font.glyphForCodePoint(cp).advanceWidth / font.unitsPerEm;
    cache.set(cp, a);
  }
  return a;
}

/** Width in em: cached per-code-point advances, or fontkit's own layout for scripts that shape. */
function emWidth(text: string, face: FontFace): number {
  const font = parsed(face);
  let cache = advanceCache.get(face);
  if (!cache) {
    cache = new Map();
    advanceCache.set(face, cache);
  }
  let sum = 0;
  for (let i = 0; i < text.length; i++) {
    const cp = text.codePointAt(i)!;
    if (cp > 0xffff) i++;
    if (!isSimple(cp)) return shapedWidth(text, face, font);
    sum += advance(font, cp, cache);
  }
  return sum;
}

function shapedWidth(text: string, face: FontFace, font: FontkitFont): number {
  const key = `${face}\u0000${text}`;
  let w = shapedCache.get(key);
  if (w === undefined) {
    try {
      w = font.layout(text).glyphs.reduce((s, g) => s + g.advanceWidth, 0) / font.unitsPerEm;
    } catch {
      w = Array.from(text).reduce((s, ch) => s + font.glyphForCodePoint(ch.codePointAt(0)!).advanceWidth, 0) / font.unitsPerEm;
    }
    shapedCache.set(key, w);
  }
  return w;
}

const printableCache = new LRUCache<string, string>({ max: SHAPED_CACHE_MAX });

/**
 * Text the face can draw: code points it has no glyph for become the visible substitute □ (never
 * U+FFFD's "�", which reads as a broken file), selectors that only pick a glyph's style go, and a
 * string whose shaping this fontkit cannot run (it throws for some scripts) keeps only the unshaped
 * characters. pdf-lib would otherwise fail on the same string when drawing it. The layout warns,
 * naming the label, for every character this changes (layout/undrawable.ts).
 */
function printable(text: string, face: FontFace): string {
  const key = `${face}\u0000${text}`;
  const known = printableCache.get(key);
  if (known !== undefined) return known;
  const font = parsed(face);
  let out = '';
  let simple = true;
  for (const ch of text) {
    const cp = ch.codePointAt(0)!;
    if (cp !== 0xfffd && font.hasGlyphForCodePoint(cp)) out += ch;
    else if (!isNotDrawn(ch)) out += SUBSTITUTE;
    if (!isSimple(cp)) simple = false;
  }
  if (!simple) {
    try {
      font.layout(out);
    } catch {
      out = unshaped(out);
    }
  }
  printableCache.set(key, out);
  return out;
}

let metrics: TypeMetrics | null = null;

/** Fallback for drawing a string fontkit cannot shape: every shaped character becomes the substitute □. */
export function unshaped(text: string): string {
  return Array.from(text, (ch) => (isSimple(ch.codePointAt(0)!) ? ch : SUBSTITUTE)).join('');
}

/** The metrics every layout measures with (DejaVu faces share one ascender and descender). */
export function typeMetrics(): TypeMetrics {
  if (metrics) return metrics;
  const faces: FontFace[] = ['regular', 'bold', 'condensed', 'condensed-bold'];
  const ascent = Math.max(...faces.map((f) => parsed(f).ascent / parsed(f).unitsPerEm));
  const descent = Math.max(...faces.map((f) => -parsed(f).descent / parsed(f).unitsPerEm));
  metrics = { ascent, descent, printable, measure: (text, face, sizePt) => emWidth(text, face) * sizePt * MM_PER_PT };
  return metrics;
}
