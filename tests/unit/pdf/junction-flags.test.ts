import { describe, expect, it } from 'vitest';
import { layoutOutput, renderOutput } from '../../../server/pdf/index.js';
import { junctionBoxFlagTexts } from '../../../server/pdf/layout/junction-flags.js';
import { flagCount } from '../../../server/pdf/layout/work.js';
import { WarningList, withDefaults } from '../../../server/pdf/layout/context.js';
import { typeMetrics } from '../../../server/pdf/fonts.js';
import { bungalowBoard } from '../../../server/seed/demo-bungalow.js';
import { request } from './fixtures.js';
import { pdfText, runsOutside, textRuns } from './helpers.js';

const atBoxes = (media = 'tape-24') => request('flags', media, { at: 'junction-boxes' }, bungalowBoard.schedule);

describe('junction-box cable flags', () => {
  it('when the demo bungalow prints flags at junction boxes, then there is one flag: old Fuse 1 leg 2 through JB1 to way 3', async () => {
    const req = atBoxes();
    const texts = junctionBoxFlagTexts({ req, options: withDefaults('flags', req.options), tm: typeMetrics(), warnings: new WarningList() });
    expect(texts).toHaveLength(1);
    expect(texts[0].way).toBe('JB1');
    expect(texts[0].label).toBe('Old Fuse 1 (red dot) leg 2 → Way 3 Sockets front');
    expect(texts[0].info).toContain('loft, above the hall');
    expect(flagCount(bungalowBoard.schedule, withDefaults('flags', req.options))).toBe(1);

    const layout = layoutOutput(req);
    expect(layout.pages).toHaveLength(1);
    expect(runsOutside(layout)).toEqual([]);
    const runs = textRuns(layout)
      .map((r) => r.text)
      .join(' ');
    for (const part of ['JB1', 'Fuse 1', 'Way 3']) expect(runs).toContain(part);
    const text = (await pdfText((await renderOutput(req)).pdf)).replace(/\s+/g, ' ');
    for (const part of ['JB1', 'Fuse 1', 'Way 3', 'loft, above the hall']) expect(text).toContain(part);
  });

  it('when a junction-box flag is laid out, then it is the board flag piece: two panels either side of the wrap for the old cable', () => {
    const page = layoutOutput(request('flags', 'tape-12', { at: 'junction-boxes', overlapMm: 5 }, bungalowBoard.schedule)).pages[0];
    const wrap = 2 * (10.3 + 6) + 5; // from memory (makers' data vary): 2.5 mm² T&E 10.3 × 6 mm, plus the 5 mm overlap asked for
    const ticks = page.items.filter((i) => i.kind === 'line' && i.lineMm === 0.2 && Math.abs(i.from.y - i.to.y) < 1e-9);
    const foldYs = [...new Set(ticks.map((t) => (t.kind === 'line' ? t.from.y.toFixed(6) : '')))].map(Number).sort((a, b) => a - b);
    expect(foldYs).toHaveLength(2);
    expect(foldYs[1] - foldYs[0]).toBeCloseTo(wrap, 5);
    expect(foldYs[0]).toBeCloseTo(page.heightMm - foldYs[1], 5);
  });

  it('when a board has no leg through a junction box, then the print says there is nothing to print', () => {
    const layout = layoutOutput(request('flags', 'tape-12', { at: 'junction-boxes' }));
    expect(layout.pages).toHaveLength(1);
    expect(layout.warnings.map((w) => w.code)).toEqual(['nothing-to-print']);
    expect(layout.warnings[0].message).toMatch(/No planned leg goes through a junction box/);
  });

  it('when flags are asked for at the board (the default), then junction boxes are not printed', () => {
    const runs = textRuns(layoutOutput(request('flags', 'tape-12')))
      .map((r) => r.text)
      .join(' ');
    expect(runs).not.toContain('JB1');
    expect(runs).toContain('Kitchen sockets');
  });
});
