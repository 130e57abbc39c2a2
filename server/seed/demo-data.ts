/**
 * The demo's sites and boards as plain data, an invented contractor's two jobs: a ground-floor flat
 * in a converted Victorian terrace (all-RCBO board plus a garden-studio sub-board) and a small joinery
 * workshop on three phases. Every private field is filled so privacy checks have something to hide,
 * and a few findings are left in on purpose so the findings panel has something to show:
 * flat way 5 is an old 2.5 mm² radial re-used on a B32 in an insulated stud wall (method 103), and its
 * Zs sits above the 80 % rule of thumb; the workshop's periodic inspection has fallen due. Flat way 7 records
 * its run through the extension roof insulation, so the capacity check works from the corrected value (and passes).
 * Names, addresses, e-mails (.example) and numbers (01632 96xxxx) are invented. No database code here.
 */
import { scheduleSchema, type Schedule, type ScheduleInput } from '../../shared/schemas/schedule.js';
import type { SiteInput } from '../../shared/schemas/site.js';
import { bungalowBoard, bungalowSite } from './demo-bungalow.js';

export interface DemoBoard {
  /** Stable key inside the demo, so a sub-board can name the board that feeds it. */
  key: string;
  schedule: Schedule;
  /** Key of the board whose sub-main feeds this one; after insert, set that circuit's `feedsBoardId`. */
  feedsFromKey?: string;
  /** Id of the sub-main circuit on the feeding board. */
  feedsFromCircuitId?: string;
}

export interface DemoSite {
  site: SiteInput;
  boards: DemoBoard[];
}

type DeviceInput = ScheduleInput['devices'][number];
type CircuitInput = ScheduleInput['circuits'][number];

const te = (liveCsa: number, cpcCsa: number, referenceMethod: NonNullable<CircuitInput['cable']>['referenceMethod'], lengthM: number) => ({
  type: 'twin-earth' as const,
  liveCsa,
  cpcCsa,
  referenceMethod,
  lengthM,
});

const rcbo = (id: string, rating: number, residualMa = 30, curve: 'B' | 'C' = 'B'): DeviceInput => ({
  id,
  row: 1,
  kind: 'rcbo',
  rating,
  curve,
  breakingCapacityKa: 6,
  residualMa,
  rcdType: 'A',
});

