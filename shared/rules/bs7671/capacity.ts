/**
 * Overload protection (433.1.1): Ib ≤ In ≤ Iz. The design current Ib, where the circuit records it,
 * must not exceed the device rating In; In must not exceed the cable's current-carrying
 * capacity Iz, with Iz from Appendix 4 for the cable and its reference method,
 * corrected for the installation conditions recorded on the cable: Iz × Ca × Cg × Ci
 * (see correction-factors.ts). With none recorded, the tabulated Iz (30 °C, not grouped, no
 * insulation beyond the method) is used as it stands. Only flat twin-and-earth (Table 4D5) is
 * tabulated here; other cables are reported unchecked.
 */
import type { Cable } from '../../schemas/schedule.js';
import type { Finding } from '../types.js';
import { correctedIz, strongestFactor, type AppliedFactor } from './correction-factors.js';
import { RING_FINAL, TABLE_4D5, type TwinEarthMethod, type TwinEarthRow } from './tables.js';
import { BS3036_OVERLOAD_FACTOR, RING_RULE_FUSES } from './tables-fuses.js';
import { circuitFinding, circuitName, deviceName, isOvercurrentDevice, num, type CircuitFacts, type ScheduleView } from './view.js';

/** A corrected capacity as printed: to 0.1 A, rounded down so a message never overstates it. */
const amps = (iz: number) => num(Math.floor(iz * 10 + 1e-9) / 10);

/** Looks up Table 4D5 Iz; null when the csa or method is not tabulated. */
export function twinEarthIz(liveCsa: number, method: string): number | null {
  const row: TwinEarthRow | undefined = TABLE_4D5[liveCsa];
  if (!row || !(method in row.iz)) return null;
  return row.iz[method as TwinEarthMethod];
}

const CABLE_NAMES = {
  'twin-earth': 'flat twin-and-earth',
  swa: 'SWA',
  'singles-conduit': 'singles in conduit',
  flex: 'flex',
  other: 'this cable type',
} as const;

function unchecked(f: CircuitFacts, field: string, why: string): Finding {
  return circuitFinding(f, 'info', 'capacity-not-checked', 'BS 7671 433.1.1', field, `${circuitName(f.circuit)}: cable capacity not checked: ${why}`);
}

/** The cable's Iz under its conditions, and how messages say where it came from. */
interface Capacity {
  iz: number;
  factors: AppliedFactor[];
  /** "at method C (Table 4D5)", or "at method C with Cg 0.70 for 3 circuits grouped (Table 4C1), from 27 A in Table 4D5". */
  basis: string;
}

type TabulatedCable = Cable & { liveCsa: number; referenceMethod: TwinEarthMethod };

function capacityOf(cable: TabulatedCable, tabulated: number): Capacity | Extract<ReturnType<typeof correctedIz>, { ok: false }> {
  const atMethodC = TABLE_4D5[cable.liveCsa].iz.C;
  const corrected = correctedIz(cable, tabulated, atMethodC);
  if (!corrected.ok) return corrected;
  const { iz, factors, insulatedAtMethodC } = corrected;
  if (!factors.length) return { iz, factors, basis: `at method ${cable.referenceMethod} (Table 4D5)` };
  const texts = factors.map((x) => x.text);
  const listed = texts.length > 1 ? `${texts.slice(0, -1).join(', ')} and ${texts[texts.length - 1]}` : texts[0];
  // Ci is worked from the clipped-direct value; say so when the circuit's own method is another.
  const method =
    insulatedAtMethodC && cable.referenceMethod !== 'C'
      ? `method C where it is in insulation (method ${cable.referenceMethod} elsewhere)`
      : `method ${cable.referenceMethod}`;
  return { iz, factors, basis: `at ${method} with ${listed}, from ${num(insulatedAtMethodC ? atMethodC : tabulated)} A in Table 4D5` };
}

/** Where a capacity finding points: at the factor that lowers Iz most when the tabulated value alone would pass, else at `otherwise`. */
function blamedField(cap: Capacity, passesTabulated: boolean, otherwise: string): string {
  return (passesTabulated ? strongestFactor(cap.factors)?.field : undefined) ?? otherwise;
}

function checkRing(f: CircuitFacts, cap: Capacity, tabulated: number): Finding[] {
  if (cap.iz >= RING_FINAL.minIz) return [];
  const { circuit, device } = f;
  const cable = circuit.cable;
  const message = cap.factors.length
    ? `needs Iz of at least ${RING_FINAL.minIz} A under its installation conditions, but it has ${amps(cap.iz)} A ${cap.basis}`
    : `needs Iz of at least ${RING_FINAL.minIz} A, but method ${cable.referenceMethod} gives ${amps(cap.iz)} A (Table 4D5)`;
  return [
    circuitFinding(
      f,
      'error',
      'ring-iz-below-20',
      'BS 7671 433.1.204',
      blamedField(cap, tabulated >= RING_FINAL.minIz, 'cable.referenceMethod'),
      `${circuitName(circuit)}: a 2.5 mm² ring final on a ${deviceName(device!)} ${message}`,
    ),
  ];
}

