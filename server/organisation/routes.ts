/** `/api/organisation`: any member reads the settings; the owner changes them. */
import { Router } from 'express';
import { organisationSaveSchema } from '../../shared/schemas/organisation.js';
import type { AppContext } from '../context.js';
import { ownerOnly, requireUser } from '../auth/guard.js';
import { parse } from '../http/parse.js';
import { organisationOf, saveOrganisation } from './service.js';

export function organisationRoutes(ctx: AppContext): Router {
  const r = Router();

  r.get('/', requireUser, async (req, res) => {
    res.json(await organisationOf(ctx.db, req.user!.organisationId));
  });

  r.put('/', ownerOnly, async (req, res) => {
    res.json(await saveOrganisation(ctx.db, req.user!.organisationId, parse(organisationSaveSchema, req.body)));
  });

  return r;
}