const flatMain: ScheduleInput = {
  board: {
    name: 'Consumer unit',
    location: 'Hall cupboard, under the stairs',
    rows: 1,
    modulesPerRow: 18,
    phases: 1,
    installationType: 'rented-domestic',
    supply: { earthing: 'TN-C-S', nominalVoltage: 230, ze: 0.28, pfcKa: 2.9, mainSwitchRating: 100, tailsCsa: 25, mainEarthCsa: 16, mainBondingCsa: 10 },
    installedOn: '2023-09-18',
    lastInspectionOn: '2023-09-18',
    mixedWiringColours: true,
    privateNotes: 'Key safe by the front door; the letting agent gives the code on the day. Landlord prefers Tuesday morning visits.',
    publicNotes: 'Test each RCBO with its test button every six months. The living-room sockets are original wiring awaiting replacement.',
  },
  devices: [
    { id: 'main', row: 1, kind: 'main-switch', modules: 2, poles: 2, rating: 100, label: 'Main switch' },
    { id: 'spd', row: 1, kind: 'spd', modules: 2, poles: 2, label: 'Surge protection' },
    rcbo('w1', 40),
    rcbo('w2', 16),
    rcbo('w3', 32),
    rcbo('w4', 32),
    rcbo('w5', 32),
    rcbo('w6', 6),
    rcbo('w7', 6),
    rcbo('w8', 32, 100),
    rcbo('w9', 6),
  ],
  circuits: [
    {
      id: 'shower',
      way: 1,
      deviceId: 'w1',
      label: 'Shower',
      description: 'Electric shower, 9.5 kW',
      kind: 'shower',
      concealedInWall: true,
      cable: te(10, 4, 'C', 11),
      points: 1,
      locations: ['Bathroom'],
      measuredZs: 0.46,
    },
    {
      id: 'immersion',
      way: 2,
      deviceId: 'w2',
      label: 'Immersion heater',
      kind: 'immersion',
      cable: te(2.5, 1.5, 'C', 8),
      points: 1,
      locations: ['Airing cupboard'],
      measuredZs: 0.71,
    },
    {
      id: 'ev',
      way: 3,
      deviceId: 'w3',
      label: 'EV charge point',
      description: 'Charge point on the drive, 7 kW, SWA clipped along the side wall',
      kind: 'fixed-appliance',
      cable: { type: 'swa', liveCsa: 6, cpcCsa: 6, referenceMethod: 'C', lengthM: 18 },
      points: 1,
      locations: ['Drive'],
      measuredZs: 0.52,
      notes: 'The charge point has its own DC fault detection; the RCBO is type A.',
      notesPublic: true,
    },
    {
      id: 'kitchen',
      way: 4,
      deviceId: 'w4',
      label: 'Kitchen sockets',
      kind: 'ring',
      socketOutlets: true,
      concealedInWall: true,
      legs: 2,
      cable: te(2.5, 1.5, 'C', 38),
      points: 7,
      locations: ['Kitchen'],
      measuredZs: 0.74,
    },
    {
      id: 'living',
      way: 5,
      deviceId: 'w5',
      label: 'Living room sockets',
      description: 'Original radial in the insulated stud wall behind the TV',
      kind: 'radial',
      socketOutlets: true,
      concealedInWall: true,
      cable: te(2.5, 1.5, '103', 16),
      points: 4,
      locations: ['Living room'],
      previousReference: 'Old board way 3',
      measuredZs: 1.21,
      notes: 'Re-used on a B32 when the board was changed. Quote for a new 4 mm² radial sent to the landlord; awaiting reply.',
      notesPublic: false,
    },
    {
      id: 'lights-front',
      way: 6,
      deviceId: 'w6',
      label: 'Lights front',
      kind: 'lighting',
      cable: te(1.5, 1, '100', 21),
      points: 9,
      locations: ['Hall', 'Living room', 'Bedroom 1'],
      measuredZs: 1.38,
    },
    {
      id: 'lights-rear',
      way: 7,
      deviceId: 'w7',
      label: 'Lights rear',
      description: 'Crosses the kitchen extension roof void, buried in the loft insulation for about 2 m',
      kind: 'lighting',
      cable: { ...te(1.5, 1, '100', 17), insulatedLengthMm: 2000 },
      points: 7,
      locations: ['Kitchen', 'Bathroom', 'Bedroom 2'],
      measuredZs: 1.12,
    },
    {
      id: 'studio',
      way: 8,
      deviceId: 'w8',
      label: 'Garden studio',
      description: 'Sub-main to the studio board, SWA buried across the garden',
      kind: 'sub-main',
      cable: { type: 'swa', liveCsa: 6, cpcCsa: 6, referenceMethod: 'D', lengthM: 24 },
      locations: ['Garden', 'Studio'],
      measuredZs: 0.61,
    },
    {
      id: 'alarms',
      way: 9,
      deviceId: 'w9',
      label: 'Smoke and heat alarms',
      kind: 'other',
      cable: te(1.5, 1, '100', 14),
      points: 4,
      locations: ['Hall', 'Kitchen', 'Bedroom 1', 'Bedroom 2'],
      measuredZs: 1.05,
    },
  ],
};

