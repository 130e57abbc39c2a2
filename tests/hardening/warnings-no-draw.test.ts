/**
 * The print page asks for the warnings list at every change of an option: answering it must not
 * draw the PDF (drawing is most of a print's cost). Here drawing throws, so a route that draws fails.
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

let t: Awaited<ReturnType<typeof startTestApp>>;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => {
  await t.close();
});

describe('the warnings list of a print', () => {
  it('when the print page asks what a 40-way chart and its flags would warn about, then it answers without drawing either', async () => {
    const owner = await signupOwner(t.app);
    const { id } = await createBoardWith(owner, makeSchedule(40));
    const chart = await owner.get(`/api/boards/${id}/pdf/chart/warnings?media=a4`).expect(200);
    expect(chart.body.pageCount).toBeGreaterThan(0);
    const flags = await owner.get(`/api/boards/${id}/pdf/flags/warnings?media=tape-12`).expect(200);
    expect(flags.body.pageCount).toBeGreaterThanOrEqual(40); // at least a flag a way on tape, a page a flag
    expect(Array.isArray(flags.body.warnings)).toBe(true);
    expect(drawLayout).not.toHaveBeenCalled();
    // The PDF itself is still drawn (and here refuses, proving the mock is the one in use).
    await owner.get(`/api/boards/${id}/pdf/chart?media=a4`).expect(500);
  });
});
