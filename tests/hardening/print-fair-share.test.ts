/**
 * One member asking for the largest chart again and again cannot keep other contractors from printing:
 * past its share of prints at once, the organisation's next print is refused at once with 503
 * print_busy and Retry-After, while another organisation's print renders.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signupOwner, startTestApp, type TestApp } from '../helpers/app.js';
import { createBoardWith, makeSchedule } from '../helpers/boards.js';
import { closeRenderPool } from '../../server/print/workers/pool.js';
import { PRINTS_AT_ONCE_PER_ORGANISATION } from '../../server/print/workers/fair-share.js';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => {
  await t.close();
  await closeRenderPool();
});

describe('prints at once per organisation', () => {
  it('when one organisation sends many big prints at once, then those past its share get 503 print_busy and another organisation still prints', async () => {
    const greedy = await signupOwner(t.app);
    const { id } = await createBoardWith(greedy, makeSchedule(300));
    const other = await signupOwner(t.app);
    const { id: otherId } = await createBoardWith(other, makeSchedule(10));

    const flood = Array.from({ length: PRINTS_AT_ONCE_PER_ORGANISATION * 3 }, () => greedy.get(`/api/boards/${id}/pdf/chart?media=a4`));
    // The other contractor's print starts while the flood is under way.
    const [answers, theirs] = await Promise.all([Promise.all(flood.map((r) => r.then((res) => res))), other.get(`/api/boards/${otherId}/pdf/chart?media=a4`)]);
    expect(theirs.status).toBe(200);
    const refused = answers.filter((a) => a.status === 503);
    expect(refused.length).toBeGreaterThan(0);
    for (const a of refused) {
      expect(a.body.error.code).toBe('print_busy');
      expect(a.headers['retry-after']).toMatch(/^\d+$/);
    }
    expect(answers.filter((a) => a.status === 200).length).toBeGreaterThanOrEqual(1);
    expect(answers.every((a) => a.status === 200 || a.status === 503)).toBe(true);
  });
});
