/**
 * Whatever the schema accepts, the checks must answer with well-formed findings and never throw:
 * the editor runs them on every keystroke and the API on every check request.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import type { Schedule } from '../../../shared/schemas/schedule.js';
import { date, schedule } from '../../helpers/schedule-arbitraries.js';
import { checkSchedule, maxZsByCircuit, nextInspectionDate } from '../../../shared/rules/index.js';
import { diffSchedules, waysChangedBetween } from '../../../shared/schedule/diff.js';

/** Follows a finding's field path into the schedule; every segment must exist. */
function pathExists(s: Schedule, path: string): boolean {
  let node: unknown = s;
  for (const part of path.split('.')) {
    if (node === null || typeof node !== 'object' || !(part in node)) return false;
    node = (node as Record<string, unknown>)[part];
  }
  return true;
}

describe('checks on any schedule the schema accepts', () => {
  it('when any valid schedule is checked, then it never throws and every finding is well formed', () => {
    fc.assert(
      fc.property(schedule, date, (s, today) => {
        const ways = new Set(s.circuits.map((c) => c.way));
        for (const f of checkSchedule(s, { today })) {
          expect(['error', 'warning', 'info']).toContain(f.severity);
          expect(f.rule.length * f.message.length * f.code.length).toBeGreaterThan(0);
          for (const w of f.ways) expect(ways.has(w)).toBe(true);
          expect(f.field, f.code).toBeDefined();
          expect(pathExists(s, f.field!), f.field).toBe(true);
        }
        const limits = Object.values(maxZsByCircuit(s));
        for (const v of limits) expect(v === null || v > 0).toBe(true);
        const next = nextInspectionDate(s.board);
        expect(next === null || /^\d{4}-\d{2}-\d{2}$/.test(next)).toBe(true);
      }),
      { numRuns: 200 },
    );
  });

  it('when a schedule is compared with itself, then no changes; with another, never a throw', () => {
    fc.assert(
      fc.property(schedule, schedule, (a, b) => {
        expect(diffSchedules(a, a)).toEqual({ changes: [], summary: 'No changes' });
        expect(waysChangedBetween(a, a)).toEqual([]);
        const d = diffSchedules(a, b);
        expect(d.summary.length).toBeGreaterThan(0);
        for (const w of waysChangedBetween(a, b)) expect(b.circuits.some((c) => c.way === w)).toBe(true);
      }),
      { numRuns: 150 },
    );
  });
});
