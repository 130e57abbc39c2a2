import { describe, expect, it } from 'vitest';
import { PDFDocument } from 'pdf-lib';
import { layoutOutput, LayoutError, renderOutput } from '../../../server/pdf/index.js';
import { RED, type LayoutDoc, type TextRun } from '../../../server/pdf/model.js';
import { bungalowBoard } from '../../../server/seed/demo-bungalow.js';
import { checkSchedule } from '../../../shared/rules/index.js';
import type { PrintOptions } from '../../../shared/schemas/print.js';
import { request } from './fixtures.js';
import { PT_PER_MM, pdfText, runsOutside, textRuns } from './helpers.js';

/** The demo bungalow's changeover with the findings the rules give it. */
function bungalow(media: string, options: Partial<PrintOptions['changeover']> = {}) {
  const schedule = bungalowBoard.schedule;
  return { ...request('changeover', media, options, schedule), findings: checkSchedule(schedule, { today: '2026-11-25' }) };
}

/** The text of each table cell (runs sharing a cell box), with the cell's top, in page order. */
function cells(layout: LayoutDoc): Array<{ page: number; y: number; x: number; text: string }> {
  const out = new Map<string, { page: number; y: number; x: number; text: string }>();
  layout.pages.forEach((p, page) => {
    for (const r of p.items.filter((i): i is TextRun => i.kind === 'text')) {
      const key = `${page}:${r.cell.x}:${r.cell.y}:${r.cell.w}:${r.cell.h}`;
      const cell = out.get(key) ?? { page, y: r.cell.y, x: r.cell.x, text: '' };
      cell.text = cell.text ? `${cell.text} ${r.text}` : r.text;
      out.set(key, cell);
    }
  });
  return [...out.values()];
}

/** The verdict cell on the same row as the old way whose reference cell starts with `reference`. */
function verdictOf(layout: LayoutDoc, reference: string): string | undefined {
  const all = cells(layout);
  const ref = all.find((c) => c.text.startsWith(reference));
  if (!ref) return undefined;
  const row = all.filter((c) => c.page === ref.page && Math.abs(c.y - ref.y) < 1e-9).sort((a, b) => a.x - b.x);
  return row[row.length - 1].text;
}

