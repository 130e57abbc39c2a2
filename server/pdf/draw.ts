/**
 * The only code that knows pdf-lib. It takes a finished layout (mm, top-left origin) and draws it:
 * millimetres become points once (72 / 25.4), y is flipped once, and the printer's offset is
 * added to every position. Fonts are embedded as subsets, once per document, only if used.
 */
import {
  PDFDocument,
  closePath,
  degrees,
  fill,
  fillAndStroke,
  lineTo,
  moveTo,
  popGraphicsState,
  pushGraphicsState,
  rectangle,
  rgb,
  setDashPattern,
  setFillingRgbColor,
  setLineWidth,
  setStrokingRgbColor,
  stroke,
  type PDFFont,
  type PDFImage,
  type PDFOperator,
  type PDFPage,
} from 'pdf-lib';
import { cachingFontkit, fontBytes, unshaped } from './fonts.js';
import type { Color, FontFace, Item, LayoutDoc, Point } from './model.js';

/** Points per millimetre. // ISO 32000-1 8.3.2.1: 1 pt = 1/72 in */
export const PT_PER_MM = 72 / 25.4;

interface Frame {
  heightMm: number;
  dx: number;
  dy: number;
}

const px = (f: Frame, xMm: number) => (xMm + f.dx) * PT_PER_MM;
const py = (f: Frame, yMm: number) => (f.heightMm - (yMm + f.dy)) * PT_PER_MM;

function paint(
  fillColor: Color | undefined,
  strokeColor: Color | undefined,
  lineMm: number | undefined,
  dashMm?: readonly number[],
): { pre: PDFOperator[]; op: PDFOperator | null } {
  const pre: PDFOperator[] = [];
  if (fillColor) pre.push(setFillingRgbColor(...fillColor));
  if (strokeColor) pre.push(setStrokingRgbColor(...strokeColor), setLineWidth((lineMm ?? 0.2) * PT_PER_MM));
  if (strokeColor && dashMm)
    pre.push(
      setDashPattern(
        dashMm.map((d) => d * PT_PER_MM),
        0,
      ),
    );
  const op = fillColor && strokeColor ? fillAndStroke() : fillColor ? fill() : strokeColor ? stroke() : null;
  return { pre, op };
}

function pathOps(points: Point[], f: Frame): PDFOperator[] {
  return [moveTo(px(f, points[0].x), py(f, points[0].y)), ...points.slice(1).map((p) => lineTo(px(f, p.x), py(f, p.y))), closePath()];
}

/** Vector items as raw operators: cheaper than one pdf-lib call per shape. */
function vectorOps(item: Exclude<Item, { kind: 'text' | 'image' | 'circle' }>, f: Frame): PDFOperator[] {
  switch (item.kind) {
    case 'rect': {
      const { pre, op } = paint(item.fill, item.stroke, item.lineMm, item.dashMm);
      if (!op) return [];
      const b = item.box;
      return [pushGraphicsState(), ...pre, rectangle(px(f, b.x), py(f, b.y + b.h), b.w * PT_PER_MM, b.h * PT_PER_MM), op, popGraphicsState()];
    }
    case 'line': {
      const { pre } = paint(undefined, item.color, item.lineMm, item.dashMm);
      return [
        pushGraphicsState(),
        ...pre,
        moveTo(px(f, item.from.x), py(f, item.from.y)),
        lineTo(px(f, item.to.x), py(f, item.to.y)),
        stroke(),
        popGraphicsState(),
      ];
    }
    case 'polygon': {
      const { pre, op } = paint(item.fill, item.stroke, item.lineMm);
      return op ? [pushGraphicsState(), ...pre, ...pathOps(item.points, f), op, popGraphicsState()] : [];
    }
    case 'modules': {
      const rects = item.boxes.map((b) => rectangle(px(f, b.x), py(f, b.y + b.h), b.w * PT_PER_MM, b.h * PT_PER_MM));
      return [pushGraphicsState(), setFillingRgbColor(...item.color), ...rects, fill(), popGraphicsState()];
    }
  }
}

function facesUsed(layout: LayoutDoc): Set<FontFace> {
  const faces = new Set<FontFace>();
  for (const page of layout.pages) for (const i of page.items) if (i.kind === 'text') faces.add(i.face);
  return faces;
}

