import { describe, expect, it } from 'vitest';
import { layoutOutput, renderOutput } from '../../../server/pdf/index.js';
import { TAPE_MAX_LENGTH_MM } from '../../../server/pdf/media.js';
import { ohms } from '../../../server/pdf/layout/chart/columns.js';
import { runBox, type ModulesItem, type TextRun } from '../../../server/pdf/model.js';
import { request, tenCircuitBoard } from './fixtures.js';
import { pageSizesPt, pdfText, PT_PER_MM, runsOutside, textRuns } from './helpers.js';

const squash = (t: string) => t.replace(/\s+/g, ' ');

describe('cable flag strip', () => {
  it('when a strip of every flag at both ends is longer than the tape takes, then it goes on over pages no longer than the way-label limit', async () => {
    const req = request('flags', 'tape-12', { layout: 'strip', bothEnds: true });
    const layout = layoutOutput(req);
    expect(layout.pages.length).toBeGreaterThan(1);
    const sizes = pageSizesPt((await renderOutput(req)).pdf);
    expect(sizes).toHaveLength(layout.pages.length);
    for (const s of sizes) expect(s.h / PT_PER_MM).toBeLessThanOrEqual(TAPE_MAX_LENGTH_MM + 1e-6); // 1000 mm: longest label in one piece (common practice)
    expect(runsOutside(layout)).toEqual([]);
    // ▼▲ half-marks where the parts meet: two at each end that joins another page.
    const marks = layout.pages.map((p) => p.items.filter((i) => i.kind === 'polygon').length);
    expect(marks[0]).toBe(2);
    expect(marks[marks.length - 1]).toBe(2);
    for (const m of marks.slice(1, -1)) expect(m).toBe(4);
    // Every flag still prints: the ten circuits, rings twice, at both ends.
    const wayRuns = textRuns(layout).filter((r) => /^\d+$/.test(r.text));
    expect(wayRuns.length).toBe(2 * 2 * (10 + 3)); // two faces a flag; fixture has 3 rings with 2 legs
  });

  it('when the strip fits one piece, then it stays one page without marks', () => {
    const layout = layoutOutput(request('flags', 'tape-12', { layout: 'strip', ways: '1,2' }));
    expect(layout.pages).toHaveLength(1);
    expect(layout.pages[0].items.filter((i) => i.kind === 'polygon')).toEqual([]);
  });
});

describe('circuit chart wording', () => {
  it('when a finding concerns several ways or one, then the chart names them "ways 3 and 6" / "way 8"', async () => {
    const text = squash(await pdfText((await renderOutput(request('chart', 'a4', { showFindings: true }))).pdf));
    expect(text).toContain('Note · ways 3 and 6 ·');
    expect(text).toContain('Check · way 8 ·');
  });

  it('when a circuit serves one point, then it says "1 point"', async () => {
    const s = tenCircuitBoard();
    s.circuits[0].points = 1;
    const text = squash(await pdfText((await renderOutput(request('chart', 'a4', {}, s))).pdf));
    expect(text).toContain('1 point');
    expect(text).not.toContain('1 points');
  });

  it('when a TT circuit has a large max Zs, then it prints whole ohms', async () => {
    expect(ohms(50 / 0.03)).toBe('1667'); // BS 7671 411.5.3: RA × IΔn ≤ 50 V, 50 V / 30 mA = 1667 Ω
    expect(ohms(16.666)).toBe('16.7');
    expect(ohms(1.37)).toBe('1.37'); // BS 7671 Table 41.3, B32 at 0.4 s
    const req = request('chart', 'a4');
    req.maxZsByCircuit = { ...req.maxZsByCircuit, c3: 50 / 0.03 };
    const text = squash(await pdfText((await renderOutput(req)).pdf));
    expect(text).toContain('1667');
    expect(text).not.toContain('1666.67');
  });

  it('when the board is three-phase, then the supply line reads 400/230 V', async () => {
    const s = tenCircuitBoard();
    s.board.phases = 3;
    expect(squash(await pdfText((await renderOutput(request('chart', 'a4', {}, s))).pdf))).toContain('400/230 V three-phase'); // 230 V × √3 ≈ 400 V
  });

  it('when a way is a sub-main, then the chart says it feeds another board', async () => {
    const s = tenCircuitBoard(); // way 9 is the garage sub-main
    const runs = textRuns(layoutOutput(request('chart', 'a4', {}, s)));
    const feeds = runs.filter((r) => r.text === 'Feeds another board');
    expect(feeds).toHaveLength(1);
    const garage = runs.find((r) => r.text === 'Garage (SWA)')!;
    expect(feeds[0].cell).toEqual(garage.cell);
    s.circuits[8].kind = 'radial';
    s.circuits[8].feedsBoardId = 12;
    expect(textRuns(layoutOutput(request('chart', 'a4', {}, s))).filter((r) => r.text === 'Feeds another board')).toHaveLength(1);
    s.circuits[8].feedsBoardId = null;
    expect(textRuns(layoutOutput(request('chart', 'a4', {}, s))).filter((r) => r.text === 'Feeds another board')).toHaveLength(0);
  });
});

