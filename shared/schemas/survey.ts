/**
 * The changeover of an old board: what was found on the board being replaced (its ways, devices,
 * what each feeds and how that was proved), the readings taken on it, the junction boxes where a
 * cable is extended to reach the new board, and the plan from each old way to the new board's ways.
 * It lives in the new board's schedule (`schedule.survey`), so revisions, 409s, the board file and
 * the CSV carry it like every other part of the board.
 */
import { z } from 'zod';
import { breakerCurves, cableSchema, circuitKinds, EMPTY_CABLE, phases, rcdTypes } from './schedule-parts.js';
import { key, singleLine, text } from './fields.js';

/** Fuse standards a fuse device can be: semi-enclosed (rewireable), cartridge to BS 88-2 / 88-3, plug-top BS 1362. */
export const fuseStandards = ['BS 3036', 'BS 88-2', 'BS 88-3', 'BS 1362'] as const;
export type FuseStandard = (typeof fuseStandards)[number];

/** What protected an old way. `rcbo` and `mcb` are the old board's own breakers, kept or not. */
export const oldDeviceKinds = ['fuse', 'mcb', 'rcbo', 'none'] as const;
export type OldDeviceKind = (typeof oldDeviceKinds)[number];

/** How the electrician proved what an old way feeds. */
export const identificationMethods = ['fuse-withdrawn', 'breaker-off', 'traced', 'as-labelled', 'not-found'] as const;
export type IdentificationMethod = (typeof identificationMethods)[number];

/** Insulation resistance test voltages (V d.c.) of BS 7671 Table 64. */
export const insulationTestVoltages = [250, 500, 1000] as const;
export type InsulationTestVoltage = (typeof insulationTestVoltages)[number];

const ohmsReading = (label: string, max: number) =>
  z
    .number({ error: `${label} must be a number` })
    .nonnegative(`${label} cannot be negative`)
    .max(max, `${label} is at most ${max}`)
    .nullable()
    .default(null);

/** Insulation resistance in MΩ; a meter's "over range" is recorded as its top value (e.g. 999). */
export const insulationReadingsSchema = z.strictObject({
  testVoltage: z
    .union([z.literal(250), z.literal(500), z.literal(1000)], { error: 'Test voltage is 250, 500 or 1000 V' })
    .nullable()
    .default(null),
  lineLine: ohmsReading('L–L insulation resistance', 10_000),
  lineEarth: ohmsReading('L–E insulation resistance', 10_000),
  neutralEarth: ohmsReading('N–E insulation resistance', 10_000),
});

/** End-to-end resistances of a ring final's three conductors (Ω), before cross-connecting. */
export const ringReadingsSchema = z.strictObject({
  r1: ohmsReading('Ring r1', 100),
  rn: ohmsReading('Ring rn', 100),
  r2: ohmsReading('Ring r2', 100),
});

/** Readings taken on one circuit, old or new. Every value is null until measured. */
export const circuitReadingsSchema = z.strictObject({
  insulation: insulationReadingsSchema.default(() => ({ testVoltage: null, lineLine: null, lineEarth: null, neutralEarth: null })),
  r1PlusR2: ohmsReading('R1+R2', 100),
  r2: ohmsReading('R2', 100),
  ring: ringReadingsSchema.default(() => ({ r1: null, rn: null, r2: null })),
  polarity: z.enum(['correct', 'incorrect']).nullable().default(null),
  /** Measured earth fault loop impedance (Ω); TT installations read high (Table 41.5 allows up to 1667 Ω at 30 mA). */
  zs: ohmsReading('Zs', 2000),
});
export type CircuitReadings = z.infer<typeof circuitReadingsSchema>;
export const EMPTY_READINGS: CircuitReadings = {
  insulation: { testVoltage: null, lineLine: null, lineEarth: null, neutralEarth: null },
  r1PlusR2: null,
  r2: null,
  ring: { r1: null, rn: null, r2: null },
  polarity: null,
  zs: null,
};

const tripMs = (label: string) =>
  z
    .number({ error: `${label} must be a number` })
    .nonnegative(`${label} cannot be negative`)
    .max(5000, `${label} is at most 5000 ms`)
    .nullable()
    .default(null);

/** An RCD's measured operating times (ms) at its rated residual current and at five times it. */
export const rcdTripTimesSchema = z.strictObject({
  atRated: tripMs('Trip time at IΔn'),
  atFiveTimes: tripMs('Trip time at 5 × IΔn'),
});
export type RcdTripTimes = z.infer<typeof rcdTripTimesSchema>;

/** The protective device found on an old way. */
export const oldDeviceSchema = z.strictObject({
  kind: z.enum(oldDeviceKinds).default('fuse'),
  fuseStandard: z.enum(fuseStandards).nullable().default(null),
  rating: z.number({ error: 'Rating must be a number' }).positive('Rating must be above zero').max(4000, 'Rating is at most 4000').nullable().default(null),
  curve: z.enum(breakerCurves).nullable().default(null),
  /** Residual-current protection found on the way (an old RCBO, or the RCD ahead of it), mA. */
  residualMa: z.number().positive('IΔn must be above zero').max(3000, 'IΔn is at most 3000').nullable().default(null),
  rcdType: z.enum(rcdTypes).nullable().default(null),
  rcdTrip: rcdTripTimesSchema.default(() => ({ atRated: null, atFiveTimes: null })),
});
export type OldDevice = z.infer<typeof oldDeviceSchema>;