/** Images by their bytes; one that will not decode maps to null and is left off the page. */
async function embedImages(doc: PDFDocument, layout: LayoutDoc): Promise<Map<Uint8Array, PDFImage | null>> {
  const images = new Map<Uint8Array, PDFImage | null>();
  for (const page of layout.pages) {
    for (const i of page.items) {
      if (i.kind !== 'image' || images.has(i.bytes)) continue;
      try {
        images.set(i.bytes, i.mime === 'image/png' ? await doc.embedPng(i.bytes) : await doc.embedJpg(i.bytes));
      } catch {
        images.set(i.bytes, null);
      }
    }
  }
  return images;
}

function drawItem(page: PDFPage, item: Item, f: Frame, fonts: Map<FontFace, PDFFont>, images: Map<Uint8Array, PDFImage | null>, ops: PDFOperator[]): void {
  if (item.kind === 'text') {
    const options = {
      x: px(f, item.x),
      y: py(f, item.y),
      size: item.sizePt,
      font: fonts.get(item.face)!,
      color: rgb(...item.color),
      rotate: degrees(-item.rotation),
    };
    try {
      page.drawText(item.text, options);
    } catch {
      // fontkit cannot shape some scripts; layout already avoids them, this keeps a stray one from failing the print.
      page.drawText(unshaped(item.text), options);
    }
  } else if (item.kind === 'image') {
    const b = item.box;
    const image = images.get(item.bytes);
    if (image) page.drawImage(image, { x: px(f, b.x), y: py(f, b.y + b.h), width: b.w * PT_PER_MM, height: b.h * PT_PER_MM });
  } else if (item.kind === 'circle') {
    const c = item;
    page.drawCircle({
      x: px(f, c.centre.x),
      y: py(f, c.centre.y),
      size: c.radiusMm * PT_PER_MM,
      color: c.fill && rgb(...c.fill),
      borderColor: c.stroke && rgb(...c.stroke),
      borderWidth: c.stroke ? (c.lineMm ?? 0.2) * PT_PER_MM : 0,
    });
  } else {
    ops.push(...vectorOps(item, f));
    return;
  }
}

/** Operators in chunks: one spread call with tens of thousands of arguments would overflow the stack. */
function pushAll(page: PDFPage, ops: PDFOperator[]): void {
  for (let i = 0; i < ops.length; i += 4096) page.pushOperators(...ops.slice(i, i + 4096));
}

export interface DrawOptions {
  /** Embed only the glyphs used (default). Full embedding exists to check subsets against. */
  subsetFonts?: boolean;
}

export interface DrawResult {
  pdf: Uint8Array;
  imagesLeftOut: number;
}

/** Draw a layout into a new PDF; `offsetMm` is the printer's feed correction (x right, y down). */
export async function drawLayout(layout: LayoutDoc, offsetMm: { xMm: number; yMm: number }, options: DrawOptions = {}): Promise<DrawResult> {
  const doc = await PDFDocument.create({ updateMetadata: false });
  doc.registerFontkit(cachingFontkit);
  doc.setTitle(layout.title);
  doc.setProducer('Waymark');
  doc.setCreator('Waymark');
  const fonts = new Map<FontFace, PDFFont>();
  for (const face of facesUsed(layout)) fonts.set(face, await doc.embedFont(fontBytes(face), { subset: options.subsetFonts ?? true }));
  const images = await embedImages(doc, layout);
  for (const p of layout.pages) {
    const page = doc.addPage([p.widthMm * PT_PER_MM, p.heightMm * PT_PER_MM]);
    const f: Frame = { heightMm: p.heightMm, dx: offsetMm.xMm, dy: offsetMm.yMm };
    let ops: PDFOperator[] = [];
    for (const item of p.items) {
      if (item.kind === 'text' || item.kind === 'image' || item.kind === 'circle') {
        // Keep the painting order: flush shapes gathered so far before a pdf-lib call.
        if (ops.length) {
          pushAll(page, ops);
          ops = [];
        }
      }
      drawItem(page, item, f, fonts, images, ops);
    }
    if (ops.length) pushAll(page, ops);
  }
  return { pdf: await doc.save(), imagesLeftOut: [...images.values()].filter((i) => i === null).length };
}
