/**
 * Dates on the board page: "18 September 2028", and whether the recommended inspection date has
 * passed. Kept here rather than imported from the rule set's date helpers so the page's download
 * carries only what it uses. Today is passed in: the page's JSON is cached per revision, so the
 * browser works out "overdue" on the day it is read.
 */
const ISO_DAY = /^(\d{4})-(\d{2})-(\d{2})$/;
const LONG = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'long', year: 'numeric', timeZone: 'UTC' });

/** A YYYY-MM-DD date as a visitor reads it ("14 May 2026"); anything else is shown as given. */
export function dayText(iso: string): string {
  const m = ISO_DAY.exec(iso);
  return m ? LONG.format(new Date(Date.UTC(Number(m[1]), Number(m[2]) - 1, Number(m[3])))) : iso;
}

/** The calendar day of a moment where the visitor is (their device's time zone), as YYYY-MM-DD. */
export function localIsoDay(moment: Date): string {
  const pad = (n: number) => String(n).padStart(2, '0');
  return `${moment.getFullYear()}-${pad(moment.getMonth() + 1)}-${pad(moment.getDate())}`;
}

/** True when the recommended date is before today (on the day itself it is due, not overdue). */
export function isOverdue(recommendedBy: string | null, today: string): boolean {
  return recommendedBy != null && ISO_DAY.test(recommendedBy) && ISO_DAY.test(today) && recommendedBy < today;
}
