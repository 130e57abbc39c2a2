/**
 * Helpers for the print API tests: binary bodies from supertest, PDF text by pdf-parse, and
 * pages rendered by poppler's pdftoppm, so checks read the PDF independently of the pdf-lib
 * that wrote it.
 */
import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { PDFParse } from 'pdf-parse';
import { PNG } from 'pngjs';
import type { Response } from 'superagent';
import type { Client } from '../helpers/app.js';

/** Collects a binary body (supertest leaves unknown types unbuffered). */
export const binary = (res: Response, done: (err: Error | null, body: Buffer) => void) => {
  const chunks: Buffer[] = [];
  res.on('data', (c: Buffer) => chunks.push(c));
  res.on('end', () => done(null, Buffer.concat(chunks)));
};
/** A GET whose body (a PDF or a ZIP) comes back as a Buffer. */
export const getBinary = (c: Client, path: string) =>
  c
    .get(path)
    .buffer(true)
    .parse(binary as never);
export const getPdf = getBinary;
/** A POST (with the CSRF token): the only way a print is recorded. */
export const postBinary = (c: Client, path: string) =>
  c
    .post(path)
    .buffer(true)
    .parse(binary as never);

export async function pdfPages(pdf: Buffer): Promise<string[]> {
  const parser = new PDFParse({ data: new Uint8Array(pdf) });
  try {
    return (await parser.getText()).pages.map((p) => p.text.replace(/\s+/g, ' '));
  } finally {
    await parser.destroy();
  }
}

/** Page 1 rendered by poppler's pdftoppm, independent of the pdf-lib that wrote it. */
export function renderPage(pdf: Buffer, dpi: number): PNG {
  const dir = mkdtempSync(join(tmpdir(), 'waymark-render-'));
  try {
    writeFileSync(join(dir, 'in.pdf'), pdf);
    execFileSync('/usr/bin/pdftoppm', ['-r', String(dpi), '-f', '1', '-l', '1', '-singlefile', '-png', join(dir, 'in.pdf'), join(dir, 'out')]);
    return PNG.sync.read(readFileSync(join(dir, 'out.png')));
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

/** Left and top edge (px) of the ink on page 1 at 100 dpi. */
export function inkBox(pdf: Buffer): { left: number; top: number } {
  const png = renderPage(pdf, 100);
  let left = png.width;
  let top = png.height;
  for (let y = 0; y < png.height; y++) {
    for (let x = 0; x < png.width; x++) {
      const i = (y * png.width + x) * 4;
      if (png.data[i] < 128 && png.data[i + 1] < 128 && png.data[i + 2] < 128) {
        left = Math.min(left, x);
        top = Math.min(top, y);
      }
    }
  }
  return { left, top };
}

export const MM = 72 / 25.4; // ISO 32000-1 8.3.2.1: 1/72 inch user unit
