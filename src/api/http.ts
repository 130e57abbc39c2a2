/**
 * The one fetch wrapper: JSON in and out, the CSRF token on every write, and API errors
 * turned into `ApiError` with the field messages the server sent (shown beside form fields).
 */
import type { z } from 'zod';

export class ApiError extends Error {
  constructor(
    readonly status: number,
    message: string,
    readonly fields: Record<string, string> = {},
    readonly code?: string,
    readonly body?: unknown,
  ) {
    super(message);
  }
}

let csrfToken: string | null = null;

async function csrf(): Promise<string> {
  if (!csrfToken) {
    const res = await fetch('/api/auth/csrf', { credentials: 'same-origin' });
    csrfToken = ((await res.json()) as { token: string }).token;
  }
  return csrfToken;
}

/** After sign-in or sign-out the session changes; fetch a fresh token next time. */
export function forgetCsrfToken(): void {
  csrfToken = null;
}

export interface RequestOptions {
  body?: unknown;
  raw?: BodyInit;
  contentType?: string;
  signal?: AbortSignal;
}

export async function request(method: string, path: string, opts: RequestOptions = {}): Promise<Response> {
  const headers: Record<string, string> = { Accept: 'application/json' };
  if (method !== 'GET' && method !== 'HEAD') headers['X-CSRF-Token'] = await csrf();
  let body: BodyInit | undefined;
  if (opts.raw !== undefined) {
    body = opts.raw;
    if (opts.contentType) headers['Content-Type'] = opts.contentType;
  } else if (opts.body !== undefined) {
    body = JSON.stringify(opts.body);
    headers['Content-Type'] = 'application/json';
  }
  const res = await fetch(path, { method, headers, body, credentials: 'same-origin', signal: opts.signal });
  if (res.status === 403 && method !== 'GET') {
    // A stale token after a session change: fetch a new one once and retry.
    const peek = (await res
      .clone()
      .json()
      .catch(() => null)) as { error?: { code?: string } } | null;
    if (peek?.error?.code === 'csrf') {
      forgetCsrfToken();
      headers['X-CSRF-Token'] = await csrf();
      return checked(await fetch(path, { method, headers, body, credentials: 'same-origin', signal: opts.signal }));
    }
  }
  return checked(res);
}

async function checked(res: Response): Promise<Response> {
  if (res.ok) return res;
  const data = (await res.json().catch(() => null)) as { error?: { message?: string; fields?: Record<string, string>; code?: string } } | null;
  throw new ApiError(res.status, data?.error?.message ?? `Request failed (${res.status})`, data?.error?.fields ?? {}, data?.error?.code, data);
}

/** JSON request parsed with the shared schema of the response, so a contract drift fails loudly. */
export async function json<S extends z.ZodType>(schema: S, method: string, path: string, opts?: RequestOptions): Promise<z.infer<S>> {
  const res = await request(method, path, opts);
  return schema.parse(await res.json());
}

/** JSON request whose response body is not needed (204 or ignored). */
export async function send(method: string, path: string, opts?: RequestOptions): Promise<void> {
  await request(method, path, opts);
}
