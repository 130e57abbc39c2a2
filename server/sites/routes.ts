/** `/api/sites`: members read; owners and electricians write. */
import { Router } from 'express';
import type { AppContext } from '../context.js';
import { siteInputSchema, siteListQuerySchema, siteUpdateSchema } from '../../shared/schemas/site.js';
import { canEdit, requireUser } from '../auth/guard.js';
import { idParam, parse } from '../http/parse.js';
import { createSite, deleteSite, getSite, listOrganisationSites, replaceSite } from './service.js';

export function siteRoutes(ctx: AppContext): Router {
  const r = Router();
  const { db } = ctx;
  r.use(requireUser);

  r.get('/', async (req, res) => {
    res.json(await listOrganisationSites(db, req.user!.organisationId, parse(siteListQuerySchema, req.query).q));
  });
  r.post('/', canEdit, async (req, res) => {
    res.status(201).json({ id: await createSite(db, req.user!.organisationId, parse(siteInputSchema, req.body)), revision: 1 });
  });
  r.get('/:id', async (req, res) => {
    res.json(await getSite(db, req.user!.organisationId, idParam(req.params)));
  });
  r.put('/:id', canEdit, async (req, res) => {
    const id = idParam(req.params);
    res.json(await replaceSite(db, req.user!.organisationId, id, parse(siteUpdateSchema, req.body)));
  });
  r.delete('/:id', canEdit, async (req, res) => {
    await deleteSite(db, req.user!.organisationId, idParam(req.params));
    res.status(204).end();
  });
  return r;
}
