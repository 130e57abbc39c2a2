/** Dates as printed on notices and charts: "10 Feb 2025", unambiguous wherever the reader is from. */
const MONTHS = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];

/** `YYYY-MM-DD` → "10 Feb 2025"; null stays null. */
export function printedDate(iso: string | null | undefined): string | null {
  if (!iso) return null;
  const [y, m, d] = iso.split('-').map(Number);
  if (!y || !m || !d) return iso;
  return `${d} ${MONTHS[m - 1]} ${y}`;
}

/** The printed next-inspection date when it is already before `today` (both `YYYY-MM-DD`), else null. */
export function overdueInspection(nextInspectionOn: string | null | undefined, today: string | undefined): string | null {
  if (!nextInspectionOn || !today || nextInspectionOn >= today) return null;
  return printedDate(nextInspectionOn);
}
