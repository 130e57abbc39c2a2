/**
 * Before-you-swap: the old board's survey judged against the plan. For every old way the readings
 * taken on it are judged as readings (Table 64, ring end-to-end, polarity, Zs cross-check), and for
 * every new way it is planned onto, the old cable and readings are judged against the new device: its
 * Zs limit (Table 41.3), the cable's capacity for the new rating, and insulation that would trip its
 * RCD. Each finding's field starts with `survey.` and its message says what to do before the changeover.
 */
import { deviceSchema, type Circuit, type Device, type Schedule } from '../../schemas/schedule.js';
import type { PlannedWay, Survey, SurveyWay } from '../../schemas/survey.js';
import type { Finding, Severity } from '../types.js';
import { twinEarthIz } from './capacity.js';
import { maxZs } from './earth-fault-loop.js';
import { judgeRcdTrip, judgeReadings } from './readings.js';
import { AMBIENT_RULE_OF_THUMB, RING_FINAL } from './tables.js';
import { BS3036_OVERLOAD_FACTOR, LOW_INSULATION_MEGOHMS, RING_RULE_FUSES } from './tables-fuses.js';
import { num, ohms } from './view.js';
import { legsOf } from '../../schedule/legs.js';

/** "Old Fuse 2 (sockets, back of house…)": how every survey finding opens. */
export function oldWayName(w: SurveyWay): string {
  const feeds = w.feeds.trim();
  return `Old ${w.reference}${feeds ? ` (${feeds.length > 48 ? `${feeds.slice(0, 47)}…` : feeds})` : ''}`;
}

/** The old way's device as a schedule device, so the board's own rules can judge it. */
export function oldDeviceAsDevice(w: SurveyWay): Device | null {
  const d = w.device;
  if (d.kind === 'none') return null;
  return deviceSchema.parse({
    id: `old-${w.id}`,
    row: 1,
    kind: d.kind,
    rating: d.rating,
    curve: d.kind === 'fuse' ? null : d.curve,
    residualMa: d.kind === 'rcbo' ? d.residualMa : null,
    rcdType: d.kind === 'rcbo' ? d.rcdType : null,
    fuseStandard: d.kind === 'fuse' ? d.fuseStandard : undefined,
  });
}

/** A planned way's device as a schedule device. */
export function plannedAsDevice(t: PlannedWay): Device {
  const rcbo = t.device.kind === 'rcbo';
  return deviceSchema.parse({
    id: `planned-${t.circuitId}`,
    row: 1,
    kind: t.device.kind,
    rating: t.device.rating,
    curve: t.device.curve,
    residualMa: rcbo ? t.device.residualMa : null,
    rcdType: rcbo ? t.device.rcdType : null,
  });
}

/** Enough of a circuit for the disconnection-time rule (kind and socket-outlets). */
const asCircuit = (w: SurveyWay, kind = w.kind) => ({ kind, socketOutlets: w.socketOutlets }) as Circuit;

const deviceText = (d: Device) =>
  d.kind === 'fuse' ? `${num(d.rating ?? 0)} A ${d.fuseStandard ?? 'fuse'}` : `${d.kind === 'rcbo' ? 'RCBO ' : ''}${d.curve ?? ''}${num(d.rating ?? 0)}`;

interface Ctx {
  survey: Survey;
  index: number;
  way: SurveyWay;
  out: Finding[];
}

function push(c: Ctx, severity: Severity, code: string, rule: string, field: string, ways: number[], message: string) {
  c.out.push({ severity, code, rule, ways, field: `survey.ways.${c.index}.${field}`, message: `${oldWayName(c.way)}: ${message}` });
}

/** The cable's Iz for a rating check: its recorded method, or clipped direct (the most it can be) when none is recorded. */
function cableIz(w: SurveyWay): { iz: number; basis: string } | null {
  const { type, liveCsa, referenceMethod } = w.cable;
  if (type !== 'twin-earth' || liveCsa == null) return null;
  const method = referenceMethod ?? 'C';
  const iz = twinEarthIz(liveCsa, method);
  if (iz == null) return null;
  return { iz, basis: referenceMethod ? `method ${method} (Table 4D5)` : 'method C, the most it can carry, as no method is recorded (Table 4D5)' };
}

