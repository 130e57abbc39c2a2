import { describe, expect, it } from 'vitest';
import { defaultMediumFor, layoutOutput, LayoutError, renderOutput, resolveMedium } from '../../../server/pdf/index.js';
import { boxInside, type Box } from '../../../server/pdf/model.js';
import { tapeWidths } from '../../../shared/schemas/print.js';
import { request } from './fixtures.js';
import { pageSizesPt, PT_PER_MM } from './helpers.js';

const sheet = {
  name: 'Die-cut 3 × 8',
  pageWidthMm: 210,
  pageHeightMm: 297,
  labelWidthMm: 63.5,
  labelHeightMm: 33.9,
  columns: 3,
  rows: 8,
  marginTopMm: 13,
  marginLeftMm: 7,
  gapXMm: 2.5,
  gapYMm: 0,
  cornerRadiusMm: 2,
};

describe('media', () => {
  it('when A4 or A5 is resolved, then the sizes are ISO 216 in mm', () => {
    expect(resolveMedium('a4')).toMatchObject({ kind: 'page', widthMm: 210, heightMm: 297 }); // ISO 216
    expect(resolveMedium('a5')).toMatchObject({ kind: 'page', widthMm: 148, heightMm: 210 }); // ISO 216
    expect(resolveMedium('a4-landscape')).toMatchObject({ widthMm: 297, heightMm: 210 }); // ISO 216
  });

  it('when a chart is rendered on A4 and A5, then pdfinfo reports the ISO 216 sizes in points (±0.01)', async () => {
    const a4 = pageSizesPt((await renderOutput(request('chart', 'a4'))).pdf);
    expect(Math.abs(a4[0].w - 595.28)).toBeLessThanOrEqual(0.01); // ISO 216 A4 210 mm × 72/25.4
    expect(Math.abs(a4[0].h - 841.89)).toBeLessThanOrEqual(0.01); // ISO 216 A4 297 mm × 72/25.4
    const a5 = pageSizesPt((await renderOutput(request('chart', 'a5'))).pdf);
    expect(Math.abs(a5[0].w - 419.53)).toBeLessThanOrEqual(0.01); // ISO 216 A5 148 mm
    expect(Math.abs(a5[0].h - 595.28)).toBeLessThanOrEqual(0.01); // ISO 216 A5 210 mm
    const landscape = pageSizesPt((await renderOutput(request('chart', 'a4-landscape'))).pdf);
    expect(Math.abs(landscape[0].w - 841.89)).toBeLessThanOrEqual(0.01); // ISO 216
  });

  it('when flags go on each tape width, then every page is exactly the tape wide', async () => {
    for (const width of tapeWidths) {
      const result = await renderOutput(request('flags', `tape-${width}`, { ways: '4' }));
      for (const size of pageSizesPt(result.pdf)) expect(Math.abs(size.w - width * PT_PER_MM)).toBeLessThanOrEqual(0.01); // tape width in mm × 72/25.4
    }
  });

  it('when a tape is resolved, then its printable band is narrower than the tape and centred margins remain', () => {
    for (const width of tapeWidths) {
      const m = resolveMedium(`tape-${width}`);
      if (m.kind !== 'tape') throw new Error('expected tape');
      expect(m.widthMm).toBe(width);
      expect(width - m.printableMm).toBeGreaterThanOrEqual(2); // common practice: printable roughly width minus 2–3 mm
      expect(width - m.printableMm).toBeLessThanOrEqual(3);
    }
    expect(resolveMedium('tape-12', undefined, { 12: { printableMm: 10 } })).toMatchObject({ printableMm: 10 });
  });

  it('when a custom size or a stored sheet layout is asked for, then it resolves; an unknown one is a LayoutError on media', () => {
    expect(resolveMedium('custom-250x180')).toMatchObject({ kind: 'page', widthMm: 250, heightMm: 180 });
    expect(resolveMedium('sheet-7', new Map([[7, sheet]]))).toMatchObject({ kind: 'sheet', layout: { columns: 3 } });
    expect(resolveMedium('sheet-7', [{ id: 7, ...sheet }])).toMatchObject({ kind: 'sheet' });
    expect(() => resolveMedium('sheet-8', new Map([[7, sheet]]))).toThrow(LayoutError);
    expect(() => resolveMedium('tape-13')).toThrow(/Unknown medium/);
    try {
      resolveMedium('letter');
    } catch (e) {
      expect((e as LayoutError).field).toBe('media');
    }
  });

  it('when an output has no medium chosen, then a sensible default resolves', () => {
    expect(resolveMedium(defaultMediumFor('chart'))).toMatchObject({ widthMm: 210, heightMm: 297 });
    expect(resolveMedium(defaultMediumFor('flags')).kind).toBe('tape');
    expect(resolveMedium(defaultMediumFor('tag')).kind).toBe('tape');
  });

  it('when tags go on a die-cut sheet, then each tag lies inside its own die-cut label', async () => {
    const medium = resolveMedium('sheet-7', new Map([[7, sheet]]));
    const req = request('tag', 'sheet-7', { copies: 5 }, undefined, medium);
    const layout = layoutOutput(req);
    expect(layout.pages).toHaveLength(1);
    const labels = Array.from({ length: 5 }, (_, i) => ({ x: 7 + (i % 3) * (63.5 + 2.5), y: 13 + Math.floor(i / 3) * 33.9, w: 63.5, h: 33.9 }));
    const codes = layout.pages[0].items.filter((i) => i.kind === 'modules' && i.purpose === 'qr');
    expect(codes).toHaveLength(5);
    codes.forEach((qr, i) => expect(boxInside((qr as { area: Box }).area, labels[i], 1e-6)).toBe(true));
    const size = pageSizesPt((await renderOutput(req)).pdf)[0];
    expect(Math.abs(size.w - 210 * PT_PER_MM)).toBeLessThanOrEqual(0.01); // the layout's page, ISO 216 A4
  });
});