const flatStudio: ScheduleInput = {
  board: {
    name: 'Studio board',
    location: 'Garden studio, left of the door',
    rows: 1,
    modulesPerRow: 8,
    phases: 1,
    installationType: 'rented-domestic',
    supply: { earthing: 'TN-C-S', nominalVoltage: 230, ze: 0.61, mainSwitchRating: 63 },
    installedOn: '2023-09-18',
    lastInspectionOn: '2023-09-18',
    privateNotes: 'Tenant uses the studio for pottery; a kiln is planned. Ask about its rating before quoting.',
  },
  devices: [{ id: 'iso', row: 1, kind: 'isolator', modules: 2, poles: 2, rating: 63, label: 'Isolator' }, rcbo('s1', 20), rcbo('s2', 6), rcbo('s3', 16)],
  circuits: [
    {
      id: 'studio-sockets',
      way: 1,
      deviceId: 's1',
      label: 'Studio sockets',
      kind: 'radial',
      socketOutlets: true,
      cable: te(2.5, 1.5, 'C', 9),
      points: 4,
      locations: ['Studio'],
      measuredZs: 0.92,
    },
    {
      id: 'studio-lights',
      way: 2,
      deviceId: 's2',
      label: 'Studio lights',
      kind: 'lighting',
      cable: te(1.5, 1, 'C', 12),
      points: 4,
      locations: ['Studio'],
      measuredZs: 1.24,
    },
    {
      id: 'studio-heater',
      way: 3,
      deviceId: 's3',
      label: 'Studio heater',
      kind: 'fixed-appliance',
      cable: te(2.5, 1.5, 'C', 6),
      points: 1,
      locations: ['Studio'],
      measuredZs: 0.88,
      notes: 'Heater is on a wall timer the tenant fitted; check it at the next visit.',
      notesPublic: false,
    },
  ],
};

const workshop: ScheduleInput = {
  board: {
    name: 'Workshop distribution board',
    location: 'Workshop, north wall beside the roller door',
    rows: 2,
    modulesPerRow: 18,
    phases: 3,
    installationType: 'industrial',
    supply: { earthing: 'TN-S', nominalVoltage: 230, ze: 0.21, pfcKa: 6.4, mainSwitchRating: 100, tailsCsa: 25, mainEarthCsa: 16, mainBondingCsa: 10 },
    installedOn: '2019-03-04',
    lastInspectionOn: '2022-11-08',
    privateNotes: 'Side-door alarm code is held by the office manager; phone before arriving.',
    publicNotes: 'Machines have local isolators: lock off at the machine as well as here before any work on them.',
  },
  devices: [
    { id: 'main', row: 1, kind: 'main-switch', modules: 4, poles: 4, rating: 100, label: 'Main switch' },
    { id: 'w1', row: 1, kind: 'mcb', modules: 3, poles: 3, rating: 20, curve: 'C', breakingCapacityKa: 10 },
    { id: 'w2', row: 1, kind: 'mcb', modules: 3, poles: 3, rating: 16, curve: 'D', breakingCapacityKa: 10 },
    { id: 'w3', row: 1, kind: 'mcb', modules: 3, poles: 3, rating: 20, curve: 'C', breakingCapacityKa: 10 },
    ...[rcbo('w4L1', 20), rcbo('w4L2', 32), rcbo('w4L3', 10), rcbo('w5L1', 6), rcbo('w5L2', 20), { ...rcbo('w5L3', 16), label: 'Spare' }].map((d) => ({
      ...d,
      row: 2,
    })),
  ],
  circuits: [
    {
      id: 'extractor',
      way: 1,
      deviceId: 'w1',
      label: 'Dust extractor',
      description: 'Three-phase dust extractor, 4 kW',
      kind: 'fixed-appliance',
      cable: { type: 'swa', liveCsa: 4, referenceMethod: 'C', lengthM: 14 },
      points: 1,
      locations: ['Workshop'],
      measuredZs: 0.55,
      notes: 'Local isolator beside the extractor: lock it off before clearing the impeller.',
      notesPublic: true,
    },
    {
      id: 'saw',
      way: 2,
      deviceId: 'w2',
      label: 'Table saw',
      description: 'Three-phase table saw, 3 kW, D curve for the start-up current',
      kind: 'fixed-appliance',
      cable: { type: 'swa', liveCsa: 2.5, referenceMethod: 'C', lengthM: 9 },
      points: 1,
      locations: ['Workshop'],
      measuredZs: 0.49,
    },
    {
      id: 'compressor',
      way: 3,
      deviceId: 'w3',
      label: 'Compressor',
      kind: 'fixed-appliance',
      cable: { type: 'swa', liveCsa: 4, referenceMethod: 'C', lengthM: 11 },
      points: 1,
      locations: ['Compressor bay'],
      measuredZs: 0.58,
    },
    {
      id: 'office-sockets',
      way: 4,
      phase: 'L1',
      deviceId: 'w4L1',
      label: 'Office sockets',
      kind: 'radial',
      socketOutlets: true,
      cable: te(2.5, 1.5, 'C', 18),
      points: 6,
      locations: ['Office'],
      measuredZs: 0.79,
    },
    {
      id: 'bench-sockets',
      way: 4,
      phase: 'L2',
      deviceId: 'w4L2',
      label: 'Bench sockets',
      kind: 'ring',
      socketOutlets: true,
      legs: 2,
      cable: { type: 'singles-conduit', liveCsa: 2.5, cpcCsa: 2.5, referenceMethod: 'B', lengthM: 42 },
      points: 8,
      locations: ['Workshop'],
      measuredZs: 0.83,
    },
    {
      id: 'shop-lights',
      way: 4,
      phase: 'L3',
      deviceId: 'w4L3',
      label: 'Workshop lights',
      kind: 'lighting',
      cable: { type: 'singles-conduit', liveCsa: 1.5, cpcCsa: 1.5, referenceMethod: 'B', lengthM: 32 },
      points: 10,
      locations: ['Workshop'],
      measuredZs: 1.45,
    },
    {
      id: 'office-lights',
      way: 5,
      phase: 'L1',
      deviceId: 'w5L1',
      label: 'Office lights',
      kind: 'lighting',
      cable: te(1.5, 1, '100', 15),
      points: 5,
      locations: ['Office', 'Kitchenette'],
      measuredZs: 1.31,
    },
    {
      id: 'welfare',
      way: 5,
      phase: 'L2',
      deviceId: 'w5L2',
      label: 'Kitchenette sockets',
      kind: 'radial',
      socketOutlets: true,
      cable: te(2.5, 1.5, 'C', 10),
      points: 3,
      locations: ['Kitchenette'],
      measuredZs: 0.74,
      notes: 'Client asked for a second kettle point; not quoted yet.',
      notesPublic: false,
    },
  ],
};

