/**
 * Text the fonts cannot draw, and right-to-left labels, read back from the PDF by tools that share
 * no code with the engine: pdf-parse (text), poppler's pdftoppm (pixels) and pdftotext -bbox (where
 * each word lands on the page).
 */
import { execFileSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { layoutOutput, renderOutput } from '../../../server/pdf/index.js';
import type { Schedule } from '../../../shared/schemas/schedule.js';
import { request, tenCircuitBoard } from './fixtures.js';
import { pdfText, rasterise } from './helpers.js';

function withLabel(label: string, way = 0): Schedule {
  const s = tenCircuitBoard();
  s.circuits[way].label = label;
  s.circuits[way].description = '';
  return s;
}

interface Word {
  text: string;
  xMin: number;
  xMax: number;
  yMin: number;
}

/** Every word on page 1 with its box, as poppler's pdftotext -bbox finds it (in the order glyphs stand on the page). */
function words(pdf: Uint8Array): Word[] {
  const dir = mkdtempSync(join(tmpdir(), 'waymark-bbox-'));
  try {
    writeFileSync(join(dir, 'in.pdf'), pdf);
    const html = execFileSync('/usr/bin/pdftotext', ['-bbox', '-f', '1', '-l', '1', join(dir, 'in.pdf'), '-'], { encoding: 'utf8' });
    return [...html.matchAll(/<word xMin="([\d.]+)" yMin="([\d.]+)" xMax="([\d.]+)" yMax="[\d.]+">([^<]*)<\/word>/g)].map((m) => ({
      xMin: Number(m[1]),
      yMin: Number(m[2]),
      xMax: Number(m[3]),
      text: m[4],
    }));
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

function differingPixels(a: Uint8Array, b: Uint8Array): { differ: number; ink: number } {
  const pa = rasterise(a, 100);
  const pb = rasterise(b, 100);
  let differ = 0;
  let ink = 0;
  for (let i = 0; i < pa.data.length; i += 4) {
    if (pa.data[i] !== pb.data[i]) differ++;
    if (pa.data[i] < 128) ink++;
  }
  return { differ, ink };
}

describe('characters the fonts cannot draw', () => {
  it('when a way label holds "配電", then the warning names both characters and the label, and the PDF carries □□, never "�"', async () => {
    const printed = await renderOutput(request('flags', 'a4', {}, withLabel('配電 Kitchen')));
    const warning = printed.warnings.find((w) => w.code === 'undrawable-characters');
    expect(warning?.label).toBe('Way 1 label');
    expect(warning?.message).toContain('"配" (U+914D)'); // Unicode code chart CJK Unified Ideographs
    expect(warning?.message).toContain('"電" (U+96FB)');
    expect(warning?.message).toContain('"配電 Kitchen"');
    const text = await pdfText(printed.pdf);
    expect(text).toContain('□□ Kitchen');
    expect(text).not.toContain('\ufffd');
    expect(text).not.toContain('配');
  });

  it('when "配電" prints, then the page is inked exactly as if □□ had been typed, and not as if nothing were there', async () => {
    const missing = (await renderOutput(request('flags', 'a4', {}, withLabel('配電 Kitchen')))).pdf;
    const boxes = (await renderOutput(request('flags', 'a4', {}, withLabel('□□ Kitchen')))).pdf;
    const bare = (await renderOutput(request('flags', 'a4', {}, withLabel('Kitchen')))).pdf;
    const same = differingPixels(missing, boxes);
    expect(same.ink).toBeGreaterThan(1000);
    expect(same.differ).toBe(0);
    expect(differingPixels(missing, bare).differ).toBeGreaterThan(50); // the substitute squares are visible ink
  });

  for (const [output, media] of [
    ['way-labels', 'tape-24'],
    ['chart', 'a4'],
    ['flags', 'tape-12'],
  ] as const) {
    it(`when ${output} on ${media} lay out an emoji label, then a warning names the emoji and the way`, () => {
      const warnings = layoutOutput(request(output, media, {}, withLabel('Lights 💡', 2))).warnings;
      const warning = warnings.find((w) => w.code === 'undrawable-characters');
      expect(warning?.label).toBe('Way 3 label');
      expect(warning?.message).toContain('"💡" (U+1F4A1)'); // Unicode code chart Miscellaneous Symbols and Pictographs
    });
  }

  it('when the board name cannot be drawn, then the chart warns naming the board name', () => {
    const s = tenCircuitBoard();
    s.board.name = 'Flat 2 配電';
    const warnings = layoutOutput(request('chart', 'a4', {}, s)).warnings.filter((w) => w.code === 'undrawable-characters');
    expect(warnings.map((w) => w.label)).toContain('Board name');
  });

  it('when every character can be drawn, then no such warning is given', () => {
    expect(layoutOutput(request('chart', 'a4')).warnings.filter((w) => w.code === 'undrawable-characters')).toEqual([]);
  });
});

describe('right-to-left labels', () => {
  it('when a Hebrew label holds an English word, then the English word is extracted as typed, never reversed', async () => {
    const text = await pdfText((await renderOutput(request('flags', 'a4', {}, withLabel('מטבח Boiler')))).pdf);
    expect(text).toContain('Boiler');
    expect(text).not.toContain('relioB');
  });

  it('when the chart prints "מטבח Boiler", then on the page "Boiler" stands left of the Hebrew, which reads חבטמ left to right', async () => {
    // UAX #9 P2: a right-to-left paragraph (first strong letter Hebrew); L2: the Hebrew run reversed, the English run kept
    const found = words((await renderOutput(request('chart', 'a4', {}, withLabel('מטבח Boiler', 1)))).pdf);
    const rows = found.filter((w, i) => w.text === 'Boiler' && found[i + 1] && Math.abs(found[i + 1].yMin - w.yMin) < 0.5);
    expect(rows.length).toBeGreaterThan(0);
    const row = found.indexOf(rows[0]);
    const hebrew = found[row + 1];
    expect(hebrew.text).toBe('חבטמ');
    expect(hebrew.xMin).toBeGreaterThan(rows[0].xMax);
    expect(found.some((w) => w.text.includes('relioB'))).toBe(false);
  });

  it('when an Arabic label with an English word prints, then no warning is given and the English word reads forwards', async () => {
    const printed = await renderOutput(request('flags', 'a4', {}, withLabel('مطبخ Boiler')));
    expect(printed.warnings.filter((w) => w.code === 'undrawable-characters')).toEqual([]);
    expect(await pdfText(printed.pdf)).toContain('Boiler');
  });
});
