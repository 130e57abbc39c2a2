/**
 * The board being edited: the copy as last loaded or saved (`loaded`), the electrician's
 * working copy, the revision it was based on, and what the rules and the schema say about
 * the working copy, recomputed a beat after each edit so findings appear while typing without
 * slowing it. Derived facts (spare ways, max Zs, findings by field) are computed once per change here.
 */
import { defineStore } from 'pinia';
import { computed, ref, toRaw, watch } from 'vue';
import { scheduleSchema, circuitSchema, deviceSchema, type Circuit, type Device, type DeviceKind, type Schedule } from '../../shared/schemas/schedule.js';
import { fieldErrors } from '../../shared/schemas/errors.js';
import { isoDay } from '../../shared/rules/dates.js';
import { checkSchedule, maxZsByCircuit } from '../../shared/rules/index.js';
import type { Finding } from '../../shared/rules/types.js';
import { undrawableTextFindings } from '../../shared/fonts/printed-text.js';
import { ApiError } from '../api/http.js';
import { applyChangeover, getSchedule, saveSchedule } from '../api/boards.js';
import { clearDraft, readDraft, writeDraft } from './boardDraft.js';
import { rebaseSchedule, type RebaseResult } from './boardRebase.js';
import { spareWays, type SpareWay } from '../../shared/schedule/ways.js';
import { sameParts, scheduleParts } from './scheduleParts.js';

export type BoardStatus = 'idle' | 'loading' | 'ready' | 'saving' | 'error';
export type SaveOutcome = 'saved' | 'unchanged' | 'invalid' | 'conflict' | 'failed';

const clone = <T>(v: T): T => JSON.parse(JSON.stringify(v)) as T;
const isoToday = () => isoDay(new Date());
/** Ids only need to be unique within one board; a short random tail keeps two editors' new items apart. */
const NO_SUCH_BOARD = 'There is no such board: it does not exist or was deleted.';
/** How long after the last keystroke the rules and the schema look at the copy: findings appear well within half a second. */
export const CHECK_DELAY_MS = 200;
export const newItemId = (prefix: string) => `${prefix}-${Math.random().toString(36).slice(2, 10)}`;

