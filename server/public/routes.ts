/**
 * The board page's API (`/api/public`, no sign-in) and the members' sharing state
 * (`/api/boards/:id/sharing`). Every public request is rate-limited per address; reports are
 * also limited per address and per board, so one visitor cannot flood a contractor's inbox.
 */
import { Router, type NextFunction, type Request, type Response } from 'express';
import { isIPv4 } from 'node:net';
import rateLimit, { ipKeyGenerator } from 'express-rate-limit';
import type { AppContext } from '../context.js';
import { requireUser } from '../auth/guard.js';
import { tooMany } from '../errors.js';
import { idParam, parse } from '../http/parse.js';
import { reportSubmitSchema } from '../../shared/schemas/reports.js';
import { submitReport } from '../reports/service.js';
import { sendImage } from '../http/images.js';
import { boardForToken, publicBoardPage, publicLogo, sharingState } from './service.js';

const MINUTE = 60_000;
const HOUR = 60 * MINUTE;
/** A board may take more reports an hour than one address may send (several visitors, one site). */
const BOARD_REPORTS_FACTOR = 3;

function limiter(windowMs: number, limit: number, message: string, keyGenerator?: (req: Request) => string) {
  return rateLimit({
    windowMs,
    limit,
    standardHeaders: 'draft-7',
    legacyHeaders: false,
    keyGenerator: keyGenerator ?? addressKey,
    handler: (_req: Request, _res: Response, next: NextFunction) => next(tooMany(message, Math.ceil(windowMs / 1000))),
  });
}

const token = (req: Request) => String(req.params.token ?? '');

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

/** Mounted at `/public`. */
export function publicRoutes(ctx: AppContext): Router {
  const r = Router();
  const limits = ctx.config.rateLimits;
  r.use(limiter(MINUTE, limits.publicPerMinute, 'Too many requests; wait a minute and try again'));
  // The page is read-only and may change at any save, token rotation or switch-off: no shared caches, no indexing.
  r.use((_req, res, next) => {
    res.set({ 'Cache-Control': 'no-store', 'X-Robots-Tag': 'noindex, nofollow' });
    next();
  });

  r.get('/boards/:token', async (req, res) => {
    // Serialised once per revision; the entity tag set here spares Express hashing the body again.
    const { json, etag } = await publicBoardPage(ctx.db, token(req));
    res.set('ETag', etag).type('json').send(json);
  });
  r.get('/boards/:token/logo', async (req, res) => {
    sendImage(res, await publicLogo(ctx.db, token(req)), 'no-store');
  });
  r.post(
    '/boards/:token/reports',
    limiter(HOUR, limits.reportsPerHour, 'Too many reports from this connection; try again later'),
    limiter(HOUR, limits.reportsPerHour * BOARD_REPORTS_FACTOR, 'This board has had many reports recently; try again later', (req) => `board:${token(req)}`),
    async (req, res) => {
      const input = parse(reportSubmitSchema, req.body);
      await submitReport(ctx, await boardForToken(ctx.db, token(req)), input);
      res.status(202).json({ received: true });
    },
  );
  return r;
}

/** Mounted at `/boards/:id/sharing`: the board page's link and state for members. */
export function sharingRoutes(ctx: AppContext): Router {
  const r = Router({ mergeParams: true });
  r.get('/', requireUser, async (req, res) => {
    res.json(await sharingState(ctx.db, ctx.config, req.user!.organisationId, idParam(req.params)));
  });
  return r;
}
