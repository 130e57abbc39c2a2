/**
 * Handover routes, mounted at `/boards/:id`: `POST /handover` (owner/electrician) and
 * `GET /handovers` (members). Guards sit on each route, not on the router, because this
 * router shares its prefix with the boards API.
 */
import { Router } from 'express';
import type { AppContext } from '../context.js';
import { canEdit, requireUser } from '../auth/guard.js';
import { idParam, parse } from '../http/parse.js';
import { perAddressAndOrganisation } from '../http/limits.js';
import { handoverSendSchema } from '../../shared/schemas/handover.js';
import { boardHandovers, sendHandover } from './service.js';

export function handoverRoutes(ctx: AppContext): Router {
  const r = Router({ mergeParams: true });
  r.post('/handover', canEdit, ...perAddressAndOrganisation(ctx, 'handovers', ctx.config.rateLimits.sendsPerHour, 'handover e-mails'), async (req, res) => {
    const boardId = idParam(req.params);
    const input = parse(handoverSendSchema, req.body);
    res.status(201).json(await sendHandover(ctx, req.user!, boardId, input));
  });
  r.get('/handovers', requireUser, async (req, res) => {
    res.json({ items: await boardHandovers(ctx, req.user!.organisationId, idParam(req.params)) });
  });
  return r;
}
