/**
 * Stale-save handling for forms saved against a revision (sites, organisation settings, sheet layouts, the
 * printer offset): the server answers 409 `stale` when someone saved first, and the form then offers a reload
 * instead of overwriting their work.
 */
import { ref, type Ref } from 'vue';
import { ApiError } from '../api/http.js';

export const STALE_SAVE_MESSAGE = 'Someone saved this since you opened it: reload to see their changes.';

/** True for the 409 `stale` answer to a save made from an old revision. */
export const isStaleSave = (err: unknown): boolean => err instanceof ApiError && err.status === 409 && err.code === 'stale';

export interface StaleSave {
  /** Whether the last save was refused as stale (cleared by the next save or a reload). */
  stale: Ref<boolean>;
  /** Runs a save; a stale refusal sets `stale` and is re-thrown, so the form still counts it as failed. */
  guard<T>(save: () => Promise<T>): Promise<T>;
}

export function useStaleSave(): StaleSave {
  const stale = ref(false);
  async function guard<T>(save: () => Promise<T>): Promise<T> {
    stale.value = false;
    try {
      return await save();
    } catch (err) {
      if (isStaleSave(err)) stale.value = true;
      throw err;
    }
  }
  return { stale, guard };
}
