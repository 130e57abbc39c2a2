/**
 * One laid-out page as SVG in printer pixels, from the same millimetre model the PDF is drawn
 * from. Colours become black or white ink (`ink.ts`); shapes are drawn without anti-aliasing
 * (`crispEdges`: a pixel is inked when its centre is inside), text as font outlines with
 * anti-aliasing that the threshold then settles; a line is never thinner than one pixel, so a
 * 0.1 mm tick does not vanish at 180 dpi.
 */
import type { Box, Color, Item, LayoutPage, Point } from '../model.js';
import { snappedModules } from './codes.js';
import { textSvg } from './glyphs.js';
import { ink } from './ink.js';
import { pixelsFor, pixelsPerMm } from './scale.js';

export interface PageSvg {
  svg: string;
  widthPx: number;
  heightPx: number;
}

const n = (v: number) => Number(v.toFixed(3));

function paintAttrs(scale: number, fill?: Color, stroke?: Color, lineMm?: number, dashMm?: readonly number[]): string {
  const parts = [`fill="${fill ? ink(fill) : 'none'}"`];
  if (stroke) {
    parts.push(`stroke="${ink(stroke)}"`, `stroke-width="${n(Math.max(1, (lineMm ?? 0.2) * scale))}"`);
    if (dashMm?.length) parts.push(`stroke-dasharray="${dashMm.map((d) => n(d * scale)).join(' ')}"`);
  }
  return parts.join(' ');
}

const pointsAttr = (points: Point[], scale: number) => points.map((p) => `${n(p.x * scale)},${n(p.y * scale)}`).join(' ');

function imageSvg(box: Box, bytes: Uint8Array, mime: string, scale: number): string {
  const href = `data:${mime};base64,${Buffer.from(bytes).toString('base64')}`;
  return `<image x="${n(box.x * scale)}" y="${n(box.y * scale)}" width="${n(box.w * scale)}" height="${n(box.h * scale)}" preserveAspectRatio="xMidYMid meet" href="${href}"/>`;
}

/** One item as SVG; `scale` is pixels per millimetre. */
export function itemSvg(item: Item, scale: number, defs: Map<string, string>): string {
  switch (item.kind) {
    case 'text':
      return textSvg(item, scale, defs);
    case 'rect': {
      if (!item.fill && !item.stroke) return '';
      const b = item.box;
      return `<rect x="${n(b.x * scale)}" y="${n(b.y * scale)}" width="${n(b.w * scale)}" height="${n(b.h * scale)}" ${paintAttrs(scale, item.fill, item.stroke, item.lineMm, item.dashMm)}/>`;
    }
    case 'line':
      return `<line x1="${n(item.from.x * scale)}" y1="${n(item.from.y * scale)}" x2="${n(item.to.x * scale)}" y2="${n(item.to.y * scale)}" ${paintAttrs(scale, undefined, item.color, item.lineMm, item.dashMm)}/>`;
    case 'polygon':
      return `<polygon points="${pointsAttr(item.points, scale)}" ${paintAttrs(scale, item.fill, item.stroke, item.lineMm)}/>`;
    case 'circle':
      return `<circle cx="${n(item.centre.x * scale)}" cy="${n(item.centre.y * scale)}" r="${n(item.radiusMm * scale)}" ${paintAttrs(scale, item.fill, item.stroke, item.lineMm)}/>`;
    case 'modules': {
      const rects = snappedModules(item, scale).map((b) => `M${b.x} ${b.y}h${b.w}v${b.h}h${-b.w}Z`);
      return `<path fill="${ink(item.color)}" d="${rects.join('')}"/>`;
    }
    case 'image':
      return imageSvg(item.box, item.bytes, item.mime, scale);
  }
}

/**
 * The page at `dpi`, white behind. `clipMm` keeps every mark inside a band (a tape printer's printable
 * band across the tape): the band's edges are rounded inwards to whole pixels, so nothing reaches the margin.
 */
export function pageSvg(page: LayoutPage, dpi: number, clipMm?: Box): PageSvg {
  const scale = pixelsPerMm(dpi);
  const widthPx = pixelsFor(page.widthMm, dpi);
  const heightPx = pixelsFor(page.heightMm, dpi);
  const glyphs = new Map<string, string>();
  const body = page.items
    .map((i) => (i.kind === 'text' ? itemSvg(i, scale, glyphs) : `<g shape-rendering="crispEdges">${itemSvg(i, scale, glyphs)}</g>`))
    .join('');
  let content = body;
  let defs = [...glyphs].map(([id, d]) => `<path id="${id}" d="${d}"/>`).join('');
  if (clipMm) {
    const x0 = Math.ceil(clipMm.x * scale - 1e-6);
    const y0 = Math.ceil(clipMm.y * scale - 1e-6);
    const x1 = Math.floor((clipMm.x + clipMm.w) * scale + 1e-6);
    const y1 = Math.floor((clipMm.y + clipMm.h) * scale + 1e-6);
    defs += `<clipPath id="band"><rect x="${x0}" y="${y0}" width="${x1 - x0}" height="${y1 - y0}"/></clipPath>`;
    content = `<g clip-path="url(#band)">${body}</g>`;
  }
  const svg =
    `<svg xmlns="http://www.w3.org/2000/svg" width="${widthPx}" height="${heightPx}" viewBox="0 0 ${widthPx} ${heightPx}">` +
    `<defs>${defs}</defs><rect width="${widthPx}" height="${heightPx}" fill="#fff"/>${content}</svg>`;
  return { svg, widthPx, heightPx };
}
