/**
 * The board's supply voltages, decided once: the chart, the notices, the board page and the
 * voltage-drop check all read them from here, so a three-phase board can never be 400/230 V on
 * one page and 690/400 V on another.
 *
 * The schedule records one nominal voltage. On a single-phase board it is the voltage to earth
 * (U0). On a three-phase board people write either figure, so a value of 250 V or more is read as
 * the voltage between phases (U) and a lower one as U0.
 */

/** Usual pairs of voltage to earth and between phases. IEC 60038 nominal voltages (from memory). */
const PAIRS: ReadonlyArray<readonly [toEarth: number, betweenPhases: number]> = [
  [230, 400],
  [240, 415],
  [220, 380],
  [127, 220],
  [120, 208],
  [277, 480],
];

/** A three-phase figure at or above this is the voltage between phases, not to earth. */
const LINE_VOLTAGE_FROM = 250;

export interface SupplyVoltages {
  /** U0, line to earth: what a single-phase circuit sees. */
  toEarth: number;
  /** U, between phases, on a three-phase board; null on single-phase. */
  betweenPhases: number | null;
}

/** U0 and U of a supply from its recorded nominal voltage and phases (230 → 230/400, 240 → 240/415, 400 → 230/400). */
export function supplyVoltages(phases: 1 | 3, nominalVoltage: number): SupplyVoltages {
  if (phases === 1) return { toEarth: nominalVoltage, betweenPhases: null };
  if (nominalVoltage >= LINE_VOLTAGE_FROM) {
    const pair = PAIRS.find(([, between]) => between === nominalVoltage);
    return { toEarth: pair ? pair[0] : Math.round(nominalVoltage / Math.sqrt(3)), betweenPhases: nominalVoltage };
  }
  const pair = PAIRS.find(([toEarth]) => toEarth === nominalVoltage);
  return { toEarth: nominalVoltage, betweenPhases: pair ? pair[1] : Math.round(nominalVoltage * Math.sqrt(3)) };
}

/** "230 V, single-phase" or "400/230 V (three-phase, 230 V to earth)", for a visitor. */
export function supplyVoltageText(phases: 1 | 3, nominalVoltage: number): string {
  const v = supplyVoltages(phases, nominalVoltage);
  if (v.betweenPhases == null) return `${v.toEarth} V, single-phase`;
  return `${v.betweenPhases}/${v.toEarth} V (three-phase, ${v.toEarth} V to earth)`;
}

/** "230 V" or "400/230 V three-phase", the short form a printed chart carries. */
export function supplyVoltageShortText(phases: 1 | 3, nominalVoltage: number): string {
  const v = supplyVoltages(phases, nominalVoltage);
  return v.betweenPhases == null ? `${v.toEarth} V` : `${v.betweenPhases}/${v.toEarth} V three-phase`;
}
