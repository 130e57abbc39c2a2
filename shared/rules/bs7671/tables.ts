/**
 * Published values the BS 7671:2018+A2:2022 rule set checks against. Each value carries its
 * source and how sure we are of it: "found" values were read in published text quoting the table,
 * "from memory" values are recalled and must be confirmed against the printed standard.
 */
import type { BreakerCurve, InstallationType, ReferenceMethod } from '../../schemas/schedule.js';

/**
 * Table 41.3: maximum Zs (Ω) for BS EN 60898 circuit-breakers and BS EN 61009 RCBOs at U0 = 230 V.
 * The one table covers both the 0.4 s (411.3.2.2) and the 5 s (411.3.2.3) disconnection times,
 * because a breaker meets either by tripping instantly on its magnetic element.
 */
export const TABLE_41_3: Record<BreakerCurve, Record<number, number>> = {
  // BS 7671:2018+A2 Table 41.3 (found) for 6–63 A; 80–125 A from the table's own formula
  // 0.95 × 230 / Ia with Ia = 5·In (B), 10·In (C), 20·In (D), rounded to two places (from memory that the table lists them)
  B: { 6: 7.28, 10: 4.37, 16: 2.73, 20: 2.19, 25: 1.75, 32: 1.37, 40: 1.09, 50: 0.87, 63: 0.69, 80: 0.55, 100: 0.44, 125: 0.35 },
  C: { 6: 3.64, 10: 2.19, 16: 1.37, 20: 1.09, 25: 0.87, 32: 0.68, 40: 0.55, 50: 0.44, 63: 0.35, 80: 0.27, 100: 0.22, 125: 0.17 },
  D: { 6: 1.82, 10: 1.09, 16: 0.68, 20: 0.55, 25: 0.44, 32: 0.34, 40: 0.27, 50: 0.22, 63: 0.17, 80: 0.14, 100: 0.11, 125: 0.09 },
};

/** Multiple of In at which each curve trips instantly (BS EN 60898 upper limit), the basis of Table 41.3. */
export const INSTANT_TRIP_MULTIPLE: Record<BreakerCurve, number> = { B: 5, C: 10, D: 20 }; // BS EN 60898-1 (found via Table 41.3's formula)

/** Cmin, the voltage factor of A2:2022 used to build Table 41.3 (found). */
export const CMIN = 0.95;

/**
 * Table 41.5: maximum Zs for an RCD giving fault protection in a TT system, 50 V / IΔn
 * (411.5.3). Used where a TT circuit relies on its RCD rather than its breaker.
 */
export function table41_5MaxZs(residualMa: number): number {
  return Math.round(50 / (residualMa / 1000)); // BS 7671:2018 Table 41.5, 50 V / IΔn: 30 mA → 1667 Ω (from memory)
}

/**
 * Earth electrode resistance above which IET guidance treats a TT electrode as possibly unstable: the
 * reading may rise as the soil dries out or freezes, even where it is within Table 41.5.
 */
export const TT_ELECTRODE_STABLE_MAX_OHMS = 200; // from memory: IET Guidance Note 3 / On-Site Guide (to check)

/** Rule of thumb for Zs measured at ambient temperature: compare with 80 % of Table 41.3. */
export const AMBIENT_RULE_OF_THUMB = 0.8; // IET guidance (On-Site Guide / Guidance Note 3) rule of thumb (found in trade press)

/** Reference methods Table 4D5 tabulates for flat twin-and-earth. */
export type TwinEarthMethod = Extract<ReferenceMethod, '100' | '101' | '102' | '103' | 'C' | 'A'>;

export interface TwinEarthRow {
  /** Current-carrying capacity Iz (A) per reference method, 30 °C ambient, no grouping. */
  iz: Record<TwinEarthMethod, number>;
  /** Voltage drop, single-phase, mV per amp per metre. */
  mvPerAm: number;
}