export const useBoardStore = defineStore('board', () => {
  const boardId = ref<number | null>(null);
  const status = ref<BoardStatus>('idle');
  const error = ref<string | null>(null);
  const code = ref('');
  const siteId = ref<number | null>(null);
  const updatedAt = ref('');
  const loaded = ref<Schedule | null>(null);
  const working = ref<Schedule | null>(null);
  const baseRevision = ref(0);
  /** Field messages from the server's last 400, by path ("circuits.3.label"). */
  const serverFields = ref<Record<string, string>>({});
  /** Set when a save was refused as stale: the revision someone else saved. */
  const conflict = ref<{ message: string } | null>(null);
  const lastSummary = ref('');
  const today = ref(isoToday());
  /** When the working copy was restored from an unsaved draft on this device: when that draft was written. */
  const restoredDraftAt = ref<string | null>(null);

  /**
   * The rule checks and the schema run off the typing path: they run CHECK_DELAY_MS after the last
   * edit (a new copy from a load or a save is checked at once), on the plain object behind the
   * working copy, so nothing they look at is tracked per keystroke; `checkedVersion` is what tells
   * the derived values to recompute.
   */
  const checkedVersion = ref(0);
  let checkTimer: ReturnType<typeof setTimeout> | undefined;
  function checkNow(): void {
    clearTimeout(checkTimer);
    checkedVersion.value++;
  }
  const checkedCopy = (): Schedule | null => {
    void checkedVersion.value;
    return working.value ? toRaw(working.value) : null;
  };

  // The copies' content part by part (see scheduleParts): a keystroke re-serialises its own circuit only.
  const workingParts = computed(() => scheduleParts(working.value));
  const loadedParts = computed(() => scheduleParts(loaded.value));
  /** Unsaved changes, from the first keystroke, gone again if the change is typed back. */
  const dirty = computed(() => working.value !== null && !sameParts(workingParts.value, loadedParts.value));

  const findings = computed<Finding[]>(() => {
    const copy = checkedCopy();
    if (!copy) return [];
    try {
      return checkSchedule(copy, { today: today.value });
    } catch {
      // A half-typed copy (e.g. a cleared number) must never break the editor; the schema messages say what is wrong.
      return [];
    }
  });

  /** Characters the printing fonts cannot draw, per text field: said while typing, not when the labels come out. */
  const printFindings = computed<Finding[]>(() => {
    const copy = checkedCopy();
    if (!copy) return [];
    try {
      return undrawableTextFindings(copy);
    } catch {
      return []; // as for the rules: a half-typed copy never breaks the editor
    }
  });

  /** Findings by the schedule path they concern, to show each beside its field (the print fonts' warnings too). */
  const findingsByField = computed(() => {
    const byField = new Map<string, Finding[]>();
    for (const f of [...findings.value, ...printFindings.value]) if (f.field) byField.set(f.field, [...(byField.get(f.field) ?? []), f]);
    return byField;
  });

  /** Spare ways (devices that feed no circuit), numbered as the chart and the way labels number them. */
  const spares = computed<SpareWay[]>(() => (working.value ? spareWays(working.value) : []));

  /** The largest Zs each circuit's device allows (BS 7671 Table 41.3), by circuit id: once per change, not per row. */
  const maxZsById = computed<Record<string, number | null>>(() => {
    if (!working.value) return {};
    try {
      return maxZsByCircuit(working.value);
    } catch {
      return {};
    }
  });

  /** Schema messages for the working copy, merged with the server's: shown beside fields, and they block saving. */
  const fieldMessages = computed<Record<string, string>>(() => {
    const copy = checkedCopy();
    if (!copy) return {};
    const parsed = scheduleSchema.safeParse(copy);
    return { ...serverFields.value, ...(parsed.success ? {} : fieldErrors(parsed.error)) };
  });

  function adopt(fresh: Awaited<ReturnType<typeof getSchedule>>): void {
    const schedule: Schedule = { board: fresh.board, devices: fresh.devices, circuits: fresh.circuits, survey: fresh.survey ?? null };
    loaded.value = clone(schedule);
    working.value = clone(schedule);
    baseRevision.value = fresh.revision;
    code.value = fresh.code;
    siteId.value = fresh.siteId;
    updatedAt.value = fresh.updatedAt;
  }

  // The draft follows every edit (a beat behind, so typing is not slowed) and goes when nothing is unsaved.
  let draftTimer: ReturnType<typeof setTimeout> | undefined;
  let copySeen: Schedule | null = null;
  watch(workingParts, () => {
    clearTimeout(draftTimer);
    draftTimer = setTimeout(keepDraft, 300);
    if (working.value !== copySeen) {
      copySeen = working.value; // a new copy: checked at once by the watcher below
      return;
    }
    clearTimeout(checkTimer);
    checkTimer = setTimeout(checkNow, CHECK_DELAY_MS);
  });
  watch(working, checkNow, { flush: 'sync' });
  function keepDraft(): void {
    if (boardId.value === null || !loaded.value || !working.value) return;
    if (dirty.value) writeDraft(boardId.value, { baseRevision: baseRevision.value, base: loaded.value, working: working.value });
    else clearDraft(boardId.value);
  }

  /** Lays an unsaved draft from this device over the fresh copy: as it was if nobody saved since, else re-applied. */
  function restoreDraft(id: number): void {
    const draft = readDraft(id);
    if (!draft || !loaded.value) return;
    const mine = draft.baseRevision === baseRevision.value ? { schedule: draft.working } : rebaseSchedule(draft.base, draft.working, loaded.value);
    if (JSON.stringify(mine.schedule) === JSON.stringify(loaded.value)) {
      clearDraft(id);
      return;
    }
    working.value = clone(mine.schedule);
    restoredDraftAt.value = draft.savedAt;
  }

  /** Loads a board; reloading the same board keeps the old copy on screen until the fresh one arrives. */
  async function load(id: number): Promise<void> {
    if (id !== boardId.value) {
      working.value = null;
      loaded.value = null;
    }
    boardId.value = id;
    status.value = 'loading';
    error.value = null;
    conflict.value = null;
    serverFields.value = {};
    today.value = isoToday();
    restoredDraftAt.value = null;
    // A board address that is not a board number (/boards/abc) names no board: say so, as for a deleted one.
    if (!Number.isInteger(id) || id < 1) {
      status.value = 'error';
      error.value = NO_SUCH_BOARD;
      return;
    }
    try {
      adopt(await getSchedule(id));
      restoreDraft(id);
      status.value = 'ready';
    } catch (err) {
      status.value = 'error';
      error.value = err instanceof ApiError && err.status === 404 ? NO_SUCH_BOARD : (err as Error).message;
    }
  }

  /** Saves the working copy against `baseRevision`; never throws, the outcome says what happened. */
  async function save(): Promise<SaveOutcome> {
    if (!working.value || boardId.value === null) return 'failed';
    checkNow(); // findings and messages as of the last keystroke, for the save and whatever it shows
    if (!dirty.value) return 'unchanged';
    const parsed = scheduleSchema.safeParse(working.value);
    if (!parsed.success) return 'invalid';
    status.value = 'saving';
    serverFields.value = {};
    try {
      const saved = await saveSchedule(boardId.value, parsed.data, baseRevision.value);
      working.value = clone(parsed.data);
      loaded.value = clone(parsed.data);
      baseRevision.value = saved.revision;
      lastSummary.value = saved.summary;
      clearDraft(boardId.value);
      restoredDraftAt.value = null;
      status.value = 'ready';
      return 'saved';
    } catch (err) {
      status.value = 'ready';
      if (err instanceof ApiError && err.status === 409) {
        conflict.value = { message: err.message };
        return 'conflict';
      }
      if (err instanceof ApiError && err.status === 400) {
        serverFields.value = err.fields;
        error.value = err.message;
        return 'invalid';
      }
      error.value = (err as Error).message;
      return 'failed';
    }
  }

  /** After a 409: fetch the saved copy and lay my edits over it where they touch other items. */
  async function reloadAndReapply(): Promise<RebaseResult | null> {
    if (!working.value || !loaded.value || boardId.value === null) return null;
    const fresh = await getSchedule(boardId.value);
    const result = rebaseSchedule(loaded.value, working.value, {
      board: fresh.board,
      devices: fresh.devices,
      circuits: fresh.circuits,
      survey: fresh.survey ?? null,
    });
    adopt(fresh);
    working.value = result.schedule;
    conflict.value = null;
    return result;
  }

  /** Throws my edits away and shows the saved copy. */
  async function discardAndReload(): Promise<void> {
    if (boardId.value === null) return;
    clearDraft(boardId.value);
    await load(boardId.value);
  }

  /**
   * Makes the new board's circuits and devices from the survey's plan: saves unsaved edits first
   * (the server applies the saved plan), then reloads what the server made. Never throws.
   */
  async function applyPlan(): Promise<{ outcome: SaveOutcome; created: string[]; updated: string[] }> {
    const none = { created: [], updated: [] };
    if (boardId.value === null) return { outcome: 'failed', ...none };
    const first = await save();
    if (first !== 'saved' && first !== 'unchanged') return { outcome: first, ...none };
    status.value = 'saving';
    try {
      const result = await applyChangeover(boardId.value, baseRevision.value);
      lastSummary.value = result.summary;
      await load(boardId.value);
      return { outcome: result.changed ? 'saved' : 'unchanged', created: result.created, updated: result.updated };
    } catch (err) {
      status.value = 'ready';
      if (err instanceof ApiError && err.status === 409) {
        conflict.value = { message: err.message };
        return { outcome: 'conflict', ...none };
      }
      if (err instanceof ApiError && err.status === 400) {
        serverFields.value = err.fields;
        error.value = err.message;
        return { outcome: 'invalid', ...none };
      }
      error.value = (err as Error).message;
      return { outcome: 'failed', ...none };
    }
  }

  function reset(): void {
    clearTimeout(checkTimer);
    clearTimeout(draftTimer);
    boardId.value = null;
    status.value = 'idle';
    loaded.value = null;
    working.value = null;
    conflict.value = null;
    serverFields.value = {};
    error.value = null;
  }

  return {
    boardId,
    status,
    error,
    code,
    siteId,
    updatedAt,
    loaded,
    working,
    baseRevision,
    serverFields,
    conflict,
    lastSummary,
    today,
    restoredDraftAt,
    dirty,
    findings,
    findingsByField,
    fieldMessages,
    spares,
    maxZsById,
    load,
    save,
    reloadAndReapply,
    discardAndReload,
    applyPlan,
    reset,
    ...editing(working),
  };
});

