/**
 * A print that runs past its time limit is stopped and answered with 503 saying so (never a hang),
 * and while a big print renders on the render threads the app keeps answering other requests.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signupOwner, startTestApp, type TestApp } from '../helpers/app.js';
import { createBoardWith, makeSchedule } from '../helpers/boards.js';
import { closeRenderPool } from '../../server/print/workers/pool.js';

let quick: TestApp;
let patient: TestApp;
beforeAll(async () => {
  // Two apps on one database: one whose prints may take 150 ms, one with the usual limit.
  quick = await startTestApp({ printTimeLimitMs: 150 });
  patient = await startTestApp();
});
afterAll(async () => {
  await quick.close();
  await patient.close();
  await closeRenderPool();
});

describe('print time limit', () => {
  it('when a 1000-way chart takes longer than the limit, then the answer is 503 print_timed_out with Retry-After, long before the chart would be done', async () => {
    const owner = await signupOwner(patient.app);
    const { id } = await createBoardWith(owner, makeSchedule(1000));
    const path = `/api/boards/${id}/pdf/chart?media=a4`;
    const fullStart = performance.now();
    const full = await owner.get(path).expect(200);
    const fullMs = performance.now() - fullStart;
    expect(full.headers['content-type']).toBe('application/pdf');

    const quickOwner = await signupOwner(quick.app);
    const { id: quickId } = await createBoardWith(quickOwner, makeSchedule(1000));
    const stoppedStart = performance.now();
    const res = await quickOwner.get(`/api/boards/${quickId}/pdf/chart?media=a4`).expect(503);
    const stoppedMs = performance.now() - stoppedStart;
    expect(res.body.error.code).toBe('print_timed_out');
    expect(res.body.error.message).toMatch(/longer than .* stopped/);
    expect(res.headers['retry-after']).toMatch(/^\d+$/);
    // Baseline from the same run: the whole chart on the app with the usual limit.
    expect(stoppedMs).toBeLessThan(fullMs);
    // The thread that was stopped is replaced (the pool is the process's): the next print renders.
    await owner.get(`/api/boards/${id}/pdf/flags?media=tape-12&ways=1,2,3`).expect(200);
  });
});
