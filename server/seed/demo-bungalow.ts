/**
 * The demo's changeover job: a 1950s bungalow whose rewireable fuse board is being replaced by an
 * RCBO consumer unit. The old board is surveyed (what each fuse feeds and how that was proved, the
 * cable found, the readings), and each old way is planned onto the new board. Two things are left in
 * on purpose so the before-you-swap findings have something to show: the back-of-house ring's
 * measured Zs passes its old 30 A fuse on the long 5 s basis but not the B32 it is planned onto, and
 * the kitchen radial's neutral-to-earth insulation is low enough to trip the new RCBO. The front
 * ring's second leg does not reach the new board's position and is extended through a junction box.
 * The new board has only its main switch until the plan is applied.
 * The address, people and numbers are invented. No database code here.
 */
import { scheduleSchema, type ScheduleInput } from '../../shared/schemas/schedule.js';
import type { SurveyInput } from '../../shared/schemas/survey.js';
import type { SiteInput } from '../../shared/schemas/site.js';

type SurveyWayInput = SurveyInput['ways'][number];

const te = (liveCsa: number, cpcCsa: number, lengthM: number) => ({ type: 'twin-earth' as const, liveCsa, cpcCsa, referenceMethod: 'C' as const, lengthM });

const rewireable = (rating: number) => ({ kind: 'fuse' as const, fuseStandard: 'BS 3036' as const, rating });

const rcbo = (rating: number) => ({ kind: 'rcbo' as const, rating, curve: 'B' as const, residualMa: 30, rcdType: 'A' as const, rcdGroup: null });

const insulation = (lineEarth: number, neutralEarth: number, lineLine = 200) => ({ testVoltage: 500 as const, lineLine, lineEarth, neutralEarth });

