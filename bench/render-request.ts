/** A render request for a bench schedule: fixed board facts and contractor, today's findings. */
import { resolveMedium } from '../server/pdf/index.js';
import type { RenderRequest } from '../server/pdf/types.js';
import { printOptionSchemas, type PrintOutput } from '../shared/schemas/print.js';
import { checkSchedule, maxZsByCircuit, nextInspectionDate } from '../shared/rules/index.js';
import type { Schedule } from '../shared/schemas/schedule.js';

export function requestFor<O extends PrintOutput>(output: O, mediaId: string, schedule: Schedule): RenderRequest<O> {
  const today = '2026-12-02';
  return {
    output,
    medium: resolveMedium(mediaId),
    options: printOptionSchemas[output].parse({}) as RenderRequest<O>['options'],
    schedule,
    board: {
      id: 1,
      code: 'WM-BENCH1',
      publicUrl: 'http://localhost:3000/b/bench-token-0123456789abcdef',
      publicEnabled: true,
      revision: 3,
      revisionDate: today,
      nextInspectionOn: nextInspectionDate(schedule.board),
    },
    contractor: { name: 'Benchmark Electrical', phone: '01632 960 000', email: 'office@bench.example' },
    findings: checkSchedule(schedule, { today }),
    offset: { xMm: 0, yMm: 0 },
    maxZsByCircuit: maxZsByCircuit(schedule),
  } as RenderRequest<O>;
}
