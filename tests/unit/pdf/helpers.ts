/**
 * Reading rendered PDFs back with tools that share no code with the engine: poppler's pdfinfo
 * and pdftoppm (page sizes, pixels), pdf-parse (text), so the tests check the file, not our model.
 */
import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { PNG } from 'pngjs';
import { PDFParse } from 'pdf-parse';
import { boxInside, runBox, type Box, type LayoutDoc, type TextRun } from '../../../server/pdf/model.js';

function withTempDir<T>(fn: (dir: string) => T): T {
  const dir = mkdtempSync(join(tmpdir(), 'waymark-pdf-test-'));
  try {
    return fn(dir);
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

/** Page sizes in points as poppler's pdfinfo reports them. */
export function pageSizesPt(pdf: Uint8Array): Array<{ w: number; h: number }> {
  return withTempDir((dir) => {
    const file = join(dir, 'in.pdf');
    writeFileSync(file, pdf);
    const out = execFileSync('/usr/bin/pdfinfo', ['-f', '1', '-l', '9999', file], { encoding: 'utf8' });
    return [...out.matchAll(/^Page\s+\d+ size:\s+([\d.]+) x ([\d.]+) pts/gm)].map((m) => ({ w: Number(m[1]), h: Number(m[2]) }));
  });
}

/** One page rendered by pdftoppm at `dpi`, decoded to RGBA; `cropMm` renders only that part of the page. */
export function rasterise(pdf: Uint8Array, dpi: number, page = 1, cropMm?: Box): PNG {
  return withTempDir((dir) => {
    const file = join(dir, 'in.pdf');
    writeFileSync(file, pdf);
    const px = (mm: number) => String(Math.round((mm / 25.4) * dpi));
    const crop = cropMm ? ['-x', px(cropMm.x), '-y', px(cropMm.y), '-W', px(cropMm.w), '-H', px(cropMm.h)] : [];
    execFileSync('/usr/bin/pdftoppm', ['-r', String(dpi), '-png', '-f', String(page), '-l', String(page), ...crop, file, join(dir, 'out')]);
    const png = readdirSync(dir).find((f) => f.endsWith('.png'))!;
    return PNG.sync.read(readFileSync(join(dir, png)));
  });
}

/** All text of the PDF as pdf-parse (pdf.js) extracts it. */
export async function pdfText(pdf: Uint8Array): Promise<string> {
  const parser = new PDFParse({ data: pdf.slice() });
  try {
    return (await parser.getText()).text;
  } finally {
    await parser.destroy();
  }
}

/** Text runs whose glyph box leaves their cell, or whose cell leaves the page (empty = all good). */
export function runsOutside(layout: LayoutDoc): Array<{ page: number; run: TextRun }> {
  const bad: Array<{ page: number; run: TextRun }> = [];
  layout.pages.forEach((p, i) => {
    const page = { x: 0, y: 0, w: p.widthMm, h: p.heightMm };
    for (const item of p.items) {
      if (item.kind !== 'text') continue;
      if (!boxInside(runBox(item), item.cell, 1e-6) || !boxInside(item.cell, page, 1e-6)) bad.push({ page: i + 1, run: item });
    }
  });
  return bad;
}

export function textRuns(layout: LayoutDoc): TextRun[] {
  return layout.pages.flatMap((p) => p.items.filter((i): i is TextRun => i.kind === 'text'));
}

export const PT_PER_MM = 72 / 25.4; // ISO 32000-1 8.3.2.1: 1 pt = 1/72 in

/** Grey level (0–255) of every pixel, row by row. */
export function luminance(png: PNG): Uint8ClampedArray {
  const out = new Uint8ClampedArray(png.width * png.height);
  for (let i = 0; i < out.length; i++) out[i] = Math.round(0.299 * png.data[4 * i] + 0.587 * png.data[4 * i + 1] + 0.114 * png.data[4 * i + 2]);
  return out;
}

/** An area grown by `by` mm each way (for cropping with a margin). */
export function grow(b: Box, by: number): Box {
  return { x: Math.max(0, b.x - by), y: Math.max(0, b.y - by), w: b.w + 2 * by, h: b.h + 2 * by };
}
