/**
 * `/api/printer-profiles`: every member reads the organisation's printer profiles (a viewer prints
 * with them); owners and electricians add, change and remove them.
 */
import { Router } from 'express';
import type { AppContext } from '../context.js';
import { canEdit, requireUser } from '../auth/guard.js';
import { idParam, parse } from '../http/parse.js';
import { printerProfileSchema, printerProfileUpdateSchema } from '../../shared/schemas/printer-profile.js';
import { createProfile, getProfile, listProfiles, removeProfile, replaceProfile } from './service.js';

export function printerProfileRoutes(ctx: AppContext): Router {
  const r = Router();
  r.use(requireUser);

  r.get('/', async (req, res) => {
    res.json({ items: await listProfiles(ctx.db, req.user!.organisationId) });
  });

  r.get('/:id', async (req, res) => {
    res.json(await getProfile(ctx.db, req.user!.organisationId, idParam(req.params)));
  });

  r.post('/', canEdit, async (req, res) => {
    const profile = parse(printerProfileSchema, req.body);
    res.status(201).json(await createProfile(ctx.db, req.user!.organisationId, profile));
  });

  r.put('/:id', canEdit, async (req, res) => {
    const id = idParam(req.params);
    const profile = parse(printerProfileUpdateSchema, req.body);
    res.json(await replaceProfile(ctx.db, req.user!.organisationId, id, profile));
  });

  r.delete('/:id', canEdit, async (req, res) => {
    await removeProfile(ctx.db, req.user!.organisationId, idParam(req.params));
    res.status(204).end();
  });
  return r;
}
