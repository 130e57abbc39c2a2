/**
 * A suggested arrangement of the changeover plan's MCB ways across the new board's RCDs, with the
 * reason for each place, for the electrician to accept or change. Three aims, in this order:
 * keep each RCD's expected protective conductor current under 30 % of its IΔn (BS 7671 531.3.2),
 * put the lighting and the power of one area on different RCDs so one trip never leaves an area
 * both dark and without sockets, and spread the lighting over the RCDs. A sub-main is left off the
 * 30 mA RCDs (selectivity), and ways planned as RCBOs need no place: each is its own RCD.
 * Pure; the expected currents are estimates, and every message says so.
 */
import type { CircuitKind, Schedule } from '../schemas/schedule.js';
import type { PlannedWay, SurveyWay } from '../schemas/survey.js';

/** 531.3.2: the protective conductor current in normal use should stay under 30 % of IΔn (BS 7671:2018, from memory). */
export const STANDING_CURRENT_SHARE = 0.3;

/**
 * Expected protective conductor current (mA) of a domestic circuit in normal use, by kind: our own
 * estimates from typical equipment (filters in electronics, LED drivers, heating elements), not a
 * standard's values (common practice). Socket circuits carry most: every plugged-in electronic item adds some.
 */
export const EXPECTED_MA: Record<CircuitKind, number> = {
  ring: 1.5,
  radial: 1,
  lighting: 0.25,
  cooker: 1,
  shower: 0.25,
  immersion: 0.25,
  'fixed-appliance': 0.75,
  'sub-main': 2,
  other: 0.5,
};

/** The usual nominal voltage to earth for the insulation leakage estimate (BS 7671 U0 = 230 V). */
const U0 = 230;

export interface RcdPlace {
  circuitId: string;
  way: number;
  label: string;
  /** `own`: planned as an RCBO; `rcd`: an MCB behind the named RCD; `none`: left off the 30 mA RCDs. */
  placed: 'own' | 'rcd' | 'none';
  rcd: string | null;
  expectedMa: number;
  why: string;
}
export interface RcdLoad {
  name: string;
  ways: number[];
  expectedMa: number;
  limitMa: number;
}
export interface RcdSuggestion {
  places: RcdPlace[];
  rcds: RcdLoad[];
  notes: string[];
}

interface Planned {
  circuitId: string;
  target: PlannedWay;
  ways: SurveyWay[];
  expectedMa: number;
  area: Set<string>;
  alarm: boolean;
}

const NOT_AREA = new Set([
  'sockets',
  'socket',
  'lights',
  'lighting',
  'light',
  'ring',
  'radial',
  'and',
  'the',
  'for',
  'with',
  'side',
  'wall',
  'points',
  'point',
  'circuit',
  'new',
  'old',
  'spur',
  'outlets',
  'supply',
  'feed',
  'worktop',
  'room',
  'rooms',
  'house',
  'of',
]);
/** The places a circuit serves, as words of its label and what the old way fed ("front", "kitchen", "upstairs"). */
function areaWords(text: string): Set<string> {
  return new Set(
    text
      .toLowerCase()
      .split(/[^a-z]+/)
      .filter((w) => w.length >= 3 && !NOT_AREA.has(w)),
  );
}
const isPower = (kind: CircuitKind) => kind === 'ring' || kind === 'radial';
/** One lighting and one socket circuit: the pair that should not go off together in one area. */
const lightAndPower = (a: CircuitKind, b: CircuitKind) => (a === 'lighting' && isPower(b)) || (b === 'lighting' && isPower(a));
const sameArea = (a: Planned, b: Planned) => [...a.area].some((w) => b.area.has(w));
const fmt = (ma: number) => (Math.round(ma * 10) / 10).toFixed(1);

/** Leakage through the insulation at U0, from the lowest of the old way's L–E and N–E readings (mA). */
function insulationMa(ways: SurveyWay[]): number {
  let ma = 0;
  for (const w of ways) {
    const lowest = Math.min(w.readings.insulation.lineEarth ?? Infinity, w.readings.insulation.neutralEarth ?? Infinity);
    if (Number.isFinite(lowest) && lowest > 0) ma += (U0 / (lowest * 1e6)) * 1000;
  }
  return ma;
}

