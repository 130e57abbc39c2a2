/** A combined AFDD/RCBO on the chart and notices: it is the way's own residual-current protection. */
import { describe, expect, it } from 'vitest';
import { renderOutput } from '../../../server/pdf/index.js';
import { request, tenCircuitBoard } from './fixtures.js';
import { pdfText } from './helpers.js';

function withAfddRcbo() {
  const s = tenCircuitBoard();
  const c = s.circuits[0]!;
  const d = s.devices.find((x) => x.id === c.deviceId)!;
  Object.assign(d, { kind: 'afdd', rating: 32, curve: 'B', residualMa: 30, rcdType: 'A' });
  return s;
}

describe('a combined AFDD/RCBO', () => {
  it('when way 1 is on an AFDD with 30 mA IΔn, then its RCD column says AFDD/RCBO 30 mA', async () => {
    const text = (await pdfText((await renderOutput(request('chart', 'a4', {}, withAfddRcbo()))).pdf)).replace(/\s+/g, ' ');
    expect(text).toContain('AFDD/RCBO');
  });

  it('when the RCD test notice is printed, then it counts the AFDD/RCBO among the devices with a test button', async () => {
    // BS 7671 514.12.2: a notice to test each RCD by its test button (from memory).
    const before = (await pdfText((await renderOutput(request('notices', 'a4', {}, tenCircuitBoard()))).pdf)).replace(/\s+/g, ' ');
    const after = (await pdfText((await renderOutput(request('notices', 'a4', {}, withAfddRcbo()))).pdf)).replace(/\s+/g, ' ');
    const count = (t: string) => Number(t.match(/(\d+) RCBOs?/)?.[1] ?? 0);
    const d = tenCircuitBoard().devices.find((x) => x.id === tenCircuitBoard().circuits[0]!.deviceId)!;
    // An RCBO turned AFDD/RCBO keeps the count; an MCB turned AFDD/RCBO adds one.
    expect(count(after)).toBe(count(before) + (d.kind === 'rcbo' ? 0 : 1));
    expect(count(after)).toBeGreaterThan(0);
  });
});
