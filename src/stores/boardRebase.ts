/**
 * Re-applying one electrician's unsaved edits onto a copy someone else saved meanwhile
 * (the answer to a 409 on save). A three-way merge by item: board fields one by one,
 * devices and circuits by their `id`. An item both sides changed differently is a conflict:
 * the saved copy keeps it and the editor lists it, so nobody's work is overwritten silently.
 * Pure: no store, no I/O, so it is tested on its own.
 */
import type { Schedule } from '../../shared/schemas/schedule.js';

export interface RebaseResult {
  schedule: Schedule;
  /** Plain sentences naming what could not be re-applied, e.g. "Way 7 was changed by both". */
  conflicts: string[];
  /** How many of my changes were carried over. */
  applied: number;
}

type Item = { id: string };

const same = (a: unknown, b: unknown) => JSON.stringify(a) === JSON.stringify(b);
const clone = <T>(v: T): T => JSON.parse(JSON.stringify(v)) as T;

/**
 * Merges `mine` (edited from `base`) onto `theirs` (the fresh saved copy): my changes win
 * where the saved copy left the same thing alone; where both changed it, theirs stays.
 */
export function rebaseSchedule(base: Schedule, mine: Schedule, theirs: Schedule): RebaseResult {
  const conflicts: string[] = [];
  const board = clone(theirs.board);
  let applied = mergeFields(base.board, mine.board, board, 'Board', conflicts);
  const devices = mergeItems(base.devices, mine.devices, theirs.devices, (d) => `Device ${d.label || d.kind} (${d.id})`, conflicts);
  const circuits = mergeItems(base.circuits, mine.circuits, theirs.circuits, (c) => `Way ${c.way} (${c.label})`, conflicts);
  applied += devices.applied + circuits.applied;
  // The survey is merged whole: mine wins when only I changed it, theirs stays when both did.
  const surveyMine = !same(base.survey ?? null, mine.survey ?? null);
  const surveyTheirs = !same(base.survey ?? null, theirs.survey ?? null);
  if (surveyMine && surveyTheirs && !same(mine.survey ?? null, theirs.survey ?? null)) conflicts.push('Survey of the old board');
  const survey = surveyMine && !surveyTheirs ? clone(mine.survey ?? null) : clone(theirs.survey ?? null);
  if (surveyMine && !surveyTheirs) applied += 1;
  const merged: Schedule = { board, devices: devices.items, circuits: circuits.items };
  if (survey !== null || theirs.survey !== undefined) merged.survey = survey;
  return { schedule: merged, conflicts, applied };
}

const isPlainObject = (v: unknown): v is Record<string, unknown> => typeof v === 'object' && v !== null && !Array.isArray(v);

/** Field-by-field merge into `target` (a copy of theirs); nested objects such as the supply go one level deeper. */
function mergeFields(base: object, mine: object, target: object, where: string, conflicts: string[]): number {
  const b = base as Record<string, unknown>;
  const m = mine as Record<string, unknown>;
  const t = target as Record<string, unknown>;
  let applied = 0;
  for (const key of Object.keys(m)) {
    if (same(m[key], b[key])) continue;
    if (isPlainObject(m[key]) && isPlainObject(b[key]) && isPlainObject(t[key])) {
      applied += mergeFields(b[key], m[key], t[key], `${where} ${key}`, conflicts);
      continue;
    }
    if (!same(t[key], b[key]) && !same(t[key], m[key])) {
      conflicts.push(`${where} field “${key}” was changed by both`);
      continue;
    }
    t[key] = clone(m[key]);
    applied++;
  }
  return applied;
}

/** Three-way merge of a list of items keyed by id; order follows whichever side reordered. */
function mergeItems<T extends Item>(base: T[], mine: T[], theirs: T[], describe: (item: T) => string, conflicts: string[]): { items: T[]; applied: number } {
  const baseById = new Map(base.map((i) => [i.id, i]));
  const mineById = new Map(mine.map((i) => [i.id, i]));
  const theirsById = new Map(theirs.map((i) => [i.id, i]));
  const result = new Map<string, T>();
  let applied = 0;
  for (const t of theirs) result.set(t.id, clone(t));
  for (const [id, b] of baseById) {
    const m = mineById.get(id);
    const t = theirsById.get(id);
    if (m && same(m, b)) continue; // untouched by me: theirs stands
    if (!m) {
      // I removed it
      if (!t) continue;
      if (same(t, b)) {
        result.delete(id);
        applied++;
      } else conflicts.push(`${describe(b)} was removed here but changed in the saved copy`);
      continue;
    }
    if (!t) {
      conflicts.push(`${describe(m)} was changed here but removed in the saved copy`);
      continue;
    }
    if (!same(t, b) && !same(t, m)) {
      conflicts.push(`${describe(m)} was changed by both`);
      continue;
    }
    result.set(id, clone(m));
    applied++;
  }
  for (const m of mine) {
    if (baseById.has(m.id)) continue;
    if (theirsById.has(m.id)) {
      conflicts.push(`${describe(m)} was added by both`);
      continue;
    }
    result.set(m.id, clone(m));
    applied++;
  }
  const reordered = !same(commonOrder(mine, baseById), commonOrder(base, mineById));
  const primary = reordered ? mine : theirs;
  const secondary = reordered ? theirs : mine;
  if (reordered) applied++;
  return { items: orderItems(primary, secondary, result), applied };
}

/** Ids of `list` that also exist in `other`, in `list`'s order: the part both sides can compare. */
function commonOrder<T extends Item>(list: T[], other: Map<string, T>): string[] {
  return list.filter((i) => other.has(i.id)).map((i) => i.id);
}

/** Lays out the surviving items in `primary` order, slotting the rest in after their neighbour in `secondary`. */
function orderItems<T extends Item>(primary: T[], secondary: T[], result: Map<string, T>): T[] {
  const ids = primary.map((i) => i.id).filter((id) => result.has(id));
  let previous: string | null = null;
  for (const item of secondary) {
    if (result.has(item.id) && !ids.includes(item.id)) {
      const at = previous === null ? 0 : ids.indexOf(previous) + 1;
      ids.splice(at, 0, item.id);
    }
    if (ids.includes(item.id)) previous = item.id;
  }
  return ids.map((id) => result.get(id) as T);
}
