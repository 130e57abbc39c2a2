/**
 * The board page's data: what anyone holding the QR code may read. Built only by
 * `toPublicBoard` (shared/public/board-page.ts), which copies named fields one by one,
 * so a field added to the schedule never reaches the public by accident.
 */
import { z } from 'zod';
import { alternativeSupplyKinds, deviceKinds, earthingArrangements, phases, rcdTypes } from './schedule.js';

const isoDate = z.string().regex(/^\d{4}-\d{2}-\d{2}$/);

/** Which residual-current device turns a way off: a shared RCD (by name) or the way's own RCBO. */
export const publicWayRcdSchema = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('rcd'), name: z.string(), residualMa: z.number().nullable() }),
  z.object({ kind: z.literal('rcbo'), residualMa: z.number().nullable() }),
]);

/**
 * A device as the board page draws it on its row: enough to draw it to scale and to say where it is,
 * nothing else (no id, no test readings). `label` is an RCD's name ("RCD 1") or the device's own label.
 */
export const publicDinDeviceSchema = z.object({
  kind: z.enum(deviceKinds),
  modules: z.number(),
  poles: z.number().int(),
  label: z.string(),
  /** What its face shows, as the editor's picture prints it: "B16" / "63 A", and "30 mA A" or a fuse's standard. */
  face: z.object({ main: z.string(), sub: z.string() }),
});

/** The board's DIN rows, top row first, each device in its order along the rail from the left. */
export const publicDinRowsSchema = z.object({
  modulesPerRow: z.number().int(),
  rows: z.array(z.object({ devices: z.array(publicDinDeviceSchema) })),
});

/** Where a way's device sits: `row` counts from 1 at the top, `index` from 0 at the left of that row's devices. */
export const publicDinPlaceSchema = z.object({ row: z.number().int(), index: z.number().int() });

export const publicWaySchema = z.object({
  /** Null only for a spare way the schedule gives no number. */
  way: z.number().int().nullable(),
  phase: z.enum(phases).nullable(),
  /** As printed on the labels: "7", or "3 L2" on a three-phase board. */
  wayText: z.string(),
  label: z.string(),
  description: z.string(),
  locations: z.array(z.string()),
  /** Device as the trade writes it, e.g. "MCB B32", "RCBO B16 30 mA"; empty when none is recorded. */
  device: z.string(),
  rcd: publicWayRcdSchema.nullable(),
  /** The circuit's notes only when the organisation marked them public, else empty. */
  notes: z.string(),
  /** A sub-main: switching it off or a trip takes everything on the board it feeds with it. */
  feedsAnotherBoard: z.boolean(),
  /** A spare way: a device on the rail that feeds no circuit yet (its label is "Spare"). */
  spare: z.boolean(),
  /** Its device on the board's rows (`dinRows`), or null when the schedule records none. */
  place: publicDinPlaceSchema.nullable(),
});

/** "If RCD 1 trips, these go off." */
export const publicRcdGroupSchema = z.object({
  name: z.string(),
  device: z.string(),
  rcdType: z.enum(rcdTypes).nullable(),
  ways: z.array(z.object({ wayText: z.string(), label: z.string(), feedsAnotherBoard: z.boolean() })),
});

export const publicBoardSchema = z.object({
  board: z.object({ name: z.string(), location: z.string(), phases: z.union([z.literal(1), z.literal(3)]) }),
  contractor: z.object({ name: z.string(), phone: z.string(), email: z.string(), hasLogo: z.boolean() }),
  supply: z.object({
    earthing: z.enum(earthingArrangements),
    /** Nominal voltage to earth as recorded. */
    nominalVoltage: z.number(),
    /** Voltage between phases on a three-phase board (400 for a 230 V supply), else null. */
    betweenPhasesVoltage: z.number().nullable(),
    /** "230 V, single-phase" or "400/230 V (three-phase, 230 V to earth)". */
    voltageText: z.string(),
    ze: z.number().nullable(),
    pfcKa: z.number().nullable(),
    mainSwitchRating: z.number().nullable(),
    alternativeSupply: z.object({ present: z.boolean(), kinds: z.array(z.enum(alternativeSupplyKinds)), description: z.string() }),
  }),
  ways: z.array(publicWaySchema),
  dinRows: publicDinRowsSchema,
  rcdGroups: z.array(publicRcdGroupSchema),
  inspection: z.object({ lastOn: isoDate.nullable(), nextOn: isoDate.nullable() }),
  revision: z.object({ number: z.number().int(), date: isoDate }),
  publicNotes: z.string(),
  /** Safety cautions shown on the page, in the order they are shown. */
  cautions: z.array(z.string()),
});

export type PublicWayRcd = z.infer<typeof publicWayRcdSchema>;
export type PublicWay = z.infer<typeof publicWaySchema>;
export type PublicDinDevice = z.infer<typeof publicDinDeviceSchema>;
export type PublicDinRows = z.infer<typeof publicDinRowsSchema>;
export type PublicDinPlace = z.infer<typeof publicDinPlaceSchema>;
export type PublicRcdGroup = z.infer<typeof publicRcdGroupSchema>;
export type PublicBoard = z.infer<typeof publicBoardSchema>;
