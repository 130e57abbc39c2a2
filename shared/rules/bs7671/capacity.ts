/**
 * Overload protection: the device rating In must not exceed the cable's current-carrying
 * capacity Iz (433.1.1), with Iz from Appendix 4 for the cable and its reference method.
 * Only flat twin-and-earth (Table 4D5) is tabulated here; other cables are reported unchecked.
 * Tabulated Iz assumes 30 °C ambient and no grouping or insulation beyond the method: the
 * designer still applies correction factors.
 */
import type { Finding } from '../types.js';
import { RING_FINAL, TABLE_4D5, type TwinEarthMethod, type TwinEarthRow } from './tables.js';
import { circuitFinding, circuitName, deviceName, isOvercurrentDevice, num, type CircuitFacts, type ScheduleView } from './view.js';

/** Looks up Table 4D5 Iz; null when the csa or method is not tabulated. */
export function twinEarthIz(liveCsa: number, method: string): number | null {
  const row: TwinEarthRow | undefined = TABLE_4D5[liveCsa];
  if (!row || !(method in row.iz)) return null;
  return row.iz[method as TwinEarthMethod];
}

const CABLE_NAMES = { 'twin-earth': 'flat twin-and-earth', swa: 'SWA', 'singles-conduit': 'singles in conduit', flex: 'flex', other: 'this cable type' } as const;

function unchecked(f: CircuitFacts, field: string, why: string): Finding {
  return circuitFinding(f, 'info', 'capacity-not-checked', 'BS 7671 433.1.1', field, `${circuitName(f.circuit)}: cable capacity not checked: ${why}`);
}

function checkCircuit(f: CircuitFacts): Finding[] {
  const { circuit, device } = f;
  if (!device || !isOvercurrentDevice(device) || device.rating == null) return [];
  const cable = circuit.cable;
  if (cable.type !== 'twin-earth') return [unchecked(f, 'cable.type', `no tabulated values for ${CABLE_NAMES[cable.type]} in this rule set; check In ≤ Iz against its Appendix 4 table`)];
  if (cable.liveCsa == null) return [unchecked(f, 'cable.liveCsa', 'record the live conductor csa')];
  if (cable.referenceMethod == null) return [unchecked(f, 'cable.referenceMethod', 'record the installation reference method')];
  const iz = twinEarthIz(cable.liveCsa, cable.referenceMethod);
  if (iz == null) return [unchecked(f, 'cable.referenceMethod', `Table 4D5 does not list ${num(cable.liveCsa)} mm² at method ${cable.referenceMethod}`)];
  const name = circuitName(circuit);
  const isRecognisedRing = circuit.kind === 'ring' && cable.liveCsa === RING_FINAL.liveCsa && (RING_FINAL.ratings as readonly number[]).includes(device.rating);
  if (isRecognisedRing) {
    if (iz >= RING_FINAL.minIz) return [];
    return [circuitFinding(f, 'error', 'ring-iz-below-20', 'BS 7671 433.1.204', 'cable.referenceMethod',
      `${name}: a 2.5 mm² ring final on a ${deviceName(device)} needs Iz of at least ${RING_FINAL.minIz} A, but method ${cable.referenceMethod} gives ${num(iz)} A (Table 4D5)`)];
  }
  if (device.rating <= iz) return [];
  return [circuitFinding(f, 'error', 'rating-over-iz', 'BS 7671 433.1.1', 'cable.liveCsa',
    `${name}: device rating ${num(device.rating)} A (${deviceName(device)}) exceeds the ${num(iz)} A capacity of ${num(cable.liveCsa)} mm² twin-and-earth at method ${cable.referenceMethod} (Table 4D5)`)];
}

/** In ≤ Iz for every circuit with a rated device, or why it could not be checked. */
export function checkCapacity(view: ScheduleView): Finding[] {
  return view.circuits.flatMap(checkCircuit);
}