/** The demo's three sites, each with its boards (the bungalow's changeover is in demo-bungalow.ts); the studio board is fed from the flat's way 8. */
export const demoSites: DemoSite[] = [
  {
    site: {
      reference: 'JOB-2417 Larkspur Terrace',
      clientName: 'Harriet Quennell (landlord)',
      address: 'Ground floor flat, 27 Larkspur Terrace, Wrenfold QX4 7LT',
      clientEmail: 'harriet.quennell@lettings.example',
      clientPhone: '01632 960217',
      notes: 'Tenant Oskar Varga (01632 960583) lets us in. Park on the drive, not the street.',
    },
    boards: [
      { key: 'flat-main', schedule: scheduleSchema.parse(flatMain) },
      { key: 'flat-studio', schedule: scheduleSchema.parse(flatStudio), feedsFromKey: 'flat-main', feedsFromCircuitId: 'studio' },
    ],
  },
  {
    site: {
      reference: 'JOB-2431 Tanners Yard',
      clientName: 'Ewan Darrow (Pell & Darrow Joinery)',
      address: 'Unit 4, Tanners Yard, Mill Lane, Kestley Bridge QX9 2RD',
      clientEmail: 'ewan@pelldarrow.example',
      clientPhone: '01632 960744',
      notes: 'Dusty workshop: wear a mask when the board is open. Invoices to the office, not the workshop.',
    },
    boards: [{ key: 'workshop', schedule: scheduleSchema.parse(workshop) }],
  },
  { site: bungalowSite, boards: [bungalowBoard] },
];
