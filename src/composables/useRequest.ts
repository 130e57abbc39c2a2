/**
 * Loading state for one read request: the explicit status union every screen shows
 * (a spinner while loading, an error with a retry, the data when ready). A newer run
 * wins over an older one still in flight, so a quick retry never shows stale data.
 * A 401 means the session has ended, so the session store is told (the shell then asks
 * the member to sign in again); call it from a component's setup.
 */
import { ref, shallowRef, type Ref, type ShallowRef } from 'vue';
import { ApiError } from '../api/http.js';
import { useSessionStore } from '../stores/session.js';
import { describeFailure } from './useZodForm.js';

export type RequestStatus = 'idle' | 'loading' | 'ready' | 'error';

export interface RequestState<T> {
  status: Ref<RequestStatus>;
  data: ShallowRef<T | null>;
  error: Ref<string | null>;
  /** HTTP status of the last failure (404 tells "gone" apart from "broken"), or null. */
  errorStatus: Ref<number | null>;
  run(): Promise<void>;
}

export function useRequest<T>(load: () => Promise<T>, options: { immediate?: boolean } = {}): RequestState<T> {
  const status = ref<RequestStatus>('idle');
  const data = shallowRef<T | null>(null);
  const error = ref<string | null>(null);
  const errorStatus = ref<number | null>(null);
  const session = useSessionStore();
  let latest = 0;

  async function run(): Promise<void> {
    const mine = ++latest;
    status.value = 'loading';
    error.value = null;
    errorStatus.value = null;
    try {
      const value = await load();
      if (mine !== latest) return;
      data.value = value;
      status.value = 'ready';
    } catch (err) {
      if (mine !== latest) return;
      error.value = describeFailure(err).message;
      errorStatus.value = err instanceof ApiError ? err.status : null;
      status.value = 'error';
      if (errorStatus.value === 401) session.expire();
    }
  }

  if (options.immediate !== false) void run();
  return { status, data, error, errorStatus, run };
}
