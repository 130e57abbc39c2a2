/**
 * The print API, under `/api/boards/:id/…` and `/api/print-settings`. Every signed-in member
 * may print (viewers read and print); the printer offset is set by owners and electricians.
 *
 * Recording: a GET never writes (a cross-site link or an image tag can make a browser send one),
 * so a print is recorded only by POST, which needs the CSRF token: `POST …/pdf/:output` (the print
 * page's download and print buttons) and `POST …/pack` (one row per file). The live preview GETs,
 * and so does a plain link to a PDF; neither fills the history. `…/image/:output` answers the same
 * labels as PNG images (`images.ts`) and records the same way.
 */
import { Router, type Request, type Response } from 'express';
import { invalid } from '../errors.js';
import type { AppContext } from '../context.js';
import { canEdit, requireUser } from '../auth/guard.js';
import { idParam, parse } from '../http/parse.js';
import { dpiSchema, profileParamSchema } from '../../shared/schemas/printer-profile.js';
import { z } from 'zod';
import { printOffsetSaveSchema } from '../../shared/schemas/print-records.js';
import { mediaIdSchema, type PrintWarning } from '../../shared/schemas/print.js';
import { parseImageQuery, parsePrintQuery } from './query.js';
import { printCalibrationImage, printImages, type PrintedImages } from './images.js';
import { printerSetupFor } from './printer-setup.js';
import { checkPrint, printCalibration, printHistory, printOffset, printPdf, setPrintOffset } from './service.js';
import { printPack } from './pack.js';

/** Browsers and proxies refuse very long headers; past this the header says how many more the JSON call lists. */
const WARNINGS_HEADER_MAX = 6000;

/** Warnings as URI-encoded JSON, cut to a safe length with a last entry saying how many were left out. */
export function warningsHeader(warnings: PrintWarning[]): string {
  let kept = warnings;
  let encoded = encodeURIComponent(JSON.stringify(kept));
  // Down to none kept: one warning alone can be longer than the header may be (a list of hundreds of ways).
  while (encoded.length > WARNINGS_HEADER_MAX && kept.length > 0) {
    kept = kept.slice(0, Math.floor(kept.length / 2));
    const more: PrintWarning = { code: 'more-warnings', message: `${warnings.length - kept.length} more warnings: see the warnings list` };
    encoded = encodeURIComponent(JSON.stringify([...kept, more]));
  }
  return encoded;
}

function sendPdf(res: Response, pdf: Uint8Array, filename: string) {
  res.set({
    'Content-Type': 'application/pdf',
    'Content-Disposition': `inline; filename="${filename}"`,
    'Cache-Control': 'private, no-store',
  });
  res.send(Buffer.from(pdf.buffer, pdf.byteOffset, pdf.byteLength));
}

function sendImages(res: Response, printed: PrintedImages) {
  res.set({
    'Content-Type': printed.contentType,
    'Content-Disposition': `attachment; filename="${printed.filename}"`,
    'Cache-Control': 'private, no-store',
    'X-Waymark-Warnings': warningsHeader(printed.warnings),
    'X-Waymark-Image-Count': String(printed.imageCount),
  });
  res.send(printed.body);
}

/** Mounted at `/api/boards`, beside the boards router. */
export function boardPrintRoutes(ctx: AppContext): Router {
  const r = Router();

  const pdfRoute = (record: boolean) => async (req: Request, res: Response) => {
    const boardId = idParam(req.params);
    const query = parsePrintQuery(req.params, req.query);
    if (query.record && !record) throw invalid('A GET records nothing: send POST to record a print', { record: 'Use POST to record the print' });
    const printed = await printPdf(ctx, req.user!, boardId, { ...query, record });
    res.set({ 'X-Waymark-Warnings': warningsHeader(printed.warnings), 'X-Waymark-Page-Count': String(printed.pageCount) });
    sendPdf(res, printed.pdf, printed.filename);
  };
  r.get('/:id/pdf/:output', requireUser, pdfRoute(false));
  r.post('/:id/pdf/:output', requireUser, pdfRoute(true));

  // The same labels as PNG images for a tape printer's phone app (one PNG, or a ZIP of them in print order).
  const imageRoute = (record: boolean) => async (req: Request, res: Response) => {
    const boardId = idParam(req.params);
    const query = parseImageQuery(req.params, req.query);
    if (query.record && !record) throw invalid('A GET records nothing: send POST to record a print', { record: 'Use POST to record the print' });
    const setup = await printerSetupFor(ctx, req.user!, query);
    sendImages(res, await printImages(ctx, req.user!, boardId, { ...query, record }, setup));
  };
  r.get('/:id/image/:output', requireUser, imageRoute(false));
  r.post('/:id/image/:output', requireUser, imageRoute(true));

  r.get('/:id/pdf/:output/warnings', requireUser, async (req, res) => {
    const boardId = idParam(req.params);
    res.json(await checkPrint(ctx, req.user!, boardId, parsePrintQuery(req.params, req.query)));
  });

  const packRoute = (record: boolean) => async (req: Request, res: Response) => {
    const { zip, filename } = await printPack(ctx, req.user!, idParam(req.params), record);
    res.set({ 'Content-Type': 'application/zip', 'Content-Disposition': `attachment; filename="${filename}"`, 'Cache-Control': 'private, no-store' });
    res.send(zip);
  };
  r.get('/:id/pack', requireUser, packRoute(false));
  r.post('/:id/pack', requireUser, packRoute(true));

  r.get('/:id/prints', requireUser, async (req, res) => {
    res.json({ items: await printHistory(ctx, req.user!, idParam(req.params)) });
  });
  return r;
}

const calibrationQuerySchema = z.strictObject({ media: mediaIdSchema.default('a4') });
const calibrationImageQuerySchema = z.strictObject({
  media: mediaIdSchema.default('tape-12'),
  dpi: dpiSchema.optional(),
  profile: profileParamSchema.optional(),
});

/** Mounted at `/api/print-settings`: the offset and the calibration page that checks it. */
export function printSettingsRoutes(ctx: AppContext): Router {
  const r = Router();
  r.use(requireUser);
  r.get('/offset', async (req, res) => {
    res.json(await printOffset(ctx, req.user!));
  });
  r.get('/calibration', async (req, res) => {
    const { media } = parse(calibrationQuerySchema, req.query);
    const printed = await printCalibration(ctx, req.user!, media);
    sendPdf(res, printed.pdf, printed.filename);
  });
  // The raster twin: the calibration page as the images route draws it, to check a printer profile.
  r.get('/calibration/image', async (req, res) => {
    const { media, dpi, profile } = parse(calibrationImageQuerySchema, req.query);
    const setup = await printerSetupFor(ctx, req.user!, { dpi, profileId: profile });
    sendImages(res, await printCalibrationImage(ctx, req.user!, media, setup));
  });
  r.put('/offset', canEdit, async (req, res) => {
    res.json(await setPrintOffset(ctx, req.user!, parse(printOffsetSaveSchema, req.body)));
  });
  return r;
}