/** A junction box where a cable is extended to reach the new board, e.g. "JB1" under the stairs. */
export const junctionBoxSchema = z.strictObject({
  id: key,
  name: singleLine(12).min(1, 'Required'),
  location: singleLine(60).default(''),
});
export type JunctionBox = z.infer<typeof junctionBoxSchema>;

/** What becomes of an old way on the new board. */
export const planActions = ['keep', 'split', 'join', 'retire', 'spare'] as const;
export type PlanAction = (typeof planActions)[number];

/** The protective device a planned way gets on the new board. */
export const plannedDeviceSchema = z.strictObject({
  kind: z.enum(['mcb', 'rcbo']).default('rcbo'),
  rating: z.number({ error: 'Rating must be a number' }).positive('Rating must be above zero').max(125, 'Rating is at most 125 A').nullable().default(null),
  curve: z.enum(breakerCurves).nullable().default('B'),
  residualMa: z.number().positive('IΔn must be above zero').max(3000, 'IΔn is at most 3000').nullable().default(30),
  rcdType: z.enum(rcdTypes).nullable().default('A'),
  /** For an MCB: the name of the RCD on the new board that covers it ("RCD 1"); null for none. */
  rcdGroup: singleLine(24).nullable().default(null),
});
export type PlannedDevice = z.infer<typeof plannedDeviceSchema>;

/** One cable leg of an old way as it reaches the new board: direct, or through a junction box. */
export const plannedLegSchema = z.strictObject({
  /** Which of the old way's legs this is (1 and 2 for a ring's); a target naming no legs takes them all when it is the only one. */
  leg: z.number().int().min(1, 'Legs start at 1').max(8, 'At most 8 legs'),
  /** The junction box the leg is extended through; null when the old cable reaches the new board. */
  junctionBoxId: key.nullable().default(null),
});
export type PlannedLeg = z.infer<typeof plannedLegSchema>;

/** A new way an old way's cables go to. Several old ways naming one `circuitId` are joined. */
export const plannedWaySchema = z.strictObject({
  /** The id of the circuit this creates or updates on the new board. */
  circuitId: key,
  way: z.number().int('Whole way numbers only').min(1, 'Ways start at 1').max(2000, 'At most 2000'),
  phase: z.enum(phases).nullable().default(null),
  label: text(24).min(1, 'Required'),
  kind: z.enum(circuitKinds).default('other'),
  device: plannedDeviceSchema.default(() => ({
    kind: 'rcbo' as const,
    rating: null,
    curve: 'B' as const,
    residualMa: 30,
    rcdType: 'A' as const,
    rcdGroup: null,
  })),
  legs: z.array(plannedLegSchema).max(8, 'At most 8 legs').default([]),
});
export type PlannedWay = z.infer<typeof plannedWaySchema>;

/** One way of the old board as found, with its readings and its plan. */
export const surveyWaySchema = z.strictObject({
  id: key,
  /** The way's reference as found: "3", "Fuse 2", "Upstairs lights". */
  reference: singleLine(40).min(1, 'Required'),
  device: oldDeviceSchema.default(() => oldDeviceSchema.parse({})),
  /** What it was found to feed, in the electrician's words. */
  feeds: text(200).default(''),
  identifiedBy: z.enum(identificationMethods).nullable().default(null),
  kind: z.enum(circuitKinds).default('other'),
  socketOutlets: z.boolean().default(false),
  cable: cableSchema.default(() => ({ ...EMPTY_CABLE })),
  /** Cable legs at the old board: a ring has two. */
  legs: z.number().int().min(1, 'At least one leg').max(8, 'At most 8 legs').default(1),
  readings: circuitReadingsSchema.default(() => structuredClone(EMPTY_READINGS)),
  action: z.enum(planActions).nullable().default(null),
  /** The new ways it goes to: one to keep, several to split; none when retired or spare. */
  targets: z.array(plannedWaySchema).max(12, 'At most 12 new ways from one old way').default([]),
  notes: text(1000).default(''),
});
export type SurveyWay = z.infer<typeof surveyWaySchema>;

/** The survey of the board this one replaces. */
export const surveySchema = z.strictObject({
  /** How the old board was described: "Rewireable fuse board, 1950s, under the stairs". */
  oldBoard: text(200).default(''),
  surveyedOn: z
    .string()
    .regex(/^\d{4}-\d{2}-\d{2}$/, 'Use the form YYYY-MM-DD')
    .nullable()
    .default(null),
  /** Ze measured at the old board's origin, Ω. */
  ze: ohmsReading('Ze', 2000),
  ways: z.array(surveyWaySchema).max(200, 'At most 200 old ways'),
  junctionBoxes: z.array(junctionBoxSchema).max(50, 'At most 50 junction boxes').default([]),
  notes: text(2000).default(''),
});
export type Survey = z.infer<typeof surveySchema>;
export type SurveyInput = z.input<typeof surveySchema>;
