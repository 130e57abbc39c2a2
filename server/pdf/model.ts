/**
 * What a layout produces: pages of positioned items in millimetres with a top-left origin
 * (y grows down the page). Layout code builds these; only `draw.ts` turns them into PDF.
 * Keeping the model plain data lets tests check every position with numbers.
 */
import type { PrintWarning } from '../../shared/schemas/print.js';

/** 1 pt = 1/72 inch (ISO 32000-1 8.3.2.1) = 25.4/72 mm. */
export const MM_PER_PT = 25.4 / 72;

export type FontFace = 'regular' | 'bold' | 'condensed' | 'condensed-bold';
export const fontFaces: readonly FontFace[] = ['regular', 'bold', 'condensed', 'condensed-bold'];

/** Clockwise turn in the page's y-down frame; text with 90 reads top to bottom. */
export type Rotation = 0 | 90 | 180 | 270;

/** RGB, each 0–1. */
export type Color = readonly [number, number, number];
export const BLACK: Color = [0, 0, 0];
export const WHITE: Color = [1, 1, 1];
export const GREY: Color = [0.45, 0.45, 0.45];
export const LIGHT_GREY: Color = [0.86, 0.86, 0.86];
export const RED: Color = [0.75, 0.05, 0.05];
/** Safety yellow for warning signs (ISO 3864-4 specifies it colorimetrically); sRGB ≈ #FFD100. // from memory */
export const SAFETY_YELLOW: Color = [1, 0xd1 / 255, 0];

export interface Point {
  x: number;
  y: number;
}
export interface Box {
  x: number;
  y: number;
  w: number;
  h: number;
}

/**
 * One line of real (extractable) text. `x, y` is the start of the baseline; `cell` is the box the
 * text was fitted into, kept so tests can prove no run spills out of its cell.
 */
export interface TextRun {
  kind: 'text';
  text: string;
  face: FontFace;
  sizePt: number;
  x: number;
  y: number;
  rotation: Rotation;
  color: Color;
  cell: Box;
  /** Advance width of the text at its size (mm). */
  widthMm: number;
  /** Font ascender and descender at this size (mm, both positive). */
  ascentMm: number;
  descentMm: number;
}

export interface RectItem {
  kind: 'rect';
  box: Box;
  fill?: Color;
  stroke?: Color;
  lineMm?: number;
  dashMm?: readonly number[];
}
export interface LineItem {
  kind: 'line';
  from: Point;
  to: Point;
  lineMm: number;
  color: Color;
  dashMm?: readonly number[];
}
export interface PolygonItem {
  kind: 'polygon';
  points: Point[];
  fill?: Color;
  stroke?: Color;
  lineMm?: number;
}
export interface CircleItem {
  kind: 'circle';
  centre: Point;
  radiusMm: number;
  fill?: Color;
  stroke?: Color;
  lineMm?: number;
}
/** Many filled rectangles of one colour (QR modules, barcode bars), drawn as one path. */
export interface ModulesItem {
  kind: 'modules';
  purpose: 'qr' | 'barcode';
  area: Box;
  boxes: Box[];
  color: Color;
}
export interface ImageItem {
  kind: 'image';
  box: Box;
  bytes: Uint8Array;
  mime: 'image/png' | 'image/jpeg';
}

export type Item = TextRun | RectItem | LineItem | PolygonItem | CircleItem | ModulesItem | ImageItem;

export interface LayoutPage {
  widthMm: number;
  heightMm: number;
  items: Item[];
}

/** A whole output laid out, ready to draw. */
export interface LayoutDoc {
  title: string;
  pages: LayoutPage[];
  warnings: PrintWarning[];
}

/** Text width in mm of `text` set in `face` at `sizePt`. */
export type Measure = (text: string, face: FontFace, sizePt: number) => number;

/** What layout needs to know about the fonts: widths, and the vertical extent per point of size. */
export interface TypeMetrics {
  measure: Measure;
  /** The text as the face can draw it (missing glyphs replaced); layout only ever places such text. */
  printable: (text: string, face: FontFace) => string;
  /** Ascender and descender as fractions of the em (positive). */
  ascent: number;
  descent: number;
}

/** The box a text run's glyphs occupy on the page, from its advance width and the font's ascender/descender. */
export function runBox(run: TextRun): Box {
  const rad = (run.rotation * Math.PI) / 180;
  const cos = Math.round(Math.cos(rad));
  const sin = Math.round(Math.sin(rad));
  const corners: Point[] = [
    { x: 0, y: -run.ascentMm },
    { x: run.widthMm, y: -run.ascentMm },
    { x: 0, y: run.descentMm },
    { x: run.widthMm, y: run.descentMm },
  ].map((p) => ({ x: run.x + p.x * cos - p.y * sin, y: run.y + p.x * sin + p.y * cos }));
  const xs = corners.map((p) => p.x);
  const ys = corners.map((p) => p.y);
  const x = Math.min(...xs);
  const y = Math.min(...ys);
  return { x, y, w: Math.max(...xs) - x, h: Math.max(...ys) - y };
}

/** Whether `inner` lies within `outer`, allowing for rounding (`toleranceMm`). */
export function boxInside(inner: Box, outer: Box, toleranceMm = 1e-6): boolean {
  return (
    inner.x >= outer.x - toleranceMm &&
    inner.y >= outer.y - toleranceMm &&
    inner.x + inner.w <= outer.x + outer.w + toleranceMm &&
    inner.y + inner.h <= outer.y + outer.h + toleranceMm
  );
}

export function insetBox(b: Box, by: number): Box {
  const dx = Math.min(by, b.w / 2);
  const dy = Math.min(by, b.h / 2);
  return { x: b.x + dx, y: b.y + dy, w: b.w - 2 * dx, h: b.h - 2 * dy };
}
