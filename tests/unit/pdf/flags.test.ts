import { describe, expect, it } from 'vitest';
import { layoutOutput, LayoutError, resolveMedium } from '../../../server/pdf/index.js';
import { cablePerimeter, TWIN_EARTH_SIZE_MM } from '../../../server/pdf/layout/cable.js';
import { flagSpecs } from '../../../server/pdf/layout/flags.js';
import { WarningList, withDefaults } from '../../../server/pdf/layout/context.js';
import { typeMetrics } from '../../../server/pdf/fonts.js';
import { EMPTY_CABLE, type Cable } from '../../../shared/schemas/schedule.js';
import { request, tenCircuitBoard } from './fixtures.js';
import { runsOutside, textRuns } from './helpers.js';

const cable = (c: Partial<Cable>): Cable => ({ ...EMPTY_CABLE, liveCsa: 2.5, cpcCsa: 1.5, ...c });

function specs(options = {}, mediaId = 'tape-12') {
  const req = request('flags', mediaId, options);
  return flagSpecs({ req, options: withDefaults('flags', req.options), tm: typeMetrics(), warnings: new WarningList() });
}

describe('cable flags', () => {
  it('when the cable is flat twin and earth, then the wrap is its perimeter 2(w + h)', () => {
    expect(cablePerimeter(cable({ liveCsa: 2.5 })).perimeterMm).toBeCloseTo(2 * (10.3 + 6), 9); // from memory (makers' data vary): 2.5 mm² T&E 10.3 × 6 mm
    expect(cablePerimeter(cable({ liveCsa: 1.5 })).perimeterMm).toBeCloseTo(2 * (8.2 + 5), 9); // from memory (makers' data vary): 1.5 mm² T&E 8.2 × 5 mm
    expect(TWIN_EARTH_SIZE_MM[6]).toEqual({ w: 13.5, h: 7 }); // from memory (makers' data vary): 6 mm² T&E 13.5 × 7 mm
  });

  it('when a round cable has a diameter, then the wrap is π·d whatever its type', () => {
    expect(cablePerimeter(cable({ type: 'swa', liveCsa: 6, diameterMm: 17 })).perimeterMm).toBeCloseTo(Math.PI * 17, 9);
    expect(cablePerimeter(cable({ type: 'twin-earth', diameterMm: 9 })).basis).toBe('diameter-override');
    expect(cablePerimeter(cable({ type: 'swa', liveCsa: 6 })).basis).toBe('round-table');
  });

  it('when flags are laid out, then each is panel + wrap (perimeter + overlap) + panel, the panels mirrored', () => {
    const layout = layoutOutput(request('flags', 'tape-12', { ways: '4', overlapMm: 5 }));
    const page = layout.pages[0];
    const wrap = 2 * (13.5 + 7) + 5; // from memory (makers' data vary): 6 mm² T&E 13.5 × 7 mm, plus the 5 mm overlap asked for
    // Fold ticks run across the tape at each end of the wrap zone.
    const ticks = page.items.filter((i) => i.kind === 'line' && i.lineMm === 0.2 && Math.abs(i.from.y - i.to.y) < 1e-9);
    const foldYs = [...new Set(ticks.map((t) => (t.kind === 'line' ? t.from.y.toFixed(6) : '')))].map(Number).sort((a, b) => a - b);
    expect(foldYs).toHaveLength(2);
    expect(foldYs[1] - foldYs[0]).toBeCloseTo(wrap, 5);
    expect(foldYs[0]).toBeCloseTo(page.heightMm - foldYs[1], 5); // panels the same length either side
    const rotations = new Set(textRuns(layout).map((r) => r.rotation));
    expect(rotations).toEqual(new Set([90, 270])); // panel A turned onto the tape, panel B a further 180°
  });

  it('when a circuit is a ring final, then it gets two flags; bothEnds doubles the set', () => {
    const one = specs();
    const board = tenCircuitBoard();
    const rings = board.circuits.filter((c) => c.kind === 'ring').length;
    expect(one).toHaveLength(board.circuits.length + rings);
    expect(specs({ bothEnds: true })).toHaveLength(2 * one.length);
    expect(specs({ legs: 3, ways: '1,2' })).toHaveLength(6);
    expect(specs({ bothEnds: true }).at(-1)!.end).toBe('far');
  });

  it('when only some ways are asked for (changed since, or the ways option), then only their flags print', () => {
    const req = { ...request('flags', 'tape-12'), onlyWays: [3, 7] };
    const layout = layoutOutput(req);
    expect(layout.pages).toHaveLength(2);
    const texts = textRuns(layout).map((r) => r.text);
    expect(texts).toContain('Downstairs lights');
    expect(texts).toContain('Shower');
  });

  it('when flags go on tape one per page, then the page is the tape wide and the flag long', () => {
    const layout = layoutOutput(request('flags', 'tape-18', { ways: '7' }));
    expect(layout.pages).toHaveLength(1);
    expect(layout.pages[0].widthMm).toBe(18); // tape-18
    expect(layout.pages[0].heightMm).toBeGreaterThan(2 * (17.1 + 10)); // longer than the wrap for 10 mm² T&E (from memory; makers' data vary)
    expect(runsOutside(layout)).toEqual([]);
  });

  it('when flags go on one strip, then there is one page with a cut line between flags', () => {
    const layout = layoutOutput(request('flags', 'tape-12', { layout: 'strip', ways: '3,4' }));
    expect(layout.pages).toHaveLength(1);
    const cuts = layout.pages[0].items.filter((i) => i.kind === 'line' && i.dashMm && i.from.x === 0 && i.to.x === 12);
    expect(cuts).toHaveLength(1);
  });

  it('when flags go on A4, then they are tiled inside the margins with cut lines', () => {
    const layout = layoutOutput(request('flags', 'a4'));
    const outlines = layout.pages.flatMap((p) => p.items.filter((i) => i.kind === 'rect' && i.dashMm));
    expect(outlines.length).toBe(specs().length);
    for (const o of outlines)
      if (o.kind === 'rect') {
        expect(o.box.x).toBeGreaterThanOrEqual(10);
        expect(o.box.x + o.box.w).toBeLessThanOrEqual(200);
      }
    expect(runsOutside(layout)).toEqual([]);
  });

  it('when die-cut labels are too short for the cable wrap, then a LayoutError says how long they must be', () => {
    const medium = resolveMedium('custom-40x20');
    expect(() => layoutOutput({ ...request('flags', 'custom-40x20', { ways: '9' }), medium })).toThrow(LayoutError);
    expect(() => layoutOutput({ ...request('flags', 'custom-40x20', { ways: '9' }), medium })).toThrow(/at least \d+ mm long/);
  });

  it('when a long label meets a short die-cut label, then it is cut with an ellipsis and a warning names the flag', () => {
    const schedule = tenCircuitBoard();
    schedule.circuits[0].label = 'Kitchen worktop sockets';
    const medium = resolveMedium('custom-80x10');
    const layout = layoutOutput({ ...request('flags', 'custom-80x10', { ways: '1', legs: 1 }, schedule), medium });
    expect(runsOutside(layout)).toEqual([]);
    expect(layout.warnings.find((w) => w.code === 'text-cut')?.label).toBe('Way 1 flag');
    expect(textRuns(layout).some((r) => r.text.endsWith('…'))).toBe(true);
    expect(textRuns(layout).filter((r) => r.text === '1')).toHaveLength(2); // the way number, whole, on both panels
  });
});
