/**
 * Breaking capacity (434.5.1): each overcurrent device must be able to break the prospective fault
 * current (PFC) at the board, or be backed up by a device upstream that can. A consumer unit or
 * distribution board to BS EN 61439-3 is commonly given a conditional short-circuit rating (often
 * 16 kA) with the maker's devices fitted, which covers devices of lower Icn; the schedule does not
 * record the assembly's rating, so a device below the PFC is a warning to confirm it, not an error.
 * One finding per board: the answer (the assembly's rating) is one fact for every device in it.
 */
import type { Device } from '../../schemas/schedule.js';
import type { Finding } from '../types.js';
import { wayText } from '../../schedule/derive.js';
import { BREAKING_CAPACITY } from './tables.js';
import { deviceName, isOvercurrentDevice, num, waysText, type ScheduleView } from './view.js';

const RULE = 'BS 7671 434.5.1';

interface Placed {
  device: Device;
  index: number;
}

/** "devices on ways 4 L1 and 4 L2", "device on way 3", "devices on way 1, and Spare (B16, no circuit)". */
function describe(view: ScheduleView, placed: Placed[]): string {
  const ids = new Set(placed.map((p) => p.device.id));
  const ways = view.circuits
    .filter((f) => f.circuit.deviceId != null && ids.has(f.circuit.deviceId))
    .map((f) => f.circuit)
    .sort((a, b) => a.way - b.way || (a.phase ?? '').localeCompare(b.phase ?? ''))
    .map(wayText);
  const used = new Set(view.circuits.map((f) => f.circuit.deviceId));
  const unused = placed
    .filter((p) => !used.has(p.device.id))
    .map((p) => (p.device.label ? `${p.device.label} (${deviceName(p.device)}, no circuit)` : `${deviceName(p.device)} (no circuit)`));
  const word = placed.length === 1 ? 'device' : 'devices';
  const onWays = ways.length ? [`on ${waysText(ways)}`] : [];
  return `${word} ${[...onWays, ...unused].join(', and ')}`;
}

function waysOf(view: ScheduleView, placed: Placed[]): number[] {
  const ids = new Set(placed.map((p) => p.device.id));
  return [...new Set(view.circuits.filter((f) => f.circuit.deviceId != null && ids.has(f.circuit.deviceId)).map((f) => f.circuit.way))].sort((a, b) => a - b);
}

function belowFaultCurrent(view: ScheduleView, low: Placed[], pfc: number): Finding {
  const byCapacity = new Map<number, Placed[]>();
  for (const p of low) byCapacity.set(p.device.breakingCapacityKa!, [...(byCapacity.get(p.device.breakingCapacityKa!) ?? []), p]);
  const groups = [...byCapacity.entries()].sort(([a], [b]) => a - b).map(([ka, placed]) => `${num(ka)} kA ${describe(view, placed)}`);
  const { usualConditionalKa } = BREAKING_CAPACITY;
  const conditional =
    pfc <= usualConditionalKa
      ? `A consumer unit or distribution board to BS EN 61439-3 may carry a conditional short-circuit rating (commonly ${usualConditionalKa} kA) that covers the devices fitted in it`
      : `A consumer unit or distribution board to BS EN 61439-3 may carry a conditional short-circuit rating that covers the devices fitted in it, but the common ${usualConditionalKa} kA would not cover ${num(pfc)} kA`;
  return {
    severity: 'warning',
    code: 'breaking-capacity-below-pfc',
    rule: RULE,
    ways: waysOf(view, low),
    field: 'board.supply.pfcKa',
    message:
      `The ${num(pfc)} kA prospective fault current at the board is above the breaking capacity of ${groups.join('; ')}. ` +
      `${conditional}: confirm from the maker's data that this assembly's rating, or a device upstream, covers ${num(pfc)} kA; otherwise fit devices rated for it`,
  };
}

function capacityUnknown(view: ScheduleView, unknown: Placed[], pfc: number): Finding {
  return {
    severity: 'info',
    code: 'breaking-capacity-not-recorded',
    rule: RULE,
    ways: waysOf(view, unknown),
    field: `devices.${unknown[0]!.index}.breakingCapacityKa`,
    message:
      `The ${num(pfc)} kA prospective fault current is above the ${BREAKING_CAPACITY.usualDomesticKa} kA usual for domestic breakers, ` +
      `but no breaking capacity is recorded for the ${describe(view, unknown)}: record each device's Icn so it can be checked`,
  };
}

/**
 * Devices whose recorded breaking capacity is below the board's PFC (a warning), and, where the PFC is
 * above the usual 6 kA, one note listing the devices whose capacity is not recorded. Below 6 kA such a
 * note would appear on nearly every board whose capacities were simply not typed in, and be ignored.
 */
export function checkBreakingCapacity(view: ScheduleView): Finding[] {
  const pfc = view.schedule.board.supply.pfcKa;
  if (pfc == null || pfc <= 0) return [];
  const breakers = view.schedule.devices.map((device, index) => ({ device, index })).filter((p) => isOvercurrentDevice(p.device));
  const low = breakers.filter((p) => p.device.breakingCapacityKa != null && p.device.breakingCapacityKa < pfc);
  const unknown = breakers.filter((p) => p.device.breakingCapacityKa == null);
  const out: Finding[] = [];
  if (low.length) out.push(belowFaultCurrent(view, low, pfc));
  if (unknown.length && pfc > BREAKING_CAPACITY.usualDomesticKa) out.push(capacityUnknown(view, unknown, pfc));
  return out;
}
