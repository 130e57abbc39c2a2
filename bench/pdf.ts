/**
 * PDF timings: each output's median against a bare pdf-lib document drawing the same
 * number of text runs and rectangles (bench/pdf-baseline.ts), measured in the same run.
 */
import { renderOutput } from '../server/pdf/index.js';
import type { RenderRequest } from '../server/pdf/types.js';
import type { Database } from '../server/db/client.js';
import { makeSchedule as syntheticSchedule } from '../tests/helpers/boards.js';
import { bareDocument } from './pdf-baseline.js';
import { drawStats } from './pdf-stats.js';
import { demoPackRenders } from './demo-pack.js';
import { requestFor } from './render-request.js';

export interface PdfFigure {
  name: string;
  medianMs: number;
  baselineMs: number;
  ratio: number;
}

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];

async function time(fn: () => Promise<unknown>, runs: number): Promise<number> {
  await fn(); // warm-up: font parsing and JIT are once per process
  const xs: number[] = [];
  for (let i = 0; i < runs; i++) {
    const t = performance.now();
    await fn();
    xs.push(performance.now() - t);
  }
  return Math.round(median(xs) * 10) / 10;
}

/** Times a group of renders done together against the baselines of the same PDFs. */
async function figure(name: string, requests: RenderRequest[], runs: number): Promise<PdfFigure> {
  const samples = await Promise.all(requests.map(async (r) => drawStats((await renderOutput(r)).pdf)));
  const medianMs = await time(async () => {
    for (const r of requests) await renderOutput(r);
  }, runs);
  const baselineMs = await time(async () => {
    for (const s of samples) await bareDocument(s);
  }, runs);
  return { name, medianMs, baselineMs, ratio: Math.round((medianMs / baselineMs) * 100) / 100 };
}

export async function benchPdf(database: Database, opts: { runs: number }): Promise<PdfFigure[]> {
  const out: PdfFigure[] = [];
  for (const n of [10, 100, 1000]) {
    out.push(await figure(`chart-${n}`, [requestFor('chart', 'a4', syntheticSchedule(n))], n === 1000 ? Math.max(3, Math.floor(opts.runs / 3)) : opts.runs));
  }
  out.push(await figure('flags-100', [requestFor('flags', 'tape-24', syntheticSchedule(100))], opts.runs));
  out.push(await figure('pack-demo', await demoPackRenders(database), opts.runs));
  return out;
}