const oldWays: SurveyWayInput[] = [
  {
    id: 'old1',
    reference: 'Fuse 1 (red dot)',
    device: rewireable(30),
    feeds: 'Sockets, front of house: lounge and front bedroom',
    identifiedBy: 'fuse-withdrawn',
    kind: 'ring',
    socketOutlets: true,
    cable: te(2.5, 1.5, 42),
    legs: 2,
    readings: { insulation: insulation(85, 60), ring: { r1: 0.48, rn: 0.49, r2: 0.8 }, r1PlusR2: 0.32, polarity: 'correct', zs: 0.68 },
    action: 'keep',
    targets: [
      { circuitId: 'sockets-front', way: 3, label: 'Sockets front', kind: 'ring', device: rcbo(32), legs: [{ leg: 1 }, { leg: 2, junctionBoxId: 'jb1' }] },
    ],
    notes: 'Leg 2 enters the old board from the loft; it stops short of the new board position by about a metre.',
  },
  {
    id: 'old2',
    reference: 'Fuse 2',
    device: rewireable(30),
    feeds: 'Sockets, back of house: kitchen-diner side wall, back bedroom',
    identifiedBy: 'fuse-withdrawn',
    kind: 'ring',
    socketOutlets: true,
    cable: te(2.5, 1.5, 64),
    legs: 2,
    readings: { insulation: insulation(40, 35), ring: { r1: 0.74, rn: 0.75, r2: 1.24 }, r1PlusR2: 1.28, polarity: 'correct', zs: 1.52 },
    action: 'keep',
    targets: [{ circuitId: 'sockets-back', way: 4, label: 'Sockets back', kind: 'ring', device: rcbo(32), legs: [{ leg: 1 }, { leg: 2 }] }],
    notes: 'Long ring with a spur to the garage; R1+R2 and Zs taken at the garage socket, the far end of the spur. Zs is high for a B32.',
  },
  {
    id: 'old3',
    reference: 'Fuse 3',
    device: rewireable(20),
    feeds: 'Kitchen: washing machine and worktop sockets (radial)',
    identifiedBy: 'traced',
    kind: 'radial',
    socketOutlets: true,
    cable: te(2.5, 1.5, 14),
    legs: 1,
    readings: { insulation: insulation(12, 0.4), r1PlusR2: 0.26, polarity: 'correct', zs: 0.61 },
    action: 'keep',
    targets: [{ circuitId: 'kitchen-radial', way: 5, label: 'Kitchen radial', kind: 'radial', device: rcbo(20), legs: [{ leg: 1 }] }],
    notes: 'N–E reading low: suspect the outside socket by the back door (water in the box).',
  },
  {
    id: 'old4',
    reference: 'Fuse 4',
    device: rewireable(45),
    feeds: 'Cooker point, kitchen',
    identifiedBy: 'fuse-withdrawn',
    kind: 'cooker',
    cable: te(6, 2.5, 9),
    legs: 1,
    readings: { insulation: insulation(150, 120), r1PlusR2: 0.21, polarity: 'correct', zs: 0.56 },
    action: 'keep',
    targets: [{ circuitId: 'cooker', way: 2, label: 'Cooker', kind: 'cooker', device: rcbo(32), legs: [{ leg: 1 }] }],
  },
  {
    id: 'old5',
    reference: 'Fuse 5',
    device: rewireable(5),
    feeds: 'Lights: front rooms and hall',
    identifiedBy: 'fuse-withdrawn',
    kind: 'lighting',
    cable: te(1, 1, 28),
    legs: 1,
    readings: { insulation: insulation(200, 150), r1PlusR2: 0.92, polarity: 'correct', zs: 1.26 },
    action: 'join',
    targets: [{ circuitId: 'lights', way: 6, label: 'Lights', kind: 'lighting', device: rcbo(6), legs: [{ leg: 1 }] }],
  },
  {
    id: 'old6',
    reference: 'Fuse 6',
    device: rewireable(5),
    feeds: 'Lights: kitchen-diner, bathroom and back bedroom',
    identifiedBy: 'breaker-off',
    kind: 'lighting',
    cable: te(1, 1, 24),
    legs: 1,
    readings: { insulation: insulation(180, 160), r1PlusR2: 0.8, polarity: 'correct', zs: 1.14 },
    action: 'join',
    targets: [{ circuitId: 'lights', way: 6, label: 'Lights', kind: 'lighting', device: rcbo(6), legs: [{ leg: 1 }] }],
  },
  {
    id: 'old7',
    reference: 'Fuse 7 (no label)',
    device: rewireable(15),
    feeds: 'Nothing found: cable cut off in the loft',
    identifiedBy: 'not-found',
    kind: 'other',
    cable: te(1.5, 1, 0),
    legs: 1,
    action: 'retire',
    notes: 'Old storage heater feed, disconnected at both ends; remove back to the board.',
  },
];

const bungalow: ScheduleInput = {
  board: {
    name: 'New consumer unit',
    location: 'Hall, above the front door (replaces the fuse board)',
    rows: 1,
    modulesPerRow: 12,
    phases: 1,
    installationType: 'domestic',
    supply: { earthing: 'TN-C-S', nominalVoltage: 230, ze: 0.24, pfcKa: 3.1, mainSwitchRating: 100, tailsCsa: 25, mainEarthCsa: 16, mainBondingCsa: 10 },
    rcdMode: 'manual',
    privateNotes: 'Owner works from home on Wednesdays: agree the power-off window the day before.',
  },
  devices: [{ id: 'main', row: 1, kind: 'main-switch', modules: 2, poles: 2, rating: 100, label: 'Main switch' }],
  circuits: [],
  survey: {
    oldBoard: 'Rewireable fuse board (wooden back, seven fuse carriers), about 1958, hall cupboard',
    surveyedOn: '2026-11-24',
    ze: 0.24,
    ways: oldWays,
    junctionBoxes: [{ id: 'jb1', name: 'JB1', location: 'loft, above the hall' }],
    notes: 'Main bonding to gas and water checked and in place.',
  },
};

export const bungalowSite: SiteInput = {
  reference: 'JOB-2460 Thrushcombe Lane',
  clientName: 'Owen Pellew',
  address: '7 Thrushcombe Lane\nBrackenhurst\nBH4 9QX',
  clientEmail: 'owen.pellew@client.example',
  clientPhone: '01632 960588',
  notes: 'Fuse board change. Survey done; board swap booked for the first week of December.',
};

export const bungalowBoard = { key: 'bungalow', schedule: scheduleSchema.parse(bungalow) };
