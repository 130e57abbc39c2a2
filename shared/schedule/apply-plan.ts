/**
 * The changeover plan made real: every old way's planned new ways become the new board's circuits
 * and devices in one step. Pure (schedule in, schedule out), so the server's route and the tests run
 * the same code. Applying the same plan twice gives the same schedule: circuits and devices the plan
 * created are found again by their ids and updated, and nothing the plan does not name is touched.
 *
 * A plan is applied only when it is whole: every old way has a plan, every leg of every kept, split
 * or joined way lands on a new way, and no two planned circuits claim one way. Anything else is
 * answered with field paths (`survey.ways.N…`) so the form can show where.
 */
import { deviceSchema, circuitSchema, type Circuit, type Device, type Schedule } from '../schemas/schedule.js';
import type { PlannedWay, SurveyWay } from '../schemas/survey.js';
import { rcdFor, wayText } from './derive.js';
import { legsOf } from './legs.js';

/** Modules a planned device takes on the DIN rail (DIN 43880 module, 17.5 mm): one-module MCBs and RCBOs, a two-module RCD. */
const MODULES = { mcb: 1, rcbo: 1, rcd: 2 } as const; // common practice

export type PlanOutcome = { ok: true; schedule: Schedule; created: string[]; updated: string[] } | { ok: false; fields: Record<string, string> };

/** The id of the device the plan makes for a circuit. */
export const plannedDeviceId = (circuitId: string) => `dev-${circuitId}`.slice(0, 40);

const moves = (w: SurveyWay) => w.action === 'keep' || w.action === 'split' || w.action === 'join';

interface Contribution {
  way: SurveyWay;
  index: number;
  target: PlannedWay;
  j: number;
  legs: number[];
}

/** Everything wrong with the plan that stops it being applied, by field. */
function planProblems(schedule: Schedule, groups: Map<string, Contribution[]>): Record<string, string> {
  const survey = schedule.survey!;
  const fields: Record<string, string> = {};
  const boxes = new Set(survey.junctionBoxes.map((b) => b.id));
  survey.ways.forEach((w, i) => {
    const at = `survey.ways.${i}`;
    if (w.action == null) {
      fields[`${at}.action`] = `Old ${w.reference} has no plan: keep, split, join, retire or spare`;
      return;
    }
    if (!moves(w)) {
      if (w.targets.length) fields[`${at}.targets`] = `Old ${w.reference} is marked ${w.action} but names new ways: remove them or change the plan`;
      return;
    }
    if (!w.targets.length) {
      fields[`${at}.targets`] = `Old ${w.reference} is planned to ${w.action} but names no new way`;
      return;
    }
    const landed = new Set(w.targets.flatMap((t) => legsOf(w, t)));
    const missing = Array.from({ length: w.legs }, (_, k) => k + 1).filter((leg) => !landed.has(leg));
    if (missing.length) fields[`${at}.targets`] = `Old ${w.reference}: leg ${missing.join(' and ')} of ${w.legs} lands on no new way`;
    w.targets.forEach((t, j) => {
      t.legs.forEach((l, k) => {
        if (l.leg > w.legs) fields[`${at}.targets.${j}.legs.${k}.leg`] = `Old ${w.reference} has ${w.legs} leg${w.legs > 1 ? 's' : ''}, not a leg ${l.leg}`;
        if (l.junctionBoxId && !boxes.has(l.junctionBoxId)) fields[`${at}.targets.${j}.legs.${k}.junctionBoxId`] = 'No such junction box in the survey';
      });
      if (t.device.rating == null) fields[`${at}.targets.${j}.device.rating`] = `Give the rating of the device for new way ${t.way}`;
    });
  });
  // One circuit is one way; one way holds one circuit (per phase).
  const wayOwner = new Map<string, string>();
  for (const [circuitId, list] of groups) {
    const first = list[0]!;
    for (const c of list.slice(1)) {
      if (c.target.way !== first.target.way || c.target.phase !== first.target.phase) {
        fields[`survey.ways.${c.index}.targets.${c.j}.way`] =
          `Joined onto ${circuitId}, which is planned for way ${wayText(first.target)}: use one way for a joined circuit`;
      }
    }
    const slot = wayText(first.target);
    const other = wayOwner.get(slot);
    if (other) fields[`survey.ways.${first.index}.targets.${first.j}.way`] = `Way ${slot} is planned for two circuits (${other} and ${circuitId})`;
    wayOwner.set(slot, circuitId);
    const existing = schedule.circuits.find((c) => c.id !== circuitId && wayText(c) === slot);
    if (existing) fields[`survey.ways.${first.index}.targets.${first.j}.way`] = `Way ${slot} is already "${existing.label}" on the new board`;
  }
  return fields;
}

/** Old references and what they fed, for the new circuit's history fields. */
function provenance(list: Contribution[]) {
  const refs = [...new Set(list.map((c) => c.way.reference))];
  const feeds = [...new Set(list.map((c) => c.way.feeds.trim()).filter(Boolean))];
  const clip = (s: string, n: number) => (s.length > n ? `${s.slice(0, n - 1)}…` : s);
  return { previousReference: clip(refs.join(' + '), 40), description: clip(feeds.join('; '), 500) };
}

