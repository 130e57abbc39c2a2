/**
 * Sentences the board page says about a way: which RCD turns it off, that a sub-main takes a whole
 * board with it, and which ways have no RCD. Pure and small: it ships in the page's chunk.
 */
import type { PublicWay } from '../schemas/public-board.js';

/** "1", "1 and 2", "1, 2 and 3". */
export function listText(items: readonly string[]): string {
  if (items.length <= 1) return items.join('');
  return `${items.slice(0, -1).join(', ')} and ${items[items.length - 1]}`;
}

/** What a sub-main's card and RCD group add: the board it feeds goes off with it. */
export const SUB_MAIN_TEXT = 'This way feeds another board (a sub-main). When it is switched off or trips, everything on that board goes off too.';

/** What turns a way off and what goes off with it, for the way's card. */
export function wayProtectionText(way: Pick<PublicWay, 'rcd' | 'feedsAnotherBoard'>): string {
  const rcd = way.rcd;
  if (!rcd) return 'No RCD protection recorded';
  const ma = rcd.residualMa != null ? ` ${rcd.residualMa} mA` : '';
  if (rcd.kind === 'rcbo') {
    return way.feedsAnotherBoard
      ? `Own RCBO${ma}: when it trips, this way and everything on the board it feeds go off`
      : `Own RCBO${ma}: only this way goes off when it trips`;
  }
  return way.feedsAnotherBoard ? `Goes off when ${rcd.name}${ma} trips, and so does everything on the board it feeds` : `Goes off when ${rcd.name}${ma} trips`;
}

/** "No RCD protection is recorded for way 4." or "… for ways 1, 2 and 3."; empty when every way has one. */
export function unprotectedText(wayTexts: readonly string[]): string {
  if (!wayTexts.length) return '';
  return `No RCD protection is recorded for ${wayTexts.length === 1 ? 'way' : 'ways'} ${listText(wayTexts)}.`;
}
