/** Mounts each business component's router under /api. One line per component. */
import { Router } from 'express';
import type { AppContext } from './context.js';
import { authRoutes } from './auth/routes.js';

export function apiRoutes(ctx: AppContext): Router {
  const api = Router();
  api.get('/health', async (_req, res) => {
    await ctx.database.pool.query('SELECT 1');
    res.json({ ok: true });
  });
  api.use('/auth', authRoutes(ctx));
  return api;
}
