/**
 * Published values for fuses, and the limits the readings are judged by. Each value carries its
 * source and how sure we are of it, as in tables.ts. The fuse Zs values below are BS 7671:2018's
 * (built with Cmin = 0.95 from the Appendix 3 time/current curves) as recalled: every one is marked
 * "from memory" and listed in docs/sources.md as still to be checked against the printed tables.
 */
import type { FuseStandard } from '../../schemas/survey.js';

/**
 * Table 41.2: maximum Zs (Ω) for fuses at U0 = 230 V where a final circuit must disconnect in 0.4 s
 * (411.3.2.2), by standard and rating. A rating missing here is not checked (the message says so).
 */
export const TABLE_41_2: Record<FuseStandard, Record<number, number>> = {
  // BS 7671:2018 Table 41.2, BS 88-2 fuses (from memory)
  'BS 88-2': { 2: 33.1, 4: 15.6, 6: 7.8, 10: 4.65, 16: 2.43, 20: 1.68, 25: 1.29, 32: 0.99, 40: 0.75, 50: 0.57, 63: 0.42 },
  // BS 7671:2018 Table 41.2, BS 88-3 fuses (from memory)
  'BS 88-3': { 5: 9.93, 16: 2.3, 20: 1.36, 32: 0.86, 45: 0.48 },
  // BS 7671:2018 Table 41.2, BS 3036 semi-enclosed fuses (from memory). One published page we found lists
  // 9.58 Ω at 5 A, which is 9.10 / 0.95, the value without Cmin: the sources disagree, so still to check.
  'BS 3036': { 5: 9.1, 15: 2.43, 20: 1.68, 30: 1.04 },
  // BS 7671:2018 Table 41.2, BS 1362 fuses (from memory)
  'BS 1362': { 3: 15.6, 13: 2.3 },
};

/**
 * Table 41.4: maximum Zs (Ω) for fuses where 5 s is allowed (411.3.2.3: distribution circuits and
 * final circuits above 63 A with socket-outlets or above 32 A fixed). Only the semi-enclosed fuses
 * of an old board are held here; another standard's 5 s limit is reported unchecked.
 */
export const TABLE_41_4: Partial<Record<FuseStandard, Record<number, number>>> = {
  // BS 7671:2018 Table 41.4, BS 3036 (from memory; one published page also gives 2.64 Ω at 30 A, but others of
  // its values differ from these, so it is not taken as a second source)
  'BS 3036': { 5: 17.7, 15: 5.35, 20: 3.83, 30: 2.64, 45: 1.59, 60: 1.11 },
};

/**
 * 433.1.202: a semi-enclosed fuse to BS 3036 protects against overload only when its rating is at
 * most 0.725 of the cable's Iz (In ≤ 0.725 × Iz), because it needs about twice its rating to blow
 * in the conventional time. (BS 7671:2018 433.1.202, from memory; the factor 0.725 is quoted in
 * published trade guidance we found, and is the ratio 1.45 / 2 of 433.1.1's conditions.)
 */
export const BS3036_OVERLOAD_FACTOR = 0.725;

/**
 * 433.1.204's ring arrangement (2.5 mm² on 30 or 32 A) names breakers and BS 88 fuses; a semi-enclosed
 * BS 3036 fuse is not among them, so its ring is checked by In ≤ 0.725 × Iz like any circuit
 * (BS 7671:2018 433.1.204, from memory).
 */
export const RING_RULE_FUSES: readonly FuseStandard[] = ['BS 88-2', 'BS 88-3'];

/**
 * Table 64: minimum insulation resistance (MΩ) by test voltage: SELV and PELV at 250 V, up to
 * 500 V at 500 V, above 500 V at 1000 V (BS 7671:2018+A2 Table 64, from memory: 0.5, 1 and 1 MΩ).
 */
export const TABLE_64_MIN_MEGOHMS: Record<250 | 500 | 1000, number> = { 250: 0.5, 500: 1, 1000: 1 };

/**
 * Below this a circuit's insulation passes Table 64 but is worth a look: a healthy new circuit reads
 * hundreds of MΩ, and a low N–E reading on an old circuit is the usual reason a new RCD trips once
 * the circuit is moved behind it (common practice; the value is our own threshold, not a standard's).
 */
export const LOW_INSULATION_MEGOHMS = 2;

/**
 * Ring end-to-end readings: r1 and rn should agree within 0.05 Ω (common practice, IET guidance
 * notes), and r2 is about 1.67 × r1 for 2.5/1.5 mm² twin-and-earth, the ratio of the conductors'
 * csa (2.5 / 1.5; common practice). We accept r2 within 10 % of that ratio (our own tolerance).
 */
export const RING_END_TO_END = { r1RnToleranceOhms: 0.05, r2Ratio: 2.5 / 1.5, r2RatioTolerance: 0.1 } as const;

/**
 * Zs ≈ Ze + (R1+R2): a measured Zs that differs from the sum by more than this suggests a wrong
 * reading or a parallel path (common practice; the margin is our own).
 */
export const ZS_CROSS_CHECK_OHMS = 0.2;

/**
 * Maximum operating times of a general (non-delay) RCD, ms: 300 ms at IΔn and 40 ms at 5 × IΔn
 * (BS EN 61008-1 / BS EN 61009-1, quoted in BS 7671 guidance for testing; from memory).
 */
export const RCD_TRIP_LIMIT_MS = { atRated: 300, atFiveTimes: 40 } as const;
