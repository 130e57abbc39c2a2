/**
 * The server's one reading of the calendar: today's date as YYYY-MM-DD in UTC, the only "today"
 * the rule checks and the prints see (the shared code never reads a clock itself).
 */
import { isoDay } from '../../shared/rules/dates.js';

export function todayIso(now = new Date()): string {
  return isoDay(now);
}
