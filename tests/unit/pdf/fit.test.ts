import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { typeMetrics } from '../../../server/pdf/fonts.js';
import { fitText, wrapText } from '../../../server/pdf/layout/fit.js';
import { cleanText } from '../../../server/pdf/layout/text.js';
import { boxInside, MM_PER_PT, runBox, type Box } from '../../../server/pdf/model.js';

const tm = typeMetrics();
const style = { face: 'bold' as const, maxPt: 12, minPt: 5, maxLines: 2 };

describe('text fitting', () => {
  it('when a label fits at the preferred size, then it is one line at that size', () => {
    const fit = fitText('Cooker', { x: 0, y: 0, w: 40, h: 8 }, style, tm);
    expect(fit).toMatchObject({ sizePt: 12, lines: ['Cooker'], cut: false });
  });

  it('when a label is too wide, then it shrinks first, and the shrunk line is exactly as wide as measured', () => {
    const cell = { x: 0, y: 0, w: 20, h: 8 };
    const fit = fitText('Kitchen sockets', cell, style, tm);
    expect(fit.lines).toEqual(['Kitchen sockets']);
    expect(fit.sizePt).toBeLessThan(12);
    expect(fit.sizePt).toBeGreaterThanOrEqual(5);
    expect(fit.runs[0].widthMm).toBeLessThanOrEqual(20);
  });

  it('when shrinking to the minimum is not enough, then it wraps to the lines the cell allows', () => {
    const fit = fitText('Downstairs sockets and hall', { x: 0, y: 0, w: 22, h: 6 }, style, tm);
    expect(fit.lines.length).toBe(2);
    expect(fit.cut).toBe(false);
  });

  it('when even wrapped text does not fit, then the last line is cut with an ellipsis and the fit says so', () => {
    const fit = fitText('Garden room façade lights and the pond pump beyond the shed', { x: 0, y: 0, w: 12, h: 4.5 }, style, tm);
    expect(fit.cut).toBe(true);
    expect(fit.runs.at(-1)!.text.endsWith('…')).toBe(true);
    expect(fit.sizePt).toBe(5);
  });

  it('when text is turned 90°, then its glyph box stays in the cell and it reads top to bottom', () => {
    const cell = { x: 10, y: 20, w: 6, h: 30 };
    const fit = fitText('Immersion', cell, style, tm, 90);
    expect(fit.runs[0].rotation).toBe(90);
    expect(boxInside(runBox(fit.runs[0]), cell)).toBe(true);
  });

  it('when a line at 10 pt is measured, then 1 pt is 25.4/72 mm', () => {
    expect(MM_PER_PT).toBeCloseTo(0.352778, 6); // ISO 32000-1 8.3.2.1: 1 pt = 1/72 in
    expect(tm.measure('Ω', 'regular', 10)).toBeGreaterThan(0);
    expect(tm.measure('WW', 'regular', 20)).toBeCloseTo(2 * tm.measure('W', 'regular', 20), 9);
  });

  it('when a description is wrapped for a table, then no line is wider than the column and at most the limit is kept', () => {
    const text = 'Ring final serving the kitchen worktop sockets, the fridge spur and the dishwasher spur under the sink';
    const wrapped = wrapText(text, 30, 'regular', 7.5, tm, 3);
    expect(wrapped.lines).toHaveLength(3);
    expect(wrapped.cut).toBe(true);
    for (const l of wrapped.lines) expect(tm.measure(l, 'regular', 7.5)).toBeLessThanOrEqual(30);
  });

  it('when a label holds newlines, tabs, controls or a lone surrogate, then it is cleaned to one printable line', () => {
    expect(cleanText('Kitchen\nring\t\u0000 \ud800x\u200b')).toBe('Kitchen ring \ufffdx');
  });

  it('property: arbitrary Unicode in any cell never puts a glyph box outside the cell', () => {
    const cellArb = fc.record({
      x: fc.double({ min: 0, max: 100, noNaN: true }),
      y: fc.double({ min: 0, max: 100, noNaN: true }),
      w: fc.double({ min: 0.5, max: 80, noNaN: true }),
      h: fc.double({ min: 0.5, max: 30, noNaN: true }),
    });
    fc.assert(
      fc.property(
        fc.string({ unit: 'grapheme', maxLength: 60 }),
        fc.string({ unit: 'binary', maxLength: 30 }),
        cellArb,
        fc.constantFrom(0, 90, 180, 270),
        fc.integer({ min: 1, max: 4 }),
        (a, b, cell: Box, rotation, maxLines) => {
          const fit = fitText(`${a}${b}`, cell, { face: 'regular', maxPt: 14, minPt: 5, maxLines }, tm, rotation as 0 | 90 | 180 | 270);
          for (const run of fit.runs) {
            expect(boxInside(runBox(run), cell, 1e-6)).toBe(true);
            expect(run.cell).toEqual(cell);
          }
          expect(fit.runs.length).toBeLessThanOrEqual(maxLines);
        },
      ),
      { numRuns: 400 },
    );
  });
});
