/**
 * An invented board for the print engine's tests: Brightwell & Daughters Electrical's consumer
 * unit at 7 Wren Close (all names made up). `boardSchedule(n)` builds n circuits for the
 * 100- and 1000-circuit cases; `tenCircuitBoard()` is the everyday board.
 */
import { scheduleSchema, type Circuit, type Device, type Schedule, type ScheduleInput } from '../../../shared/schemas/schedule.js';
import type { Finding } from '../../../shared/rules/types.js';
import type { BoardMeta, Contractor, Medium, RenderRequest } from '../../../server/pdf/types.js';
import type { PrintOptions, PrintOutput } from '../../../shared/schemas/print.js';
import { resolveMedium } from '../../../server/pdf/index.js';

export const BOARD_URL = 'https://waymark.example/b/q7Hc2mXr9LpT4vNs8KdW1a';

export const board: BoardMeta = {
  id: 41,
  code: 'WM-3F7K',
  publicUrl: BOARD_URL,
  publicEnabled: true,
  revision: 6,
  revisionDate: '2025-02-14',
  nextInspectionOn: '2030-02-10',
};

export const contractor: Contractor = { name: 'Brightwell & Daughters Electrical', phone: '01632 960418', email: 'office@brightwell-electrical.example' };

const tenCircuits: Array<Omit<ScheduleInput['circuits'][number], 'id' | 'way'>> = [
  {
    label: 'Kitchen sockets',
    kind: 'ring',
    description: 'Ring final serving the kitchen worktop sockets, the fridge spur and the dishwasher spur under the sink',
    locations: ['Kitchen', 'Utility'],
    socketOutlets: true,
    cable: { type: 'twin-earth', liveCsa: 2.5, cpcCsa: 1.5, referenceMethod: 'C', lengthM: 38, diameterMm: null },
    measuredZs: 0.62,
    points: 9,
  },
  {
    label: 'Downstairs sockets',
    kind: 'ring',
    description: 'Lounge, dining room and hall',
    locations: ['Lounge', 'Dining room', 'Hall'],
    socketOutlets: true,
    cable: { type: 'twin-earth', liveCsa: 2.5, cpcCsa: 1.5, referenceMethod: 'C', lengthM: 44, diameterMm: null },
    measuredZs: 0.71,
  },
  {
    label: 'Downstairs lights',
    kind: 'lighting',
    description: 'Ceiling roses, wall lights and the porch light',
    locations: ['Ground floor'],
    cable: { type: 'twin-earth', liveCsa: 1.5, cpcCsa: 1, referenceMethod: '102', lengthM: 30, diameterMm: null },
    measuredZs: 1.12,
  },
  {
    label: 'Cooker',
    kind: 'cooker',
    description: 'Cooker control unit beside the hob',
    locations: ['Kitchen'],
    cable: { type: 'twin-earth', liveCsa: 6, cpcCsa: 2.5, referenceMethod: 'C', lengthM: 9, diameterMm: null },
    measuredZs: 0.41,
  },
  {
    label: 'Upstairs sockets',
    kind: 'ring',
    description: 'Bedrooms 1–3 and landing',
    locations: ['Bedroom 1', 'Bedroom 2', 'Bedroom 3', 'Landing'],
    socketOutlets: true,
    cable: { type: 'twin-earth', liveCsa: 2.5, cpcCsa: 1.5, referenceMethod: 'C', lengthM: 52, diameterMm: null },
    measuredZs: 0.84,
  },
  {
    label: 'Upstairs lights',
    kind: 'lighting',
    description: 'Bedrooms, landing and the loft hatch light',
    locations: ['First floor', 'Loft'],
    cable: { type: 'twin-earth', liveCsa: 1, cpcCsa: 1, referenceMethod: '103', lengthM: 34, diameterMm: null },
    measuredZs: 1.9,
  },
  {
    label: 'Shower',
    kind: 'shower',
    description: 'Electric shower 9.5 kW via pull-cord isolator',
    locations: ['Bathroom'],
    cable: { type: 'twin-earth', liveCsa: 10, cpcCsa: 4, referenceMethod: 'C', lengthM: 14, diameterMm: null },
    measuredZs: 0.38,
  },
  {
    label: 'Immersion heater',
    kind: 'immersion',
    description: 'Cylinder cupboard, 3 kW element',
    locations: ['Airing cupboard'],
    cable: { type: 'flex', liveCsa: 2.5, cpcCsa: 2.5, referenceMethod: 'C', lengthM: 11, diameterMm: null },
    measuredZs: 0.77,
  },
  {
    label: 'Garage (SWA)',
    kind: 'sub-main',
    description: 'Sub-main to the detached garage board, buried at 600 mm',
    locations: ['Garage'],
    cable: { type: 'swa', liveCsa: 6, cpcCsa: 6, referenceMethod: 'D', lengthM: 22, diameterMm: null },
    measuredZs: 0.55,
  },
  {
    label: 'Café lights Ω²±',
    kind: 'lighting',
    description: 'Garden room: façade lights, ≤ 30 mA RCBO, Δ-test done',
    locations: ['Garden room'],
    cable: { type: 'twin-earth', liveCsa: 1.5, cpcCsa: 1, referenceMethod: 'C', lengthM: 18, diameterMm: null },
    measuredZs: 1.44,
  },
];

