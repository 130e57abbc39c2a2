/**
 * fast-check generators for schedules the schema accepts: small boards (up to 12 devices and 12
 * circuits on a handful of ids, so ways, devices and RCD links collide often) with every kind, cable,
 * reading and supply the rules look at. Shared by the rule and editor property tests.
 */
import fc from 'fast-check';
import {
  breakerCurves,
  cableTypes,
  circuitKinds,
  deviceKinds,
  installationTypes,
  phases,
  rcdTypes,
  referenceMethods,
  scheduleSchema,
  earthingArrangements,
  type Schedule,
} from '../../shared/schemas/schedule.js';

const ids = fc.constantFrom('a', 'b', 'c', 'd', 'e', 'f');
const maybe = <T>(arb: fc.Arbitrary<T>) => fc.option(arb, { nil: null });
export const date = fc.integer({ min: Date.UTC(1990, 0, 1), max: Date.UTC(2040, 11, 31) }).map((t) => new Date(t).toISOString().slice(0, 10));
const csa = fc.constantFrom(0.5, 1, 1.5, 2.5, 4, 6, 10, 16, 25, 35, 630);
const rating = fc.constantFrom(1, 6, 10, 13, 16, 20, 25, 30, 32, 33, 40, 63, 80, 125, 400, 4000);

const device = fc.record({
  id: ids,
  row: fc.integer({ min: 1, max: 12 }),
  kind: fc.constantFrom(...deviceKinds),
  modules: fc.integer({ min: 1, max: 24 }).map((n) => n / 2),
  poles: fc.integer({ min: 1, max: 4 }),
  rating: maybe(rating),
  curve: maybe(fc.constantFrom(...breakerCurves)),
  breakingCapacityKa: maybe(fc.constantFrom(6, 10)),
  residualMa: maybe(fc.constantFrom(10, 30, 100, 300, 3000, 7)),
  rcdType: maybe(fc.constantFrom(...rcdTypes)),
  protectedBy: maybe(ids),
  label: fc.constantFrom('', 'RCD A'),
});

export const circuit = fc.record({
  id: ids,
  way: fc.integer({ min: 1, max: 40 }),
  phase: maybe(fc.constantFrom(...phases)),
  deviceId: maybe(ids),
  label: fc.constantFrom('Sockets', 'Lights', 'Way'),
  kind: fc.constantFrom(...circuitKinds),
  socketOutlets: fc.boolean(),
  concealedInWall: fc.boolean(),
  cable: fc.record({
    type: fc.constantFrom(...cableTypes),
    liveCsa: maybe(csa),
    cpcCsa: maybe(csa),
    referenceMethod: maybe(fc.constantFrom(...referenceMethods)),
    lengthM: maybe(fc.double({ min: 0, max: 2000, noNaN: true })),
    diameterMm: fc.constant(null),
    ambientC: maybe(fc.double({ min: -30, max: 90, noNaN: true })),
    groupedWith: maybe(fc.integer({ min: 1, max: 100 })),
    insulatedLengthMm: maybe(fc.oneof(fc.constantFrom(0, 50, 450, 500), fc.double({ min: 0, max: 100_000, noNaN: true }))),
  }),
  measuredZs: maybe(fc.double({ min: 0, max: 200, noNaN: true })),
  zsAtAmbient: fc.boolean(),
  legs: fc.integer({ min: 1, max: 8 }),
  feedsBoardId: maybe(fc.integer({ min: 1, max: 99 })),
});

export const schedule: fc.Arbitrary<Schedule> = fc
  .record({
    board: fc.record({
      name: fc.constant('Board'),
      rows: fc.integer({ min: 1, max: 12 }),
      modulesPerRow: fc.integer({ min: 1, max: 72 }),
      phases: fc.constantFrom(1 as const, 3 as const),
      installationType: fc.constantFrom(...installationTypes),
      rcdMode: fc.constantFrom('position' as const, 'manual' as const),
      installedOn: maybe(date),
      lastInspectionOn: maybe(date),
      inspectionIntervalMonths: maybe(fc.integer({ min: 1, max: 240 })),
      supply: fc.record({
        earthing: fc.constantFrom(...earthingArrangements),
        nominalVoltage: fc.constantFrom(110, 230, 240, 400, 1000),
        ze: maybe(fc.double({ min: 0, max: 200, noNaN: true })),
        pfcKa: maybe(fc.constantFrom(0, 3, 6, 6.4, 16, 25)), // reaches the breaking-capacity check on either side of 6 and 16 kA
      }),
    }),
    devices: fc.array(device, { maxLength: 12 }),
    circuits: fc.array(circuit, { maxLength: 12 }),
  })
  .map((input) => scheduleSchema.parse(input));
