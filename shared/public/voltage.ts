/**
 * The supply voltage as a visitor should read it: "230 V, single-phase", or on a three-phase
 * board "400/230 V (three-phase, 230 V to earth)", so nobody takes a three-phase board for 230 V.
 */

/** Usual pairs of voltage to earth and between phases. IEC 60038 nominal voltages (from memory). */
const PAIRS: ReadonlyArray<readonly [toEarth: number, betweenPhases: number]> = [
  [230, 400], [240, 415], [220, 380], [127, 220], [120, 208], [277, 480],
];

/**
 * Voltage to earth and between phases of a supply. The schedule records the nominal voltage to
 * earth; a three-phase figure of 250 V or more is read as the voltage between phases instead.
 */
export function supplyVoltages(phases: 1 | 3, nominalVoltage: number): { toEarth: number; betweenPhases: number | null } {
  if (phases === 1) return { toEarth: nominalVoltage, betweenPhases: null };
  if (nominalVoltage >= 250) {
    const pair = PAIRS.find(([, between]) => between === nominalVoltage);
    return { toEarth: pair ? pair[0] : Math.round(nominalVoltage / Math.sqrt(3)), betweenPhases: nominalVoltage };
  }
  const pair = PAIRS.find(([toEarth]) => toEarth === nominalVoltage);
  return { toEarth: nominalVoltage, betweenPhases: pair ? pair[1] : Math.round(nominalVoltage * Math.sqrt(3)) };
}

/** "230 V, single-phase" or "400/230 V (three-phase, 230 V to earth)". */
export function supplyVoltageText(phases: 1 | 3, nominalVoltage: number): string {
  const v = supplyVoltages(phases, nominalVoltage);
  if (v.betweenPhases == null) return `${v.toEarth} V, single-phase`;
  return `${v.betweenPhases}/${v.toEarth} V (three-phase, ${v.toEarth} V to earth)`;
}
