/**
 * Earth fault loop impedance: a measured Zs must be low enough for the protective device to
 * disconnect in time (411.4.4 with Table 41.3; 411.5.3 with Table 41.5 for RCDs in TT systems).
 */
import type { Circuit, Device, Schedule } from '../../schemas/schedule.js';
import type { Finding } from '../types.js';
import type { FuseStandard } from '../../schemas/survey.js';
import { TABLE_41_2, TABLE_41_4 } from './tables-fuses.js';
import { AMBIENT_RULE_OF_THUMB, CMIN, FINAL_CIRCUIT_0_4S, INSTANT_TRIP_MULTIPLE, TABLE_41_3, table41_5MaxZs, TT_ELECTRODE_STABLE_MAX_OHMS } from './tables.js';
import { circuitFinding, circuitName, deviceName, isOvercurrentDevice, ohms, type CircuitFacts, type ScheduleView } from './view.js';

/** The maximum Zs for a circuit and where it comes from, as the chart and the findings quote it. */
export interface ZsLimit {
  ohms: number;
  table: 'Table 41.2' | 'Table 41.3' | 'Table 41.4' | 'Table 41.5';
  /** Disconnection time the limit is for; null for Table 41.5 (RCD operation). */
  seconds: 0.4 | 5 | null;
  /** What the limit is for, e.g. "B32", "30 A BS 3036 fuse" or "30 mA RCD". */
  basis: string;
  /** True when the rating is not printed in the table and the value comes from the table's formula. */
  derived: boolean;
}

/**
 * Disconnection time the circuit needs: 0.4 s for final circuits up to 63 A with socket-outlets or up to
 * 32 A for fixed equipment (411.3.2.2), otherwise 5 s (411.3.2.3, distribution circuits and larger finals).
 */
export function disconnectionSeconds(circuit: Circuit, device: Device): 0.4 | 5 {
  if (circuit.kind === 'sub-main') return 5;
  const rating = device.rating ?? 0;
  const sockets = circuit.socketOutlets || circuit.kind === 'ring';
  return rating <= (sockets ? FINAL_CIRCUIT_0_4S.withSockets : FINAL_CIRCUIT_0_4S.fixedOnly) ? 0.4 : 5;
}

/**
 * Table 41.3 maximum Zs for the breaker protecting a circuit, available whether or not Zs was measured,
 * so the chart can print it beside the circuit. Null when the device is not a breaker with curve and rating.
 */
export function maxZs(device: Device, circuit: Circuit): ZsLimit | null {
  if (device.kind === 'fuse') return fuseMaxZs(device.fuseStandard ?? null, device.rating, disconnectionSeconds(circuit, device));
  if (!isOvercurrentDevice(device) || device.curve == null || device.rating == null) return null;
  const printed = TABLE_41_3[device.curve][device.rating];
  // Ratings the table does not print: its own formula, to three significant figures (the table's precision at common sizes).
  const value = printed ?? Number(((CMIN * 230) / (INSTANT_TRIP_MULTIPLE[device.curve] * device.rating)).toPrecision(3));
  return {
    ohms: value,
    table: 'Table 41.3',
    seconds: disconnectionSeconds(circuit, device),
    basis: `${device.curve}${device.rating}`,
    derived: printed == null,
  };
}

/**
 * Table 41.2 (0.4 s) or Table 41.4 (5 s) maximum Zs for a fuse, by its standard and rating; null when the
 * standard or rating is unknown, or the table is not held for it (the caller reports it unchecked).
 */
export function fuseMaxZs(standard: FuseStandard | null, rating: number | null, seconds: 0.4 | 5): ZsLimit | null {
  if (standard == null || rating == null) return null;
  const value = (seconds === 0.4 ? TABLE_41_2 : TABLE_41_4)[standard]?.[rating];
  if (value == null) return null;
  return { ohms: value, table: seconds === 0.4 ? 'Table 41.2' : 'Table 41.4', seconds, basis: `${rating} A ${standard} fuse`, derived: false };
}

/**
 * The limit that applies on this board: in a TT system a circuit with an RCD relies on it for fault
 * protection (411.5), so Table 41.5 applies; otherwise the breaker's Table 41.3 value.
 */
