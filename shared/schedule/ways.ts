/**
 * A board's ways, circuits and spares alike. A spare way is a protective device on the rail that
 * feeds no circuit: it is a way all the same, and the way labels, the chart, the circuit table and
 * the board page all count it from here, so they agree on how many ways the board has.
 * Pure, no I/O.
 */
import type { Circuit, Device, Schedule } from '../schemas/schedule.js';
import { circuitsByDevice, circuitsInWayOrder, wayText } from './derive.js';

/** A protective device with no circuit, and the way number it stands at (null when none can be given). */
export interface SpareWay {
  device: Device;
  way: number | null;
  phase: Circuit['phase'];
  /** "10", "3 L2", or '' when the way has no number. */
  wayText: string;
}

export type BoardWay = { kind: 'circuit'; circuit: Circuit } | { kind: 'spare'; spare: SpareWay };

/** Devices that protect a way of their own (not a main switch, RCD or surge device). */
const WAY_DEVICES = new Set<Device['kind']>(['mcb', 'rcbo', 'afdd', 'fuse']);
const PHASE_ORDER = ['L1', 'L2', 'L3'] as const;

/**
 * Spare ways in rail order, each numbered from the way before it on the rail: the next phase of
 * the same way on a three-phase board, else the next way. No number when that number is already a
 * circuit's, or there is no way before to count from (the electrician numbers it by adding a circuit).
 */
export function spareWays(schedule: Schedule, byDevice = circuitsByDevice(schedule)): SpareWay[] {
  const used = new Set(schedule.circuits.map((c) => wayText(c)));
  const out: SpareWay[] = [];
  let last: Pick<Circuit, 'way' | 'phase'> | null = null;
  for (const d of [...schedule.devices].sort((a, b) => a.row - b.row)) {
    if (!WAY_DEVICES.has(d.kind)) continue;
    const circuits = byDevice.get(d.id) ?? [];
    if (circuits.length) {
      last = [...circuits].sort((a, b) => a.way - b.way || (a.phase ?? '').localeCompare(b.phase ?? ''))[circuits.length - 1];
      continue;
    }
    if (!last) {
      out.push({ device: d, way: null, phase: null, wayText: '' });
      continue;
    }
    const i = last.phase ? PHASE_ORDER.indexOf(last.phase as (typeof PHASE_ORDER)[number]) : -1;
    const next: Pick<Circuit, 'way' | 'phase'> =
      i >= 0 && i < 2 ? { way: last.way, phase: PHASE_ORDER[i + 1] } : { way: last.way + 1, phase: i === 2 ? 'L1' : null };
    last = next;
    out.push(used.has(wayText(next)) ? { device: d, way: null, phase: null, wayText: '' } : { device: d, ...next, wayText: wayText(next) });
  }
  return out;
}

/** Every way in way order (then phase): circuits and numbered spares together, unnumbered spares last. */
export function boardWays(schedule: Schedule): BoardWay[] {
  const circuits: BoardWay[] = circuitsInWayOrder(schedule).map((circuit) => ({ kind: 'circuit', circuit }));
  const spares = spareWays(schedule);
  const numbered: BoardWay[] = spares.filter((s) => s.way != null).map((spare) => ({ kind: 'spare', spare }));
  const unnumbered: BoardWay[] = spares.filter((s) => s.way == null).map((spare) => ({ kind: 'spare', spare }));
  const at = (w: BoardWay) => (w.kind === 'circuit' ? w.circuit : w.spare);
  const sorted = [...circuits, ...numbered].sort((a, b) => at(a).way! - at(b).way! || (at(a).phase ?? '').localeCompare(at(b).phase ?? ''));
  return [...sorted, ...unnumbered];
}

/** How many ways the board has: one per circuit and one per spare device. */
export function wayCount(schedule: Schedule): number {
  return boardWays(schedule).length;
}
