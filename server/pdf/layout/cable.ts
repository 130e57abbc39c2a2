/**
 * How long a cable flag's wrap zone must be: the cable's outer perimeter. Flat twin-and-earth is
 * a rounded rectangle (taken as 2(w + h)); round cables are π·d. A diameter on the circuit
 * overrides the tables, for cables whose maker gives other sizes.
 */
import type { Cable } from '../../../shared/schemas/schedule.js';

/** Flat twin-and-earth overall width × height by live csa (mm). // from memory: makers' data vary */
export const TWIN_EARTH_SIZE_MM: Record<number, { w: number; h: number }> = {
  1: { w: 7.8, h: 4.25 },
  1.5: { w: 8.2, h: 5 },
  2.5: { w: 10.3, h: 6 },
  4: { w: 11.9, h: 6.25 },
  6: { w: 13.5, h: 7 },
  10: { w: 17.1, h: 10 },
  16: { w: 19.4, h: 10 },
};

/** Typical overall diameter of 3-core SWA (BS 6724 style) by csa (mm). // from memory: makers vary, enter the real one as diameterMm */
export const SWA_DIAMETER_MM: Record<number, number> = {
  1.5: 12.5,
  2.5: 13.6,
  4: 15.5,
  6: 16.9,
  10: 19.6,
  16: 21.8,
  25: 25,
  35: 27.2,
  50: 27.9,
  70: 31.5,
  95: 35.5,
};

/** Typical overall diameter of round flex, 3-core, by csa (mm). // from memory */
export const FLEX_DIAMETER_MM: Record<number, number> = { 0.75: 6.5, 1: 7, 1.5: 7.8, 2.5: 9.5, 4: 11 };

/** Single insulated conductor (in conduit, each flagged on its own) by csa (mm). // from memory */
export const SINGLE_DIAMETER_MM: Record<number, number> = { 1: 2.8, 1.5: 3.1, 2.5: 3.7, 4: 4.3, 6: 4.9, 10: 6.3, 16: 7.3, 25: 9, 35: 10.2 };

/** csa assumed when a circuit records none: the usual socket-circuit cable. // common practice */
export const DEFAULT_CSA = 2.5;

export interface CableWrap {
  perimeterMm: number;
  /** How the perimeter was found, for the chart and warnings. */
  basis: 'diameter-override' | 'twin-earth-table' | 'round-table' | 'assumed';
}

/** Nearest tabled size at or above `csa` (a flag a little long wraps; a short one does not). */
function lookup<T>(table: Record<number, T>, csa: number): T | null {
  const sizes = Object.keys(table)
    .map(Number)
    .sort((a, b) => a - b);
  const size = sizes.find((s) => s >= csa - 1e-9);
  return size === undefined ? null : table[size];
}

/** The cable's outer perimeter for the wrap zone. */
export function cablePerimeter(cable: Cable): CableWrap {
  if (cable.diameterMm != null) return { perimeterMm: Math.PI * cable.diameterMm, basis: 'diameter-override' };
  const csa = cable.liveCsa ?? DEFAULT_CSA;
  const assumed = cable.liveCsa == null;
  if (cable.type === 'twin-earth' || cable.type === 'other') {
    const size = lookup(TWIN_EARTH_SIZE_MM, csa);
    if (size) return { perimeterMm: 2 * (size.w + size.h), basis: assumed ? 'assumed' : 'twin-earth-table' };
  }
  const round =
    cable.type === 'swa' ? SWA_DIAMETER_MM : cable.type === 'flex' ? FLEX_DIAMETER_MM : cable.type === 'singles-conduit' ? SINGLE_DIAMETER_MM : SWA_DIAMETER_MM;
  const d = lookup(round, csa);
  if (d != null) return { perimeterMm: Math.PI * d, basis: assumed ? 'assumed' : 'round-table' };
  // Beyond every table: take the largest tabled round size so the flag still prints; the caller warns.
  const largest = Math.max(...Object.values(SWA_DIAMETER_MM));
  return { perimeterMm: Math.PI * largest, basis: 'assumed' };
}
