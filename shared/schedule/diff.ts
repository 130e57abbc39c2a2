/**
 * What changed between two versions of a schedule, for revision summaries, the history view and
 * "changed since last print". Circuits and devices are matched by id, so renumbering a way or
 * moving a device reads as a change, not as one removed and one added.
 */
import type { BoardDetails, Circuit, Device, Schedule } from '../schemas/schedule.js';
import { deviceKindName, deviceShortText, rcdNames, wayText } from './derive.js';

export interface ScheduleChange {
  /** Field path: board fields as `board.supply.ze`; devices and circuits by their index in the newer schedule (the older one when removed). */
  path: string;
  kind: 'added' | 'removed' | 'changed';
  before?: unknown;
  after?: unknown;
  /** One plain phrase, e.g. "way 7 renamed Garage sockets". */
  text: string;
}

export interface ScheduleDiff {
  changes: ScheduleChange[];
  /** The phrases joined, e.g. "way 7 renamed Garage sockets; RCD 2 added; supply Ze 0.35 → 0.28 Ω", or "No changes". */
  summary: string;
}

/** How a field is named and its values written; `quiet` fields say "changed" without printing long or private text. */
interface FieldText {
  label: string;
  unit?: string;
  quiet?: boolean;
}

const BOARD_FIELDS: Partial<Record<keyof BoardDetails, FieldText>> = {
  name: { label: 'board name' },
  location: { label: 'board location' },
  rows: { label: 'rows' },
  modulesPerRow: { label: 'modules per row' },
  phases: { label: 'phases' },
  installationType: { label: 'installation type' },
  installedOn: { label: 'installation date' },
  lastInspectionOn: { label: 'last inspection' },
  inspectionIntervalMonths: { label: 'inspection interval', unit: 'months' },
  mixedWiringColours: { label: 'mixed wiring colours' },
  alternativeSupply: { label: 'alternative supply', quiet: true },
  rcdMode: { label: 'RCD assignment' },
  privateNotes: { label: 'private notes', quiet: true },
  publicNotes: { label: 'public notes', quiet: true },
};

const SUPPLY_FIELDS: Record<keyof BoardDetails['supply'], FieldText> = {
  earthing: { label: 'supply earthing' },
  nominalVoltage: { label: 'supply voltage', unit: 'V' },
  ze: { label: 'supply Ze', unit: 'Ω' },
  pfcKa: { label: 'prospective fault current', unit: 'kA' },
  mainSwitchRating: { label: 'main switch rating', unit: 'A' },
  tailsCsa: { label: 'tails', unit: 'mm²' },
  mainEarthCsa: { label: 'main earthing conductor', unit: 'mm²' },
  mainBondingCsa: { label: 'main bonding', unit: 'mm²' },
};

const DEVICE_FIELDS: Partial<Record<keyof Device, FieldText>> = {
  row: { label: 'row' },
  kind: { label: 'kind' },
  modules: { label: 'width', unit: 'modules' },
  poles: { label: 'poles' },
  rating: { label: 'rating', unit: 'A' },
  curve: { label: 'curve' },
  breakingCapacityKa: { label: 'breaking capacity', unit: 'kA' },
  residualMa: { label: 'IΔn', unit: 'mA' },
  rcdType: { label: 'RCD type' },
  protectedBy: { label: 'RCD' },
};

const CIRCUIT_FIELDS: Partial<Record<keyof Circuit, FieldText>> = {
  phase: { label: 'phase' },
  description: { label: 'description', quiet: true },
  kind: { label: 'kind' },
  socketOutlets: { label: 'socket-outlets' },
  concealedInWall: { label: 'concealed in wall' },
  points: { label: 'points' },
  locations: { label: 'locations' },
  previousReference: { label: 'old board reference' },
  measuredZs: { label: 'measured Zs', unit: 'Ω' },
  zsAtAmbient: { label: 'Zs measured cold' },
  legs: { label: 'cable legs' },
  notes: { label: 'notes', quiet: true },
  notesPublic: { label: 'notes public' },
  feedsBoardId: { label: 'board fed', quiet: true },
};

const CABLE_FIELDS: Record<keyof Circuit['cable'], FieldText> = {
  type: { label: 'cable type' },
  liveCsa: { label: 'live csa', unit: 'mm²' },
  cpcCsa: { label: 'cpc csa', unit: 'mm²' },
  referenceMethod: { label: 'reference method' },
  lengthM: { label: 'route length', unit: 'm' },
  diameterMm: { label: 'cable diameter', unit: 'mm' },
  ambientC: { label: 'ambient temperature', unit: '°C' },
  groupedWith: { label: 'circuits grouped' },
  insulatedLengthMm: { label: 'length in insulation', unit: 'mm' },
};