export function zsLimit(schedule: Schedule, facts: Pick<CircuitFacts, 'circuit' | 'device' | 'rcd'>): ZsLimit | null {
  if (schedule.board.supply.earthing === 'TT' && facts.rcd?.residualMa != null) {
    return { ohms: table41_5MaxZs(facts.rcd.residualMa), table: 'Table 41.5', seconds: null, basis: `${facts.rcd.residualMa} mA RCD`, derived: false };
  }
  return facts.device ? maxZs(facts.device, facts.circuit) : null;
}

function limitText(limit: ZsLimit): string {
  const source = limit.derived ? `${limit.table} formula` : limit.table;
  return `${ohms(limit.ohms)} maximum for a ${limit.basis} (${source}${limit.seconds != null ? `, ${limit.seconds} s` : ''})`;
}

function checkCircuit(view: ScheduleView, f: CircuitFacts): Finding[] {
  const measured = f.circuit.measuredZs;
  if (measured == null) return [];
  const name = circuitName(f.circuit);
  const out: Finding[] = [];
  const ze = view.schedule.board.supply.ze;
  if (ze != null && measured < ze) {
    // Zs is normally Ze plus the circuit's R1+R2, but a parallel earth path (bonded pipework, steelwork) can lower it.
    out.push(
      circuitFinding(
        f,
        'warning',
        'zs-below-ze',
        'Common practice',
        'measuredZs',
        `${name}: measured Zs ${ohms(measured)} is below Ze ${ohms(ze)}: check both readings; a parallel earth path through bonded pipework can cause this`,
      ),
    );
  }
  const limit = zsLimit(view.schedule, f);
  if (!limit) {
    const fuse = f.device?.kind === 'fuse';
    const what = !f.device
      ? 'it has no protective device recorded'
      : fuse
        ? `its fuse (${deviceName(f.device)}) has no recorded standard and rating, or one our copy of the table does not hold`
        : `its device (${deviceName(f.device)}) has no recorded curve and rating`;
    out.push(
      circuitFinding(
        f,
        'info',
        'zs-not-checked',
        fuse ? 'BS 7671 Tables 41.2 and 41.4' : 'BS 7671 Table 41.3',
        'measuredZs',
        `${name}: measured Zs ${ohms(measured)} not checked because ${what}`,
      ),
    );
  } else if (measured > limit.ohms) {
    out.push(
      circuitFinding(
        f,
        'error',
        'zs-over-max',
        `BS 7671 ${limit.table}`,
        'measuredZs',
        `${name}: measured Zs ${ohms(measured)} exceeds the ${limitText(limit)}`,
      ),
    );
  } else if (f.circuit.zsAtAmbient && limit.table !== 'Table 41.5' && measured > limit.ohms * AMBIENT_RULE_OF_THUMB) {
    out.push(
      circuitFinding(
        f,
        'warning',
        'zs-over-rule-of-thumb',
        'IET guidance: 80 % rule of thumb',
        'measuredZs',
        `${name}: measured Zs ${ohms(measured)} is within the ${limitText(limit)} but above 80 % of it (${ohms(limit.ohms * AMBIENT_RULE_OF_THUMB)}), the rule of thumb in IET guidance for a reading taken cold; conductors warm in use and Zs rises`,
      ),
    );
  }
  return out;
}

/** Measured Zs against the maximum for each circuit's device. */
export function checkEarthFaultLoop(view: ScheduleView): Finding[] {
  return view.circuits.flatMap((f) => checkCircuit(view, f));
}

/**
 * A TT installation's Ze is in the main its earth electrode's resistance. Above 200 Ω it may be within
 * Table 41.5 yet unstable as the soil dries or freezes (IET guidance), so it is a warning to look at the
 * electrode, not an error.
 */
export function checkElectrode(view: ScheduleView): Finding[] {
  const { earthing, ze } = view.schedule.board.supply;
  if (earthing !== 'TT' || ze == null || ze <= TT_ELECTRODE_STABLE_MAX_OHMS) return [];
  return [
    {
      severity: 'warning',
      code: 'tt-electrode-may-be-unstable',
      rule: 'IET Guidance Note 3',
      ways: [],
      field: 'board.supply.ze',
      message: `Ze ${ohms(ze)} is above ${TT_ELECTRODE_STABLE_MAX_OHMS} Ω: IET guidance treats an earth electrode resistance this high as possibly unstable (the soil drying or freezing raises it); check the electrode and consider improving it`,
    },
  ];
}
