/**
 * The one error path. Use-cases throw these; the error middleware turns them and zod
 * errors into `{error: {code, message, fields?}}` with the right status.
 */
import { causes } from './db/errors.js';
import type { ErrorRequestHandler } from 'express';
import { ZodError } from 'zod';
import { fieldErrors } from '../shared/schemas/errors.js';

export class AppError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields?: Record<string, string>,
    readonly headers?: Record<string, string>,
    /** Top-level fields sent beside `error`, e.g. the current `revision` of a stale save. */
    readonly extra?: Record<string, unknown>,
  ) {
    super(message);
  }
}

export const notFound = (what = 'Not found') => new AppError(404, 'not_found', what);
export const forbidden = (why = 'You do not have permission to do that') => new AppError(403, 'forbidden', why);
export const unauthorised = (why = 'Please sign in') => new AppError(401, 'unauthorised', why);
export const conflict = (why: string, fields?: Record<string, string>) => new AppError(409, 'conflict', why, fields);
/**
 * 409 `stale`: `what` was saved by someone else since this save's `baseRevision` was read. The body carries
 * the current `revision` (as a board's stale save does), so the client can reload instead of overwriting.
 */
export const stale = (what: string, revision: number) =>
  new AppError(
    409,
    'stale',
    `Someone saved this ${what} since you opened it; it is now at revision ${revision}. Reload it to see their changes.`,
    { baseRevision: `The ${what} is at revision ${revision}` },
    undefined,
    { revision },
  );
export const invalid = (why: string, fields?: Record<string, string>) => new AppError(400, 'invalid', why, fields);
export const tooMany = (why: string, retryAfterSeconds: number) =>
  new AppError(429, 'rate_limited', why, undefined, { 'Retry-After': String(retryAfterSeconds) });
export const unavailable = (why = 'The database is unavailable; try again in a moment') => new AppError(503, 'unavailable', why);

const DB_DOWN_CODES = new Set([
  'ECONNREFUSED',
  'PROTOCOL_CONNECTION_LOST',
  'ETIMEDOUT',
  'ECONNRESET',
  'EPIPE',
  'ER_CON_COUNT_ERROR',
  'PROTOCOL_ENQUEUE_AFTER_FATAL_ERROR',
  'ER_SERVER_SHUTDOWN',
]);

/** True when an error means the database cannot be reached (so the answer is 503, not 500). */
export function isDatabaseDown(err: unknown): boolean {
  for (const e of causes(err)) {
    if (typeof e.code === 'string' && DB_DOWN_CODES.has(e.code)) return true;
    if (typeof e.message === 'string' && /connect ECONNREFUSED|Connection lost|closed state|Pool is closed/i.test(e.message)) return true;
  }
  return false;
}

export const errorHandler: ErrorRequestHandler = (err, _req, res, next) => {
  if (res.headersSent) return next(err);
  if (err instanceof ZodError) {
    res.status(400).json({ error: { code: 'invalid', message: 'Some fields are not valid', fields: fieldErrors(err) } });
    return;
  }
  if (err instanceof AppError) {
    if (err.headers) res.set(err.headers);
    res.status(err.status).json({ error: { code: err.code, message: err.message, ...(err.fields ? { fields: err.fields } : {}) }, ...err.extra });
    return;
  }
  // body-parser: malformed JSON or an oversized body are the client's fault.
  if (err && typeof err.status === 'number' && err.status >= 400 && err.status < 500) {
    const message =
      err.type === 'entity.parse.failed'
        ? 'The request body is not valid JSON'
        : err.type === 'entity.too.large'
          ? 'The request body is too large'
          : err.expose
            ? err.message
            : 'Bad request';
    res.status(err.status).json({ error: { code: 'invalid', message, fields: err.type === 'entity.parse.failed' ? { body: 'not valid JSON' } : undefined } });
    return;
  }
  if (isDatabaseDown(err)) {
    res
      .set('Retry-After', '5')
      .status(503)
      .json({ error: { code: 'unavailable', message: 'The database is unavailable; try again in a moment' } });
    return;
  }
  console.error('Unhandled error', err);
  res.status(500).json({ error: { code: 'internal', message: 'Something went wrong on our side' } });
};
