/**
 * `/api/boards`: each handler parses, calls one use-case and answers. Viewers read (and export);
 * every write needs the owner or electrician role; restoring a deleted board needs the owner.
 */
import express, { Router, type Request, type Response } from 'express';
import type { AppContext } from '../context.js';
import type { Db } from '../db/client.js';
import { scheduleSaveSchema } from '../../shared/schemas/schedule.js';
import {
  baseRevisionQuerySchema,
  boardCreateSchema,
  changeoverApplySchema,
  boardListQuerySchema,
  boardPatchSchema,
  boardPublicSchema,
  circuitCsvImportSchema,
  diffQuerySchema,
} from '../../shared/schemas/boards.js';
import { canEdit, ownerOnly, requireUser } from '../auth/guard.js';
import { idParam, parse } from '../http/parse.js';
import { checkBoard, createBoard, getBoardSummary, getSchedule, listOrganisationBoards, saveSchedule } from './service.js';
import { deleteBoard, duplicateBoard, patchBoard, restoreBoard, rotatePublicToken, setPublicEnabled } from './lifecycle.js';
import { boardRevision, boardRevisions, diffRevisions } from './history.js';
import { exportBoardFile, exportCircuitsCsv, exportSurveyCsv, importBoardFile, importCircuitsCsv, parseBoardImport } from './files.js';
import type { SaveOutcome } from './writes.js';
import { applyChangeover, type ApplyOutcome } from './changeover.js';

const actor = (req: Request) => ({ id: req.user!.id, name: req.user!.name, organisationId: req.user!.organisationId });
const org = (req: Request) => req.user!.organisationId;

/** 200 with the new revision, or 409 `stale` carrying the board's current revision so the editor can reload. */
function sendSave(res: Response, outcome: SaveOutcome | ApplyOutcome): void {
  if (outcome.status === 'stale') {
    res.status(409).json({
      error: {
        code: 'stale',
        message: `Someone saved this board since you opened it; it is now at revision ${outcome.revision}. Reload it and apply your changes again.`,
        fields: { baseRevision: `The board is at revision ${outcome.revision}` },
      },
      revision: outcome.revision,
    });
    return;
  }
  const { created, updated } = outcome as ApplyOutcome;
  res.json({ revision: outcome.revision, summary: outcome.summary, changed: outcome.changed, ...(created ? { created, updated } : {}) });
}

const attachment = (res: Response, name: string) => res.set('Content-Disposition', `attachment; filename="${name}"`);
const csvBody = express.text({ type: ['text/csv', 'application/csv'], limit: '5mb' });

/** The board itself: list, create, read, move, delete and restore, duplicate, public page. */
function mountBoards(r: Router, db: Db): void {
  r.get('/', async (req, res) => {
    res.json(await listOrganisationBoards(db, org(req), parse(boardListQuerySchema, req.query)));
  });
  r.post('/', canEdit, async (req, res) => {
    res.status(201).json({ id: await createBoard(db, actor(req), parse(boardCreateSchema, req.body)) });
  });
  r.get('/:id', async (req, res) => {
    res.json(await getBoardSummary(db, org(req), idParam(req.params)));
  });
  r.patch('/:id', canEdit, async (req, res) => {
    await patchBoard(db, org(req), idParam(req.params), parse(boardPatchSchema, req.body));
    res.status(204).end();
  });
  r.delete('/:id', canEdit, async (req, res) => {
    await deleteBoard(db, org(req), idParam(req.params));
    res.status(204).end();
  });
  r.post('/:id/restore', ownerOnly, async (req, res) => {
    await restoreBoard(db, org(req), idParam(req.params));
    res.status(204).end();
  });
  r.post('/:id/duplicate', canEdit, async (req, res) => {
    res.status(201).json({ id: await duplicateBoard(db, actor(req), idParam(req.params)) });
  });
  r.post('/:id/token/rotate', canEdit, async (req, res) => {
    res.json(await rotatePublicToken(db, org(req), idParam(req.params)));
  });
  r.patch('/:id/public', canEdit, async (req, res) => {
    res.json(await setPublicEnabled(db, org(req), idParam(req.params), parse(boardPublicSchema, req.body).enabled));
  });
}

/** The schedule, its checks and its history. */
function mountSchedule(r: Router, db: Db): void {
  r.get('/:id/schedule', async (req, res) => {
    res.json(await getSchedule(db, org(req), idParam(req.params)));
  });
  r.put('/:id/schedule', canEdit, async (req, res) => {
    const id = idParam(req.params);
    sendSave(res, await saveSchedule(db, actor(req), id, parse(scheduleSaveSchema, req.body)));
  });
  r.post('/:id/changeover/apply', canEdit, async (req, res) => {
    const id = idParam(req.params);
    sendSave(res, await applyChangeover(db, actor(req), id, parse(changeoverApplySchema, req.body).baseRevision));
  });
  r.get('/:id/check', async (req, res) => {
    res.json(await checkBoard(db, org(req), idParam(req.params)));
  });
  r.get('/:id/revisions', async (req, res) => {
    res.json(await boardRevisions(db, org(req), idParam(req.params)));
  });
  r.get('/:id/revisions/:number', async (req, res) => {
    res.json(await boardRevision(db, org(req), idParam(req.params), idParam(req.params, 'number')));
  });
  r.get('/:id/diff', async (req, res) => {
    const id = idParam(req.params);
    const { from, to } = parse(diffQuerySchema, req.query);
    res.json(await diffRevisions(db, org(req), id, from, to));
  });
}

/** Files in and out: the board file and the circuit CSV. */
function mountFiles(r: Router, db: Db): void {
  r.post('/import', canEdit, async (req, res) => {
    res.status(201).json({ id: await importBoardFile(db, actor(req), parseBoardImport(req.body)) });
  });
  r.get('/:id/export', async (req, res) => {
    const { file, baseName } = await exportBoardFile(db, org(req), idParam(req.params));
    attachment(res, `${baseName}.waymark.json`).json(file);
  });
  r.get('/:id/circuits.csv', async (req, res) => {
    const { csv, baseName } = await exportCircuitsCsv(db, org(req), idParam(req.params));
    attachment(res, `${baseName}-circuits.csv`).type('text/csv; charset=utf-8').send(csv);
  });
  r.get('/:id/survey.csv', async (req, res) => {
    const { csv, baseName } = await exportSurveyCsv(db, org(req), idParam(req.params));
    attachment(res, `${baseName}-survey.csv`).type('text/csv; charset=utf-8').send(csv);
  });
  r.post('/:id/circuits/import-csv', canEdit, csvBody, async (req, res) => {
    const id = idParam(req.params);
    const { csv, baseRevision } =
      typeof req.body === 'string' ? { csv: req.body, ...parse(baseRevisionQuerySchema, req.query) } : parse(circuitCsvImportSchema, req.body);
    sendSave(res, await importCircuitsCsv(db, actor(req), id, csv, baseRevision));
  });
}

export function boardRoutes(ctx: AppContext): Router {
  const r = Router();
  r.use(requireUser);
  mountFiles(r, ctx.db);
  mountBoards(r, ctx.db);
  mountSchedule(r, ctx.db);
  return r;
}
