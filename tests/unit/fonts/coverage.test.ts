import { describe, expect, it } from 'vitest';
import { FACE_FILES, faceRanges, type CoverageFace } from '../../../scripts/font-coverage.js';
import { FACE_COVERAGE } from '../../../shared/fonts/coverage.js';
import { SUBSTITUTE, faceHasGlyph, undrawableCharacters, undrawableMessage } from '../../../shared/fonts/undrawable.js';
import { undrawableTextFindings } from '../../../shared/fonts/printed-text.js';
import { tenCircuitBoard } from '../pdf/fixtures.js';

describe('the glyph coverage table', () => {
  for (const face of Object.keys(FACE_FILES) as CoverageFace[]) {
    it(`when fonts/${FACE_FILES[face]} is read again, then its cmap is exactly the committed table (else run scripts/font-coverage.ts)`, () => {
      expect(FACE_COVERAGE[face]).toEqual(faceRanges(face));
    });
  }

  it('when a face is asked about scripts DejaVu Sans is known to cover or not, then the table agrees', () => {
    // Unicode 15 code charts: U+0041 Latin A, U+03A9 Greek Omega, U+0416 Cyrillic Zhe, U+05D0 Hebrew Alef, U+0645 Arabic Meem, U+25A1 White Square
    for (const cp of [0x41, 0x3a9, 0x416, 0x5d0, 0x645, 0x25a1]) expect(faceHasGlyph('regular', cp)).toBe(true);
    for (const cp of [0x41, 0x3a9, 0x416, 0x5d0, 0x645, 0x25a1]) expect(faceHasGlyph('condensed-bold', cp)).toBe(true);
    // U+914D, U+96FB CJK ideographs; U+0915 Devanagari Ka; U+1F44D thumbs up: not in DejaVu Sans 2.37 (fonts-dejavu-core)
    for (const cp of [0x914d, 0x96fb, 0x915, 0x1f44d]) expect(faceHasGlyph('regular', cp)).toBe(false);
  });
});

describe('characters no printing font draws', () => {
  it('when a label mixes Chinese with English, then exactly the two ideographs are listed, once each, in order', () => {
    expect(undrawableCharacters('配電 Kitchen 配')).toEqual(['配', '電']);
  });

  it('when a label is Latin, Greek, Cyrillic, Hebrew or Arabic with the usual symbols, then nothing is listed', () => {
    expect(undrawableCharacters('Café lights Ω² ±0.5 ≤ Кухня מטבח مطبخ €£½')).toEqual([]);
  });

  it('when an emoji carries a variation selector or joiner, then only the emoji itself is listed (selectors are not drawn)', () => {
    expect(undrawableCharacters('Lights 👍️ 👩‍🔧')).toEqual(['👍', '👩', '🔧']); // U+FE0F and U+200D are format characters, never drawn
  });

  it('when text holds U+FFFD or a lone surrogate (a broken encoding), then it is listed rather than printed as "�"', () => {
    expect(undrawableCharacters('Hall \ufffd \ud800')).toEqual(['\ufffd', '\ud800']);
  });

  it('when the message is made, then it names the field, each character with its code point, and the substitute', () => {
    expect(undrawableMessage('Way 3 label', '配電')).toBe(
      `Way 3 label: "配" (U+914D), "電" (U+96FB) cannot be drawn with the printing fonts and will print as ${SUBSTITUTE}`,
    );
    expect(undrawableMessage('Way 3 label', 'Kitchen')).toBeNull();
  });

  it('when a schedule holds undrawable characters, then each field gets one warning on its own path and nothing else does', () => {
    const s = tenCircuitBoard();
    s.circuits[2].label = '配電 lights';
    s.board.name = 'Flat 2 🏠';
    const findings = undrawableTextFindings(s);
    expect(findings.map((f) => [f.field, f.severity])).toEqual([
      ['board.name', 'warning'],
      ['circuits.2.label', 'warning'],
    ]);
    expect(findings[1].message).toContain(`Way ${s.circuits[2].way} label`);
    expect(findings[1].ways).toEqual([s.circuits[2].way]);
  });
});
