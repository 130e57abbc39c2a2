/**
 * Built-in starting layouts: a new board begins as one of these and the electrician edits it to
 * match what is on the wall. Each returns a complete schedule the schema accepts, with typical
 * circuits; reference methods, lengths and test results are left for the electrician to record.
 */
import { z } from 'zod';
import { scheduleSchema, type Schedule, type ScheduleInput } from '../schemas/schedule.js';

export const templateIds = ['split-load-10', 'dual-rcd-18', 'all-rcbo-12', 'three-phase-12'] as const;
export type TemplateId = (typeof templateIds)[number];
/** For request bodies that name a starting layout, e.g. `POST /api/boards {template}`. */
export const templateIdSchema = z.enum(templateIds, { error: `template must be one of ${templateIds.join(', ')}` });

export interface TemplateInfo {
  id: TemplateId;
  name: string;
  description: string;
}

/** The layouts as the "new board" picker lists them. */
export const scheduleTemplates: readonly TemplateInfo[] = [
  {
    id: 'split-load-10',
    name: '10-way split-load',
    description: 'Domestic consumer unit: main switch, two 30 mA RCDs sharing ten MCB ways, lighting split across both.',
  },
  {
    id: 'dual-rcd-18',
    name: '18-way dual-RCD',
    description: 'Larger home on two rows: main switch and RCD 1 on row 1, RCD 2 on row 2, nine ways behind each.',
  },
  { id: 'all-rcbo-12', name: '12-way all-RCBO', description: 'Main switch, surge protection and twelve 30 mA RCBOs, so one fault trips one circuit only.' },
  {
    id: 'three-phase-12',
    name: '3-phase 12-way',
    description: 'Three-phase board for a small commercial unit: four-pole main switch, three-phase machine ways, single-phase RCBO ways on L1–L3.',
  },
];

type DeviceSpec = ScheduleInput['devices'][number];
type CircuitSpec = ScheduleInput['circuits'][number];

/** Typical cable for each circuit use (common practice: BS 7671 Appendix 15 / On-Site Guide arrangements). */
const USES = {
  ring: { kind: 'ring', socketOutlets: true, legs: 2, cable: { liveCsa: 2.5, cpcCsa: 1.5 }, rating: 32 },
  radialSockets: { kind: 'radial', socketOutlets: true, cable: { liveCsa: 2.5, cpcCsa: 1.5 }, rating: 20 },
  lighting: { kind: 'lighting', cable: { liveCsa: 1.5, cpcCsa: 1.0 }, rating: 6 },
  cooker: { kind: 'cooker', cable: { liveCsa: 6, cpcCsa: 2.5 }, rating: 32 },
  shower: { kind: 'shower', cable: { liveCsa: 10, cpcCsa: 4 }, rating: 40 },
  immersion: { kind: 'immersion', cable: { liveCsa: 2.5, cpcCsa: 1.5 }, rating: 16 },
  fixed: { kind: 'fixed-appliance', cable: { liveCsa: 1.5, cpcCsa: 1.0 }, rating: 6 },
  smoke: { kind: 'other', cable: { liveCsa: 1.5, cpcCsa: 1.0 }, rating: 6 },
} as const;
type Use = keyof typeof USES;

/** A way: its number, short label, use and the rooms it serves. */
type WaySpec = [way: number, label: string, use: Use, locations?: string[]];

function circuitFor([way, label, use, locations = []]: WaySpec, deviceId: string, phase: CircuitSpec['phase'] = null): CircuitSpec {
  const { rating: _rating, cable, ...rest } = USES[use];
  return { id: `c${way}${phase ?? ''}`, way, phase, deviceId, label, locations, ...rest, cable: { type: 'twin-earth', ...cable } };
}

function breaker(id: string, row: number, kind: 'mcb' | 'rcbo', rating: number, curve: 'B' | 'C' | 'D' = 'B'): DeviceSpec {
  return kind === 'rcbo'
    ? { id, row, kind, rating, curve, breakingCapacityKa: 6, residualMa: 30, rcdType: 'A' }
    : { id, row, kind, rating, curve, breakingCapacityKa: 6 };
}

