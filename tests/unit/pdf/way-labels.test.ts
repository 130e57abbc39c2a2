import { describe, expect, it } from 'vitest';
import { layoutOutput } from '../../../server/pdf/index.js';
import { WarningList, withDefaults } from '../../../server/pdf/layout/context.js';
import { wayLabelPlan } from '../../../server/pdf/layout/way-labels.js';
import { typeMetrics } from '../../../server/pdf/fonts.js';
import type { PrintOptions } from '../../../shared/schemas/print.js';
import { boardSchedule, request, tenCircuitBoard } from './fixtures.js';
import { runsOutside, textRuns } from './helpers.js';

const DIN_MODULE_MM = 17.5; // DIN 43880: one module 17.5 mm

function plan(mediaId: string, options: Partial<PrintOptions['way-labels']> = {}, schedule = tenCircuitBoard(), onlyWays?: number[]) {
  const req = { ...request('way-labels', mediaId, options, schedule), onlyWays };
  return wayLabelPlan({ req, options: withDefaults('way-labels', req.options), tm: typeMetrics(), warnings: new WarningList() });
}

describe('way labels', () => {
  it('when a row is laid out, then each cell is the device modules × 17.5 mm, end to end from 0', () => {
    const schedule = tenCircuitBoard();
    const { strips } = plan('tape-12', {}, schedule);
    const row1 = strips.filter((s) => s.row === 1);
    expect(row1).toHaveLength(1);
    const devices = schedule.devices.filter((d) => d.row === 1);
    let x = 0;
    row1[0].cells.forEach((cell, i) => {
      expect(cell.w).toBeCloseTo(devices[i].modules * DIN_MODULE_MM, 9); // DIN 43880
      expect(cell.x).toBeCloseTo(x, 9);
      x += cell.w;
    });
    expect(row1[0].lengthMm).toBeCloseTo(14 * DIN_MODULE_MM, 9); // fixture row 1: 2 + 2 + 4 + 2 + 4 modules; DIN 43880
  });

  it('when the half-module device is on the rail, then its cell is 8.75 mm and its text turns to fit', () => {
    const { strips, pieces } = plan('a4', { heightMm: 14 });
    const row2 = strips.find((s) => s.row === 2)!;
    const half = row2.cells.find((c) => c.deviceId === 'd10')!;
    expect(half.w).toBeCloseTo(0.5 * DIN_MODULE_MM, 9); // DIN 43880: devices in half-module steps
    const piece = pieces[strips.indexOf(row2)];
    const inHalf = piece.items.filter((i) => i.kind === 'text' && i.cell.x >= half.x - 1e-9 && i.cell.x + i.cell.w <= half.x + half.w + 1e-9);
    expect(inHalf.length).toBeGreaterThan(0);
    for (const r of inHalf) if (r.kind === 'text') expect(r.rotation).toBe(90);
  });

  it('when another pitch is chosen, then cells follow it', () => {
    const { strips } = plan('tape-12', { pitchMm: 18 });
    expect(strips[0].cells[0].w).toBeCloseTo(2 * 18, 9);
  });

  it('when a tape strip prints, then its page is the tape wide and exactly the row long', () => {
    const layout = layoutOutput(request('way-labels', 'tape-12'));
    expect(layout.pages[0].widthMm).toBe(12);
    expect(layout.pages[0].heightMm).toBeCloseTo(14 * DIN_MODULE_MM, 9); // 14 modules × 17.5 mm, DIN 43880
    expect(runsOutside(layout)).toEqual([]);
  });

  it('when a row is longer than the medium takes, then it splits at a device edge and the parts add up, with join marks', () => {
    const schedule = boardSchedule(18);
    const { strips, pieces } = plan('tape-12', { maxLengthMm: 200 }, schedule);
    const row = strips.filter((s) => s.row === 1);
    expect(row.map((s) => s.parts)).toEqual([2, 2]);
    expect(row[0].lengthMm + row[1].lengthMm).toBeCloseTo(18 * DIN_MODULE_MM, 9); // DIN 43880
    expect(row[0].lengthMm).toBeLessThanOrEqual(200);
    expect((row[0].lengthMm / DIN_MODULE_MM) % 1).toBeCloseTo(0, 9); // cut on a device edge
    const marks = (i: number) => pieces[i].items.filter((it) => it.kind === 'polygon').length;
    expect(marks(0)).toBe(2);
    expect(marks(1)).toBe(2);
  });

  it('when a strip goes on A4, then rows wider than the page split to the page width', () => {
    const layout = layoutOutput(request('way-labels', 'a4'));
    const tiles = layout.pages.flatMap((p) => p.items.filter((i) => i.kind === 'rect' && i.dashMm));
    for (const t of tiles) if (t.kind === 'rect') expect(t.box.x + t.box.w).toBeLessThanOrEqual(200 + 1e-9);
    expect(runsOutside(layout)).toEqual([]);
  });

  it('when only changed ways are asked for, then only their devices print, each its own cell width', () => {
    const { strips } = plan('tape-12', {}, tenCircuitBoard(), [7]);
    expect(strips).toHaveLength(1);
    expect(strips[0].cells).toEqual([expect.objectContaining({ deviceId: 'd7', x: 0, w: DIN_MODULE_MM })]);
  });

  it('when cells are filled, then way numbers and labels appear in them', () => {
    const texts = textRuns(layoutOutput(request('way-labels', 'tape-18')))
      .map((r) => r.text)
      .join(' ');
    for (const word of ['Kitchen', 'Cooker', 'Shower', 'RCD 1', 'Main switch']) expect(texts).toContain(word);
  });
});
