import { describe, expect, it } from 'vitest';
import { layoutOutput } from '../../../server/pdf/index.js';
import { noticeContent, noticesCalledFor } from '../../../server/pdf/layout/notice-content.js';
import { warningTriangle } from '../../../server/pdf/layout/symbols.js';
import { SAFETY_YELLOW, type PolygonItem } from '../../../server/pdf/model.js';
import { board, request, tenCircuitBoard } from './fixtures.js';
import { runsOutside, textRuns } from './helpers.js';

const ALL = 'inspection,rcd-test,earthing,mixed-colours,alternative-supply,voltage';

describe('notices', () => {
  it('when no kinds are chosen, then the board decides: inspection and RCD test always here, the rest when recorded', () => {
    const board = tenCircuitBoard();
    expect(noticesCalledFor(board, 3)).toEqual(['inspection', 'rcd-test', 'earthing']);
    board.board.mixedWiringColours = true;
    board.board.phases = 3;
    board.board.alternativeSupply = { present: true, kinds: ['pv', 'battery'], description: 'Inverter in the loft' };
    expect(noticesCalledFor(board, 0)).toEqual(['inspection', 'rcd-test', 'mixed-colours', 'alternative-supply', 'voltage']);
  });

  it('when a three-phase board is on 230 V, then the voltage warning says 400 V', () => {
    const s = tenCircuitBoard();
    s.board.phases = 3;
    expect(noticeContent('voltage', s, board).title).toBe('Danger: 400 volts'); // 230/400 V: BS EN 60038 (from memory)
  });

  it('when every notice prints on A4, then warnings carry the yellow triangle and the others do not', () => {
    const layout = layoutOutput(request('notices', 'a4', { kinds: ALL, earthingCount: 2 }));
    const yellow = layout.pages.flatMap((p) => p.items.filter((i): i is PolygonItem => i.kind === 'polygon' && i.fill === SAFETY_YELLOW));
    expect(yellow).toHaveLength(3); // mixed colours, alternative supply, voltage
    const titles = textRuns(layout).map((r) => r.text);
    expect(titles.filter((t) => t.startsWith('Safety Electrical'))).toHaveLength(2); // two copies asked for; the title may wrap
    expect(runsOutside(layout)).toEqual([]);
    expect(layout.warnings).toEqual([]);
  });

  it('when the warning triangle is drawn, then it is equilateral with its border and flash inside', () => {
    const [outer, inner, flash] = warningTriangle({ x: 0, y: 0, w: 30, h: 30 }) as PolygonItem[];
    const side = (a: { x: number; y: number }, b: { x: number; y: number }) => Math.hypot(a.x - b.x, a.y - b.y);
    const [a, b, c] = outer.points;
    expect(side(a, b)).toBeCloseTo(side(b, c), 9); // ISO 7010 W012: equilateral triangle
    expect(side(b, c)).toBeCloseTo(side(c, a), 9);
    const inside = (p: { x: number; y: number }, t: PolygonItem) => {
      const [p1, p2, p3] = t.points;
      const s = (q1: typeof p, q2: typeof p) => (q2.x - q1.x) * (p.y - q1.y) - (q2.y - q1.y) * (p.x - q1.x);
      const d = [s(p1, p2), s(p2, p3), s(p3, p1)];
      return d.every((v) => v >= 0) || d.every((v) => v <= 0);
    };
    for (const p of inner.points) expect(inside(p, outer)).toBe(true);
    for (const p of flash.points) expect(inside(p, inner)).toBe(true);
  });

  it('when notices go on 12 mm tape, then each is as long as its wording needs and nothing is cut', () => {
    const layout = layoutOutput(request('notices', 'tape-12', { kinds: 'inspection,earthing,voltage', earthingCount: 1 }));
    expect(layout.pages).toHaveLength(3);
    for (const p of layout.pages) expect(p.widthMm).toBe(12);
    expect(layout.warnings).toEqual([]);
    expect(runsOutside(layout)).toEqual([]);
  });

  it('when the inspection notice prints, then it gives the last and next dates, or blanks to write in', () => {
    const texts = textRuns(layoutOutput(request('notices', 'a4', { kinds: 'inspection' })))
      .map((r) => r.text)
      .join(' ');
    expect(texts).toContain('Date of last inspection: 10 Feb 2025'); // BS 7671 514.12.1 (from memory)
    expect(texts).toContain('Recommended date of next inspection: 10 Feb 2030'); // BS 7671 514.12.1 (from memory)
    const blank = { ...request('notices', 'a4', { kinds: 'inspection' }) };
    blank.board = { ...blank.board, nextInspectionOn: null };
    expect(
      textRuns(layoutOutput(blank))
        .map((r) => r.text)
        .join(' '),
    ).toContain('Recommended date of next inspection: ____');
  });
});
