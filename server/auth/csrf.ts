/**
 * CSRF guard: a random token kept in the session, handed out by `GET /api/auth/csrf`,
 * and required in the `X-CSRF-Token` header of every state-changing request.
 */
import { randomBytes, timingSafeEqual } from 'node:crypto';
import type { Request, RequestHandler } from 'express';
import { AppError } from '../errors.js';

const SAFE = new Set(['GET', 'HEAD', 'OPTIONS']);

export function csrfToken(req: Request): string {
  if (!req.session.csrfToken) req.session.csrfToken = randomBytes(24).toString('base64url');
  return req.session.csrfToken;
}

export const requireCsrf: RequestHandler = (req, _res, next) => {
  if (SAFE.has(req.method)) return next();
  // Compared as bytes: a header of non-ASCII characters can match the token's length in characters
  // but not in bytes, and timingSafeEqual throws on buffers of different lengths.
  const sent = Buffer.from(req.get('x-csrf-token') ?? '', 'utf8');
  const expected = Buffer.from(req.session?.csrfToken ?? '', 'utf8');
  const ok = expected.length > 0 && sent.length === expected.length && timingSafeEqual(sent, expected);
  if (!ok) return next(new AppError(403, 'csrf', 'Missing or wrong X-CSRF-Token header: fetch one from GET /api/auth/csrf'));
  next();
};
