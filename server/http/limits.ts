/**
 * Limits on the requests that cost the most or send mail on someone's behalf: sign-up, password
 * reset, accepting an invitation, invitations and handover e-mails. Each is counted per address
 * and, where a signed-in member sends, per organisation too, so neither one connection nor one
 * tenant with many connections can flood mailboxes or the CPU (each of these hashes or mails).
 */
import type { NextFunction, Request, RequestHandler, Response } from 'express';
import rateLimit, { ipKeyGenerator } from 'express-rate-limit';
import { tooMany } from '../errors.js';

const HOUR = 60 * 60 * 1000;

function limiter(limit: number, message: string, keyGenerator: (req: Request) => string): RequestHandler {
  return rateLimit({
    windowMs: HOUR,
    limit,
    standardHeaders: 'draft-7',
    legacyHeaders: false,
    keyGenerator,
    handler: (_req: Request, _res: Response, next: NextFunction) => next(tooMany(message, HOUR / 1000)),
  });
}

/** The connection's address, IPv6 grouped by /56 as the library advises. */
const addressKey = (req: Request) => `address:${ipKeyGenerator(req.ip ?? '')}`;

/** Per address: for anonymous requests (sign-up, reset, accepting an invitation). */
export function perAddress(limit: number, what: string): RequestHandler {
  return limiter(limit, `Too many ${what} from this connection; try again in an hour`, addressKey);
}

/** Per address and per organisation: for mail a signed-in member sends (invitations, handovers). */
export function perAddressAndOrganisation(limit: number, what: string): RequestHandler[] {
  return [
    perAddress(limit, what),
    limiter(limit, `Too many ${what} from this organisation; try again in an hour`, (req) => `organisation:${req.user?.organisationId ?? 'none'}`),
  ];
}
