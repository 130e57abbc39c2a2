/**
 * The print page asks for the warnings list at every change of an option: answering it must not
 * draw the PDF (drawing is most of a print's cost). Prints run on the render threads, which a mock
 * in this thread cannot reach, so the render worker's job is run here with drawing made to throw:
 * the warnings job ('check') must answer, the PDF job must fail. The API then answers the warnings
 * list with the page count the PDF itself has.
 */
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';

vi.mock('../../server/pdf/draw.js', () => ({
  drawLayout: vi.fn(async () => {
    throw new Error('drawn: the warnings list must only lay out');
  }),
}));

const { signupOwner, startTestApp } = await import('../helpers/app.js');
const { createBoardWith, makeSchedule } = await import('../helpers/boards.js');
const { drawLayout } = await import('../../server/pdf/draw.js');
const { default: renderJob } = await import('../../server/print/workers/render-worker.js');
const { resolveMedium } = await import('../../server/pdf/index.js');
const { closeRenderPool } = await import('../../server/print/workers/pool.js');
const { request } = await import('../unit/pdf/fixtures.js');

let t: Awaited<ReturnType<typeof startTestApp>>;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => {
  await t.close();
  await closeRenderPool();
});

describe('the warnings list of a print', () => {
  it('when the render worker is asked what a 40-way chart and its flags would warn about, then it answers without drawing either', async () => {
    const schedule = makeSchedule(40);
    const chart = await renderJob({ kind: 'check', request: { ...request('chart', 'a4'), schedule, checkedOn: '2026-01-05' } });
    const flags = await renderJob({
      kind: 'check',
      request: { ...request('flags', 'tape-12'), schedule, medium: resolveMedium('tape-12'), checkedOn: '2026-01-05' },
    });
    expect(chart.ok && chart.result).toMatchObject({ pageCount: expect.any(Number) });
    expect(flags.ok && 'pageCount' in flags.result && flags.result.pageCount).toBeGreaterThanOrEqual(40); // at least a flag a way, a page a flag
    expect(drawLayout).not.toHaveBeenCalled();
    // The PDF job does draw (and here refuses, proving the mock is the one in use).
    await expect(renderJob({ kind: 'pdf', request: { ...request('chart', 'a4'), schedule, checkedOn: null } })).rejects.toThrow(/drawn/);
  });

  it('when the print page asks for a chart warnings list, then it gives the page count the PDF itself has', async () => {
    const owner = await signupOwner(t.app);
    const { id } = await createBoardWith(owner, makeSchedule(40));
    const listed = await owner.get(`/api/boards/${id}/pdf/chart/warnings?media=a4`).expect(200);
    expect(Array.isArray(listed.body.warnings)).toBe(true);
    const pdf = await owner.get(`/api/boards/${id}/pdf/chart?media=a4`).expect(200);
    expect(listed.body.pageCount).toBe(Number(pdf.headers['x-waymark-page-count']));
  });
});
