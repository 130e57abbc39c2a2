/**
 * Runs in a worker thread of the render pool (`pool.ts`): lays out and draws one print job, so the
 * CPU-heavy part of a print never holds the app's event loop. Pure engine work only: the job carries
 * everything (the board's schedule, the contractor, the medium), and nothing here reads the database.
 */
import { layoutOutput, renderOutput } from '../../pdf/index.js';
import { rasterOutput } from '../../pdf/raster/index.js';
import { LayoutError, type RenderRequest } from '../../pdf/types.js';
import { checkSchedule, maxZsByCircuit } from '../../../shared/rules/index.js';
import type { JobAnswer, JobResults, PrintJobRequest, RenderJob } from './jobs.js';

/** The engine's request with the board judged by the rules (findings and maximum Zs per circuit). */
function judged({ checkedOn, ...request }: PrintJobRequest): RenderRequest {
  if (checkedOn === null) return { ...request, findings: [], maxZsByCircuit: {} };
  return { ...request, findings: checkSchedule(request.schedule, { today: checkedOn }), maxZsByCircuit: maxZsByCircuit(request.schedule) };
}

async function work(job: RenderJob): Promise<JobResults[RenderJob['kind']]> {
  const request = judged(job.request);
  switch (job.kind) {
    case 'pdf':
      return renderOutput(request);
    case 'images': {
      const { images, warnings } = await rasterOutput(request, job.dpi);
      return { images, warnings };
    }
    case 'check': {
      const layout = layoutOutput(request);
      return { warnings: layout.warnings, pageCount: layout.pages.length };
    }
  }
}

/** Piscina calls the default export with each job. */
export default async function renderJob(job: RenderJob): Promise<JobAnswer<RenderJob['kind']>> {
  try {
    return { ok: true, result: await work(job) };
  } catch (err) {
    if (err instanceof LayoutError) return { ok: false, layoutError: { message: err.message, field: err.field } };
    throw err;
  }
}
