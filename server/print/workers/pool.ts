/**
 * The render pool: a few worker threads (piscina) that lay out and draw prints, so a big print costs
 * the app's event loop only the copy of its bytes and `/api/health` and the board page keep answering.
 * One pool per process, started on first use. Each job has a time limit: a job still waiting or
 * running when it passes is cancelled (a running one's thread is stopped and replaced) and the request
 * gets 503 saying so, never a hang. A full queue is refused at once with 503 and `Retry-After`.
 *
 * The worker loads the same code as the app: `render-worker.ts` under tsx (npm start, dev, tests;
 * under vitest, which registers no loader for threads, tsx's loader is added to the thread's
 * `execArgv`) or `render-worker.js` beside this file when the server is run as built JavaScript.
 */
import { availableParallelism } from 'node:os';
import { createRequire } from 'node:module';
import { extname } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { Piscina } from 'piscina';
import { AppError } from '../../errors.js';
import { LayoutError } from '../../pdf/types.js';
import type { JobAnswer, JobResults, RenderJob } from './jobs.js';

export interface RenderPoolOptions {
  /** Worker threads; by default one fewer than the cores (at least one), leaving a core to the event loop. */
  threads?: number;
  /** Jobs that may wait for a thread before new ones are refused. */
  queue?: number;
}

/** Seconds a client is told to wait after a refusal. // common practice: a few seconds for a busy server */
const RETRY_AFTER_SECONDS = 5;

/** How much lower the render threads run than the rest of the process (nice(2): 0 to 19, higher is lower). */
const RENDER_NICENESS = 10;

const ownExtension = extname(fileURLToPath(import.meta.url));

/** tsx's loader for the thread when this process runs TypeScript without it (vitest); else the process's own flags. */
function workerExecArgv(): string[] {
  const underTsx = process.execArgv.some((arg) => arg.includes('tsx'));
  if (ownExtension !== '.ts' || underTsx) return process.execArgv;
  const tsxLoader = pathToFileURL(createRequire(import.meta.url).resolve('tsx')).href;
  return [...process.execArgv, '--import', tsxLoader];
}

let pool: Piscina | null = null;

function renderPool(options: RenderPoolOptions = {}): Piscina {
  if (pool) return pool;
  const threads = options.threads ?? Math.max(1, availableParallelism() - 1);
  pool = new Piscina({
    filename: new URL(`./render-worker${ownExtension}`, import.meta.url).href,
    execArgv: workerExecArgv(),
    minThreads: threads,
    maxThreads: threads,
    maxQueue: options.queue ?? threads * 16,
    // A thread left idle is kept: starting one (loading the engine and fonts) costs far more than the memory.
    idleTimeout: 60_000,
    // Below the event loop and the database in the CPU's queue (nice(2), through @napi-rs/nice): on a busy
    // machine a print takes a little longer rather than every other request waiting behind it.
    niceIncrement: RENDER_NICENESS,
  });
  return pool;
}

/** Starts the threads before the first print needs them (the server calls this when it starts). */
export function warmRenderPool(options?: RenderPoolOptions): void {
  renderPool(options);
}

/** Stops the threads; the next job starts a new pool. */
export async function closeRenderPool(): Promise<void> {
  const closing = pool;
  pool = null;
  await closing?.destroy();
}

const timedOut = (limitMs: number) =>
  new AppError(
    503,
    'print_timed_out',
    `This print took longer than ${Math.round(limitMs / 1000)} s and was stopped: print fewer ways at a time, or try again in a moment`,
    undefined,
    { 'Retry-After': String(RETRY_AFTER_SECONDS) },
  );

const busy = () =>
  new AppError(503, 'print_busy', 'The server is busy with other prints; try again in a moment', undefined, { 'Retry-After': String(RETRY_AFTER_SECONDS) });

/**
 * Runs one job on the pool within `timeLimitMs` (waiting for a thread counts: the limit bounds the
 * request's answer). A layout the medium cannot take is thrown as the engine throws it (LayoutError).
 */
export async function runRenderJob<J extends RenderJob>(job: J, timeLimitMs: number): Promise<JobResults[J['kind']]> {
  const signal = AbortSignal.timeout(timeLimitMs);
  let answer: JobAnswer<J['kind']>;
  try {
    answer = await renderPool().run(job, { signal });
  } catch (err) {
    if (signal.aborted) throw timedOut(timeLimitMs);
    if (err instanceof Error && err.message === 'Task queue is at limit') throw busy();
    throw err;
  }
  if (!answer.ok) throw new LayoutError(answer.layoutError.message, answer.layoutError.field);
  return answer.result;
}
