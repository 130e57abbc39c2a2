/** `/api/organisation`: any member reads the settings and the notice wording; the owner changes them. */
import { Router } from 'express';
import { organisationSaveSchema } from '../../shared/schemas/organisation.js';
import type { AppContext } from '../context.js';
import { ownerOnly, requireUser } from '../auth/guard.js';
import { parse } from '../http/parse.js';
import { organisationOf, saveOrganisation } from './service.js';
import { noticeWordingSaveSchema } from '../../shared/schemas/notice-wording.js';
import { noticeWordingOf, saveNoticeWording } from './notice-wording.js';

export function organisationRoutes(ctx: AppContext): Router {
  const r = Router();

  r.get('/', requireUser, async (req, res) => {
    res.json(await organisationOf(ctx.db, req.user!.organisationId));
  });

  r.put('/', ownerOnly, async (req, res) => {
    res.json(await saveOrganisation(ctx.db, req.user!.organisationId, parse(organisationSaveSchema, req.body)));
  });

  r.get('/notice-wording', requireUser, async (req, res) => {
    res.json(await noticeWordingOf(ctx.db, req.user!.organisationId));
  });

  r.put('/notice-wording', ownerOnly, async (req, res) => {
    res.json(await saveNoticeWording(ctx.db, req.user!.organisationId, parse(noticeWordingSaveSchema, req.body)));
  });

  return r;
}
