/**
 * Every rate limit of the app, counted in the one store all app processes share (MariaDB,
 * `limit-store.ts`), so two processes behind a balancer do not double a limit. Sign-in, password
 * resets, sign-up, accepting an invitation, invitations, handover e-mails, board-page reads and
 * reports each name their counter; mail sent by a signed-in member is also counted per organisation,
 * so neither one connection nor one tenant with many connections can flood mailboxes or the CPU.
 */
import { isIPv4 } from 'node:net';
import type { NextFunction, Request, RequestHandler, Response } from 'express';
import rateLimit, { ipKeyGenerator } from 'express-rate-limit';
import type { AppContext } from '../context.js';
import { tooMany } from '../errors.js';
import { SharedLimitStore } from './limit-store.js';

export const MINUTE = 60_000;
export const HOUR = 60 * MINUTE;

export interface LimitSpec {
  /** The counter's name in the shared store: the same limit in every process counts together. Unique per limit. */
  name: string;
  windowMs: number;
  limit: number;
  /** Said with the 429. */
  message: string;
  /** What is counted; the connection's address unless given. */
  key?: (req: Request) => string;
}

/**
 * The address a limit counts against. IPv4 (plain or IPv4-mapped, as a dual-stack listener sees
 * it) is taken as it is; only real IPv6 addresses go through the library's /56 grouping, whose
 * address parsing showed up in every board-page request's profile.
 */
export function addressKey(req: Request): string {
  const ip = req.ip ?? '';
  if (isIPv4(ip)) return ip;
  if (ip.startsWith('::ffff:') && isIPv4(ip.slice(7))) return ip.slice(7);
  return ipKeyGenerator(ip);
}

/** One limit, counted in the shared store; over it, 429 with `Retry-After` up to the end of the window. */
export function sharedLimit(ctx: AppContext, spec: LimitSpec): RequestHandler {
  return rateLimit({
    windowMs: spec.windowMs,
    limit: spec.limit,
    standardHeaders: 'draft-7',
    legacyHeaders: false,
    keyGenerator: spec.key ?? addressKey,
    store: new SharedLimitStore(ctx.db, `${ctx.config.rateLimitScope}${spec.name}:`),
    handler: (req: Request, _res: Response, next: NextFunction) => {
      const resetTime = (req as Request & { rateLimit?: { resetTime?: Date } }).rateLimit?.resetTime;
      const seconds = resetTime ? Math.ceil((resetTime.getTime() - Date.now()) / 1000) : spec.windowMs / 1000;
      next(tooMany(spec.message, Math.max(1, seconds)));
    },
  });
}

/** Per address, an hour: for anonymous requests that mail or hash (sign-up, reset, accepting an invitation). */
export function perAddress(ctx: AppContext, name: string, limit: number, what: string): RequestHandler {
  return sharedLimit(ctx, { name, windowMs: HOUR, limit, message: `Too many ${what} from this connection; try again in an hour` });
}

/** Per address and per organisation, an hour: for mail a signed-in member sends (invitations, handovers). */
export function perAddressAndOrganisation(ctx: AppContext, name: string, limit: number, what: string): RequestHandler[] {
  return [
    perAddress(ctx, `${name}-address`, limit, what),
    sharedLimit(ctx, {
      name: `${name}-organisation`,
      windowMs: HOUR,
      limit,
      message: `Too many ${what} from this organisation; try again in an hour`,
      key: (req) => String(req.user?.organisationId ?? 'none'),
    }),
  ];
}
