/**
 * The board schedule: the one document everything Waymark prints comes from.
 * Parsed by the server on every save and import, reused by the editor's forms,
 * and the body of the board file (see `boardFileSchema`).
 */
import { z } from 'zod';

const text = (max: number) => z.string().trim().max(max, `At most ${max} characters`);
const positive = (label: string, max: number) => z.number({ error: `${label} must be a number` }).positive(`${label} must be above zero`).max(max, `${label} is at most ${max}`);
const isoDate = z.string().regex(/^\d{4}-\d{2}-\d{2}$/, 'Use the form YYYY-MM-DD').refine((s) => !Number.isNaN(Date.parse(`${s}T00:00:00Z`)) && new Date(`${s}T00:00:00Z`).toISOString().startsWith(s), 'Not a real date');
const key = z.string().min(1, 'Required').max(40, 'At most 40 characters').regex(/^[A-Za-z0-9_-]+$/, 'Letters, digits, - and _ only');

export const earthingArrangements = ['TN-S', 'TN-C-S', 'TT'] as const;
export const installationTypes = ['domestic', 'rented-domestic', 'hmo', 'commercial', 'industrial', 'caravan', 'special-location', 'construction-site'] as const;
export const alternativeSupplyKinds = ['pv', 'battery', 'generator', 'wind', 'other'] as const;
export const deviceKinds = ['main-switch', 'rcd', 'rcbo', 'mcb', 'afdd', 'spd', 'isolator', 'timer', 'blank'] as const;
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

/** Longest short label: what fits a way label over one 17.5 mm module at the minimum text size. */
export const SHORT_LABEL_MAX = 24;

export const supplySchema = z.strictObject({
  earthing: z.enum(earthingArrangements),
  nominalVoltage: positive('Nominal voltage', 1000).default(230),
  ze: z.number().nonnegative('Ze cannot be negative').max(200, 'Ze is at most 200 Ω').nullable().default(null),
  pfcKa: z.number().nonnegative('Fault current cannot be negative').max(100, 'At most 100 kA').nullable().default(null),
  mainSwitchRating: positive('Main switch rating', 4000).nullable().default(null),
  tailsCsa: positive('Tails csa', 1000).nullable().default(null),
  mainEarthCsa: positive('Main earthing conductor csa', 1000).nullable().default(null),
  mainBondingCsa: positive('Main bonding csa', 1000).nullable().default(null),
});

export const boardDetailsSchema = z.strictObject({
  name: text(120).min(1, 'Required'),
  location: text(200).default(''),
  rows: z.number().int('Whole rows only').min(1, 'At least one row').max(60, 'At most 60 rows').default(1),
  modulesPerRow: z.number().int('Whole modules only').min(1, 'At least one module').max(72, 'At most 72 modules').default(18),
  phases: z.union([z.literal(1), z.literal(3)], { error: 'Phases must be 1 or 3' }).default(1),
  installationType: z.enum(installationTypes).default('domestic'),
  supply: supplySchema,
  installedOn: isoDate.nullable().default(null),
  lastInspectionOn: isoDate.nullable().default(null),
  /** Months to the next periodic inspection; null means the usual interval for the installation type. */
  inspectionIntervalMonths: z.number().int().min(1, 'At least one month').max(240, 'At most 240 months').nullable().default(null),
  mixedWiringColours: z.boolean().default(false),
  alternativeSupply: z.strictObject({
    present: z.boolean(),
    kinds: z.array(z.enum(alternativeSupplyKinds)).max(5).default([]),
    description: text(200).default(''),
  }).default({ present: false, kinds: [], description: '' }),
  /** How devices are assigned to RCDs: by their place on the row (split-load) or set on each device. */
  rcdMode: z.enum(['position', 'manual']).default('position'),
  privateNotes: text(4000).default(''),
  publicNotes: text(2000).default(''),
});

export const deviceSchema = z.strictObject({
  id: key,
  row: z.number().int().min(1, 'Rows start at 1').max(60, 'At most 60 rows'),
  kind: z.enum(deviceKinds),
  /** Width in DIN 43880 modules (17.5 mm each), in half-module steps. */
  modules: z.number().min(0.5, 'At least half a module').max(12, 'At most 12 modules').refine((m) => Number.isInteger(m * 2), 'Half-module steps only').default(1),
  poles: z.number().int().min(1).max(4).default(1),
  rating: positive('Rating', 4000).nullable().default(null),
  curve: z.enum(breakerCurves).nullable().default(null),
  breakingCapacityKa: positive('Breaking capacity', 100).nullable().default(null),
  residualMa: positive('IΔn', 3000).nullable().default(null),
  rcdType: z.enum(rcdTypes).nullable().default(null),
  /** The RCD that protects this device, when the board's rcdMode is 'manual'. */
  protectedBy: key.nullable().default(null),
  /** Own name for the device, e.g. "RCD 1"; blank means a generated one. */
  label: text(24).default(''),
});

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
  groupedWith: z.number({ error: 'Circuits grouped must be a number' }).int('Whole circuits only').min(1, 'Count this circuit too: at least 1').max(100, 'At most 100 circuits').nullable().default(null),
  /** Length of the run totally surrounded by thermal insulation (mm), for Ci; null or 0 means none. */
  insulatedLengthMm: z.number({ error: 'Length in insulation must be a number' }).nonnegative('Length in insulation cannot be negative').max(100_000, 'At most 100000 mm (100 m)').nullable().default(null),
});

