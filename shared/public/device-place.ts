/**
 * Where a way's switch is, in words a householder can follow in a dark cupboard: "3rd from the left
 * on the top row, after RCD 1". Devices are counted as a person sees them: one per device whatever
 * its width, from the left, rows from the top; blank covers are not counted (they switch nothing).
 * Pure and small: it ships in the board page's chunk.
 */
import type { PublicDinDevice, PublicDinPlace, PublicDinRows, PublicWay } from '../schemas/public-board.js';

/** 1st, 2nd, 3rd, 4th … 11th, 12th, 13th … 21st, 22nd. */
export function ordinal(n: number): string {
  const tens = n % 100;
  const last = n % 10;
  const suffix = tens >= 11 && tens <= 13 ? 'th' : last === 1 ? 'st' : last === 2 ? 'nd' : last === 3 ? 'rd' : 'th';
  return `${n}${suffix}`;
}

/** "the top row", "the 2nd row", "the 3rd row", counted from the top; empty on a one-row board, where there is nothing to tell apart. */
export function rowText(row: number, rowCount: number): string {
  if (rowCount <= 1) return '';
  return row === 1 ? 'the top row' : `the ${ordinal(row)} row`;
}

/** "a 2-pole device, 2 modules wide": what makes a device stand out from its one-module neighbours. */
function sizeText(d: PublicDinDevice): string {
  const poles = d.poles > 1 ? `a ${d.poles}-pole device` : '';
  const width = d.modules === 1 ? '' : d.modules === 0.5 ? 'half a module wide' : `${d.modules} modules wide`;
  return [poles, width].filter(Boolean).join(', ');
}

/** The RCD it sits after on its row (the nearest to its left), else the one it sits before, as "after RCD 1". */
function rcdText(devices: readonly PublicDinDevice[], index: number): string {
  const named = (d: PublicDinDevice) => d.label || 'an RCD';
  const after = devices
    .slice(0, index)
    .reverse()
    .find((d) => d.kind === 'rcd');
  if (after) return `after ${named(after)}`;
  const before = devices.slice(index + 1).find((d) => d.kind === 'rcd');
  return before ? `before ${named(before)}` : '';
}

/**
 * Where the device at `place` is: "3rd from the left on the top row, after RCD 1", "5th and last from
 * the left" for the last, and its poles and width when it is more than one module. Null when the
 * place is not on the rows (a stale or broken reference), so the page says nothing rather than something wrong.
 */
export function devicePlaceText(rows: PublicDinRows['rows'], place: PublicDinPlace): string | null {
  const devices = rows[place.row - 1]?.devices;
  const device = devices?.[place.index];
  if (!devices || !device) return null;
  const counted = devices.filter((d, i) => d.kind !== 'blank' || i === place.index);
  const position = counted.indexOf(device) + 1;
  const row = rowText(place.row, rows.length);
  const blanksBefore = devices.slice(0, place.index).some((d) => d.kind === 'blank');
  let where: string;
  if (counted.length === 1) where = `the only device on ${row || 'the board'}`;
  else {
    const last = position === counted.length ? ' and last' : '';
    where = `${ordinal(position)}${last} from the left${blanksBefore ? ' (not counting blank covers)' : ''}${row ? ` on ${row}` : ''}`;
  }
  const size = sizeText(device);
  return [where, rcdText(devices, place.index)].filter(Boolean).join(', ') + (size ? ` — ${size}` : '');
}

/** "way 3 (Garage sockets)", or "the spare way" for a spare the schedule gives no number. */
function wayName(way: Pick<PublicWay, 'wayText' | 'label'>): string {
  return way.wayText ? `way ${way.wayText} (${way.label})` : `the ${way.label.toLowerCase()} way`;
}

/** The locator's sentence, which is also the picture's text alternative: "The switch for way 3 (Garage sockets) is the MCB B16, 3rd from the left …". */
export function wayPlaceSentence(way: Pick<PublicWay, 'wayText' | 'label' | 'device' | 'place'>, rows: PublicDinRows['rows']): string {
  const where = way.place ? devicePlaceText(rows, way.place) : null;
  if (!where) return `Where the switch for ${wayName(way)} sits on the board is not recorded.`;
  return `The switch for ${wayName(way)} is ${way.device ? `the ${way.device}, ` : ''}${where}.`;
}

/** Way numbers over each device, keyed "row:index", as the editor's picture writes them ("4 L1, 4 L2"). */
export function wayTextsByPlace(ways: readonly Pick<PublicWay, 'wayText' | 'place'>[]): Map<string, string> {
  const out = new Map<string, string[]>();
  for (const w of ways) {
    if (!w.place || !w.wayText) continue;
    const key = `${w.place.row}:${w.place.index}`;
    out.set(key, [...(out.get(key) ?? []), w.wayText]);
  }
  return new Map([...out].map(([key, texts]) => [key, texts.join(', ')]));
}