/** Editing helpers on the working copy: one place that knows how to add and move items sensibly. */
function editing(working: { value: Schedule | null }) {
  const schedule = (): Schedule => {
    if (!working.value) throw new Error('No board is loaded');
    return working.value;
  };

  /** A new circuit on the next free way, on the first breaker that feeds nothing yet. */
  function addCircuit(afterIndex?: number): Circuit {
    const s = schedule();
    const used = new Set(s.circuits.map((c) => c.deviceId));
    const freeBreaker = s.devices.find((d) => (d.kind === 'mcb' || d.kind === 'rcbo') && !used.has(d.id));
    const way = afterIndex !== undefined && s.circuits[afterIndex] ? nextFreeWay(s, s.circuits[afterIndex].way) : nextFreeWay(s, 0);
    const circuit = circuitSchema.parse({ id: newItemId('c'), way, label: 'New circuit', deviceId: freeBreaker?.id ?? null });
    const at = afterIndex === undefined ? s.circuits.length : afterIndex + 1;
    s.circuits.splice(at, 0, circuit);
    return s.circuits[at];
  }

  function removeCircuit(id: string): void {
    const s = schedule();
    s.circuits = s.circuits.filter((c) => c.id !== id);
  }

  /** Adds a device at the end of a row; breakers come as B-curve 6 kA, RCDs as 30 mA type A (common practice). */
  function addDevice(row: number, kind: DeviceKind): Device {
    const s = schedule();
    const defaults: Partial<Record<DeviceKind, Partial<Device>>> = {
      mcb: { rating: 16, curve: 'B', breakingCapacityKa: 6 },
      rcbo: { rating: 16, curve: 'B', breakingCapacityKa: 6, residualMa: 30, rcdType: 'A' },
      rcd: { modules: 2, poles: 2, rating: 63, residualMa: 30, rcdType: 'A' },
      'main-switch': { modules: 2, poles: 2, rating: 100 },
      isolator: { modules: 2, poles: 2, rating: 63 },
      afdd: { rating: 16, curve: 'B' },
      spd: { modules: 2 },
    };
    const device = deviceSchema.parse({ id: newItemId('d'), row, kind, ...defaults[kind] });
    const lastOnRow = s.devices.map((d) => d.row).lastIndexOf(row);
    const at = lastOnRow === -1 ? insertionForRow(s, row) : lastOnRow + 1;
    s.devices.splice(at, 0, device);
    return s.devices[at];
  }

  /** Removes a device; circuits it fed keep their way but lose the device (a finding says so). */
  function removeDevice(id: string): void {
    const s = schedule();
    s.devices = s.devices.filter((d) => d.id !== id);
    for (const c of s.circuits) if (c.deviceId === id) c.deviceId = null;
    for (const d of s.devices) if (d.protectedBy === id) d.protectedBy = null;
  }

  /** Moves a device to a place on its row (`toPosition` counts devices on that row from 0). */
  function moveDevice(id: string, toPosition: number, toRow?: number): void {
    const s = schedule();
    const from = s.devices.findIndex((d) => d.id === id);
    if (from === -1) return;
    const [device] = s.devices.splice(from, 1);
    device.row = toRow ?? device.row;
    const rowIndexes = s.devices.map((d, i) => (d.row === device.row ? i : -1)).filter((i) => i !== -1);
    const clamped = Math.max(0, Math.min(toPosition, rowIndexes.length));
    const at = clamped < rowIndexes.length ? rowIndexes[clamped] : rowIndexes.length ? rowIndexes[rowIndexes.length - 1] + 1 : insertionForRow(s, device.row);
    s.devices.splice(at, 0, device);
  }

  /**
   * Puts a circuit on a spare way: its number (the next free one when the spare has none), its phase
   * and its device, placed among the circuits where that way falls, so the row stays where the spare was.
   */
  function addCircuitOnSpare(spare: SpareWay): Circuit {
    const s = schedule();
    const way = spare.way ?? nextFreeWay(s, Math.max(0, ...s.circuits.map((c) => c.way)));
    const circuit = circuitSchema.parse({ id: newItemId('c'), way, phase: spare.phase, label: 'New circuit', deviceId: spare.device.id });
    const after = s.circuits.findIndex((c) => c.way > way || (c.way === way && (c.phase ?? '') > (circuit.phase ?? '')));
    const at = after === -1 ? s.circuits.length : after;
    s.circuits.splice(at, 0, circuit);
    return s.circuits[at];
  }

  return { addCircuit, removeCircuit, addDevice, removeDevice, moveDevice, addCircuitOnSpare };
}

/** Where a row's first device goes so the list stays in row order. */
function insertionForRow(s: Schedule, row: number): number {
  const after = s.devices.findIndex((d) => d.row > row);
  return after === -1 ? s.devices.length : after;
}

function nextFreeWay(s: Schedule, from: number): number {
  const used = new Set(s.circuits.map((c) => c.way));
  let way = from + 1;
  while (used.has(way)) way++;
  return Math.min(way, 999);
}
