/** Members' side of discrepancy reports, mounted at `/boards/:id/reports`. (Visitors send them through server/public.) */
import { Router } from 'express';
import type { AppContext } from '../context.js';
import { canEdit, requireUser } from '../auth/guard.js';
import { idParam, parse } from '../http/parse.js';
import { reportResolveSchema } from '../../shared/schemas/reports.js';
import { boardReports, resolveBoardReport } from './service.js';

export function reportRoutes(ctx: AppContext): Router {
  const r = Router({ mergeParams: true });
  r.use(requireUser);
  r.get('/', async (req, res) => {
    res.json({ items: await boardReports(ctx.db, req.user!.organisationId, idParam(req.params)) });
  });
  r.patch('/:reportId', canEdit, async (req, res) => {
    const input = parse(reportResolveSchema, req.body);
    res.json(await resolveBoardReport(ctx.db, req.user!, idParam(req.params), idParam(req.params, 'reportId'), input));
  });
  return r;
}
