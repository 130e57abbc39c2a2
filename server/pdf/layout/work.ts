/**
 * How much one print would make, counted before anything is laid out or drawn, so a request that
 * would cost the server seconds of its one thread (thousands of flag pages) is refused up front.
 * Pure: the counts come from the schedule and the options alone.
 */
import type { Schedule } from '../../../shared/schemas/schedule.js';
import { legsOf } from './flags.js';
import { wayFilter } from './context.js';

/**
 * Most flags one print may make. A 2,000-way board (the schema's largest) still prints one leg of
 * each at the board end in one request; more (every leg at both ends) goes in several prints.
 */
export const MAX_FLAGS_PER_PRINT = 2000;

type FlagWork = { legs?: number; bothEnds: boolean; ways?: string; at?: 'board' | 'junction-boxes' };

/** Flags a flags print would make: each leg of each wanted circuit, at one end or both; at junction boxes, each planned leg through one. */
export function flagCount(schedule: Schedule, options: FlagWork, onlyWays?: number[]): number {
  const wanted = wayFilter(onlyWays, options.ways);
  if (options.at === 'junction-boxes') {
    const targets = (schedule.survey?.ways ?? []).flatMap((w) => w.targets).filter(wanted);
    return targets.reduce((n, t) => n + t.legs.filter((l) => l.junctionBoxId != null).length, 0);
  }
  const perEnd = schedule.circuits.filter(wanted).reduce((n, c) => n + legsOf(c, options.legs), 0);
  return perEnd * (options.bothEnds ? 2 : 1);
}

/** Null when the print fits one request, else the sentence saying what would fit. */
export function flagWorkProblem(schedule: Schedule, options: FlagWork, onlyWays?: number[]): string | null {
  const count = flagCount(schedule, options, onlyWays);
  if (count <= MAX_FLAGS_PER_PRINT) return null;
  const oneEnd = options.bothEnds ? flagCount(schedule, { ...options, bothEnds: false }, onlyWays) : count;
  const hint = options.bothEnds && oneEnd <= MAX_FLAGS_PER_PRINT ? 'print one end at a time' : 'print fewer ways at a time (the ways option) or fewer legs';
  return `This print would make ${count} flags; at most ${MAX_FLAGS_PER_PRINT} fit one print: ${hint}`;
}