/** The old installation as found: its fuse against the cable, and Zs against the old device. */
function asFound(c: Ctx) {
  const w = c.way;
  const device = oldDeviceAsDevice(w);
  // A retired or spare way's cable is not reused: how it was protected no longer matters.
  if (!device || device.rating == null || w.action === 'retire' || w.action === 'spare') return;
  const cap = cableIz(w);
  const recognisedRing =
    w.kind === 'ring' &&
    w.cable.liveCsa === RING_FINAL.liveCsa &&
    (RING_FINAL.ratings as readonly number[]).includes(device.rating) &&
    (device.kind !== 'fuse' || (device.fuseStandard != null && RING_RULE_FUSES.includes(device.fuseStandard)));
  if (cap && !recognisedRing) {
    const semi = device.kind === 'fuse' && device.fuseStandard === 'BS 3036';
    const allowed = semi ? BS3036_OVERLOAD_FACTOR * cap.iz : cap.iz;
    if (device.rating > allowed + 1e-9) {
      push(
        c,
        'warning',
        'survey-old-rating-over-iz',
        semi ? 'BS 7671 433.1.202' : 'BS 7671 433.1.1',
        'cable.liveCsa',
        [],
        semi
          ? `as found, its ${deviceText(device)} rewireable fuse is too big for ${num(w.cable.liveCsa!)} mm² cable: In must be at most 0.725 × Iz = 0.725 × ${num(cap.iz)} A = ${num(Math.floor(allowed * 10) / 10)} A at ${cap.basis}. The new device must respect the cable, not the old fuse`
          : `as found, its ${deviceText(device)} is above the ${num(cap.iz)} A capacity of ${num(w.cable.liveCsa!)} mm² cable at ${cap.basis}. The new device must respect the cable, not the old one`,
      );
    }
  }
  const zs = w.readings.zs;
  const limit = maxZs(device, asCircuit(w));
  if (zs != null && limit && zs > limit.ohms) {
    push(
      c,
      'warning',
      'survey-zs-over-old-limit',
      `BS 7671 ${limit.table}`,
      'readings.zs',
      [],
      `as found, measured Zs ${ohms(zs)} is over the ${ohms(limit.ohms)} maximum for its ${limit.basis} (${limit.table}, ${limit.seconds} s): the old circuit does not disconnect in time today`,
    );
  }
}

function judgeTarget(c: Ctx, t: PlannedWay, j: number) {
  const w = c.way;
  const device = plannedAsDevice(t);
  const ways = [t.way];
  const planned = `the ${deviceText(device)} planned for new way ${t.way}`;
  const zs = w.readings.zs;
  const limit = maxZs(device, asCircuit(w, t.kind));
  if (zs != null && limit) {
    if (zs > limit.ohms) {
      push(
        c,
        'error',
        'swap-zs-over-new-limit',
        `BS 7671 ${limit.table}`,
        'readings.zs',
        ways,
        `measured Zs ${ohms(zs)} is over the ${ohms(limit.ohms)} maximum (${limit.table}, ${limit.seconds} s) of ${planned}. Before the changeover: find the high resistance (a loose joint, a long spur), or plan a device whose limit it meets; an RCD does not make up for it`,
      );
    } else if (zs > limit.ohms * AMBIENT_RULE_OF_THUMB) {
      push(
        c,
        'warning',
        'swap-zs-near-new-limit',
        'IET guidance: 80 % rule of thumb',
        'readings.zs',
        ways,
        `measured Zs ${ohms(zs)} is within the ${ohms(limit.ohms)} maximum (${limit.table}) of ${planned} but above 80 % of it: retest once it is connected to the new board`,
      );
    }
  }
  const cap = cableIz(w);
  const rating = device.rating;
  const recognisedRing =
    t.kind === 'ring' && w.cable.liveCsa === RING_FINAL.liveCsa && rating != null && (RING_FINAL.ratings as readonly number[]).includes(rating);
  if (cap && rating != null && !recognisedRing && rating > cap.iz) {
    push(
      c,
      'error',
      'swap-rating-over-iz',
      'BS 7671 433.1.1',
      `targets.${j}.device.rating`,
      ways,
      `the ${num(w.cable.liveCsa!)} mm² cable found carries ${num(cap.iz)} A at ${cap.basis}, less than the ${num(rating)} A of ${planned}: plan a lower rating, or replace the cable`,
    );
  }
  if (recognisedRing && cap && cap.iz < RING_FINAL.minIz) {
    push(
      c,
      'error',
      'swap-ring-iz-below-20',
      'BS 7671 433.1.204',
      'cable.referenceMethod',
      ways,
      `a 2.5 mm² ring on ${deviceText(device)} needs Iz of at least ${RING_FINAL.minIz} A, but the cable found has ${num(cap.iz)} A at ${cap.basis}`,
    );
  }
  const behindRcd = device.kind === 'rcbo' || t.device.rcdGroup != null;
  const { lineEarth, neutralEarth, testVoltage } = w.readings.insulation;
  const lowest = [
    ['N–E', neutralEarth, 'neutralEarth'],
    ['L–E', lineEarth, 'lineEarth'],
  ] as const;
  for (const [name, value, key] of lowest) {
    if (behindRcd && value != null && value < LOW_INSULATION_MEGOHMS) {
      push(
        c,
        value < 1 ? 'error' : 'warning',
        'swap-insulation-will-trip-rcd',
        'Common practice',
        `readings.insulation.${key}`,
        ways,
        `${name} insulation resistance ${num(value)} MΩ${testVoltage ? ` at ${testVoltage} V` : ''} will likely trip the RCD of ${planned} as soon as the circuit is behind it. Before the changeover: find the cause (often an outside or damp accessory) and retest`,
      );
      break;
    }
  }
}

