/** Dates as a UK reader expects them ("3 Mar 2025, 14:05"); an unreadable value is shown as it came. */
import { shortDate } from '../../../shared/rules/dates.js';

export function formatDateTime(iso: string): string {
  const date = new Date(iso);
  if (Number.isNaN(date.getTime())) return iso;
  return new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric', hour: '2-digit', minute: '2-digit' }).format(date);
}

/** A calendar day (YYYY-MM-DD) in the same style, "1 Jun 2027"; read as written, with no time zone to shift it. */
export const formatDay = shortDate;

/**
 * Text written by the server with calendar days in it ("installation date 2025-06-01 → 2027-06-01")
 * with each day as the rest of the app writes it ("1 Jun 2025 → 1 Jun 2027"). Only whole
 * YYYY-MM-DD words change, so a board code or a number is left alone.
 */
export function formatDaysInText(text: string): string {
  return text.replace(/(?<![\w-])\d{4}-\d{2}-\d{2}(?![\w-])/g, formatDay);
}

/** Month names as typed: any start of three letters or more ("Dec", "Decem", "December"), so "decimal" is not a month. */
const MONTHS = ['january', 'february', 'march', 'april', 'may', 'june', 'july', 'august', 'september', 'october', 'november', 'december'];
const monthNumber = (word: string) => 1 + MONTHS.findIndex((m) => word.length >= 3 && m.startsWith(word));

/** The ISO day when year, month and day make a real calendar date (31 Feb does not), else null. */
function isoIfReal(year: number, month: number, day: number): string | null {
  if (year < 1900 || year > 2199 || month < 1 || month > 12 || day < 1) return null;
  if (day > new Date(Date.UTC(year, month, 0)).getUTCDate()) return null;
  return `${year}-${String(month).padStart(2, '0')}-${String(day).padStart(2, '0')}`;
}

/** A year as typed: four digits, or two read as this century ("26" → 2026), the way a date is written on site. */
const fullYear = (y: string) => (y.length === 2 ? 2000 + Number(y) : Number(y));

/**
 * A date typed the way a UK user writes it, as YYYY-MM-DD: day first ("02/12/2026", "2/12/26",
 * "2.12.2026"), with the month in words ("2 Dec 2026", "2nd December 2026") or ISO ("2026-12-02").
 * Null when it is not a real date (31/02/2026) or not a date at all, so the caller can say so
 * instead of dropping it. Never month first: 02/12 is always 2 December.
 */
export function parseDay(text: string): string | null {
  const t = text.trim().toLowerCase().replace(/,/g, ' ').replace(/\s+/g, ' ');
  const iso = /^(\d{4})[-/.](\d{1,2})[-/.](\d{1,2})$/.exec(t);
  if (iso) return isoIfReal(Number(iso[1]), Number(iso[2]), Number(iso[3]));
  const numeric = /^(\d{1,2})[/.\- ](\d{1,2})[/.\- ](\d{4}|\d{2})$/.exec(t);
  if (numeric) return isoIfReal(fullYear(numeric[3]), Number(numeric[2]), Number(numeric[1]));
  const words = /^(\d{1,2})(?:st|nd|rd|th)?[ \-/]?([a-z]+)\.?[ \-/]?(\d{4}|\d{2})$/.exec(t);
  if (!words) return null;
  const month = words[2] === 'sept' ? 9 : monthNumber(words[2]);
  return month ? isoIfReal(fullYear(words[3]), month, Number(words[1])) : null;
}