/** 433.1.202: a BS 3036 fuse's rating may be at most 0.725 of the cable's Iz. */
function checkSemiEnclosed(f: CircuitFacts, cap: Capacity, tabulated: number): Finding[] {
  const { circuit, device } = f;
  const rating = device!.rating!;
  const allowed = BS3036_OVERLOAD_FACTOR * cap.iz;
  if (rating <= allowed + 1e-9) return [];
  const cable = circuit.cable;
  return [
    circuitFinding(
      f,
      'error',
      'rating-over-0725-iz',
      'BS 7671 433.1.202',
      blamedField(cap, rating <= BS3036_OVERLOAD_FACTOR * tabulated, 'cable.liveCsa'),
      `${circuitName(circuit)}: a ${num(rating)} A BS 3036 rewireable fuse needs In ≤ 0.725 × Iz, but 0.725 × ${amps(cap.iz)} A = ${amps(allowed)} A for ${num(cable.liveCsa!)} mm² twin-and-earth ${cap.basis}; a larger cable, or a lower rating, is needed`,
    ),
  ];
}

/** Ib ≤ In: a circuit designed to carry more than its device's rating would trip in normal use, or be overloaded behind a fuse. */
function checkDesignCurrent(f: CircuitFacts): Finding[] {
  const { circuit, device } = f;
  const ib = circuit.designCurrent;
  if (ib == null || !device || !isOvercurrentDevice(device) || device.rating == null || ib <= device.rating) return [];
  return [
    circuitFinding(
      f,
      'error',
      'design-current-over-rating',
      'BS 7671 433.1.1',
      'designCurrent',
      `${circuitName(circuit)}: design current Ib ${num(ib)} A recorded exceeds the device rating ${num(device.rating)} A (${deviceName(device)}); Ib ≤ In ≤ Iz needs a device of at least ${num(ib)} A on a cable to match, or a smaller load`,
    ),
  ];
}

/** With Ib recorded, what In ≤ Iz leaves room for: a lower rating when Ib fits the cable, a larger cable when it does not. */
function designCurrentHint(ib: number | null | undefined, iz: number): string {
  if (ib == null) return '';
  return ib <= iz
    ? `; with Ib ${num(ib)} A recorded, a device rated from ${num(ib)} A up to ${amps(iz)} A would meet Ib ≤ In ≤ Iz`
    : `; Ib ${num(ib)} A recorded is itself above ${amps(iz)} A, so a larger cable is needed`;
}

/** In ≤ Iz under the recorded conditions, or why it could not be checked. */
function checkCable(f: CircuitFacts): Finding[] {
  const { circuit, device } = f;
  if (!device || !isOvercurrentDevice(device) || device.rating == null) return [];
  const cable = circuit.cable;
  if (cable.type !== 'twin-earth')
    return [unchecked(f, 'cable.type', `no tabulated values for ${CABLE_NAMES[cable.type]} in this rule set; check In ≤ Iz against its Appendix 4 table`)];
  if (cable.liveCsa == null) return [unchecked(f, 'cable.liveCsa', 'record the live conductor csa')];
  if (cable.referenceMethod == null) return [unchecked(f, 'cable.referenceMethod', 'record the installation reference method')];
  const tabulated = twinEarthIz(cable.liveCsa, cable.referenceMethod);
  if (tabulated == null) return [unchecked(f, 'cable.referenceMethod', `Table 4D5 does not list ${num(cable.liveCsa)} mm² at method ${cable.referenceMethod}`)];
  const cap = capacityOf(cable as TabulatedCable, tabulated);
  if ('ok' in cap) {
    return [
      cap.unsuitable
        ? circuitFinding(f, 'error', 'ambient-over-cable-limit', 'BS 7671 Table 4B1', cap.field, `${circuitName(circuit)}: ${cap.why}`)
        : unchecked(f, cap.field, cap.why),
    ];
  }
  // 433.1.204 names breakers and BS 88 fuses; a rewireable fuse's ring is checked by 0.725 below.
  const ringDevice = device.kind !== 'fuse' || (device.fuseStandard != null && RING_RULE_FUSES.includes(device.fuseStandard));
  const isRecognisedRing =
    ringDevice && circuit.kind === 'ring' && cable.liveCsa === RING_FINAL.liveCsa && (RING_FINAL.ratings as readonly number[]).includes(device.rating);
  if (isRecognisedRing) return checkRing(f, cap, tabulated);
  if (device.kind === 'fuse' && device.fuseStandard === 'BS 3036') return checkSemiEnclosed(f, cap, tabulated);
  if (device.rating <= cap.iz) return [];
  return [
    circuitFinding(
      f,
      'error',
      'rating-over-iz',
      'BS 7671 433.1.1',
      blamedField(cap, device.rating <= tabulated, 'cable.liveCsa'),
      `${circuitName(circuit)}: device rating ${num(device.rating)} A (${deviceName(device)}) exceeds the ${amps(cap.iz)} A capacity of ${num(cable.liveCsa)} mm² twin-and-earth ${cap.basis}${designCurrentHint(circuit.designCurrent, cap.iz)}`,
    ),
  ];
}

/** Ib ≤ In where Ib is recorded, and In ≤ Iz × Ca × Cg × Ci for every circuit with a rated device, or why it could not be checked. */
export function checkCapacity(view: ScheduleView): Finding[] {
  return view.circuits.flatMap((f) => [...checkDesignCurrent(f), ...checkCable(f)]);
}
