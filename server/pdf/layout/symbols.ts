/**
 * Vector symbols drawn on notices: the electricity warning triangle in the ISO 7010 W012 shape
 * (equilateral triangle, black border, black flash on ISO 3864 safety yellow; the proportions are
 * our own, the standard's were not to hand) and the protective-earth sign for bonding labels.
 */
import { BLACK, SAFETY_YELLOW, type Box, type Item, type Point } from '../model.js';

const SQRT3 = Math.sqrt(3);

/** Border of the triangle as a share of its side (our own proportion). */
const BORDER_SHARE = 0.075;

/** The flash inside a unit box (y down): a zig-zag ending in a point at the bottom. */
const FLASH: Point[] = [
  { x: 0.42, y: 0 },
  { x: 0.86, y: 0 },
  { x: 0.6, y: 0.4 },
  { x: 0.82, y: 0.4 },
  { x: 0.26, y: 1 },
  { x: 0.43, y: 0.54 },
  { x: 0.2, y: 0.54 },
];

/** Apex-up equilateral triangle of side `s` with its apex at `apex`. */
function triangle(apex: Point, s: number): Point[] {
  const h = (s * SQRT3) / 2;
  return [apex, { x: apex.x + s / 2, y: apex.y + h }, { x: apex.x - s / 2, y: apex.y + h }];
}

/** The largest warning triangle that fits `box`, centred. */
export function warningTriangle(box: Box): Item[] {
  const s = Math.min(box.w, (box.h * 2) / SQRT3);
  const h = (s * SQRT3) / 2;
  const apex = { x: box.x + box.w / 2, y: box.y + (box.h - h) / 2 };
  const centroid = { x: apex.x, y: apex.y + (2 * h) / 3 };
  const inradius = s / (2 * SQRT3);
  const inner = (s * (inradius - BORDER_SHARE * s)) / inradius;
  const innerH = (inner * SQRT3) / 2;
  const innerApex = { x: centroid.x, y: centroid.y - (2 * innerH) / 3 };
  const flashW = inner * 0.34;
  const flashH = innerH * 0.6;
  const flashTop = innerApex.y + innerH * 0.3;
  const flash = FLASH.map((p) => ({ x: centroid.x - flashW / 2 + p.x * flashW, y: flashTop + p.y * flashH }));
  return [
    { kind: 'polygon', points: triangle(apex, s), fill: BLACK },
    { kind: 'polygon', points: triangle(innerApex, inner), fill: SAFETY_YELLOW },
    { kind: 'polygon', points: flash, fill: BLACK },
  ];
}

/** Protective earth: the earth sign in a circle, fitted to `box`. */
export function earthSymbol(box: Box): Item[] {
  const r = (Math.min(box.w, box.h) / 2) * 0.92;
  const c = { x: box.x + box.w / 2, y: box.y + box.h / 2 };
  const line = r * 0.09;
  const bar = (dy: number, half: number): Item => ({
    kind: 'line',
    from: { x: c.x - half, y: c.y + dy },
    to: { x: c.x + half, y: c.y + dy },
    lineMm: line,
    color: BLACK,
  });
  return [
    { kind: 'circle', centre: c, radiusMm: r - line / 2, stroke: BLACK, lineMm: line },
    { kind: 'line', from: { x: c.x, y: c.y - r * 0.62 }, to: { x: c.x, y: c.y + r * 0.05 }, lineMm: line, color: BLACK },
    bar(r * 0.05, r * 0.55),
    bar(r * 0.27, r * 0.36),
    bar(r * 0.49, r * 0.17),
  ];
}
