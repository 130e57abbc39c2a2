/**
 * The circuit chart's columns and what each cell says, as paragraphs (bold first line, detail
 * after). BS 7671 514.9.1 wants, per circuit, its type, points served, conductors and wiring type,
 * and how each protective device is identified: the columns follow that.
 */
import { deviceKindName, feedsAnotherBoard, hasOwnRcd, rcdFor, rcdNames, wayText } from '../../../../shared/schedule/derive.js';
import type { SpareWay } from '../../../../shared/schedule/ways.js';
import type { Circuit, Device, Schedule } from '../../../../shared/schemas/schedule.js';
import { GREY, RED, type Color, type FontFace } from '../../model.js';

export interface Paragraph {
  text: string;
  face: FontFace;
  color?: Color;
}

/** Facts every row needs, computed once per chart (not per row). */
export interface ChartFacts {
  devices: Map<string, Device>;
  rcds: Map<string, Device | null>;
  rcdNames: Map<string, string>;
  maxZs: Record<string, number | null> | undefined;
}

export interface Column {
  header: string;
  weight: number;
  maxLines: number;
  cell: (c: Circuit, f: ChartFacts) => Paragraph[];
}

export function chartFacts(schedule: Schedule, maxZs: Record<string, number | null> | undefined): ChartFacts {
  return { devices: new Map(schedule.devices.map((d) => [d.id, d])), rcds: rcdFor(schedule), rcdNames: rcdNames(schedule), maxZs };
}

const CABLE_NAMES: Record<Circuit['cable']['type'], string> = {
  'twin-earth': 'Twin & earth',
  swa: 'SWA',
  'singles-conduit': 'Singles in conduit',
  flex: 'Flex',
  other: 'Other',
};
const dash = (): Paragraph[] => [{ text: '—', face: 'regular', color: GREY }];
/**
 * Ohms as a chart prints them: two decimals for the small values of TN circuits, fewer as values
 * grow, whole ohms from 100 Ω (a TT circuit's 50 V / 30 mA = 1667 Ω, not "1666.67").
 */
export const ohms = (v: number | null | undefined) => (v == null ? null : v >= 100 ? Math.round(v).toFixed(0) : v >= 10 ? v.toFixed(1) : v.toFixed(2));

function deviceCell(c: Pick<Circuit, 'deviceId'>, f: ChartFacts): Paragraph[] {
  const d = c.deviceId ? f.devices.get(c.deviceId) : undefined;
  if (!d) return dash();
  const main = `${d.curve ?? ''}${d.rating ?? ''}` || deviceKindName(d);
  const detail = [deviceKindName(d), d.poles > 1 ? `${d.poles}-pole` : '', d.breakingCapacityKa ? `${d.breakingCapacityKa} kA` : '']
    .filter(Boolean)
    .join(' · ');
  return [
    { text: main, face: 'bold' },
    { text: detail, face: 'regular' },
  ];
}

function rcdCell(c: Pick<Circuit, 'deviceId'>, f: ChartFacts): Paragraph[] {
  const rcd = c.deviceId ? f.rcds.get(c.deviceId) : null;
  if (!rcd) return [{ text: 'None', face: 'regular', color: GREY }];
  const name = hasOwnRcd(rcd) ? (rcd.kind === 'afdd' ? 'AFDD/RCBO' : 'RCBO') : (f.rcdNames.get(rcd.id) ?? 'RCD');
  const details = [rcd.residualMa != null ? `${rcd.residualMa} mA` : '', rcd.rcdType ? `Type ${rcd.rcdType}` : ''].filter(Boolean);
  return [{ text: name, face: 'bold' }, ...details.map((text) => ({ text, face: 'regular' as const }))];
}

function cableCell(c: Circuit): Paragraph[] {
  const k = c.cable;
  const size = k.liveCsa != null ? `${k.liveCsa}${k.cpcCsa != null ? `/${k.cpcCsa}` : ''} mm²` : 'Size not recorded';
  const detail = [CABLE_NAMES[k.type], k.referenceMethod ? `method ${k.referenceMethod}` : '', k.lengthM != null ? `${k.lengthM} m` : '']
    .filter(Boolean)
    .join(' · ');
  return [
    { text: size, face: k.liveCsa != null ? 'bold' : 'regular' },
    { text: detail, face: 'regular' },
  ];
}

function zsCell(c: Circuit, f: ChartFacts): Paragraph[] {
  const measured = ohms(c.measuredZs);
  if (measured == null) return dash();
  const max = f.maxZs?.[c.id];
  const over = max != null && c.measuredZs! > max;
  return over
    ? [
        { text: measured, face: 'bold', color: RED },
        { text: 'over max', face: 'regular', color: RED },
      ]
    : [{ text: measured, face: 'regular' }];
}

function circuitCell(c: Circuit): Paragraph[] {
  return [
    { text: c.label, face: 'bold' },
    // Switching this way off (or a trip) turns off the whole board it feeds, not one circuit.
    ...(feedsAnotherBoard(c) ? [{ text: 'Feeds another board', face: 'bold' as const }] : []),
    ...(c.description ? [{ text: c.description, face: 'regular' as const }] : []),
  ];
}

/** Column order and relative widths (the way column is fixed-width). */
export const chartColumns: Column[] = [
  { header: 'Way', weight: 0, maxLines: 2, cell: (c) => [{ text: wayText(c), face: 'bold' }] },
  { header: 'Circuit', weight: 34, maxLines: 12, cell: circuitCell },
  {
    header: 'Locations',
    weight: 17,
    maxLines: 6,
    cell: (c) => [
      ...(c.locations.length ? [{ text: c.locations.join(', '), face: 'regular' as const }] : []),
      ...(c.points != null ? [{ text: `${c.points} point${c.points === 1 ? '' : 's'}`, face: 'regular' as const, color: GREY }] : []),
    ],
  },
  { header: 'Device', weight: 13, maxLines: 4, cell: deviceCell },
  { header: 'RCD', weight: 12, maxLines: 3, cell: rcdCell },
  { header: 'Cable', weight: 17, maxLines: 4, cell: cableCell },
  {
    header: 'Max Zs (Ω)',
    weight: 9,
    maxLines: 2,
    cell: (c, f) => {
      const v = ohms(f.maxZs?.[c.id]);
      return v ? [{ text: v, face: 'regular' }] : dash();
    },
  },
  { header: 'Zs (Ω)', weight: 8.5, maxLines: 3, cell: zsCell },
];

/**
 * A spare way's row: its number, "Spare", and the device waiting on the rail (with its RCD, since
 * whoever puts a circuit on it needs to know); nothing else is known of a way with no circuit.
 */
export function spareRow(s: SpareWay, f: ChartFacts): Paragraph[][] {
  const at = { deviceId: s.device.id };
  const cells: Record<string, Paragraph[]> = {
    Way: s.wayText ? [{ text: s.wayText, face: 'bold' }] : dash(),
    Circuit: [{ text: 'Spare', face: 'bold' }],
    Device: deviceCell(at, f),
    RCD: rcdCell(at, f),
  };
  return chartColumns.map((col) => cells[col.header] ?? []);
}