function plannedCircuits(schedule: Schedule): Planned[] {
  const byId = new Map<string, Planned>();
  for (const w of schedule.survey?.ways ?? []) {
    if (w.action !== 'keep' && w.action !== 'split' && w.action !== 'join') continue;
    for (const t of w.targets) {
      const p = byId.get(t.circuitId) ?? { circuitId: t.circuitId, target: t, ways: [], expectedMa: 0, area: new Set<string>(), alarm: false };
      p.ways.push(w);
      for (const word of areaWords(`${t.label} ${w.feeds}`)) p.area.add(word);
      p.alarm ||= /alarm|smoke|detector/i.test(`${t.label} ${w.feeds}`);
      byId.set(t.circuitId, p);
    }
  }
  for (const p of byId.values()) p.expectedMa = EXPECTED_MA[p.target.kind] + insulationMa(p.ways);
  return [...byId.values()].sort((a, b) => a.target.way - b.target.way);
}

interface Bin {
  name: string;
  members: Planned[];
  load: number;
}

/** What it costs to put `p` on `bin`: never over the limit, then light and power of one area apart, then lighting spread, then balance. */
function cost(p: Planned, bin: Bin, limit: number): number {
  if (bin.load + p.expectedMa > limit + 1e-9) return Infinity;
  let c = bin.load / limit;
  for (const m of bin.members) {
    if (sameArea(p, m) && lightAndPower(p.target.kind, m.target.kind)) c += 10;
    if (p.target.kind === 'lighting' && m.target.kind === 'lighting') c += 3;
  }
  return c;
}

function reason(p: Planned, bin: Bin, others: Bin[], limitMa: number, rcdMa: number): string {
  const parts: string[] = [];
  const apart = others.flatMap((o) =>
    o.members.filter((m) => sameArea(p, m) && lightAndPower(p.target.kind, m.target.kind)).map((m) => `${m.target.label} (${o.name})`),
  );
  if (apart.length)
    parts.push(`${apart.join(', ')} ${apart.length > 1 ? 'serve' : 'serves'} the same area on another RCD, so one trip leaves it with light or power`);
  const lights = others.flatMap((o) =>
    o.members.filter((m) => p.target.kind === 'lighting' && m.target.kind === 'lighting').map((m) => `${m.target.label} (${o.name})`),
  );
  if (lights.length) parts.push(`the lighting is spread: ${lights.join(', ')} elsewhere`);
  const together = bin.members.filter((m) => m !== p && sameArea(p, m) && lightAndPower(p.target.kind, m.target.kind)).map((m) => m.target.label);
  if (together.length)
    parts.push(`it shares ${bin.name} with ${together.join(', ')} of the same area, as no other RCD does better: consider an RCBO for one of them`);
  parts.push(`${bin.name} then carries about ${fmt(bin.load)} mA of its ${fmt(limitMa)} mA (30 % of ${rcdMa} mA, BS 7671 531.3.2)`);
  return `${parts.join('; ')}.`;
}

/**
 * The suggestion for the survey's plan, or null when nothing is planned. RCD names already used in
 * the plan are kept; more RCDs are added ("RCD 1", "RCD 2"…) when the expected currents need them,
 * and there are at least two whenever two or more MCB ways are planned.
 */
