/**
 * The print pack: everything a board needs in one ZIP, each output on its usual medium, with a
 * short read-me listing the files, their warnings and anything that could not be laid out.
 * The calibration page is left out: it checks a printer, not a board.
 */
import type { AppContext } from '../context.js';
import type { CurrentUser } from '../http/context.js';
import type { MediaId, PrintOptions, PrintOutput } from '../../shared/schemas/print.js';
import { printOptionSchemas } from '../../shared/schemas/print.js';
import { AppError } from '../errors.js';
import { defaultMedia, type PrintQuery } from './query.js';
import { loadPrintSource, type PrintSource } from './source.js';
import { printRecordFor, renderWith } from './service.js';
import { todayIso as today } from '../http/clock.js';
import * as repo from './repository.js';
import { zipEntries, type ZipEntry } from './zip.js';

/** Every board output; the changeover schedule only for a board with a survey of the old board it replaces. */
export const packOutputs = ['chart', 'flags', 'way-labels', 'notices', 'tag', 'changeover'] as const satisfies readonly PrintOutput[];

/** Media tried in turn: a tag whose QR does not fit the usual tape goes on the next wider one. */
const packMedia: Record<(typeof packOutputs)[number], MediaId[]> = {
  chart: [defaultMedia.chart],
  flags: [defaultMedia.flags],
  'way-labels': [defaultMedia['way-labels']],
  notices: [defaultMedia.notices],
  tag: [defaultMedia.tag, 'tape-36', 'a4'],
  changeover: [defaultMedia.changeover],
};

interface PackFile {
  output: PrintOutput;
  media: MediaId;
  name: string;
  pdf: Uint8Array;
  pageCount: number;
  warnings: string[];
}

async function renderFirstFitting(ctx: AppContext, user: CurrentUser, source: PrintSource, output: (typeof packOutputs)[number]): Promise<PackFile | string> {
  const options = printOptionSchemas[output].parse({}) as PrintOptions[typeof output];
  let reason = '';
  for (const media of packMedia[output]) {
    const query: PrintQuery = { output, media, options, record: false };
    try {
      const r = await renderWith(ctx, user, source, query);
      const name = `${source.board.code}-${output}-${media}.pdf`;
      return { output, media, name, pdf: r.pdf, pageCount: r.pageCount, warnings: r.warnings.map((w) => w.message) };
    } catch (err) {
      if (!(err instanceof AppError) || err.status !== 422) throw err;
      reason = err.message;
    }
  }
  return `${output}: not included (${reason})`;
}

function readMe(source: PrintSource, files: PackFile[], skipped: string[]): string {
  const lines = [
    `${source.schedule.board.name} (${source.board.code}), revision ${source.board.revision} of ${source.board.revisionDate}`,
    '',
    ...files.flatMap((f) => [`${f.name}: ${f.output} on ${f.media}, ${f.pageCount} page(s)`, ...f.warnings.map((w) => `  warning: ${w}`)]),
    ...skipped,
    '',
    'Print at 100 % (actual size, no fit-to-page). Check scale and alignment with the calibration page from the print settings.',
    'Isolate and prove dead before working on the board; only competent persons should work inside it. Follow BS 7671 and local regulations.',
  ];
  return lines.join('\r\n') + '\r\n';
}

/** Renders every board output and zips them; with `record`, each file is recorded as a print. */
export async function printPack(ctx: AppContext, user: CurrentUser, boardId: number, record: boolean): Promise<{ zip: Buffer; filename: string }> {
  const source = await loadPrintSource(ctx.db, ctx.config, user.organisationId, boardId, today());
  const files: PackFile[] = [];
  const skipped: string[] = [];
  const surveyed = (source.schedule.survey?.ways.length ?? 0) > 0;
  for (const output of packOutputs.filter((o) => o !== 'changeover' || surveyed)) {
    const made = await renderFirstFitting(ctx, user, source, output);
    if (typeof made === 'string') skipped.push(made);
    else files.push(made);
  }
  const entries: ZipEntry[] = [...files.map((f) => ({ name: f.name, data: f.pdf })), { name: 'READ-ME.txt', data: readMe(source, files, skipped) }];
  const zip = await zipEntries(entries);
  if (record)
    await repo.insertPrints(
      ctx.db,
      files.map((f) => printRecordFor(user, source, f.output, f.media)),
    );
  return { zip, filename: `${source.board.code}-pack-r${source.board.revision}.zip` };
}
