/** One organisation's prints at once are capped, so it cannot take every render place from the others. */
import { describe, expect, it } from 'vitest';
import { PRINTS_AT_ONCE_PER_ORGANISATION, withinOrganisationShare } from '../../../server/print/workers/fair-share.js';
import { AppError } from '../../../server/errors.js';

/** A print that finishes when the test says so. */
function held() {
  let finish!: () => void;
  const done = new Promise<void>((resolve) => (finish = resolve));
  return { done, finish };
}

describe('prints at once per organisation', () => {
  it('when one organisation has its share rendering, then its next print is 503 print_busy at once while another organisation still prints', async () => {
    const prints = Array.from({ length: PRINTS_AT_ONCE_PER_ORGANISATION }, held);
    const running = prints.map((p) => withinOrganisationShare(1, () => p.done));
    const refused = await withinOrganisationShare(1, async () => 'drawn').catch((err: unknown) => err);
    expect(refused).toBeInstanceOf(AppError);
    expect(refused).toMatchObject({ status: 503, code: 'print_busy', headers: { 'Retry-After': '5' } });
    await expect(withinOrganisationShare(2, async () => 'drawn')).resolves.toBe('drawn');

    // One print done frees one place, and only one.
    prints[0].finish();
    await running[0];
    const next = held();
    const again = withinOrganisationShare(1, () => next.done);
    await expect(withinOrganisationShare(1, async () => 'drawn')).rejects.toMatchObject({ code: 'print_busy' });
    for (const p of [...prints, next]) p.finish();
    await Promise.all([...running, again]);
    await expect(withinOrganisationShare(1, async () => 'drawn')).resolves.toBe('drawn');
  });

  it('when a print fails, then its place is given back', async () => {
    for (let i = 0; i < PRINTS_AT_ONCE_PER_ORGANISATION + 2; i++) {
      await expect(withinOrganisationShare(3, async () => Promise.reject(new Error('layout')))).rejects.toThrow('layout');
    }
    await expect(withinOrganisationShare(3, async () => 'drawn')).resolves.toBe('drawn');
  });
});