export function suggestRcdSplit(schedule: Schedule, rcdMa = 30): RcdSuggestion | null {
  const planned = plannedCircuits(schedule);
  if (!planned.length) return null;
  const limitMa = STANDING_CURRENT_SHARE * rcdMa;
  const places = new Map<string, RcdPlace>();
  const notes: string[] = [
    'Expected currents are estimates by kind of circuit plus what the old insulation readings let through; measure with a clamp meter where in doubt.',
  ];
  const onMcbs: Planned[] = [];
  for (const p of planned) {
    const base = { circuitId: p.circuitId, way: p.target.way, label: p.target.label, expectedMa: p.expectedMa };
    if (p.target.device.kind === 'rcbo') {
      places.set(p.circuitId, {
        ...base,
        placed: 'own',
        rcd: null,
        why: `its own RCBO: a fault trips this way only${p.expectedMa > limitMa ? `, but its expected ${fmt(p.expectedMa)} mA is over 30 % of its IΔn: look for the leakage` : ''}.`,
      });
    } else if (p.target.kind === 'sub-main') {
      places.set(p.circuitId, {
        ...base,
        placed: 'none',
        rcd: null,
        why: 'feeds another board: keep it off the 30 mA RCDs (the sub-board gives its own circuits 30 mA protection), or use a time-delayed RCD, so RCDs in series discriminate (BS 7671 Chapter 53).',
      });
    } else {
      onMcbs.push(p);
    }
  }
  const named = [...new Set(onMcbs.map((p) => p.target.device.rcdGroup).filter((n): n is string => !!n))];
  const total = onMcbs.reduce((n, p) => n + p.expectedMa, 0);
  const count = Math.max(named.length, onMcbs.length >= 2 ? 2 : onMcbs.length, Math.ceil(total / limitMa - 1e-9));
  const bins: Bin[] = Array.from({ length: count }, (_, i) => ({ name: named[i] ?? nextName(named, i), members: [], load: 0 }));
  // Biggest first, so the limit is met while there is still room to choose.
  for (const p of [...onMcbs].sort((a, b) => b.expectedMa - a.expectedMa || a.target.way - b.target.way)) {
    let best = bins.reduce((b, bin) => (cost(p, bin, limitMa) < cost(p, b, limitMa) ? bin : b), bins[0]!);
    if (p.expectedMa > limitMa)
      notes.push(`${p.target.label} alone is expected to pass ${fmt(p.expectedMa)} mA, over 30 % of ${rcdMa} mA: give it its own RCBO, or find the leakage.`);
    if (!Number.isFinite(cost(p, best, limitMa))) {
      best = {
        name: nextName(
          bins.map((b) => b.name),
          bins.length,
        ),
        members: [],
        load: 0,
      };
      bins.push(best);
    }
    best.members.push(p);
    best.load += p.expectedMa;
    places.set(p.circuitId, {
      circuitId: p.circuitId,
      way: p.target.way,
      label: p.target.label,
      expectedMa: p.expectedMa,
      placed: 'rcd',
      rcd: best.name,
      why: '',
    });
  }
  for (const bin of bins)
    for (const p of bin.members)
      places.get(p.circuitId)!.why = reason(
        p,
        bin,
        bins.filter((b) => b !== bin),
        limitMa,
        rcdMa,
      );
  if (planned.some((p) => p.alarm))
    notes.push('Smoke and heat alarms: best on their own RCBO, so a fault on another circuit cannot switch them off (BS 5839-6 guidance, from memory).');
  const rcds = bins
    .filter((b) => b.members.length)
    .map((b) => ({ name: b.name, ways: b.members.map((m) => m.target.way).sort((x, y) => x - y), expectedMa: b.load, limitMa }));
  return { places: planned.map((p) => places.get(p.circuitId)!), rcds, notes };
}

function nextName(taken: string[], i: number): string {
  for (let n = i + 1; ; n++) if (!taken.includes(`RCD ${n}`)) return `RCD ${n}`;
}

/** Writes an accepted suggestion into the plan: each MCB way names its RCD, a sub-main none. Returns a new schedule. */
export function acceptRcdSplit(schedule: Schedule, suggestion: RcdSuggestion): Schedule {
  const out = structuredClone(schedule);
  const byId = new Map(suggestion.places.map((p) => [p.circuitId, p]));
  for (const w of out.survey?.ways ?? []) {
    for (const t of w.targets) {
      const place = byId.get(t.circuitId);
      if (place && place.placed !== 'own' && t.device.kind === 'mcb') t.device.rcdGroup = place.rcd;
    }
  }
  return out;
}