/** A cable with nothing recorded: the default of a circuit without one. */
export const EMPTY_CABLE = {
  type: 'twin-earth', liveCsa: null, cpcCsa: null, referenceMethod: null, lengthM: null, diameterMm: null,
  ambientC: null, groupedWith: null, insulatedLengthMm: null,
} as const satisfies z.output<typeof cableSchema>;

export const circuitSchema = z.strictObject({
  id: key,
  way: z.number().int('Whole way numbers only').min(1, 'Ways start at 1').max(2000, 'At most 2000'),
  phase: z.enum(phases).nullable().default(null),
  deviceId: key.nullable().default(null),
  label: text(SHORT_LABEL_MAX).min(1, 'Required'),
  description: text(500).default(''),
  kind: z.enum(circuitKinds).default('other'),
  /** Supplies socket-outlets (so 411.3.3 asks for 30 mA RCD protection up to 32 A). */
  socketOutlets: z.boolean().default(false),
  /** Cable concealed in a wall less than 50 mm deep without mechanical protection (522.6.202/203). */
  concealedInWall: z.boolean().default(false),
  cable: cableSchema.default(() => ({ ...EMPTY_CABLE })),
  points: z.number().int().min(0).max(999).nullable().default(null),
  locations: z.array(text(60).min(1, 'Empty location')).max(20, 'At most 20 locations').default([]),
  /** Way or reference on the board this circuit came from, for replacements. */
  previousReference: text(40).default(''),
  measuredZs: z.number().nonnegative('Zs cannot be negative').max(200, 'At most 200 Ω').nullable().default(null),
  /** Measured at ambient temperature (so the 80 % rule of thumb applies) rather than at operating temperature. */
  zsAtAmbient: z.boolean().default(true),
  /** Cable ends at the labelling point: a ring final has two. */
  legs: z.number().int().min(1, 'At least one leg').max(8, 'At most 8 legs').default(1),
  notes: text(2000).default(''),
  notesPublic: z.boolean().default(false),
  /** For a sub-main: the board it feeds (a board id in the same organisation). */
  feedsBoardId: z.number().int().positive().nullable().default(null),
});

export const scheduleSchema = z.strictObject({
  board: boardDetailsSchema,
  devices: z.array(deviceSchema).max(2000, 'At most 2000 devices'),
  circuits: z.array(circuitSchema).max(2000, 'At most 2000 circuits'),
});

export type Supply = z.infer<typeof supplySchema>;
export type BoardDetails = z.infer<typeof boardDetailsSchema>;
export type Device = z.infer<typeof deviceSchema>;
export type Cable = z.infer<typeof cableSchema>;
export type Circuit = z.infer<typeof circuitSchema>;
export type Schedule = z.infer<typeof scheduleSchema>;
export type ScheduleInput = z.input<typeof scheduleSchema>;

/** `GET /api/boards/:id/schedule` */
export const scheduleResponseSchema = scheduleSchema.extend({
  id: z.number(),
  revision: z.number().int(),
  updatedAt: z.string(),
  code: z.string(),
  siteId: z.number().nullable(),
});
export type ScheduleResponse = z.infer<typeof scheduleResponseSchema>;

/** `PUT /api/boards/:id/schedule`: the whole schedule and the revision it was edited from. */
export const scheduleSaveSchema = scheduleSchema.extend({
  baseRevision: z.number({ error: 'baseRevision is required' }).int().min(1),
});
export type ScheduleSave = z.infer<typeof scheduleSaveSchema>;

/** The board file: our own documented JSON format, versioned. */
export const BOARD_FILE_FORMAT = 1;
export const boardFileSchema = scheduleSchema.extend({
  format: z.literal(BOARD_FILE_FORMAT, { error: `format must be ${BOARD_FILE_FORMAT}` }),
  kind: z.literal('waymark-board', { error: "kind must be 'waymark-board'" }),
  exportedAt: z.string().optional(),
});
export type BoardFile = z.infer<typeof boardFileSchema>;
