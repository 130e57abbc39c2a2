/**
 * The schedule as stored: one JSON document per board and per revision. Helpers that turn it
 * back into a checked `Schedule`, compare two, and build the search words lists look up.
 */
import { scheduleSchema, type Schedule } from '../../shared/schemas/schedule.js';

/**
 * MariaDB hands JSON columns back as text. Parsing with the schema on every read also fills in
 * the defaults of any field added to the schema after the document was saved.
 */
export function readStoredSchedule(value: unknown): Schedule {
  return scheduleSchema.parse(typeof value === 'string' ? JSON.parse(value) : value);
}

/**
 * Same content. Both sides must be outputs of `scheduleSchema` (which writes keys in schema order
 * and fills defaults), so comparing their JSON text compares content, not formatting.
 */
export function sameSchedule(a: Schedule, b: Schedule): boolean {
  return JSON.stringify(a) === JSON.stringify(b);
}

/** Lower-cased words of the board's name, location and code and of every way's texts, for `GET /api/boards?q=`. */
export function searchTextOf(schedule: Schedule, code: string): string {
  const parts: string[] = [schedule.board.name, schedule.board.location, code];
  for (const c of schedule.circuits) parts.push(c.label, c.description, c.previousReference, ...c.locations);
  for (const d of schedule.devices) if (d.label) parts.push(d.label);
  return parts.filter(Boolean).join(' \n').toLowerCase();
}

/** `%word%` for LIKE, with the wildcard characters in the word itself taken literally. */
export function likeContains(word: string): string {
  return `%${word.replace(/[\\%_]/g, (ch) => `\\${ch}`)}%`;
}
