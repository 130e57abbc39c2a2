/**
 * Correction factors for a cable's recorded installation conditions (Appendix 4 section 5):
 * Ca for ambient temperature (Table 4B1), Cg for grouping (Table 4C1, bunched row) and Ci for a
 * length totally surrounded by thermal insulation (Table 52.2 / 523.9). Each reads the safer
 * tabulated point when a value falls between two. The factors are multiplied together, as if every
 * condition met on the same stretch of cable: the schedule does not say where along the route each
 * one is, and multiplying is never the less cautious answer.
 */
import type { Cable } from '../../schemas/schedule.js';
import { FULLY_INSULATED, nextTabulatedKey, TABLE_4B1_THERMOPLASTIC_70, TABLE_4C1_BUNCHED, TABLE_52_2 } from './tables.js';
import { num } from './view.js';

/** One factor that changed the capacity: its value, the cable field it comes from and how messages name it. */
export interface AppliedFactor {
  value: number;
  /** How far it lowers the tabulated Iz at the circuit's own method (Ci is worked from method C, so it can differ from value). */
  effect: number;
  field: 'cable.ambientC' | 'cable.groupedWith' | 'cable.insulatedLengthMm';
  /** "Cg 0.70 for 3 circuits grouped (Table 4C1)". */
  text: string;
}

/** Iz under the recorded conditions, or why the tables cannot give one. */
export type CorrectedIz =
  | { ok: true; iz: number; factors: AppliedFactor[]; insulatedAtMethodC: boolean }
  | { ok: false; field: AppliedFactor['field']; why: string; /** The cable must not be used there at all, rather than "cannot say". */ unsuitable: boolean };

/** Table 4B1 Ca for 70 °C thermoplastic at this ambient; null above the table (the cable is not for that heat). */
export function ambientFactor(ambientC: number): number | null {
  const key = nextTabulatedKey(TABLE_4B1_THERMOPLASTIC_70, ambientC);
  return key == null ? null : TABLE_4B1_THERMOPLASTIC_70[key];
}

/** Table 4C1 (bunched or enclosed) Cg for this many circuits in the group; null above 20, where the table stops. */
export function groupingFactor(circuits: number): number | null {
  const key = nextTabulatedKey(TABLE_4C1_BUNCHED, circuits);
  return key == null ? null : TABLE_4C1_BUNCHED[key];
}

/** Ci for a length (mm) totally surrounded by thermal insulation, applied to the method C capacity. */
export function insulationFactor(lengthMm: number, liveCsa: number): number {
  if (lengthMm <= 0) return 1;
  if (liveCsa > FULLY_INSULATED.table52_2MaxCsa || lengthMm >= FULLY_INSULATED.fromMm) return FULLY_INSULATED.factor;
  const key = nextTabulatedKey(TABLE_52_2, lengthMm);
  // Between 400 mm and 0.5 m the safer neighbour is 523.9's 0.5.
  return key == null ? FULLY_INSULATED.factor : TABLE_52_2[key];
}

const factorText = (name: string, value: number, what: string, source: string) => `${name} ${value.toFixed(2)} for ${what} (${source})`;

/** Ca and Cg as recorded, leaving out those equal to 1; or the field the tables cannot answer for. */
function airFactors(cable: Cable): AppliedFactor[] | Extract<CorrectedIz, { ok: false }> {
  const factors: AppliedFactor[] = [];
  if (cable.ambientC != null) {
    const ca = ambientFactor(cable.ambientC);
    if (ca == null)
      return {
        ok: false,
        field: 'cable.ambientC',
        unsuitable: true,
        why: `Table 4B1 gives no factor for 70 °C thermoplastic cable above 60 °C ambient (${num(cable.ambientC)} °C recorded): the cable is not for that heat`,
      };
    if (ca !== 1)
      factors.push({ value: ca, effect: ca, field: 'cable.ambientC', text: factorText('Ca', ca, `${num(cable.ambientC)} °C ambient`, 'Table 4B1') });
  }
  if (cable.groupedWith != null) {
    const cg = groupingFactor(cable.groupedWith);
    if (cg == null)
      return { ok: false, field: 'cable.groupedWith', unsuitable: false, why: `Table 4C1 goes up to 20 circuits grouped (${cable.groupedWith} recorded)` };
    if (cg !== 1)
      factors.push({ value: cg, effect: cg, field: 'cable.groupedWith', text: factorText('Cg', cg, `${cable.groupedWith} circuits grouped`, 'Table 4C1') });
  }
  return factors;
}

/**
 * Iz × Ca × Cg × Ci for a cable whose tabulated Iz at its own method is `atMethod` and at method C
 * `atMethodC`. Ci applies to the method C value (Table 52.2 is relative to clipped direct), so the
 * insulated stretch limits the cable only when `atMethodC × Ci` is below `atMethod`; then
 * `insulatedAtMethodC` is true and the capacity is worked from method C.
 */
export function correctedIz(cable: Cable & { liveCsa: number }, atMethod: number, atMethodC: number): CorrectedIz {
  const air = airFactors(cable);
  if (!Array.isArray(air)) return air;
  const factors = [...air];
  let base = atMethod;
  let insulatedAtMethodC = false;
  const length = cable.insulatedLengthMm ?? 0;
  const ci = insulationFactor(length, cable.liveCsa);
  if (ci < 1 && atMethodC * ci < atMethod) {
    base = atMethodC;
    insulatedAtMethodC = true;
    const source = cable.liveCsa > FULLY_INSULATED.table52_2MaxCsa || length >= FULLY_INSULATED.fromMm ? '523.9' : 'Table 52.2';
    factors.push({
      value: ci,
      effect: (atMethodC * ci) / atMethod,
      field: 'cable.insulatedLengthMm',
      text: factorText('Ci', ci, `${num(length)} mm in thermal insulation`, source),
    });
  }
  const iz = factors.reduce((v, f) => v * f.value, base);
  // Rounded only to drop floating-point noise (27 × 0.7 = 18.900000000000002).
  return { ok: true, iz: Math.round(iz * 1e6) / 1e6, factors, insulatedAtMethodC };
}

/** The factor that lowers Iz most, where a finding caused by the conditions should point. */
export function strongestFactor(factors: AppliedFactor[]): AppliedFactor | undefined {
  return factors.filter((f) => f.effect < 1).sort((a, b) => a.effect - b.effect)[0];
}