/** Appendix 4 Table 4D5: 70 °C thermoplastic flat twin-and-earth (6242Y), by live csa (mm²). */
export const TABLE_4D5: Record<number, TwinEarthRow> = {
  // BS 7671:2018+A2 Appendix 4 Table 4D5 (found): rows 1.0 and 1.5, and 2.5 mm² methods C and A
  1: { iz: { 100: 13, 101: 10.5, 102: 13, 103: 8, C: 16, A: 11.5 }, mvPerAm: 44 },
  1.5: { iz: { 100: 16, 101: 13, 102: 16, 103: 10, C: 20, A: 14.5 }, mvPerAm: 29 },
  // 2.5 mm² methods 100–103 and every row below: BS 7671 Table 4D5 (from memory)
  2.5: { iz: { 100: 21, 101: 17, 102: 21, 103: 13.5, C: 27, A: 20 }, mvPerAm: 18 },
  4: { iz: { 100: 27, 101: 22, 102: 27, 103: 17.5, C: 37, A: 26 }, mvPerAm: 11 },
  6: { iz: { 100: 34, 101: 27, 102: 35, 103: 23.5, C: 47, A: 32 }, mvPerAm: 7.3 },
  10: { iz: { 100: 45, 101: 36, 102: 47, 103: 32, C: 64, A: 44 }, mvPerAm: 4.4 },
  16: { iz: { 100: 57, 101: 46, 102: 63, 103: 42.5, C: 85, A: 57 }, mvPerAm: 2.8 },
};

/**
 * Table 4B1: ambient temperature factor Ca for 70 °C thermoplastic cable in air, by ambient °C,
 * against the tables' 30 °C (from memory). The table gives no value above 60 °C for this cable:
 * it is not to be used there. Our copy starts at 25 °C; below that the checks take 25 °C's factor,
 * so a cold run never earns more than we are sure of.
 */
export const TABLE_4B1_THERMOPLASTIC_70: Record<number, number> = {
  // BS 7671:2018 Appendix 4 Table 4B1, 70 °C thermoplastic column (from memory)
  25: 1.03,
  30: 1,
  35: 0.94,
  40: 0.87,
  45: 0.79,
  50: 0.71,
  55: 0.61,
  60: 0.5,
};

/**
 * Table 4C1, row 1: grouping factor Cg for circuits or multicore cables bunched in air, on a surface,
 * embedded or enclosed (methods A to F), by the number in the group (from memory). Rows 2–4 (one
 * layer on a wall, tray or ladder) give higher factors, but a schedule that records only a count
 * cannot tell a single spaced layer from a bunch, so the checks always read row 1, the safer one.
 * The table stops at 20.
 */
export const TABLE_4C1_BUNCHED: Record<number, number> = {
  // BS 7671:2018 Appendix 4 Table 4C1, item 1 "bunched in air, on a surface, embedded or enclosed" (from memory)
  1: 1,
  2: 0.8,
  3: 0.7,
  4: 0.65,
  5: 0.6,
  6: 0.57,
  7: 0.54,
  8: 0.52,
  9: 0.5,
  12: 0.45,
  16: 0.41,
  20: 0.38,
};

/**
 * Table 52.2: factor Ci for a cable totally surrounded by thermal insulation for a short length (mm),
 * applied to its capacity clipped direct (method C); for cables up to 10 mm² (from memory). For 0.5 m
 * or more, and for larger cables without better information, 523.9 takes 0.5 of the method C value
 * (from memory). Table 4D5's method 103 is that same half of method C (1.5 mm²: 10 of 20 A, found),
 * which is why Ci is taken from method C and never stacked on a method already in insulation.
 */
export const TABLE_52_2: Record<number, number> = {
  // BS 7671:2018 Table 52.2 (from memory)
  50: 0.88,
  100: 0.78,
  200: 0.63,
  400: 0.51,
};
/** 523.9: the factor for 0.5 m or more in insulation, and the largest csa Table 52.2 covers (from memory). */
export const FULLY_INSULATED = { factor: 0.5, fromMm: 500, table52_2MaxCsa: 10 } as const;

/**
 * The tabulated point a measured value falls on, taking the safer neighbour when it falls between
 * two: the next key up, because every one of these factors falls as its key rises. Null above the
 * last key. Tables here are small records keyed by number.
 */
export function nextTabulatedKey(table: Record<number, number>, value: number): number | null {
  const keys = Object.keys(table)
    .map(Number)
    .sort((a, b) => a - b);
  return keys.find((k) => k >= value) ?? null;
}

/**
 * 433.1.204: a 2.5 mm² thermoplastic ring final on a 30 or 32 A device meets 433.1.1
 * when the cable's Iz under its installation conditions is at least 20 A (partly: secondary pages quote it).
 */
export const RING_FINAL = { liveCsa: 2.5, ratings: [30, 32], minIz: 20 } as const;

/**
 * Voltage drop limits, percent of nominal voltage, for an installation supplied from a public low voltage
 * distribution system (BS 7671 525 and Appendix 4 Section 6, found; the table's number, 4Ab, from memory).
 */
export const VOLTAGE_DROP_LIMIT_PERCENT = { lighting: 3, other: 5 } as const;

/**
 * Ratings breakers are made in. BS EN 60898-1 preferred values 6–125 A (from memory, incl. 8 and 13 A),
 * plus the 1–4 A sizes makers list for control circuits (common practice).
 */
