/**
 * Text as outlines from the same DejaVu files the PDF embeds, through fontkit: the image never
 * depends on the fonts a server happens to have. Glyphs advance by their advance widths, as
 * pdf-lib sets them, so a run is exactly as wide in the image as the layout measured it.
 */
import { cachingFontkit, fontBytes, unshaped } from '../fonts.js';
import { MM_PER_PT, type TextRun } from '../model.js';
import { ink } from './ink.js';

type Font = ReturnType<typeof cachingFontkit.create>;
type Glyph = ReturnType<Font['glyphForCodePoint']>;

/** Outline path data per face and glyph id, in font units (y up): a board's labels repeat the same letters. */
const outlines = new Map<string, string>();

function outline(face: string, glyph: Glyph): string {
  const key = `${face}:${glyph.id}`;
  let d = outlines.get(key);
  if (d === undefined) {
    d = glyph.path.toSVG();
    outlines.set(key, d);
  }
  return d;
}

function glyphsOf(font: Font, text: string): Glyph[] {
  try {
    return font.layout(text).glyphs;
  } catch {
    // As in the PDF draw step: fontkit cannot shape some scripts; layout avoids them, this keeps a stray one from failing.
    return font.layout(unshaped(text)).glyphs;
  }
}

/**
 * One run as an SVG group, positioned in pixels (`scale` px per mm). Each glyph outline goes once into
 * `defs` (id → path) and is referenced by `<use>`: a page repeats the same few dozen letters.
 */
export function textSvg(run: TextRun, scale: number, defs: Map<string, string>): string {
  const font = cachingFontkit.create(fontBytes(run.face));
  const k = (run.sizePt * MM_PER_PT * scale) / font.unitsPerEm;
  let x = 0;
  const paths: string[] = [];
  for (const g of glyphsOf(font, run.text)) {
    const id = `${run.face}-${g.id}`;
    if (!defs.has(id)) defs.set(id, outline(run.face, g));
    if (defs.get(id)) paths.push(`<use href="#${id}" x="${x}"/>`);
    x += g.advanceWidth;
  }
  const at = `translate(${run.x * scale} ${run.y * scale}) rotate(${run.rotation}) scale(${k} ${-k})`;
  return `<g transform="${at}" fill="${ink(run.color)}">${paths.join('')}</g>`;
}
