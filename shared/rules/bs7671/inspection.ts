/**
 * Periodic inspection: the next date is the last inspection (or the installation, for a new
 * board) plus the interval: the one recorded on the board, else the usual interval for the kind
 * of installation from IET Guidance Note 3 Table 3.2. 514.12.1 asks for both dates on a notice at the origin.
 */
import type { BoardDetails } from '../../schemas/schedule.js';
import type { CheckContext, Finding } from '../types.js';
import { addDays, addMonths, longDate } from '../dates.js';
import { INSPECTION_DUE_SOON_DAYS, INSPECTION_INTERVAL_MONTHS } from './tables.js';

/** Months to the next inspection: the board's own interval, else the Guidance Note 3 one. */
export function inspectionIntervalMonths(board: Pick<BoardDetails, 'inspectionIntervalMonths' | 'installationType'>): number {
  return board.inspectionIntervalMonths ?? INSPECTION_INTERVAL_MONTHS[board.installationType];
}

/** Next periodic inspection (YYYY-MM-DD): last inspection, else installation, plus the interval; null with neither date. */
export function nextInspectionOn(
  board: Pick<BoardDetails, 'lastInspectionOn' | 'installedOn' | 'inspectionIntervalMonths' | 'installationType'>,
): string | null {
  const from = board.lastInspectionOn ?? board.installedOn;
  return from ? addMonths(from, inspectionIntervalMonths(board)) : null;
}

function intervalText(months: number): string {
  return months % 12 === 0 ? `${months / 12}-year` : `${months}-month`;
}

/** Inspection findings: missing last date, overdue, due soon, a last date in the future. */
export function checkInspection(board: BoardDetails, context: CheckContext, next: string | null): Finding[] {
  const months = inspectionIntervalMonths(board);
  const rule = board.inspectionIntervalMonths != null ? 'BS 7671 514.12.1' : 'IET Guidance Note 3 Table 3.2';
  const out: Finding[] = [];
  if (board.lastInspectionOn == null) {
    out.push({
      severity: 'info',
      code: 'no-last-inspection',
      rule: 'BS 7671 514.12.1',
      ways: [],
      field: 'board.lastInspectionOn',
      message: board.installedOn
        ? `No last inspection date is recorded; the next inspection is counted from installation on ${longDate(board.installedOn)}`
        : 'No last inspection or installation date is recorded, so the next inspection date cannot be given',
    });
  } else if (board.lastInspectionOn > context.today) {
    out.push({
      severity: 'warning',
      code: 'last-inspection-in-future',
      rule: 'Data check',
      ways: [],
      field: 'board.lastInspectionOn',
      message: `The last inspection date ${longDate(board.lastInspectionOn)} is after today`,
    });
  }
  if (next == null) return out;
  const field = board.lastInspectionOn != null ? 'board.lastInspectionOn' : 'board.installedOn';
  if (next < context.today) {
    out.push({
      severity: 'warning',
      code: 'inspection-overdue',
      rule,
      ways: [],
      field,
      message: `Periodic inspection overdue: it was due on ${longDate(next)} (${intervalText(months)} interval)`,
    });
  } else if (next <= addDays(context.today, INSPECTION_DUE_SOON_DAYS)) {
    out.push({
      severity: 'info',
      code: 'inspection-due-soon',
      rule,
      ways: [],
      field,
      message: `Periodic inspection due on ${longDate(next)} (${intervalText(months)} interval)`,
    });
  }
  return out;
}
