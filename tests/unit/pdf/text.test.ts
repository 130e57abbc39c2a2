import { describe, expect, it } from 'vitest';
import { renderOutput } from '../../../server/pdf/index.js';
import { request, tenCircuitBoard } from './fixtures.js';
import { pdfText } from './helpers.js';

const schedule = tenCircuitBoard();
const squash = (s: string) => s.replace(/\s+/g, ' ');

describe('text in the PDFs stays real text', () => {
  for (const [output, media] of [
    ['flags', 'a4'],
    ['way-labels', 'tape-24'],
    ['chart', 'a4'],
    ['chart', 'a5'],
  ] as const) {
    it(`when ${output} print on ${media}, then pdf-parse extracts every circuit's label and way number`, async () => {
      const text = squash(await pdfText((await renderOutput(request(output, media))).pdf));
      for (const c of schedule.circuits) {
        expect(text).toContain(c.label);
        expect(text).toMatch(new RegExp(`(^|\\D)${c.way}(\\D|$)`));
      }
    });
  }

  it('when the chart prints, then the caution, the supply, the RCD groups and the symbols ² Ω ≤ Δ ± é extract', async () => {
    const text = squash(await pdfText((await renderOutput(request('chart', 'a4'))).pdf));
    expect(text).toContain('isolate the supply and prove dead');
    expect(text).toContain('BS 7671');
    expect(text).toContain('Ze 0.21 Ω');
    expect(text).toContain('RCD 1');
    expect(text).toContain('1.37'); // BS 7671:2018+A2 Table 41.3: B32 max Zs 1.37 Ω, passed in as maxZsByCircuit
    for (const ch of ['²', 'Ω', '≤', 'Δ', '±', 'é']) expect(text).toContain(ch);
  });

  it('when notices print, then each carries its regulation number', async () => {
    const kinds = 'inspection,rcd-test,earthing,mixed-colours,alternative-supply,voltage';
    const text = squash(await pdfText((await renderOutput(request('notices', 'a4', { kinds, earthingCount: 1 }))).pdf));
    for (const reg of ['514.12.1', '514.12.2', '514.13.1', '514.14.1', '514.15.1', '514.10.1']) expect(text).toContain(`BS 7671 ${reg}`); // BS 7671 Section 514
    expect(text).toContain('Safety Electrical Connection – Do Not Remove'); // BS 7671 514.13.1 label wording
    expect(text).toContain('10 Feb 2030');
  });
});
