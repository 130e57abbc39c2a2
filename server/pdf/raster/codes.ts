/**
 * QR modules and barcode bars on whole pixels. Scaled as they are, a 0.4 mm module at 180 dpi
 * would be 2.83 px and its edges would fall between pixels, some modules 2 px and some 3 once
 * thresholded: a reader copes badly with modules of uneven size. Here every module is the same
 * whole number of pixels, the code centred in its area; what is left over widens the quiet zone.
 */
import type { Box, ModulesItem } from '../model.js';

export interface PixelBox {
  x: number;
  y: number;
  w: number;
  h: number;
}

/** Whole pixels per module, never less than one. */
function pixelsPerModule(spanPx: number, modules: number): number {
  return Math.max(1, Math.floor(spanPx / modules + 1e-6));
}

/** One axis of the code in pixels: either a grid of whole-pixel modules, or (along a bar) plain rounding. */
type Axis = (startMm: number, lengthMm: number) => { start: number; length: number };

function moduleAxis(areaStart: number, areaLength: number, m: number, scale: number, unit: number): Axis {
  const count = Math.round(areaLength / m);
  const origin = Math.round(areaStart * scale + (areaLength * scale - count * unit) / 2);
  return (s, l) => ({ start: origin + Math.round((s - areaStart) / m) * unit, length: Math.round(l / m) * unit });
}

const plainAxis =
  (scale: number): Axis =>
  (s, l) => {
    const start = Math.round(s * scale);
    return { start, length: Math.round((s + l) * scale) - start };
  };

/**
 * Dark modules in pixels for `item`, at `scale` px per mm, every module the same whole number of pixels.
 * Works whichever way the code was turned on the page: bars run along the area's longer side of each box.
 */
export function snappedModules(item: ModulesItem, scale: number): PixelBox[] {
  if (!item.boxes.length) return [];
  const area: Box = item.area;
  // Bars of a barcode span the whole area one way; that way is not a module grid.
  const barsUpright = item.purpose === 'barcode' && item.boxes.every((b) => Math.abs(b.h - area.h) < 1e-6);
  const barsAcross = item.purpose === 'barcode' && !barsUpright;
  const m = Math.min(...item.boxes.map((b) => (barsUpright ? b.w : barsAcross ? b.h : Math.min(b.w, b.h))));
  const unit = Math.min(
    barsAcross ? Infinity : pixelsPerModule(area.w * scale, Math.round(area.w / m)),
    barsUpright ? Infinity : pixelsPerModule(area.h * scale, Math.round(area.h / m)),
  );
  const x = barsAcross ? plainAxis(scale) : moduleAxis(area.x, area.w, m, scale, unit);
  const y = barsUpright ? plainAxis(scale) : moduleAxis(area.y, area.h, m, scale, unit);
  return item.boxes.map((b) => {
    const h = x(b.x, b.w);
    const v = y(b.y, b.h);
    return { x: h.start, y: v.start, w: h.length, h: v.length };
  });
}
