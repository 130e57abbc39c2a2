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
