/**
 * One file chosen in a form and sent: the chosen file, a busy flag, the failure message and the
 * field faults a refused file came back with (rows and fields at fault), shared by the board-file
 * and circuit-CSV imports.
 */
import { ref } from 'vue';
import { ApiError } from '../api/http.js';
import { describeFailure } from './useZodForm.js';

export function useFileUpload() {
  const file = ref<File | null>(null);
  const busy = ref(false);
  const message = ref<string | null>(null);
  const faults = ref<Record<string, string>>({});

  function reset(): void {
    message.value = null;
    faults.value = {};
  }

  function choose(event: Event): void {
    file.value = (event.target as HTMLInputElement).files?.[0] ?? null;
    reset();
  }

  /** Sends the chosen file with `send`; `explain` may word a failure better than the server's message. */
  async function upload(send: (file: File) => Promise<void>, explain?: (err: unknown) => string | null): Promise<void> {
    if (!file.value) return;
    busy.value = true;
    reset();
    try {
      await send(file.value);
    } catch (err) {
      message.value = explain?.(err) ?? describeFailure(err).message;
      faults.value = err instanceof ApiError ? err.fields : {};
    } finally {
      busy.value = false;
    }
  }

  return { file, busy, message, faults, choose, upload };
}