describe('changeover schedule', () => {
  it('when the demo bungalow prints on A4, then each old way shows its reference, device, cable, new way and junction box', async () => {
    const req = bungalow('a4');
    const text = (await pdfText((await renderOutput(req)).pdf)).replace(/\s+/g, ' ');
    for (const ref of ['Fuse 1 (red dot)', 'Fuse 2', 'Fuse 3', 'Fuse 4', 'Fuse 5', 'Fuse 6', 'Fuse 7 (no label)']) expect(text).toContain(ref);
    for (const way of ['Way 2 Cooker', 'Way 3 Sockets front', 'Way 4 Sockets back', 'Way 5 Kitchen radial', 'Way 6 Lights']) expect(text).toContain(way);
    expect(text).toContain('Changeover schedule');
    expect(text).toContain('New consumer unit');
    expect(text).toContain('30 A BS 3036');
    expect(text).toContain('2.5/1.5 mm² T&E');
    expect(text).toContain('Surveyed on 24 Nov 2026');
    expect(text).toContain('Ze 0.24 Ω');
    expect(text).toContain('Retired');
    const layout = layoutOutput(req);
    const joined = cells(layout)
      .map((c) => c.text)
      .join(' | ');
    expect(joined).toContain('Way 3 Sockets front · RCBO B32 30 mA leg 2 via JB1 loft, above the hall');
    expect(joined).toContain('R1+R2 0.32 Ω');
    expect(joined).toContain('r1/rn/r2 0.48/0.49/0.80 Ω');
    expect(joined).toMatch(/IR L–L 200 \/ L–E 85 \/ N–E 60 MΩ @ 500 V/);
  });

  it('when old Fuse 2’s Zs is over the B32’s limit, then its verdict is "Fix before changeover", its Zs is red and the finding is listed', async () => {
    const req = bungalow('a4');
    const layout = layoutOutput(req);
    expect(verdictOf(layout, 'Fuse 2')).toMatch(/^Fix before changeover/);
    expect(verdictOf(layout, 'Fuse 1 (red dot)')).toMatch(/^Check/); // only the old fuse against the cable: a warning
    expect(verdictOf(layout, 'Fuse 5')).toBe('OK');
    const zs = textRuns(layout).find((r) => r.text === 'Zs 1.52 Ω');
    expect(zs?.color).toEqual(RED);
    const detail = cells(layout)
      .map((c) => c.text)
      .find((t) => t.includes('Zs 1.52 Ω is over'));
    expect(detail).toContain('1.37 Ω maximum'); // BS 7671:2018+A2 Table 41.3, B32 at 0.4 s
    const text = (await pdfText((await renderOutput(req)).pdf)).replace(/\s+/g, ' ');
    expect(text).toMatch(/Fix before ?changeover/);
    expect(text).toContain('1.37 Ω maximum'); // BS 7671:2018+A2 Table 41.3, B32 at 0.4 s
  });

  it('when the schedule ends, then the caution says to isolate, prove dead, lock off, re-test after the swap and follow BS 7671', async () => {
    const text = (await pdfText((await renderOutput(bungalow('a4'))).pdf)).replace(/\s+/g, ' ');
    expect(text).toContain('Isolate the supply and prove dead');
    expect(text).toContain('Lock off the means of isolation');
    expect(text).toContain('taken on the old board as found on 24 Nov 2026');
    expect(text).toContain('test every circuit again on the new board after the changeover');
    expect(text).toContain('Follow BS 7671 and the local codes');
  });

  it('when it prints on A4 and A5, then the pages are the ISO 216 sizes', async () => {
    const sizes = [
      ['a4', 210, 297],
      ['a5', 148, 210],
      ['a4-landscape', 297, 210],
      ['a5-landscape', 210, 148],
    ] as const; // ISO 216: A4 210 × 297 mm, A5 148 × 210 mm
    for (const [media, wMm, hMm] of sizes) {
      const doc = await PDFDocument.load((await renderOutput(bungalow(media))).pdf);
      const { width, height } = doc.getPage(0).getSize();
      expect(Math.abs(width - wMm * PT_PER_MM)).toBeLessThan(0.5);
      expect(Math.abs(height - hMm * PT_PER_MM)).toBeLessThan(0.5);
    }
  });

  it('when laid out on any of its sheets, then every text run stays in its cell and nothing is cut', () => {
    for (const media of ['a4', 'a5', 'a4-landscape', 'a5-landscape']) {
      const layout = layoutOutput(bungalow(media));
      expect(runsOutside(layout)).toEqual([]);
      expect(layout.warnings.filter((w) => w.code === 'text-cut')).toEqual([]);
      const verdict = textRuns(layout).filter((r) => r.text.includes('changeove'));
      for (const r of verdict) expect(r.text).toMatch(/changeover/); // the word is never broken
    }
  });

  it('when readings are switched off, then the readings column is left out', () => {
    const text = textRuns(layoutOutput(bungalow('a4', { showReadings: false })))
      .map((r) => r.text)
      .join(' ');
    expect(text).not.toContain('Readings as found');
    expect(text).not.toContain('R1+R2 0.32');
    expect(text).toContain('30 A BS 3036');
  });

  it('when the board has no survey, or the medium is tape, then it is refused saying what would work', () => {
    const noSurvey = () => layoutOutput(request('changeover', 'a4'));
    expect(noSurvey).toThrow(LayoutError);
    expect(noSurvey).toThrow(/This board has no survey of an old board/);
    for (const media of ['tape-24', 'custom-250x180']) expect(() => layoutOutput(bungalow(media))).toThrow(/use a4 or a5/);
  });
});
