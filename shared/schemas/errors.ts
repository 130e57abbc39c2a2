import type { ZodError } from 'zod';

/** The error body every API failure carries. */
export interface ApiErrorBody {
  error: { code?: string; message: string; fields?: Record<string, string> };
}

/** Flattens zod issues to `{ "circuits.3.label": "Too long: at most 24 characters" }`. */
export function fieldErrors(err: ZodError): Record<string, string> {
  const out: Record<string, string> = {};
  for (const issue of err.issues) {
    const path = issue.path.length ? issue.path.map(String).join('.') : '(body)';
    if (!(path in out)) out[path] = issue.message;
  }
  return out;
}
