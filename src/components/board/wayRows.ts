/**
 * The lines of the circuit table: the circuits in the schedule's own order (the electrician may
 * have arranged them), with each spare way slotted in before the first circuit that comes after it,
 * so a board kept in way order reads 1, 2, … 9, 10 Spare as the chart does. Spares with no number
 * go last, as `boardWays` lists them.
 */
import type { Circuit } from '../../../shared/schemas/schedule.js';
import type { SpareWay } from '../../../shared/schedule/ways.js';

export type WayRow = { kind: 'circuit'; key: string; circuit: Circuit; index: number } | { kind: 'spare'; key: string; spare: SpareWay };

const after = (spare: SpareWay, c: Circuit) => c.way > spare.way! || (c.way === spare.way && (c.phase ?? '') > (spare.phase ?? ''));

export function wayRows(circuits: readonly Circuit[], spares: readonly SpareWay[]): WayRow[] {
  const numbered = spares.filter((s) => s.way != null).sort((a, b) => a.way! - b.way! || (a.phase ?? '').localeCompare(b.phase ?? ''));
  const rows: WayRow[] = [];
  let next = 0;
  circuits.forEach((circuit, index) => {
    while (next < numbered.length && after(numbered[next], circuit)) rows.push(spareRow(numbered[next++]));
    rows.push({ kind: 'circuit', key: circuit.id, circuit, index });
  });
  for (const spare of [...numbered.slice(next), ...spares.filter((s) => s.way == null)]) rows.push(spareRow(spare));
  return rows;
}

function spareRow(spare: SpareWay): WayRow {
  return { kind: 'spare', key: `spare-${spare.device.id}`, spare };
}
