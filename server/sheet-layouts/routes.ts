/**
 * `/api/sheet-layouts`: every member reads the organisation's layouts (a viewer prints on them);
 * owners and electricians add, change and remove them.
 */
import { Router } from 'express';
import type { AppContext } from '../context.js';
import { canEdit, requireUser } from '../auth/guard.js';
import { idParam, parse } from '../http/parse.js';
import { sheetLayoutSchema, sheetLayoutUpdateSchema } from '../../shared/schemas/print.js';
import { createLayout, getLayout, listLayouts, removeLayout, replaceLayout } from './service.js';

export function sheetLayoutRoutes(ctx: AppContext): Router {
  const r = Router();
  r.use(requireUser);

  r.get('/', async (req, res) => {
    res.json({ items: await listLayouts(ctx.db, req.user!.organisationId) });
  });

  r.get('/:id', async (req, res) => {
    res.json(await getLayout(ctx.db, req.user!.organisationId, idParam(req.params)));
  });

  r.post('/', canEdit, async (req, res) => {
    const layout = parse(sheetLayoutSchema, req.body);
    res.status(201).json(await createLayout(ctx.db, req.user!.organisationId, layout));
  });

  r.put('/:id', canEdit, async (req, res) => {
    const id = idParam(req.params);
    const layout = parse(sheetLayoutUpdateSchema, req.body);
    res.json(await replaceLayout(ctx.db, req.user!.organisationId, id, layout));
  });

  r.delete('/:id', canEdit, async (req, res) => {
    await removeLayout(ctx.db, req.user!.organisationId, idParam(req.params));
    res.status(204).end();
  });
  return r;
}