const mainSwitch = (row: number, poles = 2, rating = 100): DeviceSpec => ({
  id: 'main',
  row,
  kind: 'main-switch',
  modules: poles,
  poles,
  rating,
  label: 'Main switch',
});
const rcd = (n: number, row: number): DeviceSpec => ({
  id: `rcd${n}`,
  row,
  kind: 'rcd',
  modules: 2,
  poles: 2,
  rating: 80,
  residualMa: 30,
  rcdType: 'A',
  label: `RCD ${n}`,
});

/** MCB ways on a row: a breaker per way, a circuit for each way that has a use, the rest spare. */
function mcbWays(row: number, ways: WaySpec[], spares: number[]): { devices: DeviceSpec[]; circuits: CircuitSpec[] } {
  const devices: DeviceSpec[] = [];
  const circuits: CircuitSpec[] = [];
  for (const spec of ways) {
    devices.push(breaker(`w${spec[0]}`, row, 'mcb', USES[spec[2]].rating));
    circuits.push(circuitFor(spec, `w${spec[0]}`));
  }
  for (const way of spares) devices.push({ ...breaker(`w${way}`, row, 'mcb', 16), label: 'Spare' });
  return { devices, circuits };
}

function board(name: string, location: string, extra: Partial<ScheduleInput['board']> = {}): ScheduleInput['board'] {
  return {
    name,
    location,
    supply: { earthing: 'TN-C-S', nominalVoltage: 230, mainSwitchRating: 100, tailsCsa: 25, mainEarthCsa: 16, mainBondingCsa: 10 },
    ...extra,
  };
}

function splitLoad10(name: string, location: string): ScheduleInput {
  const a = mcbWays(
    1,
    [
      [1, 'Cooker', 'cooker', ['Kitchen']],
      [2, 'Kitchen sockets', 'ring', ['Kitchen']],
      [3, 'Downstairs sockets', 'ring', ['Lounge', 'Dining room']],
      [4, 'Downstairs lights', 'lighting', ['Hall', 'Lounge', 'Kitchen']],
      [5, 'Smoke alarms', 'smoke', ['Hall', 'Landing']],
    ],
    [],
  );
  const b = mcbWays(
    1,
    [
      [6, 'Shower', 'shower', ['Bathroom']],
      [7, 'Upstairs sockets', 'ring', ['Bedrooms']],
      [8, 'Immersion heater', 'immersion', ['Airing cupboard']],
      [9, 'Upstairs lights', 'lighting', ['Landing', 'Bedrooms', 'Bathroom']],
    ],
    [10],
  );
  return {
    board: board(name, location, { rows: 1, modulesPerRow: 18 }),
    devices: [mainSwitch(1), rcd(1, 1), ...a.devices, rcd(2, 1), ...b.devices],
    circuits: [...a.circuits, ...b.circuits],
  };
}

function dualRcd18(name: string, location: string): ScheduleInput {
  const a = mcbWays(
    1,
    [
      [1, 'Kitchen sockets', 'ring', ['Kitchen']],
      [2, 'Cooker', 'cooker', ['Kitchen']],
      [3, 'Utility sockets', 'radialSockets', ['Utility room']],
      [4, 'Ground floor lights', 'lighting', ['Hall', 'Lounge', 'Kitchen']],
      [5, 'Ground floor sockets', 'ring', ['Lounge', 'Dining room']],
      [6, 'Outside lights', 'lighting', ['Garden']],
      [7, 'Boiler', 'fixed', ['Kitchen']],
    ],
    [8, 9],
  );
  const b = mcbWays(
    2,
    [
      [10, 'Shower', 'shower', ['Bathroom']],
      [11, 'First floor sockets', 'ring', ['Bedrooms']],
      [12, 'First floor lights', 'lighting', ['Landing', 'Bedrooms']],
      [13, 'Immersion heater', 'immersion', ['Airing cupboard']],
      [14, 'Smoke alarms', 'smoke', ['Hall', 'Landing']],
      [15, 'Garage sockets', 'radialSockets', ['Garage']],
      [16, 'Loft lights', 'lighting', ['Loft']],
    ],
    [17, 18],
  );
  return {
    board: board(name, location, { rows: 2, modulesPerRow: 14 }),
    devices: [mainSwitch(1), rcd(1, 1), ...a.devices, rcd(2, 2), ...b.devices],
    circuits: [...a.circuits, ...b.circuits],
  };
}

