/**
 * Facts read off a schedule that several parts need the same way: the chart, the labels,
 * the board page and the rule checks. Pure functions, no I/O.
 */
import type { Circuit, Device, Schedule } from '../schemas/schedule.js';

const BREAKERS = new Set(['mcb', 'rcbo']);

/** Short device text as an electrician writes it: "B32", "RCBO B16 30 mA", "RCD 63 A 30 mA". */
export function deviceShortText(d: Device): string {
  const rating = d.rating != null ? `${d.rating}` : '';
  switch (d.kind) {
    case 'mcb':
      return `${d.curve ?? ''}${rating}` || 'MCB';
    case 'rcbo':
      return [`${d.curve ?? ''}${rating}`, d.residualMa != null ? `${d.residualMa} mA` : ''].filter(Boolean).join(' ') || 'RCBO';
    case 'rcd':
      return ['RCD', rating && `${rating} A`, d.residualMa != null ? `${d.residualMa} mA` : ''].filter(Boolean).join(' ');
    case 'main-switch':
      return ['Main switch', rating && `${rating} A`].filter(Boolean).join(' ');
    case 'afdd':
      return ['AFDD', rating && `${d.curve ?? ''}${rating}`, d.residualMa != null ? `${d.residualMa} mA` : ''].filter(Boolean).join(' ');
    case 'fuse':
      return [rating && `${rating} A`, d.fuseStandard ?? 'fuse'].filter(Boolean).join(' ');
    case 'spd':
      return 'SPD';
    case 'isolator':
      return ['Isolator', rating && `${rating} A`].filter(Boolean).join(' ');
    case 'timer':
      return 'Timer';
    case 'blank':
      return '';
  }
}

/** Device kind as the trade names it. */
export function deviceKindName(d: Device): string {
  const names: Record<Device['kind'], string> = {
    'main-switch': 'Main switch',
    rcd: 'RCD',
    rcbo: 'RCBO',
    mcb: 'MCB',
    fuse: 'Fuse',
    afdd: 'AFDD',
    spd: 'SPD',
    isolator: 'Isolator',
    timer: 'Timer/contactor',
    blank: 'Blank',
  };
  return names[d.kind];
}

export function isBreaker(d: Device): boolean {
  return BREAKERS.has(d.kind);
}
/**
 * A device that is its own residual-current protection: an RCBO, or an AFDD with an IΔn recorded
 * (a combined AFDD/RCBO unit).
 */
export function hasOwnRcd(d: Device): boolean {
  return d.kind === 'rcbo' || (d.kind === 'afdd' && d.residualMa != null);
}
export function givesRcdProtection(d: Device): boolean {
  return d.kind === 'rcd' || hasOwnRcd(d);
}

/** Devices of one row in their order along the DIN rail. */
export function devicesOnRow(schedule: Schedule, row: number): Device[] {
  return schedule.devices.filter((d) => d.row === row);
}

/** Name of an RCD for charts and the board page: its own label, else "RCD 1", "RCD 2"… in board order. */
export function rcdNames(schedule: Schedule): Map<string, string> {
  const names = new Map<string, string>();
  let n = 0;
  for (const d of schedule.devices) {
    if (d.kind !== 'rcd') continue;
    n++;
    names.set(d.id, d.label || `RCD ${n}`);
  }
  return names;
}

/**
 * Which RCD protects each device. An RCBO protects itself. In 'position' mode an RCD protects
 * the devices after it on the same row until the next RCD, main switch or isolator (the usual
 * split-load arrangement); in 'manual' mode each device names its RCD.
 */
export function rcdFor(schedule: Schedule): Map<string, Device | null> {
  const byId = new Map(schedule.devices.map((d) => [d.id, d]));
  const out = new Map<string, Device | null>();
  if (schedule.board.rcdMode === 'manual') {
    for (const d of schedule.devices) {
      if (hasOwnRcd(d)) {
        out.set(d.id, d);
        continue;
      }
      const rcd = d.protectedBy ? byId.get(d.protectedBy) : undefined;
      out.set(d.id, rcd && rcd.kind === 'rcd' ? rcd : null);
    }
    return out;
  }
  let current: Device | null = null;
  let row = -1;
  for (const d of schedule.devices) {
    if (d.row !== row) {
      row = d.row;
      current = null;
    }
    if (d.kind === 'rcd') {
      current = d;
      out.set(d.id, null);
      continue;
    }
    if (d.kind === 'main-switch' || d.kind === 'isolator') {
      current = null;
      out.set(d.id, null);
      continue;
    }
    out.set(d.id, hasOwnRcd(d) ? d : current);
  }
  return out;
}

/** The RCD (or RCBO, or AFDD/RCBO) that gives a circuit its residual-current protection, if any. */
export function circuitRcd(schedule: Schedule, circuit: Circuit, rcds = rcdFor(schedule)): Device | null {
  if (!circuit.deviceId) return null;
  return rcds.get(circuit.deviceId) ?? null;
}

/**
 * Whether the schedule alone says this way feeds another board (a sub-main, or a link to the board
 * it feeds): switching it off takes a whole board with it. The other board is not read.
 */
export function feedsAnotherBoard(c: Pick<Circuit, 'kind' | 'feedsBoardId'>): boolean {
  return c.kind === 'sub-main' || c.feedsBoardId != null;
}

/** Way as printed: "7", or "3 L2" on a three-phase board. */
export function wayText(c: Pick<Circuit, 'way' | 'phase'>): string {
  return c.phase ? `${c.way} ${c.phase}` : String(c.way);
}

/** Circuits in way order (then phase), as a chart lists them. */
export function circuitsInWayOrder(schedule: Schedule): Circuit[] {
  return [...schedule.circuits].sort((a, b) => a.way - b.way || (a.phase ?? '').localeCompare(b.phase ?? ''));
}

/** The circuits each device feeds (a three-pole device may feed one circuit per phase). */
export function circuitsByDevice(schedule: Schedule): Map<string, Circuit[]> {
  const out = new Map<string, Circuit[]>();
  for (const c of schedule.circuits) {
    if (!c.deviceId) continue;
    const list = out.get(c.deviceId) ?? [];
    list.push(c);
    out.set(c.deviceId, list);
  }
  return out;
}

/** What goes off when each RCD trips: "if RCD 1 trips, these go off". */
export function rcdGroups(schedule: Schedule): Array<{ rcd: Device; name: string; circuits: Circuit[] }> {
  const rcds = rcdFor(schedule);
  const names = rcdNames(schedule);
  const groups = schedule.devices.filter((d) => d.kind === 'rcd').map((rcd) => ({ rcd, name: names.get(rcd.id) ?? 'RCD', circuits: [] as Circuit[] }));
  const byId = new Map(groups.map((g) => [g.rcd.id, g]));
  for (const c of circuitsInWayOrder(schedule)) {
    const rcd = c.deviceId ? rcds.get(c.deviceId) : null;
    if (rcd && rcd.kind === 'rcd') byId.get(rcd.id)?.circuits.push(c);
  }
  return groups;
}
