/**
 * The vocabulary of a board schedule (enumerations of kinds, curves, phases) and the cable record,
 * kept apart from the schedule itself so the survey of an old board can reuse them without a cycle.
 */
import { z } from 'zod';
import { positive } from './fields.js';

export const earthingArrangements = ['TN-S', 'TN-C-S', 'TT'] as const;
/**
 * Kinds of installation, for the usual inspection interval and the dwelling rules. Values are only ever
 * added, so saved schedules keep parsing: 'special-location' (any other special location, 1 year) predates
 * the separate locations that IET Guidance Note 3 gives their own intervals.
 */
export const installationTypes = [
  'domestic',
  'rented-domestic',
  'hmo',
  'commercial',
  'industrial',
  'caravan',
  'caravan-park',
  'agricultural',
  'swimming-pool',
  'marina',
  'petrol-station',
  'leisure-complex',
  'special-location',
  'construction-site',
] as const;
export const alternativeSupplyKinds = ['pv', 'battery', 'generator', 'wind', 'other'] as const;
export const deviceKinds = ['main-switch', 'rcd', 'rcbo', 'mcb', 'fuse', 'afdd', 'spd', 'isolator', 'timer', 'blank'] as const;
export const breakerCurves = ['B', 'C', 'D'] as const;
export const rcdTypes = ['AC', 'A', 'F', 'B'] as const;
export const circuitKinds = ['ring', 'radial', 'lighting', 'cooker', 'shower', 'immersion', 'fixed-appliance', 'sub-main', 'other'] as const;
export const phases = ['L1', 'L2', 'L3'] as const;
export const cableTypes = ['twin-earth', 'swa', 'singles-conduit', 'flex', 'other'] as const;
/** Installation reference methods of BS 7671 Appendix 4 (Table 4A2 and the 100-series for insulated ceilings). */
export const referenceMethods = ['A', 'B', 'C', 'D', 'E', 'F', '100', '101', '102', '103'] as const;

export type EarthingArrangement = (typeof earthingArrangements)[number];
export type InstallationType = (typeof installationTypes)[number];
export type DeviceKind = (typeof deviceKinds)[number];
export type BreakerCurve = (typeof breakerCurves)[number];
export type CircuitKind = (typeof circuitKinds)[number];
export type CableType = (typeof cableTypes)[number];
export type ReferenceMethod = (typeof referenceMethods)[number];
export type Phase = (typeof phases)[number];

export const cableSchema = z.strictObject({
  type: z.enum(cableTypes).default('twin-earth'),
  liveCsa: positive('Live csa', 630).nullable().default(null),
  cpcCsa: positive('cpc csa', 630).nullable().default(null),
  referenceMethod: z.enum(referenceMethods).nullable().default(null),
  lengthM: z.number().nonnegative('Length cannot be negative').max(2000, 'At most 2000 m').nullable().default(null),
  /** Overall diameter of a round cable (mm), or an override for the flag's wrap size. */
  diameterMm: positive('Diameter', 200).nullable().default(null),
  // Installation conditions, for the correction factors on the cable's capacity. Each is null until
  // recorded, so documents saved before they existed parse unchanged and are checked as before.
  /** Hottest ambient temperature along the route (°C), for Ca; null means the tables' 30 °C. */
  ambientC: z.number({ error: 'Ambient temperature must be a number' }).min(-30, 'At least -30 °C').max(90, 'At most 90 °C').nullable().default(null),
  /**
   * How many circuits (or multicore cables) run together at the worst point of the route, this one
   * included, for Cg; null or 1 means not grouped. The count alone does not say whether the cables
   * are bunched or spaced in one layer, so the checks use the bunched or enclosed row of the grouping
   * table for every reference method: it is never the higher factor (see the rule set's tables).
   */
  groupedWith: z
    .number({ error: 'Circuits grouped must be a number' })
    .int('Whole circuits only')
    .min(1, 'Count this circuit too: at least 1')
    .max(100, 'At most 100 circuits')
    .nullable()
    .default(null),
  /** Length of the run totally surrounded by thermal insulation (mm), for Ci; null or 0 means none. */
  insulatedLengthMm: z
    .number({ error: 'Length in insulation must be a number' })
    .nonnegative('Length in insulation cannot be negative')
    .max(100_000, 'At most 100000 mm (100 m)')
    .nullable()
    .default(null),
});

/** A cable with nothing recorded: the default of a circuit without one. */
export const EMPTY_CABLE = {
  type: 'twin-earth',
  liveCsa: null,
  cpcCsa: null,
  referenceMethod: null,
  lengthM: null,
  diameterMm: null,
  ambientC: null,
  groupedWith: null,
  insulatedLengthMm: null,
} as const satisfies z.output<typeof cableSchema>;
