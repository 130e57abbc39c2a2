import { describe, expect, it } from 'vitest';
import { drawLayout } from '../../../server/pdf/draw.js';
import { typeMetrics } from '../../../server/pdf/fonts.js';
import { fitText } from '../../../server/pdf/layout/fit.js';
import { fontFaces, type LayoutDoc } from '../../../server/pdf/model.js';
import { pdfText, rasterise } from './helpers.js';

/**
 * Every character the engine's own wording uses, the symbols electricians type, the substitute □
 * drawn for what no face has, and Hebrew and Arabic (shaped: joined forms and the lam-alef ligature).
 */
const GLYPHS = [
  ' !"#$%&\'()*+,-./0123456789:;<=>?@ABCDEFGHIJKLMNOPQRSTUVWXYZ[\\]^_`abcdefghijklmnopqrstuvwxyz{|}~',
  '² ³ Ω Δ ± ≤ ≥ → — – ° µ ∅ Æ Ø Å é ü ß € £ ½ … · × − ’ “ ” ▼ ▲ □',
  'מטבח חדר שינה Kitchen مطبخ غرفة النوم لا',
];

function glyphSheet(): LayoutDoc {
  const tm = typeMetrics();
  const items = fontFaces.flatMap((face, f) =>
    GLYPHS.flatMap((line, l) => fitText(line, { x: 5, y: 5 + (f * GLYPHS.length + l) * 9, w: 200, h: 8 }, { face, maxPt: 11, minPt: 11 }, tm).runs),
  );
  return { title: 'Glyphs', pages: [{ widthMm: 210, heightMm: 5 + fontFaces.length * GLYPHS.length * 9, items }], warnings: [] };
}

describe('embedded fonts', () => {
  it('when the glyphs used are embedded as a subset, then they render pixel for pixel like the full font', async () => {
    const sheet = glyphSheet();
    const subset = (await drawLayout(sheet, { xMm: 0, yMm: 0 })).pdf;
    const full = (await drawLayout(sheet, { xMm: 0, yMm: 0 }, { subsetFonts: false })).pdf;
    expect(subset.length).toBeLessThan(full.length / 5); // the point of subsetting (measured: ~7 KB against ~400 KB)
    const a = rasterise(subset, 150);
    const b = rasterise(full, 150);
    expect([a.width, a.height]).toEqual([b.width, b.height]);
    let differ = 0;
    let ink = 0;
    for (let i = 0; i < a.data.length; i += 4) {
      if (a.data[i] !== b.data[i] || a.data[i + 1] !== b.data[i + 1] || a.data[i + 2] !== b.data[i + 2]) differ++;
      if (a.data[i] < 128) ink++;
    }
    expect(ink).toBeGreaterThan(5000); // glyphs really drew (a blank subset would also "match" a blank page)
    expect(differ).toBe(0);
  });

  it('when the subset is extracted, then the text comes back as typed', async () => {
    const text = await pdfText((await drawLayout(glyphSheet(), { xMm: 0, yMm: 0 })).pdf);
    for (const ch of ['²', 'Ω', '≤', 'Δ', '±', 'é', '€', '½', '□']) expect(text).toContain(ch);
  });
});
