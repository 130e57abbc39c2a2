/**
 * The unsaved working copy of a board, kept in the browser's storage while it differs from the
 * saved copy, so a phone that locks, a reload or a lost tab mid-survey loses nothing. A draft is
 * kept with the copy it was edited from; when the board was saved elsewhere since, the draft is
 * laid over the fresh copy like a 409 is (`rebaseSchedule`). Drafts are removed on save, on
 * discard and on sign-out, so a shared phone keeps no board after its member leaves.
 */
import type { Schedule } from '../../shared/schemas/schedule.js';

const PREFIX = 'waymark.draft.';

export interface BoardDraft {
  baseRevision: number;
  /** The saved copy the draft was edited from. */
  base: Schedule;
  working: Schedule;
  /** When it was last written (ISO). */
  savedAt: string;
}

const storage = (): Storage | null => {
  try {
    return typeof window === 'undefined' ? null : window.localStorage;
  } catch {
    return null;
  }
};

export function readDraft(boardId: number): BoardDraft | null {
  const raw = storage()?.getItem(PREFIX + boardId);
  if (!raw) return null;
  try {
    const draft = JSON.parse(raw) as BoardDraft;
    return typeof draft.baseRevision === 'number' && draft.base && draft.working ? draft : null;
  } catch {
    return null;
  }
}

/** Writes the draft; a full or refused storage loses only the safety net, never the edit on screen. */
export function writeDraft(boardId: number, draft: Omit<BoardDraft, 'savedAt'>): void {
  try {
    storage()?.setItem(PREFIX + boardId, JSON.stringify({ ...draft, savedAt: new Date().toISOString() }));
  } catch {
    /* storage full or private mode */
  }
}

export function clearDraft(boardId: number): void {
  storage()?.removeItem(PREFIX + boardId);
}

/** Every board's draft, on sign-out. */
export function clearAllDrafts(): void {
  const s = storage();
  if (!s) return;
  for (const key of Object.keys(s)) if (key.startsWith(PREFIX)) s.removeItem(key);
}
