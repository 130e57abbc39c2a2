/**
 * Right-to-left text in visual order. pdf-lib draws a string's glyphs left to right as fontkit
 * returns them, and fontkit reverses a whole string whose first script is Hebrew or Arabic, so a
 * mixed label came out with its English word backwards ("nehctiK"). Here one line is cut into its
 * directional runs, put in the order they appear on the page, by the Unicode Bidirectional
 * Algorithm (UAX #9, https://www.unicode.org/reports/tr9/, via bidi-js); each run is then shaped
 * on its own in its own direction (fonts.ts), which keeps Arabic joining on the logical order.
 */
import bidiJs from 'bidi-js';

// bidi-js is CommonJS whose module.exports is the factory itself; its typings, written as an ES module, call that the default export.
const bidiFactory = bidiJs as unknown as typeof bidiJs.default;
const bidi = bidiFactory();

/** One directional run of a line: its text in logical order (mirrored brackets already swapped when right to left). */
export interface DirectionalRun {
  text: string;
  rtl: boolean;
}

/** Strong right-to-left letters and the marks of those blocks: without one, a line is left to right and needs no work. */
const RIGHT_TO_LEFT = /[\u0590-\u08ff\ufb1d-\ufdff\ufe70-\ufefc\u{10800}-\u{10fff}\u{1e800}-\u{1efff}]/u;

/**
 * The runs of one line of text, left to right as they are seen on the page (UAX #9 rules L1–L2:
 * levels resolved for the line as a paragraph of its own, the direction taken from its first
 * strong letter, rule P2). Right-to-left runs keep their logical order: whoever draws them reverses
 * their glyphs after shaping. Characters mirrored at odd levels (rule L4) are already swapped.
 */
export function directionalRuns(line: string): DirectionalRun[] {
  if (!RIGHT_TO_LEFT.test(line)) return [{ text: line, rtl: false }];
  const embedding = bidi.getEmbeddingLevels(line);
  const { levels } = embedding;
  const mirrored = bidi.getMirroredCharactersMap(line, levels);
  const order = bidi.getReorderedIndices(line, embedding);
  const runs: DirectionalRun[] = [];
  let from = 0;
  while (from < order.length) {
    const level = levels[order[from]];
    const step = level & 1 ? -1 : 1;
    let to = from + 1;
    while (to < order.length && levels[order[to]] === level && order[to] === order[to - 1] + step) to++;
    const first = Math.min(order[from], order[to - 1]);
    const last = Math.max(order[from], order[to - 1]);
    let text = '';
    for (let i = first; i <= last; i++) text += mirrored.get(i) ?? line[i];
    runs.push({ text, rtl: (level & 1) === 1 });
    from = to;
  }
  return runs;
}

/** The line as read left to right on the page (each right-to-left run's characters reversed): what tests compare with. */
export function visualOrder(line: string): string {
  return directionalRuns(line)
    .map((r) => (r.rtl ? Array.from(r.text).reverse().join('') : r.text))
    .join('');
}
