/**
 * The render pool: prints are laid out and drawn on worker threads, so the event loop keeps
 * turning while a big print renders; a job over its time limit is stopped, not waited for.
 * The PDFs are read back with pdf-parse, which shares no code with the engine.
 */
import { afterAll, describe, expect, it } from 'vitest';
import { PDFParse } from 'pdf-parse';
import { renderOutput } from '../../../server/pdf/index.js';
import { checkSchedule, maxZsByCircuit } from '../../../shared/rules/index.js';
import type { RenderRequest } from '../../../server/pdf/types.js';
import type { PrintJobRequest } from '../../../server/print/workers/jobs.js';
import { LayoutError } from '../../../server/pdf/types.js';
import { AppError } from '../../../server/errors.js';
import { closeRenderPool, runRenderJob } from '../../../server/print/workers/pool.js';
import { boardSchedule, request } from '../pdf/fixtures.js';

const LIMIT_MS = 60_000;
/** The day the rules judge the board on (the render thread judges it). */
const CHECKED_ON = '2026-01-05';

/** The fixture's request as a print job: the thread works out findings and maximum Zs itself. */
const job = ({ findings: _f, maxZsByCircuit: _m, ...req }: RenderRequest): PrintJobRequest => ({ ...req, checkedOn: CHECKED_ON });

afterAll(async () => {
  await closeRenderPool();
});

async function pdfText(pdf: Uint8Array): Promise<string> {
  // A copy: pdf-parse hands its bytes to pdf.js, which takes them over.
  const parser = new PDFParse({ data: new Uint8Array(pdf) });
  try {
    return (await parser.getText()).text;
  } finally {
    await parser.destroy();
  }
}

/** The longest gap between 1 ms timer ticks while `work` runs: how long the event loop was held. */
async function longestStall(work: () => Promise<unknown>): Promise<number> {
  let last = performance.now();
  let longest = 0;
  const timer = setInterval(() => {
    const now = performance.now();
    longest = Math.max(longest, now - last);
    last = now;
  }, 1);
  try {
    await work();
    await new Promise((r) => setTimeout(r, 5));
  } finally {
    clearInterval(timer);
  }
  return longest;
}

/** A 600-way chart: about a second of layout and drawing on this machine. */
const bigChart = () => request('chart', 'a4', {}, boardSchedule(600));

describe('render pool', () => {
  it("when a chart is rendered in the pool, then its PDF reads back with the same text as one rendered here with the rules' findings", async () => {
    const req = request('chart', 'a4');
    const pooled = await runRenderJob({ kind: 'pdf', request: job(req) }, LIMIT_MS);
    const findings = checkSchedule(req.schedule, { today: CHECKED_ON });
    expect(findings.length).toBeGreaterThan(0);
    const inThread = await renderOutput({ ...req, findings, maxZsByCircuit: maxZsByCircuit(req.schedule) });
    expect(pooled.pageCount).toBe(inThread.pageCount);
    expect(await pdfText(pooled.pdf)).toBe(await pdfText(inThread.pdf));
    expect(await pdfText(pooled.pdf)).toContain('Kitchen sockets');
  });

  it('when a big chart renders in the pool, then the event loop stalls far less than when the same chart renders in this thread', async () => {
    await runRenderJob({ kind: 'check', request: job(request('tag', 'tape-24')) }, LIMIT_MS); // a thread is up
    const inThread = await longestStall(() => renderOutput(bigChart()));
    const pooled = await longestStall(() => runRenderJob({ kind: 'pdf', request: job(bigChart()) }, LIMIT_MS));
    // Baseline from the same run: in this thread the loop waits for the whole layout at least.
    expect(inThread).toBeGreaterThan(200);
    expect(pooled).toBeLessThan(inThread / 4);
  });

  it('when a tag cannot fit its tape, then the pool throws the LayoutError with its field, as the engine does', async () => {
    const err = await runRenderJob({ kind: 'pdf', request: job(request('tag', 'tape-12')) }, LIMIT_MS).catch((e: unknown) => e);
    expect(err).toBeInstanceOf(LayoutError);
    expect((err as LayoutError).message).toMatch(/tape-\d+/);
  });

  it('when a job runs past its time limit, then it is stopped at the limit with 503 and the pool renders the next job', async () => {
    const started = performance.now();
    const full = await longestStall(() => runRenderJob({ kind: 'pdf', request: job(bigChart()) }, LIMIT_MS));
    const fullMs = performance.now() - started;
    expect(full).toBeLessThan(fullMs);
    const stoppedAt = performance.now();
    const err = await runRenderJob({ kind: 'pdf', request: job(bigChart()) }, 100).catch((e: unknown) => e);
    const stoppedMs = performance.now() - stoppedAt;
    expect(err).toBeInstanceOf(AppError);
    expect((err as AppError).status).toBe(503);
    expect((err as AppError).code).toBe('print_timed_out');
    expect((err as AppError).headers?.['Retry-After']).toMatch(/^\d+$/);
    expect(stoppedMs).toBeLessThan(fullMs / 2);
    const next = await runRenderJob({ kind: 'pdf', request: job(request('tag', 'tape-24')) }, LIMIT_MS);
    expect(await pdfText(next.pdf)).toContain('WM-3F7K');
  });
});
