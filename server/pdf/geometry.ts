/**
 * Moving laid-out items between frames. A piece (a flag, a strip, a notice) is laid out in its own
 * frame, length along x; placing it on a tape page or a sheet turns it by a multiple of 90° and
 * shifts it. Doing this once here keeps every layout simple and every position exact.
 */
import type { Box, Item, Point, Rotation, TextRun } from './model.js';

/** Local origin goes to (x, y) and the local axes turn clockwise by `rotation`. */
export interface Placement {
  x: number;
  y: number;
  rotation: Rotation;
}

export const IDENTITY: Placement = { x: 0, y: 0, rotation: 0 };

const COS: Record<Rotation, number> = { 0: 1, 90: 0, 180: -1, 270: 0 };
const SIN: Record<Rotation, number> = { 0: 0, 90: 1, 180: 0, 270: -1 };

export function mapPoint(p: Point, at: Placement): Point {
  const c = COS[at.rotation];
  const s = SIN[at.rotation];
  return { x: at.x + p.x * c - p.y * s, y: at.y + p.x * s + p.y * c };
}

export function mapBox(b: Box, at: Placement): Box {
  const a = mapPoint({ x: b.x, y: b.y }, at);
  const z = mapPoint({ x: b.x + b.w, y: b.y + b.h }, at);
  return { x: Math.min(a.x, z.x), y: Math.min(a.y, z.y), w: Math.abs(z.x - a.x), h: Math.abs(z.y - a.y) };
}

/**
 * The placement that lands a local `w × h` frame, turned by `rotation`, exactly on `target`
 * (whose sides must be `h × w` for 90° and 270°).
 */
export function placeFrame(w: number, h: number, target: Box, rotation: Rotation): Placement {
  switch (rotation) {
    case 0:
      return { x: target.x, y: target.y, rotation };
    case 90:
      return { x: target.x + h, y: target.y, rotation };
    case 180:
      return { x: target.x + w, y: target.y + h, rotation };
    case 270:
      return { x: target.x, y: target.y + w, rotation };
  }
}

export function addRotation(a: Rotation, b: Rotation): Rotation {
  return ((a + b) % 360) as Rotation;
}

function mapRun(run: TextRun, at: Placement): TextRun {
  const o = mapPoint(run, at);
  return { ...run, x: o.x, y: o.y, rotation: addRotation(run.rotation, at.rotation), cell: mapBox(run.cell, at) };
}

/** One item in another frame. */
export function mapItem(item: Item, at: Placement): Item {
  switch (item.kind) {
    case 'text':
      return mapRun(item, at);
    case 'rect':
      return { ...item, box: mapBox(item.box, at) };
    case 'line':
      return { ...item, from: mapPoint(item.from, at), to: mapPoint(item.to, at) };
    case 'polygon':
      return { ...item, points: item.points.map((p) => mapPoint(p, at)) };
    case 'circle':
      return { ...item, centre: mapPoint(item.centre, at) };
    case 'modules':
      return { ...item, area: mapBox(item.area, at), boxes: item.boxes.map((b) => mapBox(b, at)) };
    case 'image':
      return { ...item, box: mapBox(item.box, at) };
  }
}

/** Items in another frame; the identity placement returns the same array (no copying). */
export function mapItems(items: Item[], at: Placement): Item[] {
  if (at.rotation === 0 && at.x === 0 && at.y === 0) return items;
  return items.map((i) => mapItem(i, at));
}
