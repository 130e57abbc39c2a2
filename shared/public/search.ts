/**
 * The board page's search: a visitor types "garage" and sees the ways serving the garage.
 * Every word typed must appear (as part of a word) in the way's label, description,
 * locations or way number, ignoring case and accents. Pure, small: it ships in the page's chunk.
 */
import type { PublicWay } from '../schemas/public-board.js';

/** Lower case without accents, so "Cafe" finds "Café". */
export function foldText(s: string): string {
  return s.normalize('NFD').replace(/[\u0300-\u036f]/g, '').toLowerCase();
}

/** The words of a query; punctuation separates words. */
export function queryWords(query: string): string[] {
  return foldText(query).split(/[^\p{L}\p{N}]+/u).filter(Boolean);
}

function haystack(w: PublicWay): string {
  return foldText([w.label, w.description, ...w.locations].join(' \u0000 '));
}

/** Ways matching every word of the query; an empty query matches every way. */
export function searchWays<W extends PublicWay>(ways: readonly W[], query: string): W[] {
  const words = queryWords(query);
  if (!words.length) return [...ways];
  return ways.filter((w) => {
    const text = haystack(w);
    return words.every((word) => text.includes(word) || String(w.way) === word);
  });
}