function judgePlan(c: Ctx, known: Set<string>) {
  const w = c.way;
  if (w.action == null) {
    push(
      c,
      'info',
      'swap-no-plan',
      'Common practice',
      'action',
      [],
      'no plan yet: say whether it is kept, split, joined, retired or left spare on the new board',
    );
    return;
  }
  const moving = w.action === 'keep' || w.action === 'split' || w.action === 'join';
  if (moving && w.targets.length === 0) {
    push(c, 'warning', 'swap-plan-without-way', 'Common practice', 'targets', [], `planned to ${w.action}, but no new way is named: choose the way it goes to`);
  }
  if (!moving && w.targets.length > 0) {
    push(
      c,
      'warning',
      'swap-retired-with-way',
      'Common practice',
      'targets',
      w.targets.map((t) => t.way),
      `marked ${w.action}, yet new ways are named for it: remove them, or change the plan`,
    );
  }
  if (!moving) return;
  w.targets.forEach((t, j) => {
    t.legs.forEach((l, k) => {
      if (l.junctionBoxId && !known.has(l.junctionBoxId)) {
        push(
          c,
          'error',
          'swap-unknown-junction-box',
          'Common practice',
          `targets.${j}.legs.${k}.junctionBoxId`,
          [t.way],
          `leg ${l.leg} names a junction box that is not in the survey`,
        );
      }
    });
  });
  // Every leg of the old cable ends on a new way: a ring's two legs both land, or the plan says otherwise.
  const landed = new Set(w.targets.flatMap((t) => legsOf(w, t)));
  const missing = Array.from({ length: w.legs }, (_, i) => i + 1).filter((leg) => !landed.has(leg));
  if (missing.length) {
    push(
      c,
      'warning',
      'swap-leg-not-planned',
      'Common practice',
      'targets',
      w.targets.map((t) => t.way),
      `leg${missing.length > 1 ? 's' : ''} ${missing.join(' and ')} of ${w.legs} ${missing.length > 1 ? 'are' : 'is'} not planned onto a new way: every leg must end on a new way, or the way be marked retired`,
    );
  }
}

/** Every before-you-swap finding of the survey, in the order of the old ways. */
export function checkChangeover(schedule: Schedule): Finding[] {
  const survey = schedule.survey;
  if (!survey) return [];
  const known = new Set(survey.junctionBoxes.map((b) => b.id));
  const out: Finding[] = [];
  const ze = survey.ze ?? schedule.board.supply.ze;
  survey.ways.forEach((way, index) => {
    const c: Ctx = { survey, index, way, out };
    const behindRcd = way.targets.some((t) => t.device.kind === 'rcbo' || t.device.rcdGroup != null);
    for (const i of judgeReadings(way.readings, { ring: way.kind === 'ring', ze, behindRcd: false, liveCsa: way.cable.liveCsa, cpcCsa: way.cable.cpcCsa })) {
      // Low insulation is judged against the new RCD below, where the plan is known.
      if (i.code === 'insulation-low' && behindRcd) continue;
      push(
        c,
        i.severity,
        i.code,
        i.rule,
        `readings.${i.field}`,
        way.targets.map((t) => t.way),
        i.message,
      );
    }
    for (const i of judgeRcdTrip(way.device.rcdTrip, way.device.residualMa)) push(c, i.severity, i.code, i.rule, `device.rcdTrip.${i.field}`, [], i.message);
    asFound(c);
    judgePlan(c, known);
    if (way.action === 'keep' || way.action === 'split' || way.action === 'join') way.targets.forEach((t, j) => judgeTarget(c, t, j));
  });
  return out;
}
