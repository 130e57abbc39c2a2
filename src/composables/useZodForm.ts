/**
 * A form model checked with the same shared zod schema the server parses with, so a field's
 * message reads the same whether the browser or the server found the problem. Server field
 * messages (ApiError.fields) land beside the same fields.
 * Give the `<a-form>` the `novalidate` attribute: otherwise the browser's own check of
 * `type="email"` inputs blocks the submit before the schema's message can show.
 */
import { reactive, ref, toRaw, watch, type Ref } from 'vue';
import type { z } from 'zod';
import { fieldErrors } from '../../shared/schemas/errors.js';
import { ApiError } from '../api/http.js';

/** Props for `<a-form-item v-bind="form.field('email')">`: the error state and message of one field. */
export interface FieldBinding {
  validateStatus?: 'error';
  help?: string;
}

export interface ZodForm<S extends z.ZodType> {
  model: z.input<S>;
  errors: Ref<Record<string, string>>;
  /** A message for the whole form (the server's message, or a network failure). */
  formError: Ref<string | null>;
  submitting: Ref<boolean>;
  field(path: string): FieldBinding;
  validate(): z.output<S> | null;
  submit(action: (data: z.output<S>) => Promise<void>): Promise<boolean>;
  reset(values?: Partial<z.input<S>>): void;
}

/** Turns any failure into messages: an ApiError keeps the server's words and field messages. */
export function describeFailure(err: unknown): { message: string; fields: Record<string, string> } {
  if (err instanceof ApiError) {
    const fields = Object.fromEntries(Object.entries(err.fields).filter(([path]) => path !== '(body)'));
    return { message: err.fields['(body)'] ?? err.message, fields };
  }
  if (err instanceof TypeError) return { message: 'Waymark could not be reached. Check the connection and try again.', fields: {} };
  return { message: err instanceof Error ? err.message : String(err), fields: {} };
}

export function useZodForm<S extends z.ZodType>(schema: S, initial: z.input<S>): ZodForm<S> {
  const model = reactive(structuredClone(initial) as object) as z.input<S>;
  const errors = ref<Record<string, string>>({});
  const formError = ref<string | null>(null);
  const submitting = ref(false);
  // After the first submit, fields re-check as they change, so a fixed field clears at once.
  let attempted = false;

  function validate(): z.output<S> | null {
    const result = schema.safeParse(toRaw(model));
    errors.value = result.success ? {} : fieldErrors(result.error);
    return result.success ? result.data : null;
  }

  watch(
    model as object,
    () => {
      if (attempted) validate();
    },
    { deep: true },
  );

  async function submit(action: (data: z.output<S>) => Promise<void>): Promise<boolean> {
    attempted = true;
    formError.value = null;
    const data = validate();
    if (data === null) return false;
    submitting.value = true;
    try {
      await action(data);
      return true;
    } catch (err) {
      const failure = describeFailure(err);
      errors.value = failure.fields;
      formError.value = failure.message;
      return false;
    } finally {
      submitting.value = false;
    }
  }

  function field(path: string): FieldBinding {
    const message = errors.value[path];
    return message ? { validateStatus: 'error', help: message } : {};
  }

  function reset(values: Partial<z.input<S>> = {}): void {
    Object.assign(model as object, structuredClone(initial), values);
    attempted = false;
    errors.value = {};
    formError.value = null;
  }

  return { model, errors, formError, submitting, field, validate, submit, reset };
}
