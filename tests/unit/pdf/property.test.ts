import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { layoutOutput, renderOutput, resolveMedium } from '../../../server/pdf/index.js';
import type { PrintOutput } from '../../../shared/schemas/print.js';
import type { Schedule } from '../../../shared/schemas/schedule.js';
import { request, tenCircuitBoard } from './fixtures.js';
import { runsOutside } from './helpers.js';

/** Any Unicode at all, including combining marks, emoji, right-to-left and unassigned code points. */
const anyText = (max: number) =>
  fc.oneof(
    fc.string({ unit: 'grapheme', maxLength: max }),
    fc.string({ unit: 'binary', maxLength: max }),
    fc.string({ unit: 'grapheme-composite', maxLength: max }),
  );

const scheduleWith = fc
  .record({
    labels: fc.array(anyText(24), { minLength: 10, maxLength: 10 }),
    descriptions: fc.array(anyText(200), { minLength: 10, maxLength: 10 }),
    location: anyText(60),
    boardName: anyText(120),
  })
  .map(({ labels, descriptions, location, boardName }): Schedule => {
    const s = tenCircuitBoard();
    s.board.name = boardName || 'Board';
    s.board.location = location;
    s.board.alternativeSupply = { present: true, kinds: ['pv'], description: location };
    s.circuits.forEach((c, i) => {
      c.label = labels[i] || '?';
      c.description = descriptions[i];
      c.locations = location ? [location] : [];
    });
    s.devices.forEach((d, i) => {
      d.label = labels[i]?.slice(0, 24) ?? '';
    });
    return s;
  });

const cases: Array<[PrintOutput, string]> = [
  ['flags', 'tape-6'],
  ['flags', 'tape-12'],
  ['flags', 'a4'],
  ['flags', 'custom-100x20'],
  ['way-labels', 'tape-9'],
  ['way-labels', 'a5'],
  ['chart', 'a4'],
  ['chart', 'a5-landscape'],
  ['notices', 'tape-12'],
  ['notices', 'a4'],
  ['tag', 'tape-24'],
  ['tag', 'custom-60x30'],
];

describe('property: arbitrary Unicode labels', () => {
  for (const [output, media] of cases) {
    it(`never place a text run outside its cell: ${output} on ${media}`, () => {
      fc.assert(
        fc.property(scheduleWith, (schedule) => {
          const req = {
            ...request(output, media, output === 'notices' ? { kinds: 'inspection,alternative-supply,earthing' } : {}, schedule),
            medium: resolveMedium(media),
          };
          expect(runsOutside(layoutOutput(req))).toEqual([]);
        }),
        { numRuns: output === 'chart' ? 15 : 30 },
      );
    });
  }

  it('render to a PDF without failing, whatever the script', async () => {
    await fc.assert(
      fc.asyncProperty(scheduleWith, fc.constantFrom(...cases), async (schedule, [output, media]) => {
        const result = await renderOutput(request(output, media, {}, schedule));
        expect(result.pageCount).toBeGreaterThan(0);
        expect(Buffer.from(result.pdf.subarray(0, 5)).toString()).toBe('%PDF-');
      }),
      { numRuns: 12 },
    );
  });
});
