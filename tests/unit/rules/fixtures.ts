/**
 * Small factories for schedules in rule tests: give only what the test is about, the schema
 * fills the defaults, so every fixture is a schedule the API would accept.
 */
import { scheduleSchema, type Schedule } from '../../../shared/schemas/schedule.js';
import type { z } from 'zod';
import { checkSchedule, type Finding } from '../../../shared/rules/index.js';

type BoardSchemaInput = z.input<typeof scheduleSchema>['board'];
type BoardInput = Partial<Omit<BoardSchemaInput, 'supply'>> & { supply?: Partial<BoardSchemaInput['supply']> };
type DeviceInput = z.input<typeof scheduleSchema>['devices'][number];
type CircuitInput = Partial<z.input<typeof scheduleSchema>['circuits'][number]>;

/** A fixed "today" so date checks never depend on the clock. */
export const TODAY = '2026-06-15';

/** A schedule from the parts a test cares about, parsed by the real schema. */
export function makeSchedule(parts: { board?: BoardInput; devices?: DeviceInput[]; circuits?: CircuitInput[] }): Schedule {
  const { supply, ...board } = parts.board ?? {};
  return scheduleSchema.parse({
    board: { name: 'Test board', lastInspectionOn: '2025-01-10', ...board, supply: { earthing: 'TN-C-S', ...supply } },
    devices: parts.devices ?? [],
    circuits: (parts.circuits ?? []).map((c, i) => ({ id: `c${i + 1}`, way: i + 1, label: `Circuit ${i + 1}`, ...c })),
  });
}

/** One breaker and one circuit on it: the shape most rule tests need. */
export function oneCircuit(device: Partial<DeviceInput>, circuit: CircuitInput, board?: BoardInput): Schedule {
  return makeSchedule({
    board,
    devices: [{ id: 'd1', row: 1, kind: 'rcbo', rating: 32, curve: 'B', residualMa: 30, rcdType: 'A', ...device }],
    circuits: [{ deviceId: 'd1', ...circuit }],
  });
}

/** Findings of the default rule set with the fixed today. */
export function findings(schedule: Schedule): Finding[] {
  return checkSchedule(schedule, { today: TODAY });
}

/** Findings with one code. */
export function withCode(schedule: Schedule, code: string): Finding[] {
  return findings(schedule).filter((f) => f.code === code);
}
