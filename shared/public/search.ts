/**
 * The board page's search: a visitor types "garage" and sees the ways serving the garage, or
 * "way 5", "5", "L1", "4 L2" and sees those ways. Every word typed must appear (as part of a word)
 * in the way's label, description or locations, or name its way number or phase, ignoring case
 * and accents. After the word "way" numbers and phases mean the way only, so "way 5" is way 5 and
 * not a description mentioning 5 mm². Pure, small: it ships in the page's chunk.
 */
import type { PublicWay } from '../schemas/public-board.js';

/** Lower case without accents, so "Cafe" finds "Café". */
export function foldText(s: string): string {
  return s
    .normalize('NFD')
    .replace(/[\u0300-\u036f]/g, '')
    .toLowerCase();
}

/** The words of a query; punctuation separates words, and "4l2" is read as "4 l2". */
export function queryWords(query: string): string[] {
  return foldText(query)
    .split(/[^\p{L}\p{N}]+/u)
    .filter(Boolean)
    .flatMap((word) => (/^\d+l[123]$/.exec(word) ? [word.slice(0, -2), word.slice(-2)] : [word]));
}

const WAY_WORDS = new Set(['way', 'ways']);
const isWayReference = (word: string) => /^\d+$/.test(word) || /^l[123]$/.test(word);

function haystack(w: PublicWay): string {
  return foldText([w.label, w.description, ...w.locations].join(' \u0000 '));
}

/** True when a word is this way's number or phase: "5" for 5 L1, "l1" for 5 L1. */
function namesWay(w: PublicWay, word: string): boolean {
  return String(w.way) === word || (w.phase != null && w.phase.toLowerCase() === word);
}

/** Ways matching every word of the query; an empty query (or "way" alone) matches every way. */
export function searchWays<W extends PublicWay>(ways: readonly W[], query: string): W[] {
  const all = queryWords(query);
  const byWay = all.some((word) => WAY_WORDS.has(word));
  const words = byWay ? all.filter((word) => !WAY_WORDS.has(word)) : all;
  if (!words.length) return [...ways];
  return ways.filter((w) => {
    const text = haystack(w);
    return words.every((word) => namesWay(w, word) || (!(byWay && isWayReference(word)) && text.includes(word)));
  });
}