const SUMMARY_MAX_PHRASES = 8;

/**
 * Pairs items of `b` with items of `a` by id. Ids should be unique, but a schedule the schema
 * accepts may repeat one, so the n-th item with an id pairs with the n-th of the other side.
 */
function pairById<T extends { id: string }>(a: T[], b: T[]): { matched: Array<T | undefined>; removed: number[] } {
  const queues = new Map<string, number[]>();
  a.forEach((item, i) => queues.set(item.id, [...(queues.get(item.id) ?? []), i]));
  const matched = b.map((item) => {
    const i = queues.get(item.id)?.shift();
    return i === undefined ? undefined : a[i];
  });
  return { matched, removed: [...queues.values()].flat().sort((x, y) => x - y) };
}

function same(a: unknown, b: unknown): boolean {
  return JSON.stringify(a) === JSON.stringify(b);
}

function show(value: unknown, unit?: string): string {
  if (value === null || value === undefined || value === '') return 'none';
  if (typeof value === 'boolean') return value ? 'yes' : 'no';
  if (Array.isArray(value)) return value.length ? value.join(', ') : 'none';
  return unit ? `${value} ${unit}` : String(value);
}

/** "supply Ze 0.35 → 0.28 Ω", "supply Ze set to 0.28 Ω", "private notes changed". */
function phrase(subject: string, field: FieldText, before: unknown, after: unknown): string {
  const label = `${subject}${subject ? ' ' : ''}${field.label}`;
  if (field.quiet) return `${label} changed`;
  const empty = (v: unknown) => v === null || v === undefined || v === '' || (Array.isArray(v) && v.length === 0);
  if (empty(before)) return `${label} set to ${show(after, field.unit)}`;
  if (empty(after)) return `${label} cleared (was ${show(before, field.unit)})`;
  if (field.unit && typeof before === 'number' && typeof after === 'number') return `${label} ${before} → ${after} ${field.unit}`;
  return `${label} ${show(before, field.unit)} → ${show(after, field.unit)}`;
}

function compareFields<T extends object>(path: string, subject: string, fields: Partial<Record<keyof T, FieldText>>, a: T, b: T): ScheduleChange[] {
  const out: ScheduleChange[] = [];
  for (const key of Object.keys(fields) as Array<keyof T>) {
    const before = a[key];
    const after = b[key];
    if (same(before, after)) continue;
    out.push({ path: `${path}.${String(key)}`, kind: 'changed', before, after, text: phrase(subject, fields[key]!, before, after) });
  }
  return out;
}

function boardChanges(a: BoardDetails, b: BoardDetails): ScheduleChange[] {
  return [...compareFields('board', '', BOARD_FIELDS, a, b), ...compareFields('board.supply', '', SUPPLY_FIELDS, a.supply, b.supply)];
}

/** "RCD 2", "MCB B32", or the device's own label. */
function deviceTitle(d: Device, rcds: Map<string, string>): string {
  if (d.kind === 'rcd') return rcds.get(d.id) ?? 'RCD';
  return d.label || [deviceKindName(d), d.kind === 'rcbo' || d.kind === 'mcb' ? deviceShortText(d) : ''].filter(Boolean).join(' ');
}

function deviceChanges(a: Schedule, b: Schedule): ScheduleChange[] {
  const namesA = rcdNames(a);
  const namesB = rcdNames(b);
  const { matched, removed } = pairById(a.devices, b.devices);
  const out: ScheduleChange[] = [];
  b.devices.forEach((d, i) => {
    const old = matched[i];
    const title = deviceTitle(d, namesB);
    if (!old) {
      out.push({ path: `devices.${i}`, kind: 'added', after: d, text: `${title} added` });
      return;
    }
    if (old.label !== d.label)
      out.push({
        path: `devices.${i}.label`,
        kind: 'changed',
        before: old.label,
        after: d.label,
        text: d.label ? `${deviceTitle(old, namesA)} renamed ${d.label}` : `${deviceTitle(old, namesA)} label cleared`,
      });
    // Named as it was, so "MCB B40 rating 40 → 32 A" says which device changed.
    out.push(...compareFields(`devices.${i}`, deviceTitle(old, namesA), DEVICE_FIELDS, old, d));
  });
  for (const i of removed) out.push({ path: `devices.${i}`, kind: 'removed', before: a.devices[i], text: `${deviceTitle(a.devices[i], namesA)} removed` });
  return [...out, ...reorderings(a, b)];
}

