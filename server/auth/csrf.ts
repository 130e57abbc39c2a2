/**
 * CSRF guard, a signed double-submit: `GET /api/auth/csrf` sets a random value in an httpOnly
 * cookie and answers its HMAC under the session secret; every state-changing request must send that
 * HMAC in `X-CSRF-Token`. Another site can make the browser send the cookie but can read neither it
 * nor the answer, and cannot compute the HMAC. Nothing is stored on the server, so a visitor who
 * only fetches a token (or a script fetching millions) leaves no session row behind.
 */
import { createHmac, randomBytes, timingSafeEqual } from 'node:crypto';
import type { Request, RequestHandler, Response } from 'express';
import { AppError } from '../errors.js';

const SAFE = new Set(['GET', 'HEAD', 'OPTIONS']);
export const CSRF_COOKIE = 'waymark.csrf';
const MAX_AGE_MS = 14 * 24 * 3600 * 1000;

const sign = (secret: string, value: string) => createHmac('sha256', secret).update(`csrf|${value}`).digest('base64url');

function cookieValue(req: Request): string | undefined {
  const value = (req.cookies as Record<string, unknown> | undefined)?.[CSRF_COOKIE];
  return typeof value === 'string' && /^[A-Za-z0-9_-]{32}$/.test(value) ? value : undefined;
}

/** The token for this browser, setting its cookie first when it has none (or a malformed one). */
export function csrfToken(req: Request, res: Response, secret: string): string {
  let value = cookieValue(req);
  if (!value) {
    value = randomBytes(24).toString('base64url');
    res.cookie(CSRF_COOKIE, value, { httpOnly: true, sameSite: 'lax', secure: req.secure, path: '/', maxAge: MAX_AGE_MS });
  }
  return sign(secret, value);
}

export function requireCsrf(secret: string): RequestHandler {
  return (req, _res, next) => {
    if (SAFE.has(req.method)) return next();
    const value = cookieValue(req);
    // Compared as bytes: a header of non-ASCII characters can match the token's length in characters
    // but not in bytes, and timingSafeEqual throws on buffers of different lengths.
    const sent = Buffer.from(req.get('x-csrf-token') ?? '', 'utf8');
    const expected = Buffer.from(value ? sign(secret, value) : '', 'utf8');
    const ok = expected.length > 0 && sent.length === expected.length && timingSafeEqual(sent, expected);
    if (!ok) return next(new AppError(403, 'csrf', 'Missing or wrong X-CSRF-Token header: fetch one from GET /api/auth/csrf'));
    next();
  };
}