describe('way label wording and sizes', () => {
  function board() {
    const s = tenCircuitBoard();
    s.devices.find((d) => d.id === 'spd')!.label = 'Surge protection';
    s.circuits = s.circuits.filter((c) => c.way !== 5); // way 5's MCB (d5) left spare
    return s;
  }

  it('when the SPD is labelled "Surge protection", then the words print once', () => {
    const texts = textRuns(layoutOutput(request('way-labels', 'tape-18', {}, board()))).map((r) => r.text);
    expect(texts.filter((t) => /surge protection/i.test(t))).toHaveLength(1);
    expect(texts).toContain('SPD');
  });

  it('when a way is spare, then its cell still carries its way number', () => {
    const runs = textRuns(layoutOutput(request('way-labels', 'a4', { heightMm: 14 }, board())));
    const spare = runBox(runs.find((r) => r.text === 'Spare')!);
    const centre = (b: { x: number; w: number }) => b.x + b.w / 2;
    const five = runs
      .filter((r) => r.text === '5')
      .map(runBox)
      .filter((b) => Math.abs(centre(b) - centre(spare)) < 17.5 / 2 && Math.abs(b.y - spare.y) < 14);
    expect(five).toHaveLength(1); // DIN 43880: the spare MCB's cell is one 17.5 mm module
  });

  it('when a row prints, then its circuit labels share one size', () => {
    const layout = layoutOutput(request('way-labels', 'tape-18'));
    const row1 = layout.pages[0].items.filter((i): i is TextRun => i.kind === 'text');
    const labels = ['Kitchen', 'Cooker', 'Shower', 'Upstairs', 'Downstairs', 'Immersion'];
    const sizes = new Set(row1.filter((r) => labels.some((l) => r.text.startsWith(l))).map((r) => r.sizePt));
    expect(sizes.size).toBe(1);
  });

  it('when a strip is split, then the last part names the part it meets, not "the next part"', () => {
    const layout = layoutOutput(request('way-labels', 'a4', { maxLengthMm: 100 }));
    const captions = textRuns(layout)
      .filter((r) => r.text.startsWith('Row 1 · part'))
      .map((r) => r.text);
    expect(captions.length).toBeGreaterThanOrEqual(3);
    const last = captions[captions.length - 1];
    expect(last).not.toContain('next part');
    expect(last).toMatch(new RegExp(`meet part ${captions.length - 1}\\b`));
    expect(captions[0]).toContain('meet part 2');
  });
});

describe('board tag caption', () => {
  for (const media of ['tape-24', 'tape-36', 'a4']) {
    it(`when the tag prints on ${media}, then "Scan for the board page" sits with the QR code, not under the barcode`, () => {
      const items = layoutOutput(request('tag', media)).pages[0].items;
      const qr = items.find((i): i is ModulesItem => i.kind === 'modules' && i.purpose === 'qr')!;
      const bars = items.find((i): i is ModulesItem => i.kind === 'modules' && i.purpose === 'barcode')!;
      const caption = items.filter((i): i is TextRun => i.kind === 'text' && /Scan|board page/.test(i.text)).map(runBox);
      expect(caption.length).toBeGreaterThan(0);
      // On tape the tag runs down the page: compare along y there, along x on a sheet.
      const along = media.startsWith('tape') ? 'y' : 'x';
      const span = along === 'y' ? 'h' : 'w';
      for (const c of caption) {
        expect(c[along] + c[span]).toBeLessThanOrEqual(bars.area[along] + 1e-6);
        expect(c[along]).toBeLessThanOrEqual(qr.area[along] + qr.area[span] + 6);
      }
    });
  }
});