/** Order along a row matters (it sets RCD groups on split-load boards), so a reordering is a change. */
function reorderings(a: Schedule, b: Schedule): ScheduleChange[] {
  const rows = new Set(b.devices.map((d) => d.row));
  const out: ScheduleChange[] = [];
  for (const row of [...rows].sort((x, y) => x - y)) {
    const idsB = b.devices.filter((d) => d.row === row).map((d) => d.id);
    const idsA = a.devices.filter((d) => d.row === row && idsB.includes(d.id)).map((d) => d.id);
    const commonB = idsB.filter((id) => idsA.includes(id));
    if (!same(idsA, commonB)) out.push({ path: 'devices', kind: 'changed', before: idsA, after: commonB, text: `devices reordered on row ${row}` });
  }
  return out;
}

function deviceTextOf(s: Schedule, id: string | null): string {
  const d = id ? s.devices.find((x) => x.id === id) : undefined;
  return d ? deviceShortText(d) || deviceKindName(d) : 'none';
}

function circuitChanges(a: Schedule, b: Schedule): ScheduleChange[] {
  const { matched, removed } = pairById(a.circuits, b.circuits);
  const out: ScheduleChange[] = [];
  b.circuits.forEach((c, i) => {
    const old = matched[i];
    const way = `way ${wayText(c)}`;
    if (!old) {
      out.push({ path: `circuits.${i}`, kind: 'added', after: c, text: `${way} added (${c.label})` });
      return;
    }
    if (old.way !== c.way)
      out.push({ path: `circuits.${i}.way`, kind: 'changed', before: old.way, after: c.way, text: `way ${wayText(old)} moved to way ${c.way}` });
    if (old.label !== c.label) out.push({ path: `circuits.${i}.label`, kind: 'changed', before: old.label, after: c.label, text: `${way} renamed ${c.label}` });
    const devA = deviceTextOf(a, old.deviceId);
    const devB = deviceTextOf(b, c.deviceId);
    if (old.deviceId !== c.deviceId)
      out.push({ path: `circuits.${i}.deviceId`, kind: 'changed', before: old.deviceId, after: c.deviceId, text: `${way} device ${devA} → ${devB}` });
    out.push(...compareFields(`circuits.${i}`, way, CIRCUIT_FIELDS, old, c));
    out.push(...compareFields(`circuits.${i}.cable`, way, CABLE_FIELDS, old.cable, c.cable));
  });
  for (const i of removed)
    out.push({ path: `circuits.${i}`, kind: 'removed', before: a.circuits[i], text: `way ${wayText(a.circuits[i])} removed (${a.circuits[i].label})` });
  return out;
}

/** Joins the phrases, naming how many more there are past the first few so a summary stays readable. */
export function summarise(changes: ScheduleChange[]): string {
  if (changes.length === 0) return 'No changes';
  const texts = changes.map((c) => c.text);
  const shown = texts.slice(0, SUMMARY_MAX_PHRASES).join('; ');
  const more = texts.length - SUMMARY_MAX_PHRASES;
  return more > 0 ? `${shown}; and ${more} more change${more === 1 ? '' : 's'}` : shown;
}

/** Every change from `a` to `b`, board first, then devices, then circuits, with a generated summary. */
export function diffSchedules(a: Schedule, b: Schedule): ScheduleDiff {
  const changes = [...boardChanges(a.board, b.board), ...deviceChanges(a, b), ...circuitChanges(a, b)];
  return { changes, summary: summarise(changes) };
}

/** What a way label or cable flag prints for a circuit: way, phase, label and device text. */
function labelContent(s: Schedule, c: Circuit): string {
  return JSON.stringify([c.way, c.phase, c.label, deviceTextOf(s, c.deviceId)]);
}

/**
 * Way numbers (in `b`) whose printed label content changed since `a`, including ways added since,
 * so "changed since last print" reprints only those. Removed ways are not listed: nothing is left to print.
 */
export function waysChangedBetween(a: Schedule, b: Schedule): number[] {
  const { matched } = pairById(a.circuits, b.circuits);
  const ways = new Set<number>();
  b.circuits.forEach((c, i) => {
    const old = matched[i];
    if (!old || labelContent(a, old) !== labelContent(b, c)) ways.add(c.way);
  });
  return [...ways].sort((x, y) => x - y);
}