/** Where the next device of `modules` width goes: the last row with room, else a new row. */
function placeDevice(schedule: Schedule, modules: number): number {
  const used = new Map<number, number>();
  for (const d of schedule.devices) used.set(d.row, (used.get(d.row) ?? 0) + d.modules);
  const last = schedule.devices.length ? Math.max(...schedule.devices.map((d) => d.row)) : 1;
  if ((used.get(last) ?? 0) + modules <= schedule.board.modulesPerRow) return last;
  const next = last + 1;
  if (next > schedule.board.rows) schedule.board.rows = Math.min(60, next);
  return Math.min(60, next);
}

/** The named RCD a planned MCB sits behind, made when the board has none of that name. */
function rcdNamed(schedule: Schedule, name: string, t: PlannedWay): Device {
  const found = schedule.devices.find((d) => d.kind === 'rcd' && d.label === name);
  if (found) return found;
  const id = `rcd-${
    name
      .toLowerCase()
      .replace(/[^a-z0-9]+/g, '-')
      .replace(/^-|-$/g, '') || 'x'
  }`.slice(0, 40);
  const rcd = deviceSchema.parse({
    id,
    row: placeDevice(schedule, MODULES.rcd),
    kind: 'rcd',
    modules: MODULES.rcd,
    poles: 2,
    rating: 63, // common practice: a 63 A two-pole RCD
    residualMa: t.device.residualMa ?? 30,
    rcdType: t.device.rcdType ?? 'A',
    label: name,
  });
  schedule.devices.push(rcd);
  return rcd;
}

/** Names each device's RCD explicitly, so devices added by the plan cannot change what the old rows meant. */
function toManualRcds(schedule: Schedule) {
  if (schedule.board.rcdMode === 'manual') return;
  const rcds = rcdFor(schedule);
  for (const d of schedule.devices) {
    const rcd = rcds.get(d.id);
    d.protectedBy = rcd && rcd.kind === 'rcd' ? rcd.id : null;
  }
  schedule.board.rcdMode = 'manual';
}

function applyDevice(schedule: Schedule, circuit: Circuit | undefined, circuitId: string, t: PlannedWay): string {
  const rcbo = t.device.kind === 'rcbo';
  const protectedBy = !rcbo && t.device.rcdGroup ? rcdNamed(schedule, t.device.rcdGroup, t).id : null;
  const fields = {
    kind: t.device.kind,
    rating: t.device.rating,
    curve: t.device.curve,
    residualMa: rcbo ? t.device.residualMa : null,
    rcdType: rcbo ? t.device.rcdType : null,
    protectedBy,
  };
  const id = circuit?.deviceId && schedule.devices.some((d) => d.id === circuit.deviceId) ? circuit.deviceId : plannedDeviceId(circuitId);
  const existing = schedule.devices.find((d) => d.id === id);
  if (existing) Object.assign(existing, fields, existing.kind === 'mcb' || existing.kind === 'rcbo' ? {} : { modules: MODULES[t.device.kind], poles: 1 });
  else
    schedule.devices.push(deviceSchema.parse({ id, row: placeDevice(schedule, MODULES[t.device.kind]), modules: MODULES[t.device.kind], poles: 1, ...fields }));
  return id;
}

/**
 * Applies the survey's plan to the new board. The schedule passed in is not changed.
 * Each planned circuit takes its way, label, kind and device from the first old way planned onto
 * it, socket-outlets if any old way had them, and one leg for every old leg that lands on it (a
 * ring's two, or one per joined cable). A new circuit also takes the cable found on that old way
 * and what the old ways fed as its description; a circuit made by an earlier apply keeps its own.
 */
export function applyPlan(given: Schedule): PlanOutcome {
  if (!given.survey) return { ok: false, fields: { survey: 'This board has no survey of an old board to plan from' } };
  const schedule = structuredClone(given);
  const groups = new Map<string, Contribution[]>();
  schedule.survey!.ways.forEach((way, index) => {
    if (!moves(way)) return;
    way.targets.forEach((target, j) => {
      const list = groups.get(target.circuitId) ?? [];
      list.push({ way, index, target, j, legs: legsOf(way, target) });
      groups.set(target.circuitId, list);
    });
  });
  const fields = planProblems(schedule, groups);
  if (Object.keys(fields).length) return { ok: false, fields };

  if ([...groups.values()].some((list) => list[0]!.target.device.kind === 'mcb' && list[0]!.target.device.rcdGroup)) toManualRcds(schedule);
  const created: string[] = [];
  const updated: string[] = [];
  const ordered = [...groups.entries()].sort(([, a], [, b]) => a[0]!.target.way - b[0]!.target.way);
  for (const [circuitId, list] of ordered) {
    const first = list[0]!;
    const t = first.target;
    const circuit = schedule.circuits.find((c) => c.id === circuitId);
    const deviceId = applyDevice(schedule, circuit, circuitId, t);
    const legs = Math.min(
      8,
      Math.max(
        1,
        list.reduce((n, c) => n + c.legs.length, 0),
      ),
    );
    const { previousReference, description } = provenance(list);
    const planned = {
      way: t.way,
      phase: t.phase,
      label: t.label,
      kind: t.kind,
      deviceId,
      legs,
      previousReference,
      socketOutlets: list.some((c) => c.way.socketOutlets),
    };
    if (circuit) {
      // What the electrician has since recorded on the new circuit (its cable, its description) stays.
      Object.assign(circuit, planned, circuit.cable.liveCsa == null ? { cable: { ...first.way.cable } } : {}, circuit.description ? {} : { description });
      updated.push(circuitId);
    } else {
      schedule.circuits.push(circuitSchema.parse({ id: circuitId, ...planned, cable: { ...first.way.cable }, description }));
      created.push(circuitId);
    }
  }
  return { ok: true, schedule, created, updated };
}
