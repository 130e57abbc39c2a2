/**
 * Way order, the one rule the chart, the board page and the editor's "Sort by way" share: a new
 * list in way then phase order, with the schedule's own list left as it was.
 */
import { describe, expect, it } from 'vitest';
import { scheduleSchema } from '../../../shared/schemas/schedule.js';
import { circuitsInWayOrder } from '../../../shared/schedule/derive.js';
import { makeSchedule } from '../../helpers/boards.js';

describe('circuitsInWayOrder', () => {
  it('when the circuits were entered out of order, then it answers them by way, then phase, and leaves the schedule untouched', () => {
    const base = makeSchedule(0, 'Way order board');
    const schedule = scheduleSchema.parse({
      ...base,
      board: { ...base.board, phases: 3 },
      circuits: [
        { id: 'c7', way: 7, label: 'Garage' },
        { id: 'c2-L3', way: 2, phase: 'L3', label: 'Cooker L3' },
        { id: 'c2-L1', way: 2, phase: 'L1', label: 'Cooker L1' },
        { id: 'c1', way: 1, label: 'Lights' },
      ],
    });
    const entered = schedule.circuits.map((c) => c.id);

    const ordered = circuitsInWayOrder(schedule);

    expect(ordered.map((c) => c.id)).toEqual(['c1', 'c2-L1', 'c2-L3', 'c7']);
    expect(ordered).not.toBe(schedule.circuits);
    expect(schedule.circuits.map((c) => c.id)).toEqual(entered);
  });
});
