/**
 * `/api/dev/mail`: the mail the local capture SMTP server caught, for owners, and only when
 * `config.devMail` is on. Otherwise every path here answers 404, as if it did not exist.
 */
import { Router } from 'express';
import { capturedMailQuerySchema } from '../../shared/schemas/dev-mail.js';
import type { AppContext } from '../context.js';
import { ownerOnly } from '../auth/guard.js';
import { notFound } from '../errors.js';
import { idParam, parse } from '../http/parse.js';
import { capturedMailList, capturedMailMessage } from './service.js';

export function devRoutes(ctx: AppContext): Router {
  const r = Router();
  if (!ctx.config.devMail) {
    r.use((_req, _res, next) => next(notFound('No such API route')));
    return r;
  }

  r.get('/mail', ownerOnly, async (req, res) => {
    const { to } = parse(capturedMailQuerySchema, req.query);
    res.json({ messages: await capturedMailList(ctx.db, req.user!.organisationId, to) });
  });

  r.get('/mail/:id', ownerOnly, async (req, res) => {
    res.json(await capturedMailMessage(ctx.db, req.user!.organisationId, idParam(req.params)));
  });

  return r;
}
