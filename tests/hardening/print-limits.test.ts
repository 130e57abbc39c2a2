/** One print request cannot make thousands of pages on the server's one thread: it is refused up front, saying what fits. */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signupOwner, startTestApp, type TestApp } from '../helpers/app.js';
import { addMember } from '../helpers/accounts.js';
import { createBoardWith, makeSchedule } from '../helpers/boards.js';
import { flagCount, MAX_FLAGS_PER_PRINT } from '../../server/pdf/layout/work.js';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => {
  await t.close();
});

describe('the work one print may do', () => {
  it('when a viewer asks for every leg at both ends of a 300-way board, then 422 names the limit and the way out, before drawing', async () => {
    const owner = await signupOwner(t.app);
    const schedule = makeSchedule(300);
    const { id } = await createBoardWith(owner, schedule);
    const viewer = await addMember(t, owner, 'viewer');
    expect(flagCount(schedule, { legs: 8, bothEnds: true })).toBe(4800);
    const started = performance.now();
    const res = await viewer.get(`/api/boards/${id}/pdf/flags?media=tape-12&legs=8&bothEnds=true`).expect(422);
    const refusedMs = performance.now() - started;
    expect(res.body.error.message).toContain(String(MAX_FLAGS_PER_PRINT));
    expect(res.body.error.message).toMatch(/fewer ways|one end/);
    await viewer.get(`/api/boards/${id}/pdf/flags/warnings?media=tape-12&legs=8&bothEnds=true`).expect(422);
    // What fits still prints: one leg at the board end of the first ten ways.
    const fitStarted = performance.now();
    await viewer.get(`/api/boards/${id}/pdf/flags?media=tape-12&ways=1,2,3,4,5,6,7,8,9,10`).expect(200);
    // The refusal is cheaper than even a ten-way print (a baseline from the same run, not a fixed time).
    expect(refusedMs).toBeLessThan(performance.now() - fitStarted + 200);
  });

  it('when both ends would pass the limit but one end fits, then the message says to print one end at a time', async () => {
    const owner = await signupOwner(t.app);
    const { id } = await createBoardWith(owner, makeSchedule(1500));
    const res = await owner.get(`/api/boards/${id}/pdf/flags?media=tape-12&legs=1&bothEnds=true`).expect(422);
    expect(res.body.error.message).toContain('one end at a time');
  });
});