export const BREAKER_RATINGS = [1, 2, 3, 4, 6, 8, 10, 13, 16, 20, 25, 32, 40, 50, 63, 80, 100, 125] as const;

/** Residual operating currents (mA) RCDs and RCBOs are made in (common practice). */
export const RESIDUAL_RATINGS_MA = [10, 30, 100, 300, 500, 1000] as const;

/** Largest IΔn that counts as additional protection: 30 mA (411.3.3 found; 415.1.1 from memory). */
export const ADDITIONAL_PROTECTION_MA = 30;

/** Largest socket-outlet circuit rating 411.3.3 asks 30 mA protection for (found). */
export const SOCKET_RCD_MAX_RATING = 32;

/**
 * 411.3.2.2: 0.4 s applies to final circuits up to 63 A with socket-outlets and up to 32 A for fixed
 * equipment only; other final circuits and distribution circuits may take 5 s (411.3.2.3) (from memory).
 */
export const FINAL_CIRCUIT_0_4S = { withSockets: 63, fixedOnly: 32 } as const;

/**
 * Usual maximum months between periodic inspections by installation type, as IET Guidance Note 3 Table 3.2
 * lists them (the initial frequency; the inspector may set a shorter or longer one, recorded on the board).
 * Domestic to construction-site values were found in secondary pages; the rest are from memory, to check.
 */
export const INSPECTION_INTERVAL_MONTHS: Record<InstallationType, number> = {
  domestic: 120, // IET Guidance Note 3 Table 3.2: domestic 10 years (found in secondary pages)
  'rented-domestic': 60, // IET Guidance Note 3 Table 3.2: rented domestic 5 years (found in secondary pages)
  hmo: 60, // IET Guidance Note 3 Table 3.2: residential accommodation 5 years (found in secondary pages)
  commercial: 60, // IET Guidance Note 3 Table 3.2: commercial 5 years (found in secondary pages)
  industrial: 36, // IET Guidance Note 3 Table 3.2: industrial 3 years (found in secondary pages)
  caravan: 36, // IET Guidance Note 3 Table 3.2: caravans 3 years (found in secondary pages)
  'caravan-park': 12, // from memory: IET Guidance Note 3 Table 3.2, caravan parks 1 year
  agricultural: 36, // from memory: IET Guidance Note 3 Table 3.2, agricultural and horticultural premises 3 years
  'swimming-pool': 12, // from memory: IET Guidance Note 3 Table 3.2, swimming pools 1 year
  marina: 12, // from memory: IET Guidance Note 3 Table 3.2, marinas 1 year
  'petrol-station': 12, // from memory: IET Guidance Note 3 Table 3.2, petrol filling stations 1 year
  'leisure-complex': 12, // from memory: IET Guidance Note 3 Table 3.2, leisure complexes (not swimming pools) 1 year
  // Any other special location: the 1 year it always had, the shortest interval above (common practice).
  'special-location': 12,
  'construction-site': 3, // IET Guidance Note 3 Table 3.2: construction sites 3 months (found in secondary pages)
};

/** Installation types that are dwellings, where 411.3.3 allows no risk-assessment exception and 411.3.4 applies. */
export const DWELLINGS: ReadonlySet<InstallationType> = new Set<InstallationType>(['domestic', 'rented-domestic', 'hmo']);

/** How far ahead an inspection counts as "due soon" (common practice: plan a quarter ahead). */
export const INSPECTION_DUE_SOON_DAYS = 90;

/**
 * Breaking capacity (434.5.1, from memory): a device's rated short-circuit capacity (Icn for BS EN 60898
 * breakers and BS EN 61009 RCBOs) at least the prospective fault current where it is installed, unless a
 * device on the supply side with enough capacity gives backup protection. A consumer unit or distribution
 * board to BS EN 61439-3 commonly carries a 16 kA conditional short-circuit rating with the maker's devices,
 * which is such backup (from memory / common practice). 6 kA is the usual rating of domestic breakers
 * (common practice), so a device of unknown capacity is only worth a note where the PFC is above it.
 */
export const BREAKING_CAPACITY = { usualConditionalKa: 16, usualDomesticKa: 6 } as const;

/** cpc csa of flat twin-and-earth (BS 6004, 6242Y) by live csa, mm² (from memory), for the hint in "record the cpc". */
export const TWIN_EARTH_CPC: Record<number, number> = { 1: 1, 1.5: 1, 2.5: 1.5, 4: 1.5, 6: 2.5, 10: 4, 16: 6 };