const tenDevices: ScheduleInput['devices'] = [
  { id: 'ms', row: 1, kind: 'main-switch', modules: 2, poles: 2, rating: 100 },
  { id: 'rcd1', row: 1, kind: 'rcd', modules: 2, poles: 2, rating: 63, residualMa: 30, rcdType: 'A' },
  { id: 'd1', row: 1, kind: 'mcb', rating: 32, curve: 'B', breakingCapacityKa: 6 },
  { id: 'd2', row: 1, kind: 'mcb', rating: 32, curve: 'B', breakingCapacityKa: 6 },
  { id: 'd3', row: 1, kind: 'mcb', rating: 6, curve: 'B', breakingCapacityKa: 6 },
  { id: 'd4', row: 1, kind: 'mcb', rating: 32, curve: 'B', breakingCapacityKa: 6 },
  { id: 'rcd2', row: 1, kind: 'rcd', modules: 2, poles: 2, rating: 63, residualMa: 30, rcdType: 'A' },
  { id: 'd5', row: 1, kind: 'mcb', rating: 32, curve: 'B', breakingCapacityKa: 6 },
  { id: 'd6', row: 1, kind: 'mcb', rating: 6, curve: 'B', breakingCapacityKa: 6 },
  { id: 'd7', row: 1, kind: 'mcb', rating: 40, curve: 'B', breakingCapacityKa: 6 },
  { id: 'd8', row: 1, kind: 'mcb', rating: 16, curve: 'B', breakingCapacityKa: 6 },
  { id: 'd9', row: 2, kind: 'rcbo', rating: 32, curve: 'C', residualMa: 30, rcdType: 'A', breakingCapacityKa: 6 },
  { id: 'd10', row: 2, kind: 'rcbo', modules: 0.5, rating: 6, curve: 'B', residualMa: 30, rcdType: 'A' },
  { id: 'spd', row: 2, kind: 'spd', modules: 2 },
  { id: 'b1', row: 2, kind: 'blank', modules: 1 },
];

/** The everyday board: 10 circuits on two DIN rows, two RCDs, two RCBOs, a sub-main in SWA. */
export function tenCircuitBoard(): Schedule {
  return scheduleSchema.parse({
    board: {
      name: 'Main consumer unit',
      location: 'Under the stairs, 7 Wren Close, Ashby Marsh',
      rows: 2,
      modulesPerRow: 18,
      installationType: 'domestic',
      supply: { earthing: 'TN-C-S', nominalVoltage: 230, ze: 0.21, pfcKa: 1.9, mainSwitchRating: 100, tailsCsa: 25, mainEarthCsa: 16, mainBondingCsa: 10 },
      installedOn: '2019-05-02',
      lastInspectionOn: '2025-02-10',
    },
    devices: tenDevices,
    circuits: tenCircuits.map((c, i) => ({ id: `c${i + 1}`, way: i + 1, deviceId: `d${i + 1}`, legs: c.kind === 'ring' ? 2 : 1, ...c })),
  } satisfies ScheduleInput);
}

const labels = ['Kitchen sockets', 'Lounge lights', 'Bedroom 2 radial', 'Loft sockets', 'Workshop 3-phase', 'Boiler spur', 'Hall lights', 'Office radial'];

/** `n` circuits, each on its own RCBO, 18 modules a row (rows beyond 12 are fine for the engine). */
export function boardSchedule(n: number): Schedule {
  const base = tenCircuitBoard();
  const devices: Device[] = [];
  const circuits: Circuit[] = [];
  for (let i = 0; i < n; i++) {
    devices.push({
      id: `r${i + 1}`,
      row: Math.floor(i / 18) + 1,
      kind: 'rcbo',
      modules: 1,
      poles: 1,
      rating: [6, 16, 20, 32][i % 4],
      curve: 'B',
      breakingCapacityKa: 6,
      residualMa: 30,
      rcdType: 'A',
      protectedBy: null,
      label: '',
    });
    circuits.push({
      ...base.circuits[i % 10],
      id: `k${i + 1}`,
      way: i + 1,
      deviceId: `r${i + 1}`,
      label: `${labels[i % labels.length]} ${i + 1}`,
      description: i % 3 === 0 ? 'Serves the sockets along the north wall and the spur to the extractor above the hob in the rear extension' : 'Radial circuit',
    });
  }
  return { ...base, board: { ...base.board, rows: Math.ceil(n / 18) }, devices, circuits };
}

export const findings: Finding[] = [
  {
    severity: 'info',
    rule: 'Common practice',
    ways: [3, 6],
    message: 'The two lighting circuits are behind different RCDs, so one trip does not leave the whole house dark.',
    code: 'lighting-split',
  },
  {
    severity: 'warning',
    rule: 'BS 7671 Table 41.3',
    ways: [8],
    message: 'Way 8: Zs was measured cold; compare it with 80 % of the maximum rather than the maximum itself.',
    code: 'zs-ambient',
  },
];

/** Maximum Zs for each circuit's device, 0.4 s. // BS 7671:2018+A2 Table 41.3 */
export const maxZsByCircuit: Record<string, number | null> = {
  c1: 1.37,
  c2: 1.37,
  c3: 7.28,
  c4: 1.37,
  c5: 1.37,
  c6: 7.28,
  c7: 1.09,
  c8: 2.73,
  c9: 0.68,
  c10: 7.28,
};

/** A render request for the ten-circuit board, ready to tweak. */
export function request<O extends PrintOutput>(
  output: O,
  mediaId: string,
  options: Partial<PrintOptions[O]> = {},
  schedule: Schedule = tenCircuitBoard(),
  medium?: Medium,
): RenderRequest<O> {
  return {
    output,
    medium: medium ?? resolveMedium(mediaId),
    options: options as PrintOptions[O],
    schedule,
    board,
    contractor,
    findings,
    offset: { xMm: 0, yMm: 0 },
    maxZsByCircuit,
  };
}
