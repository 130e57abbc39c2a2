/**
 * The board page's API (`/api/public`, no sign-in) and the members' sharing state
 * (`/api/boards/:id/sharing`). Every public request is rate-limited per address; reports are
 * also limited per address and per board, so one visitor cannot flood a contractor's inbox.
 */
import { Router, type Request } from 'express';
import type { AppContext } from '../context.js';
import { requireUser } from '../auth/guard.js';
import { HOUR, MINUTE, sharedLimit } from '../http/limits.js';
import { idParam, parse } from '../http/parse.js';
import { reportSubmitSchema } from '../../shared/schemas/reports.js';
import { submitReport } from '../reports/service.js';
import { sendImage } from '../http/images.js';
import { boardForToken, publicBoardPage, publicLogo, sharingState } from './service.js';
import { BOARD_PAGE_CACHE_CONTROL, PRIVATE_CACHE_CONTROL } from './caching.js';

/** A board may take more reports an hour than one address may send (several visitors, one site). */
const BOARD_REPORTS_FACTOR = 3;

const token = (req: Request) => String(req.params.token ?? '');

/** Reads of board pages per address, one counter for the page's HTML, its JSON and its logo. */
export const publicReadLimit = (ctx: AppContext) =>
  sharedLimit(ctx, {
    name: 'public-read',
    windowMs: MINUTE,
    limit: ctx.config.rateLimits.publicPerMinute,
    message: 'Too many requests; wait a minute and try again',
  });

/** Mounted at `/public`. */
export function publicRoutes(ctx: AppContext): Router {
  const r = Router();
  const limits = ctx.config.rateLimits;
  r.use(publicReadLimit(ctx));
  // Not indexed; nothing kept by a cache unless a route says so below (a 404, a 429 and every error stay uncached).
  r.use((_req, res, next) => {
    res.set({ 'Cache-Control': PRIVATE_CACHE_CONTROL, 'X-Robots-Tag': 'noindex, nofollow' });
    next();
  });

  r.get('/boards/:token', async (req, res) => {
    // Serialised once per revision; the entity tag set here spares Express hashing the body again, and
    // Express answers 304 to a cache that sends it back (If-None-Match) while the page is unchanged.
    const { json, etag } = await publicBoardPage(ctx.db, token(req));
    res.set({ ETag: etag, 'Cache-Control': BOARD_PAGE_CACHE_CONTROL }).type('json').send(json);
  });
  r.get('/boards/:token/logo', async (req, res) => {
    sendImage(res, await publicLogo(ctx.db, token(req)), BOARD_PAGE_CACHE_CONTROL);
  });
  r.post(
    '/boards/:token/reports',
    sharedLimit(ctx, {
      name: 'report-address',
      windowMs: HOUR,
      limit: limits.reportsPerHour,
      message: 'Too many reports from this connection; try again later',
    }),
    sharedLimit(ctx, {
      name: 'report-board',
      windowMs: HOUR,
      limit: limits.reportsPerHour * BOARD_REPORTS_FACTOR,
      message: 'This board has had many reports recently; try again later',
      key: token,
    }),
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
