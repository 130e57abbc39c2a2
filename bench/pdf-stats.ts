/**
 * Counts what a PDF draws — text-showing operators and rectangles per page — by reading
 * its content streams, so the baseline can draw exactly as much without any layout.
 */
import { PDFDocument, PDFRawStream, PDFArray, PDFName, PDFRef, type PDFDict } from 'pdf-lib';
import { inflateSync } from 'node:zlib';

export interface DrawStats {
  pages: Array<{ widthPt: number; heightPt: number; textRuns: number; rects: number }>;
}

function streamText(doc: PDFDocument, ref: unknown): string {
  const obj = ref instanceof PDFRef ? doc.context.lookup(ref) : ref;
  if (obj instanceof PDFArray)
    return obj
      .asArray()
      .map((r) => streamText(doc, r))
      .join('\n');
  if (obj instanceof PDFRawStream) {
    const filter = obj.dict.get(PDFName.of('Filter'));
    const bytes = filter ? inflateSync(Buffer.from(obj.contents)) : Buffer.from(obj.contents);
    return bytes.toString('latin1');
  }
  return '';
}

export async function drawStats(pdf: Uint8Array): Promise<DrawStats> {
  const doc = await PDFDocument.load(pdf);
  return {
    pages: doc.getPages().map((page) => {
      const contents = (page.node as PDFDict).get(PDFName.of('Contents'));
      const text = streamText(doc, contents);
      return {
        widthPt: page.getWidth(),
        heightPt: page.getHeight(),
        textRuns: (text.match(/\bT[jJ]\b/g) ?? []).length,
        rects: (text.match(/\bre\b/g) ?? []).length,
      };
    }),
  };
}
