/**
 * The board schedule: the one document everything Waymark prints comes from.
 * Parsed by the server on every save and import, reused by the editor's forms,
 * and the body of the board file (see `boardFileSchema`).
 */
import { z } from 'zod';

import { isoDate, key, positive, singleLine, text } from './fields.js';
import {
  alternativeSupplyKinds,
  breakerCurves,
  cableSchema,
  circuitKinds,
  deviceKinds,
  earthingArrangements,
  EMPTY_CABLE,
  installationTypes,
  phases,
  rcdTypes,
} from './schedule-parts.js';
import { circuitReadingsSchema, fuseStandards, rcdTripTimesSchema, surveySchema } from './survey.js';

export * from './schedule-parts.js';
export { fuseStandards, type FuseStandard } from './survey.js';

/** Most DIN rows a board may have: the schema's limit, which the editor offers in full. */
export const MAX_ROWS = 60;

/**
 * Largest Ze or Zs the schedule takes (Ω). A TT installation's readings include its earth electrode, and
 * BS 7671:2018+A2 Table 41.5 allows up to 1667 Ω for a 30 mA RCD (50 V / 0.03 A), so the cap sits above
 * that, as the survey's readings do; it only catches a slip of the decimal point.
 */
export const LOOP_IMPEDANCE_MAX_OHMS = 2000;

/** Largest design current Ib a circuit may record (A): as large as the largest device rating the schedule takes. */
export const DESIGN_CURRENT_MAX_A = 4000;

/** Longest short label: what fits a way label over one 17.5 mm module at the minimum text size. */
export const SHORT_LABEL_MAX = 24;

export const supplySchema = z.strictObject({
  earthing: z.enum(earthingArrangements),
  nominalVoltage: positive('Nominal voltage', 1000).default(230),
  ze: z
    .number()
    .nonnegative('Ze cannot be negative')
    .max(LOOP_IMPEDANCE_MAX_OHMS, `Ze is at most ${LOOP_IMPEDANCE_MAX_OHMS} Ω: check the decimal point`)
    .nullable()
    .default(null),
  pfcKa: z.number().nonnegative('Fault current cannot be negative').max(100, 'At most 100 kA').nullable().default(null),
  mainSwitchRating: positive('Main switch rating', 4000).nullable().default(null),
  tailsCsa: positive('Tails csa', 1000).nullable().default(null),
  mainEarthCsa: positive('Main earthing conductor csa', 1000).nullable().default(null),
  mainBondingCsa: positive('Main bonding csa', 1000).nullable().default(null),
});

export const boardDetailsSchema = z.strictObject({
  name: singleLine(120).min(1, 'Required'),
  location: singleLine(200).default(''),
  rows: z.number().int('Whole rows only').min(1, 'At least one row').max(MAX_ROWS, `At most ${MAX_ROWS} rows`).default(1),
  modulesPerRow: z.number().int('Whole modules only').min(1, 'At least one module').max(72, 'At most 72 modules').default(18),
  phases: z.union([z.literal(1), z.literal(3)], { error: 'Phases must be 1 or 3' }).default(1),
  installationType: z.enum(installationTypes).default('domestic'),
  supply: supplySchema,
  installedOn: isoDate.nullable().default(null),
  lastInspectionOn: isoDate.nullable().default(null),
  /** Months to the next periodic inspection; null means the usual interval for the installation type. */
  inspectionIntervalMonths: z.number().int().min(1, 'At least one month').max(240, 'At most 240 months').nullable().default(null),
  mixedWiringColours: z.boolean().default(false),
  alternativeSupply: z
    .strictObject({
      present: z.boolean(),
      kinds: z.array(z.enum(alternativeSupplyKinds)).max(5).default([]),
      description: text(200).default(''),
    })
    .default({ present: false, kinds: [], description: '' }),
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
  modules: z
    .number()
    .min(0.5, 'At least half a module')
    .max(12, 'At most 12 modules')
    .refine((m) => Number.isInteger(m * 2), 'Half-module steps only')
    .default(1),
  poles: z.number().int().min(1).max(4).default(1),
  rating: positive('Rating', 4000).nullable().default(null),
  curve: z.enum(breakerCurves).nullable().default(null),
  breakingCapacityKa: positive('Breaking capacity', 100).nullable().default(null),
  residualMa: positive('IΔn', 3000).nullable().default(null),
  rcdType: z.enum(rcdTypes).nullable().default(null),
  /** For a fuse: the standard it is made to (the rules' limits differ by standard). Absent on boards saved before fuses. */
  fuseStandard: z.enum(fuseStandards).nullish(),
  /** For an RCD or RCBO: its measured operating times. */
  rcdTrip: rcdTripTimesSchema.nullish(),
  /** The RCD that protects this device, when the board's rcdMode is 'manual'. */
  protectedBy: key.nullable().default(null),
  /** Own name for the device, e.g. "RCD 1"; blank means a generated one. */
  label: singleLine(24).default(''),
});

