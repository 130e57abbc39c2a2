/**
 * Voltage drop estimate (BS 7671 525, worked by Appendix 4 Section 6): route length × mV/A/m × design current
 * / 1000, against Table 4Ab's limits for an installation supplied from a public low voltage distribution
 * system, 3 % of the voltage to earth (U0) for lighting and 5 % for other uses. The design current is
 * taken as the device rating, the worst case the circuit can carry. The drop is from this board;
 * a board fed by a sub-main adds the sub-main's own drop.
 */
import { supplyVoltages } from '../../schedule/voltage.js';
import type { Finding } from '../types.js';
import { TABLE_4D5, VOLTAGE_DROP_LIMIT_PERCENT } from './tables.js';
import { circuitFinding, circuitName, isOvercurrentDevice, num, type CircuitFacts, type ScheduleView } from './view.js';

/** Where the limits come from: regulation 525 sets them by Appendix 4 Table 4Ab. */
const VOLTAGE_DROP_RULE = 'BS 7671 525, Appendix 4 Table 4Ab';

/** A ring's load taken at its midpoint: each leg carries half over half the length, a quarter of a radial's drop (common practice). */
const RING_LENGTH_FACTOR = 0.25;

/** Estimated drop in volts, or null when the cable is not tabulated or data is missing. */
export function estimatedVoltageDrop(f: Pick<CircuitFacts, 'circuit' | 'device'>): number | null {
  const { circuit, device } = f;
  const cable = circuit.cable;
  if (!device || !isOvercurrentDevice(device) || device.rating == null) return null;
  if (cable.type !== 'twin-earth' || cable.liveCsa == null || cable.lengthM == null) return null;
  const row = TABLE_4D5[cable.liveCsa];
  if (!row) return null;
  const length = circuit.kind === 'ring' ? cable.lengthM * RING_LENGTH_FACTOR : cable.lengthM;
  return (row.mvPerAm * device.rating * length) / 1000;
}

function checkCircuit(view: ScheduleView, f: CircuitFacts): Finding[] {
  const volts = estimatedVoltageDrop(f);
  if (volts == null) return [];
  // Table 4D5 cables are two-core, so each circuit is single-phase: the limit is a share of U0, even
  // when a three-phase board records its 400 V between phases.
  const board = view.schedule.board;
  const nominal = supplyVoltages(board.phases, board.supply.nominalVoltage).toEarth;
  const isLighting = f.circuit.kind === 'lighting';
  const limitPercent = isLighting ? VOLTAGE_DROP_LIMIT_PERCENT.lighting : VOLTAGE_DROP_LIMIT_PERCENT.other;
  const percent = (volts / nominal) * 100;
  if (percent <= limitPercent) return [];
  const use = isLighting ? 'lighting' : 'this use';
  return [
    circuitFinding(
      f,
      'warning',
      'voltage-drop-over-limit',
      VOLTAGE_DROP_RULE,
      'cable.lengthM',
      `${circuitName(f.circuit)}: estimated voltage drop ${num(volts)} V (${num(percent)} %) over ${num(f.circuit.cable.lengthM ?? 0)} m of ${num(f.circuit.cable.liveCsa ?? 0)} mm² at ${num(f.device?.rating ?? 0)} A exceeds the ${limitPercent} % limit for ${use} from a public supply (${num((nominal * limitPercent) / 100)} V; ${VOLTAGE_DROP_RULE})`,
    ),
  ];
}

/** Voltage drop of every circuit with a tabulated cable and a route length. */
export function checkVoltageDrop(view: ScheduleView): Finding[] {
  return view.circuits.flatMap((f) => checkCircuit(view, f));
}
