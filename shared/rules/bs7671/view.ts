/**
 * A schedule prepared once for the rule groups: each circuit with its index (for field paths),
 * its protective device and the RCD that covers it, so every rule reads the same facts.
 */
import type { Circuit, Device, Schedule } from '../../schemas/schedule.js';
import type { Finding, Severity } from '../types.js';
import { circuitRcd, deviceShortText, rcdFor, wayText } from '../../schedule/derive.js';

export interface CircuitFacts {
  circuit: Circuit;
  /** Position in `schedule.circuits`, for `circuits.<index>.<field>` paths. */
  index: number;
  /** The device it names, or null when none is named or the id is unknown. */
  device: Device | null;
  /** The RCD or RCBO giving residual-current protection, if any. */
  rcd: Device | null;
}

export interface ScheduleView {
  schedule: Schedule;
  devicesById: Map<string, Device>;
  circuits: CircuitFacts[];
}

/** Builds the view the rule groups share. */
export function viewOf(schedule: Schedule): ScheduleView {
  const devicesById = new Map<string, Device>();
  for (const d of schedule.devices) if (!devicesById.has(d.id)) devicesById.set(d.id, d);
  const rcds = rcdFor(schedule);
  const circuits = schedule.circuits.map((circuit, index) => ({
    circuit,
    index,
    device: circuit.deviceId ? (devicesById.get(circuit.deviceId) ?? null) : null,
    rcd: circuitRcd(schedule, circuit, rcds),
  }));
  return { schedule, devicesById, circuits };
}

/** "Way 4 (Kitchen sockets)", the way every circuit finding opens. */
export function circuitName(c: Circuit): string {
  return `Way ${wayText(c)} (${c.label})`;
}

/** "B32", "RCBO B32 30 mA" as written in messages. */
export function deviceName(d: Device): string {
  return deviceShortText(d) || d.kind;
}

/** Ohms as printed in findings: two decimal places. */
export function ohms(value: number): string {
  return `${value.toFixed(2)} Ω`;
}

/** A number without trailing zeros: 2.5, 13.5, 32. */
export function num(value: number): string {
  return String(Math.round(value * 100) / 100);
}

/** A finding about one circuit, pointing at one of its fields. */
export function circuitFinding(f: CircuitFacts, severity: Severity, code: string, rule: string, field: string, message: string): Finding {
  return { severity, code, rule, ways: [f.circuit.way], field: `circuits.${f.index}.${field}`, message };
}

/**
 * A list of ways as a sentence says it: "way 4", "ways 1 and 3", "ways 1, 2 and 3 L2".
 * `capital` starts it with "Way"/"Ways" for the head of a message. Items are way texts
 * (`wayText`, so "3 L2" on a three-phase board) or numbers.
 */
export function waysText(ways: readonly (string | number)[], capital = false): string {
  const items = ways.map(String);
  const word = `${capital ? 'W' : 'w'}ay${items.length === 1 ? '' : 's'}`;
  const listed = items.length <= 1 ? items.join('') : `${items.slice(0, -1).join(', ')} and ${items[items.length - 1]}`;
  return `${word} ${listed}`;
}

/** Way numbers fed by a device, for device-level findings. */
export function waysOfDevice(view: ScheduleView, deviceId: string): number[] {
  return [...new Set(view.circuits.filter((c) => c.circuit.deviceId === deviceId).map((c) => c.circuit.way))].sort((a, b) => a - b);
}

/** Devices that can give overcurrent protection to a circuit (an AFDD counts when it carries a breaker rating). */
export function isOvercurrentDevice(d: Device): boolean {
  return d.kind === 'mcb' || d.kind === 'rcbo' || d.kind === 'fuse' || (d.kind === 'afdd' && d.rating != null);
}