export const circuitSchema = z.strictObject({
  id: key,
  way: z.number().int('Whole way numbers only').min(1, 'Ways start at 1').max(2000, 'At most 2000'),
  phase: z.enum(phases).nullable().default(null),
  deviceId: key.nullable().default(null),
  label: singleLine(SHORT_LABEL_MAX).min(1, 'Required'),
  description: text(500).default(''),
  kind: z.enum(circuitKinds).default('other'),
  /**
   * Design current Ib (A): the current the circuit is expected to carry in normal use, for the Ib ≤ In ≤ Iz check
   * (433.1.1) and the voltage drop estimate. Absent or null until recorded, when the device rating In stands in;
   * optional, so documents and board files written before it parse unchanged (no board file format bump).
   */
  designCurrent: positive('Design current', DESIGN_CURRENT_MAX_A).nullish(),
  /** Supplies socket-outlets (so 411.3.3 asks for 30 mA RCD protection up to 32 A). */
  socketOutlets: z.boolean().default(false),
  /** Cable concealed in a wall less than 50 mm deep without mechanical protection (522.6.202/203). */
  concealedInWall: z.boolean().default(false),
  cable: cableSchema.default(() => ({ ...EMPTY_CABLE })),
  points: z.number().int().min(0).max(999).nullable().default(null),
  locations: z.array(singleLine(60).min(1, 'Empty location')).max(20, 'At most 20 locations').default([]),
  /** Way or reference on the board this circuit came from, for replacements. */
  previousReference: singleLine(40).default(''),
  measuredZs: z
    .number()
    .nonnegative('Zs cannot be negative')
    .max(LOOP_IMPEDANCE_MAX_OHMS, `Zs is at most ${LOOP_IMPEDANCE_MAX_OHMS} Ω: check the decimal point`)
    .nullable()
    .default(null),
  /** Measured at ambient temperature (so the 80 % rule of thumb applies) rather than at operating temperature. */
  zsAtAmbient: z.boolean().default(true),
  /** Cable ends at the labelling point: a ring final has two. */
  legs: z.number().int().min(1, 'At least one leg').max(8, 'At most 8 legs').default(1),
  notes: text(2000).default(''),
  notesPublic: z.boolean().default(false),
  /** For a sub-main: the board it feeds (a board id in the same organisation). */
  feedsBoardId: z.number().int().positive().nullable().default(null),
  /** Test readings on the new circuit (Zs stays in `measuredZs`); null until any is taken. */
  readings: circuitReadingsSchema.nullish(),
});

export const scheduleSchema = z.strictObject({
  board: boardDetailsSchema,
  devices: z.array(deviceSchema).max(2000, 'At most 2000 devices'),
  circuits: z.array(circuitSchema).max(2000, 'At most 2000 circuits'),
  /** The survey of the board this one replaces, with its readings and the changeover plan; absent or null when there is none. */
  survey: surveySchema.nullish(),
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

/**
 * `PUT /api/boards/:id/schedule`: the whole schedule and the revision it was edited from. What GET
 * answered can be sent back as it is: its read-only members (id, revision, updatedAt, code, siteId)
 * are accepted and ignored, since the board's id is in the path and the rest is the server's to set.
 */
export const scheduleSaveSchema = scheduleSchema
  .extend({
    baseRevision: z.number({ error: 'baseRevision is required' }).int().min(1),
    id: z.unknown().optional(),
    revision: z.unknown().optional(),
    updatedAt: z.unknown().optional(),
    code: z.unknown().optional(),
    siteId: z.unknown().optional(),
  })
  .transform(({ id: _id, revision: _revision, updatedAt: _updatedAt, code: _code, siteId: _siteId, ...save }) => save);
export type ScheduleSave = z.infer<typeof scheduleSaveSchema>;

/**
 * The board file: our own documented JSON format, versioned. Format 2 added the survey of the old
 * board, fuses and readings; a format 1 file (written before them) is read as it was, every new
 * field taking its default.
 */
export const BOARD_FILE_FORMAT = 2;
/** Formats this version reads. Format 1 files have no survey key, so the schema's defaults read them as they were. */
export const READABLE_BOARD_FILE_FORMATS = [1, BOARD_FILE_FORMAT] as const;
export const boardFileSchema = scheduleSchema.extend({
  format: z.union([z.literal(1), z.literal(BOARD_FILE_FORMAT)], { error: `format must be 1 or ${BOARD_FILE_FORMAT}` }),
  kind: z.literal('waymark-board', { error: "kind must be 'waymark-board'" }),
  exportedAt: z.string().optional(),
});
export type BoardFile = z.infer<typeof boardFileSchema>;
