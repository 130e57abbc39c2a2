/**
 * A schedule's content as one string per part (the board, the devices, the survey, each circuit),
 * each kept in its own computed value: typing in one circuit re-serialises that circuit alone, where
 * a deep watch or a whole-copy JSON would walk all 120 circuits on every keystroke. Two copies with
 * the same strings hold the same content, which is how the editor knows there is something unsaved.
 */
import { computed, type ComputedRef } from 'vue';
import type { Schedule } from '../../shared/schemas/schedule.js';

const signatures = new WeakMap<object, ComputedRef<string>>();

function signature(part: object | null): string {
  if (part === null) return 'null';
  let sig = signatures.get(part);
  if (!sig) {
    sig = computed(() => JSON.stringify(part));
    signatures.set(part, sig);
  }
  return sig.value;
}

/** The copy's parts in a fixed order; null for no copy. Read inside a computed or a watch, so it is tracked. */
export function scheduleParts(schedule: Schedule | null): string[] | null {
  if (!schedule) return null;
  return [signature(schedule.board), signature(schedule.devices), signature(schedule.survey ?? null), ...schedule.circuits.map(signature)];
}

export function sameParts(a: readonly string[] | null, b: readonly string[] | null): boolean {
  if (a === null || b === null) return a === b;
  return a.length === b.length && a.every((part, i) => part === b[i]);
}
