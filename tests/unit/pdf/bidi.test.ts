/**
 * Right-to-left text in visual order. Expected orders follow the Unicode Bidirectional Algorithm,
 * UAX #9 (https://www.unicode.org/reports/tr9/), rules P2–P3 (the paragraph takes the direction of
 * its first strong letter), W/N rules (numbers and neutrals), L2 (reversal) and L4 (mirroring); the
 * Arabic forms follow the Unicode Standard's Arabic joining (chapter 9.2, ArabicShaping.txt) and the
 * Arabic Presentation Forms-B code chart.
 */
import { describe, expect, it } from 'vitest';
import { directionalRuns, visualOrder } from '../../../server/pdf/bidi.js';
import { cachingFontkit, fontBytes } from '../../../server/pdf/fonts.js';

/** The glyph's PostScript name (fontkit has it; its typings leave it out). */
const glyphName = (g: object) => (g as { name: string }).name;
const hex = (cps: number[]) => cps.map((c) => c.toString(16).toUpperCase());
const glyphCodePoints = (text: string) =>
  cachingFontkit
    .create(fontBytes('regular'))
    .layout(text)
    .glyphs.flatMap((g) => g.codePoints);

describe('visual order of mixed-direction labels (UAX #9)', () => {
  it('when a line is all left to right, then it is one run and unchanged', () => {
    expect(directionalRuns('Kitchen sockets')).toEqual([{ text: 'Kitchen sockets', rtl: false }]);
  });

  it('when a Hebrew label holds an English word, then the English word reads forwards, left of the Hebrew', () => {
    // UAX #9 P2: first strong letter is Hebrew, so the paragraph is right to left; "Kitchen" is level 2, kept as typed (L2)
    expect(visualOrder('מטבח Kitchen')).toBe('Kitchen חבטמ');
    expect(directionalRuns('מטבח Kitchen')).toEqual([
      { text: 'Kitchen', rtl: false },
      { text: 'מטבח ', rtl: true },
    ]);
  });

  it('when an English label holds a Hebrew word, then the paragraph stays left to right and only the Hebrew is reversed', () => {
    // UAX #9 section 3.4 example 1 ("car means CAR." displays "car means RAC.") with Hebrew for the capitals
    expect(visualOrder('car means מטבח.')).toBe('car means חבטמ.');
  });

  it('when a number sits between Hebrew words, then its digits keep their order (W rules, level 2)', () => {
    expect(visualOrder('חדר 12 שינה')).toBe('הניש 12 רדח');
  });

  it('when brackets are in a right-to-left run, then they are mirrored so they still enclose their word (L4)', () => {
    expect(visualOrder('מטבח (Kitchen)')).toBe('(Kitchen) חבטמ');
  });

  it('when a Hebrew + English label is laid out by the print fonts, then the glyphs come in visual order', () => {
    const seen = String.fromCodePoint(...glyphCodePoints('מטבח Kitchen'));
    expect(seen).toBe('Kitchen חבטמ');
  });

  it('when an Arabic word with an English word is laid out, then the Arabic is joined (positional forms) and the English reads forwards', () => {
    // مطبخ = meem, tah, beh, khah. Joined: meem initial U+FEE3, tah medial U+FEC4, beh medial U+FE92, khah final U+FEA6 (Presentation Forms-B),
    // drawn right to left, so left to right on the page they come khah … meem.
    const cps = glyphCodePoints('Kitchen مطبخ');
    expect(String.fromCodePoint(...cps.slice(0, 8))).toBe('Kitchen ');
    const glyphs = cachingFontkit.create(fontBytes('regular')).layout('Kitchen مطبخ').glyphs.slice(8);
    expect(glyphs.map(glyphName)).toEqual(['uniFEA6', 'uniFE92', 'uniFEC4', 'uniFEE3']);
    expect(hex(glyphs.flatMap((g) => g.codePoints))).toEqual(['62E', '628', '637', '645']);
  });

  it('when lam is followed by alef, then the two join into the one lam-alef ligature', () => {
    // Unicode Standard 9.2: lam + alef is obligatorily a ligature, U+FEFB (isolated form)
    expect(cachingFontkit.create(fontBytes('regular')).layout('لا').glyphs.map(glyphName)).toEqual(['uniFEFB']);
  });
});
