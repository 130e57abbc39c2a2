/**
 * The baseline a PDF output is compared with: a bare pdf-lib document that embeds the same
 * font (subset) and draws the same number of text runs and rectangles per page, with no layout.
 */
import { PDFDocument, rgb } from 'pdf-lib';
import fontkit from '@pdf-lib/fontkit';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import type { DrawStats } from './pdf-stats.js';

const fontBytes = readFileSync(join(import.meta.dirname, '..', 'fonts', 'DejaVuSans.ttf'));
const boldBytes = readFileSync(join(import.meta.dirname, '..', 'fonts', 'DejaVuSans-Bold.ttf'));
const SAMPLE = 'Way 12 Kitchen sockets B32 2.5/1.5 mm² Zs 0.84 Ω';

export async function bareDocument(stats: DrawStats): Promise<Uint8Array> {
  const doc = await PDFDocument.create();
  doc.registerFontkit(fontkit);
  const font = await doc.embedFont(fontBytes, { subset: true });
  const bold = await doc.embedFont(boldBytes, { subset: true });
  for (const p of stats.pages) {
    const page = doc.addPage([p.widthPt, p.heightPt]);
    for (let i = 0; i < p.rects; i++) {
      page.drawRectangle({ x: (i * 7) % p.widthPt, y: (i * 11) % p.heightPt, width: 20, height: 8, borderColor: rgb(0, 0, 0), borderWidth: 0.5 });
    }
    for (let i = 0; i < p.textRuns; i++) {
      page.drawText(SAMPLE.slice(0, 8 + (i % 40)), { x: 10, y: (i * 9) % p.heightPt, size: 7, font: i % 5 === 0 ? bold : font });
    }
  }
  return doc.save();
}
