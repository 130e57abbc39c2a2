/**
 * Prints as images for a tape printer's phone app: the same layout as the PDF, drawn as 1-bit
 * PNGs at the printer's resolution (`server/pdf/raster`). One label answers one PNG; several answer
 * a ZIP of PNGs named in print order. A printer profile (`profile=<id>`) gives the resolution and
 * the printable band of each tape; `dpi=` overrides its resolution.
 */
import type { AppContext } from '../context.js';
import type { CurrentUser } from '../http/context.js';
import type { MediaId, PrintOutput, PrintWarning } from '../../shared/schemas/print.js';
import { printOptionSchemas } from '../../shared/schemas/print.js';
import type { RasterImage } from '../pdf/raster/index.js';
import type { TapeSettings } from '../pdf/index.js';
import { todayIso as today } from '../http/clock.js';
import { loadCalibrationSource, loadPrintSource, type PrintSource } from './source.js';
import { engine, printRecordFor, renderRequestFor } from './service.js';
import type { ImageQuery, PrintQuery } from './query.js';
import * as repo from './repository.js';
import { zipEntries } from './zip.js';
import { runRenderJob } from './workers/pool.js';
import { withinOrganisationShare } from './workers/fair-share.js';

/** Resolution when neither `dpi=` nor a profile gives one: the usual tape printer head. // common practice */
export const DEFAULT_DPI = 180;

/** What the images are drawn for: a resolution and, from a profile, each tape's printable band. */
export interface PrinterSetup {
  dpi: number;
  tape: TapeSettings;
}

export interface PrintedImages {
  body: Buffer;
  contentType: 'image/png' | 'application/zip';
  filename: string;
  warnings: PrintWarning[];
  imageCount: number;
}

/** `BOARD-flags-tape-12-180dpi`: the stem every file of one print shares. */
const stemOf = (code: string, output: PrintOutput, media: MediaId, dpi: number) => `${code}-${output}-${media}-${dpi}dpi`;

/** The images as one PNG, or a ZIP whose entries (`…-01.png`, `…-02.png`) sort in print order. */
async function packImages(images: RasterImage[], stem: string): Promise<Pick<PrintedImages, 'body' | 'contentType' | 'filename'>> {
  if (images.length === 1) return { body: images[0].png, contentType: 'image/png', filename: `${stem}.png` };
  const digits = Math.max(2, String(images.length).length);
  const entries = images.map((img, i) => ({ name: `${stem}-${String(i + 1).padStart(digits, '0')}.png`, data: img.png }));
  return { body: await zipEntries(entries), contentType: 'application/zip', filename: `${stem}.zip` };
}

async function draw(ctx: AppContext, user: CurrentUser, source: PrintSource, query: PrintQuery, setup: PrinterSetup) {
  const req = await renderRequestFor(ctx, user, source, query, setup.tape);
  // The images go to a tape printer, not the office printer the organisation's offset corrects.
  const request = { ...req, offset: { xMm: 0, yMm: 0 } };
  const drawn = await engine(() =>
    withinOrganisationShare(user.organisationId, () => runRenderJob({ kind: 'images', request, dpi: setup.dpi }, ctx.config.printTimeLimitMs)),
  );
  // Bytes from the render thread arrive as Uint8Array; Express sends only a Buffer as bytes.
  const images: RasterImage[] = drawn.images.map((i) => ({ ...i, png: Buffer.from(i.png.buffer, i.png.byteOffset, i.png.byteLength) }));
  return { images, warnings: drawn.warnings };
}

/** One output of a board as images; recorded in the history when the query asks (`record=1`, POST only). */
export async function printImages(ctx: AppContext, user: CurrentUser, boardId: number, query: ImageQuery, setup: PrinterSetup): Promise<PrintedImages> {
  const source = await loadPrintSource(ctx.db, ctx.config, user.organisationId, boardId, today());
  const result = await draw(ctx, user, source, query, setup);
  if (query.record) await repo.insertPrints(ctx.db, [printRecordFor(user, source, query.output, `${query.media}@${setup.dpi}dpi`)]);
  const packed = await packImages(result.images, stemOf(source.board.code, query.output, query.media, setup.dpi));
  return { ...packed, warnings: result.warnings, imageCount: result.images.length };
}

/** The calibration page as an image, to check a profile's band and margins by printing it once (no board, not recorded). */
export async function printCalibrationImage(ctx: AppContext, user: CurrentUser, media: MediaId, setup: PrinterSetup): Promise<PrintedImages> {
  const source = await loadCalibrationSource(ctx.db, ctx.config, user.organisationId, today());
  const options = printOptionSchemas.calibration.parse({});
  const result = await draw(ctx, user, source, { output: 'calibration', media, options, record: false }, setup);
  const packed = await packImages(result.images, `calibration-${media}-${setup.dpi}dpi`);
  return { ...packed, warnings: result.warnings, imageCount: result.images.length };
}