function allRcbo12(name: string, location: string): ScheduleInput {
  const ways: WaySpec[] = [
    [1, 'Kitchen sockets', 'ring', ['Kitchen']],
    [2, 'Cooker', 'cooker', ['Kitchen']],
    [3, 'Ground floor sockets', 'ring', ['Lounge']],
    [4, 'Ground floor lights', 'lighting', ['Hall', 'Lounge', 'Kitchen']],
    [5, 'First floor sockets', 'ring', ['Bedrooms']],
    [6, 'First floor lights', 'lighting', ['Landing', 'Bedrooms']],
    [7, 'Shower', 'shower', ['Bathroom']],
    [8, 'Immersion heater', 'immersion', ['Airing cupboard']],
    [9, 'Smoke alarms', 'smoke', ['Hall', 'Landing']],
    [10, 'Boiler', 'fixed', ['Kitchen']],
    [11, 'Outside sockets', 'radialSockets', ['Garden']],
  ];
  const devices: DeviceSpec[] = [mainSwitch(1), { id: 'spd', row: 1, kind: 'spd', modules: 2, poles: 2, label: 'Surge protection' }];
  for (const spec of ways) devices.push(breaker(`w${spec[0]}`, 1, 'rcbo', USES[spec[2]].rating));
  devices.push({ ...breaker('w12', 1, 'rcbo', 16), label: 'Spare' });
  return { board: board(name, location, { rows: 1, modulesPerRow: 18 }), devices, circuits: ways.map((spec) => circuitFor(spec, `w${spec[0]}`)) };
}

function threePhase12(name: string, location: string): ScheduleInput {
  const machines: Array<[number, string, number]> = [
    [1, 'Machine 1', 20],
    [2, 'Machine 2', 16],
    [3, 'Machine 3', 20],
    [4, 'Machine 4', 32],
  ];
  const devices: DeviceSpec[] = [mainSwitch(1, 4, 100)];
  const circuits: CircuitSpec[] = [];
  for (const [way, label, rating] of machines) {
    devices.push({ ...breaker(`w${way}`, 1, 'mcb', rating, 'C'), modules: 3, poles: 3, breakingCapacityKa: 10 });
    circuits.push({
      id: `c${way}`,
      way,
      deviceId: `w${way}`,
      label,
      kind: 'fixed-appliance',
      locations: ['Workshop'],
      cable: { type: 'swa', liveCsa: rating > 20 ? 6 : 4 },
    });
  }
  const single: Array<[number, 'L1' | 'L2' | 'L3', string, Use, string]> = [
    [5, 'L1', 'Office sockets', 'radialSockets', 'Office'],
    [5, 'L2', 'Office lights', 'lighting', 'Office'],
    [5, 'L3', 'Workshop sockets', 'ring', 'Workshop'],
    [6, 'L1', 'Workshop lights', 'lighting', 'Workshop'],
    [6, 'L2', 'Welfare sockets', 'radialSockets', 'Kitchenette'],
  ];
  for (let way = 5; way <= 9; way++) {
    for (const phase of ['L1', 'L2', 'L3'] as const) {
      const spec = single.find(([w, p]) => w === way && p === phase);
      const id = `w${way}${phase}`;
      devices.push(spec ? breaker(id, 2, 'rcbo', USES[spec[3]].rating) : { ...breaker(id, 2, 'rcbo', 16), label: 'Spare' });
      if (spec) circuits.push(circuitFor([way, spec[2], spec[3], [spec[4]]], id, phase));
    }
  }
  for (let i = 0; i < 9; i++) devices.push({ id: `blank${i + 1}`, row: 3, kind: 'blank' });
  const details = board(name, location, { rows: 3, modulesPerRow: 16, phases: 3, installationType: 'commercial' });
  return { board: { ...details, supply: { ...details.supply, earthing: 'TN-S', mainSwitchRating: 100 } }, devices, circuits };
}

const BUILDERS: Record<TemplateId, (name: string, location: string) => ScheduleInput> = {
  'split-load-10': splitLoad10,
  'dual-rcd-18': dualRcd18,
  'all-rcbo-12': allRcbo12,
  'three-phase-12': threePhase12,
};

/** A complete schedule for a starting layout, named as the user asked. */
export function buildTemplate(id: TemplateId, details: { name?: string; location?: string } = {}): Schedule {
  const info = scheduleTemplates.find((t) => t.id === id)!;
  return scheduleSchema.parse(BUILDERS[id](details.name || info.name, details.location ?? ''));
}
