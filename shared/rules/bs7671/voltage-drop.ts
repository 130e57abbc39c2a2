/**
 * Voltage drop estimate (BS 7671 525, worked by Appendix 4 Section 6): route length × mV/A/m × current
 * / 1000, against Table 4Ab's limits for an installation supplied from a public low voltage distribution
 * system, 3 % of the voltage to earth (U0) for lighting and 5 % for other uses. The current is the
 * circuit's design current Ib where it is recorded; else the device rating In, the most the circuit can
 * carry, which overstates the drop of a lightly loaded circuit (lighting above all). Every message says
 * which was used, with the working, so a hand check agrees. The drop is from this board; a board fed by
 * a sub-main adds the sub-main's own drop.
 */
import { supplyVoltages } from '../../schedule/voltage.js';
import type { Finding } from '../types.js';
import { TABLE_4D5, VOLTAGE_DROP_LIMIT_PERCENT } from './tables.js';
import { circuitFinding, circuitName, isOvercurrentDevice, num, type CircuitFacts, type ScheduleView } from './view.js';

/** Where the limits come from: regulation 525 sets them by Appendix 4 Table 4Ab. */
const VOLTAGE_DROP_RULE = 'BS 7671 525, Appendix 4 Table 4Ab';

/**
 * A ring's load taken at its midpoint: each leg carries half the current over half the ring's length, so the
 * drop is a radial's on a quarter of the length (common practice, from memory). A load spread evenly round
 * the ring would drop less, so this errs high.
 */
const RING_LENGTH_FACTOR = 0.25;

/** The current a drop is worked at: Ib when recorded, else the device rating In. */
export interface WorkingCurrent {
  amps: number;
  source: 'design-current' | 'device-rating';
}

/** Ib when the circuit records it; else the rating of its overcurrent device; null when neither is known. */
export function workingCurrent(f: Pick<CircuitFacts, 'circuit' | 'device'>): WorkingCurrent | null {
  if (f.circuit.designCurrent != null) return { amps: f.circuit.designCurrent, source: 'design-current' };
  const device = f.device;
  if (!device || !isOvercurrentDevice(device) || device.rating == null) return null;
  return { amps: device.rating, source: 'device-rating' };
}

/** Everything a drop is worked from, so the message can show the sum. */
interface Working {
  volts: number;
  current: WorkingCurrent;
  mvPerAm: number;
  /** The route length recorded (m); for a ring, the whole length round. */
  lengthM: number;
  /** The length the sum uses: a quarter of a ring's, else the route length. */
  usedM: number;
}

function workingOf(f: Pick<CircuitFacts, 'circuit' | 'device'>): Working | null {
  const cable = f.circuit.cable;
  const current = workingCurrent(f);
  if (!current || cable.type !== 'twin-earth' || cable.liveCsa == null || cable.lengthM == null) return null;
  const row = TABLE_4D5[cable.liveCsa];
  if (!row) return null;
  const usedM = f.circuit.kind === 'ring' ? cable.lengthM * RING_LENGTH_FACTOR : cable.lengthM;
  return { volts: (row.mvPerAm * current.amps * usedM) / 1000, current, mvPerAm: row.mvPerAm, lengthM: cable.lengthM, usedM };
}

/** Estimated drop in volts (at Ib when recorded, else at In), or null when the cable is not tabulated or data is missing. */
export function estimatedVoltageDrop(f: Pick<CircuitFacts, 'circuit' | 'device'>): number | null {
  return workingOf(f)?.volts ?? null;
}

/** "at Ib 6 A recorded" / "at the device rating 32 A, no design current recorded". */
function currentText(current: WorkingCurrent): string {
  return current.source === 'design-current'
    ? `at Ib ${num(current.amps)} A recorded`
    : `at the device rating ${num(current.amps)} A, no design current recorded`;
}

/** How the drop was worked: "40 m of 1.5 mm² at …: 29 mV/A/m × 6 A × 40 m (Table 4D5)", a ring with its quarter length. */
function workingText(f: CircuitFacts, w: Working): string {
  const csa = num(f.circuit.cable.liveCsa ?? 0);
  const sum = `${num(w.mvPerAm)} mV/A/m × ${num(w.current.amps)} A × ${num(w.usedM)} m (Table 4D5)`;
  if (f.circuit.kind !== 'ring') return `${num(w.lengthM)} m of ${csa} mm² ${currentText(w.current)}: ${sum}`;
  return `${num(w.lengthM)} m round the ring of ${csa} mm² ${currentText(w.current)}, worked on ${num(w.usedM)} m, a quarter of that (load taken at the midpoint, half the current in each leg): ${sum}`;
}

function checkCircuit(view: ScheduleView, f: CircuitFacts): Finding[] {
  const w = workingOf(f);
  if (w == null) return [];
  // Table 4D5 cables are two-core, so each circuit is single-phase: the limit is a share of U0, even
  // when a three-phase board records its 400 V between phases.
  const board = view.schedule.board;
  const nominal = supplyVoltages(board.phases, board.supply.nominalVoltage).toEarth;
  const isLighting = f.circuit.kind === 'lighting';
  const limitPercent = isLighting ? VOLTAGE_DROP_LIMIT_PERCENT.lighting : VOLTAGE_DROP_LIMIT_PERCENT.other;
  const percent = (w.volts / nominal) * 100;
  if (percent <= limitPercent) return [];
  const use = isLighting ? 'lighting' : 'this use';
  return [
    circuitFinding(
      f,
      'warning',
      'voltage-drop-over-limit',
      VOLTAGE_DROP_RULE,
      'cable.lengthM',
      `${circuitName(f.circuit)}: estimated voltage drop ${num(w.volts)} V (${num(percent)} %) exceeds the ${limitPercent} % limit for ${use} from a public supply (${num((nominal * limitPercent) / 100)} V; ${VOLTAGE_DROP_RULE}); ${workingText(f, w)}`,
    ),
  ];
}

/** Voltage drop of every circuit with a tabulated cable, a route length and a current to work at. */
export function checkVoltageDrop(view: ScheduleView): Finding[] {
  return view.circuits.flatMap((f) => checkCircuit(view, f));
}
