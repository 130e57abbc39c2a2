/**
 * Synthetic boards of any size for the benchmark: realistic circuits cycled from a small
 * mix (sockets, lighting, cooker, shower), each on its own RCBO, spread over as many rows as needed.
 */
import type { Circuit, Device, Schedule } from '../shared/schemas/schedule.js';
import { scheduleSchema } from '../shared/schemas/schedule.js';

const MIX: Array<Pick<Circuit, 'kind' | 'label' | 'socketOutlets'> & { rating: number; live: number; cpc: number }> = [
  { kind: 'ring', label: 'Sockets', socketOutlets: true, rating: 32, live: 2.5, cpc: 1.5 },
  { kind: 'lighting', label: 'Lights', socketOutlets: false, rating: 6, live: 1.5, cpc: 1.0 },
  { kind: 'radial', label: 'Radial sockets', socketOutlets: true, rating: 20, live: 2.5, cpc: 1.5 },
  { kind: 'cooker', label: 'Cooker', socketOutlets: false, rating: 32, live: 6, cpc: 2.5 },
];
const ROOMS = ['Kitchen', 'Hall', 'Landing', 'Bedroom 1', 'Bedroom 2', 'Lounge', 'Garage', 'Utility', 'Office', 'Loft'];

export function syntheticSchedule(circuitCount: number): Schedule {
  const perRow = 18;
  const devices: Device[] = [];
  const circuits: Circuit[] = [];
  for (let i = 0; i < circuitCount; i++) {
    const m = MIX[i % MIX.length];
    const room = ROOMS[i % ROOMS.length];
    devices.push({ id: `d${i + 1}`, row: Math.floor(i / perRow) + 1, kind: 'rcbo', modules: 1, poles: 1, rating: m.rating, curve: 'B', breakingCapacityKa: 6, residualMa: 30, rcdType: 'A', protectedBy: null, label: '' });
    circuits.push(scheduleSchema.shape.circuits.element.parse({
      id: `c${i + 1}`, way: i + 1, deviceId: `d${i + 1}`, label: `${room} ${m.label}`.slice(0, 24),
      description: `${m.label} serving the ${room.toLowerCase()} and the rooms beside it, way ${i + 1}`,
      kind: m.kind, socketOutlets: m.socketOutlets, legs: m.kind === 'ring' ? 2 : 1,
      cable: { type: 'twin-earth', liveCsa: m.live, cpcCsa: m.cpc, referenceMethod: 'C', lengthM: 12 + (i % 20) },
      locations: [room], measuredZs: 0.4 + (i % 7) * 0.1, points: 4 + (i % 6),
    }));
  }
  return scheduleSchema.parse({
    board: {
      name: `Benchmark board ${circuitCount}`, location: 'Plant room', rows: Math.max(1, Math.ceil(circuitCount / perRow)), modulesPerRow: perRow,
      supply: { earthing: 'TN-C-S', ze: 0.35, pfcKa: 1.6, mainSwitchRating: 100, tailsCsa: 25, mainEarthCsa: 16, mainBondingCsa: 10 },
      lastInspectionOn: '2026-01-15',
    },
    devices,
    circuits,
  });
}
