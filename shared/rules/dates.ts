/**
 * Calendar arithmetic on YYYY-MM-DD strings, in UTC so a date never shifts with the
 * machine's time zone. Pure: no clock is read; callers pass the dates in.
 */

function parts(iso: string): [number, number, number] {
  const [y, m, d] = iso.split('-').map(Number);
  return [y, m, d];
}

/** A moment's calendar date in UTC, YYYY-MM-DD. */
export function isoDay(date: Date): string {
  return date.toISOString().slice(0, 10);
}
const format = isoDay;

/** Adds whole months; a day the target month lacks clamps to its last day (31 Jan + 1 month → 28/29 Feb). */
export function addMonths(iso: string, months: number): string {
  const [y, m, d] = parts(iso);
  const first = new Date(Date.UTC(y, m - 1 + months, 1));
  const lastDay = new Date(Date.UTC(first.getUTCFullYear(), first.getUTCMonth() + 1, 0)).getUTCDate();
  return format(new Date(Date.UTC(first.getUTCFullYear(), first.getUTCMonth(), Math.min(d, lastDay))));
}

/** Adds whole days. */
export function addDays(iso: string, days: number): string {
  const [y, m, d] = parts(iso);
  return format(new Date(Date.UTC(y, m - 1, d + days)));
}

/** Whole days from `from` to `to` (negative when `to` is earlier). */
export function daysBetween(from: string, to: string): number {
  const [y1, m1, d1] = parts(from);
  const [y2, m2, d2] = parts(to);
  return Math.round((Date.UTC(y2, m2 - 1, d2) - Date.UTC(y1, m1 - 1, d1)) / 86_400_000);
}

const LONG = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'long', year: 'numeric', timeZone: 'UTC' });

/** "14 May 2026", the way notices and findings print a date; a text that is not YYYY-MM-DD is given back as it is. */
export function longDate(iso: string): string {
  const [y, m, d] = parts(iso);
  return y && m && d ? LONG.format(new Date(Date.UTC(y, m - 1, d))) : iso;
}

/**
 * Three-letter months for "10 Feb 2025". Kept by hand rather than Intl: en-GB's short month for
 * September is "Sept" in current ICU, and labels and table columns are sized for three letters.
 */
const SHORT_MONTHS = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];

/** "10 Feb 2025": the short date of charts, labels and screens; a text that is not YYYY-MM-DD is given back as it is. */
export function shortDate(iso: string): string {
  const m = /^(\d{4})-(\d{2})-(\d{2})$/.exec(iso);
  const month = m ? SHORT_MONTHS[Number(m[2]) - 1] : undefined;
  return m && month && Number(m[3]) >= 1 && Number(m[3]) <= 31 ? `${Number(m[3])} ${month} ${m[1]}` : iso;
}
