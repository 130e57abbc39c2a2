/** Mounts each business component's router under /api. One line per component. */
import { Router } from 'express';
import type { AppContext } from './context.js';
import { authRoutes } from './auth/routes.js';
import { invitationRoutes, membersRoutes } from './members/routes.js';
import { organisationRoutes } from './organisation/routes.js';
import { devRoutes } from './dev/routes.js';
import { sheetLayoutRoutes } from './sheet-layouts/routes.js';
import { printerProfileRoutes } from './printer-profiles/routes.js';
import { boardPrintRoutes, printSettingsRoutes } from './print/routes.js';
import { siteRoutes } from './sites/routes.js';
import { boardRoutes } from './boards/routes.js';
import { publicRoutes, sharingRoutes } from './public/routes.js';
import { PRIVATE_CACHE_CONTROL } from './public/caching.js';
import { reportRoutes } from './reports/routes.js';
import { logoRoutes, photoRoutes } from './uploads/routes.js';
import { handoverRoutes } from './handover/routes.js';

export function apiRoutes(ctx: AppContext): Router {
  const api = Router();
  // Signed-in answers are for one member: no cache may keep them (the board page's own routes say otherwise).
  api.use((_req, res, next) => {
    res.set('Cache-Control', PRIVATE_CACHE_CONTROL);
    next();
  });
  api.get('/health', async (_req, res) => {
    await ctx.database.pool.query('SELECT 1');
    res.json({ ok: true });
  });
  // First: the board page is the busiest route, and every layer before it is matched on each request.
  api.use('/public', publicRoutes(ctx));
  api.use('/auth', authRoutes(ctx));
  api.use('/members', membersRoutes(ctx));
  api.use('/invitations', invitationRoutes(ctx));
  api.use('/organisation', organisationRoutes(ctx));
  api.use('/dev', devRoutes(ctx));
  api.use('/sheet-layouts', sheetLayoutRoutes(ctx));
  api.use('/printer-profiles', printerProfileRoutes(ctx));
  api.use('/print-settings', printSettingsRoutes(ctx));
  api.use('/boards', boardPrintRoutes(ctx));
  api.use('/sites', siteRoutes(ctx));
  api.use('/boards', boardRoutes(ctx));
  api.use('/boards/:id/sharing', sharingRoutes(ctx));
  api.use('/boards/:id/reports', reportRoutes(ctx));
  api.use('/boards/:id/photos', photoRoutes(ctx));
  api.use('/organisation/logo', logoRoutes(ctx));
  api.use('/boards/:id', handoverRoutes(ctx));
  return api;
}
