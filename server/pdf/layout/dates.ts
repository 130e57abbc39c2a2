/** Dates as printed on notices and charts: "10 Feb 2025", unambiguous wherever the reader is from. */
import { shortDate } from '../../../shared/rules/dates.js';

/** `YYYY-MM-DD` → "10 Feb 2025"; null stays null. */
export function printedDate(iso: string | null | undefined): string | null {
  return iso ? shortDate(iso) : null;
}

/** The printed next-inspection date when it is already before `today` (both `YYYY-MM-DD`), else null. */
export function overdueInspection(nextInspectionOn: string | null | undefined, today: string | undefined): string | null {
  if (!nextInspectionOn || !today || nextInspectionOn >= today) return null;
  return printedDate(nextInspectionOn);
}
