/**
 * A PDF needs at least one page: when a filter leaves nothing to print, say so on a page of the
 * chosen medium instead of returning a broken file.
 */
import { GREY, type LayoutDoc, type TypeMetrics } from '../model.js';
import type { Medium } from '../types.js';
import { fitText } from './fit.js';
import { placePieces, slotFor } from './place.js';

export function emptyDoc(layout: LayoutDoc, medium: Medium, tm: TypeMetrics): LayoutDoc {
  const message = layout.warnings[0]?.message ?? 'Nothing to print';
  const slot = slotFor(medium, 20);
  const w = slot.kind === 'fixed' ? slot.widthMm : Math.min(slot.maxLengthMm, 80);
  const fit = fitText(message, { x: 0, y: 0, w, h: slot.heightMm }, { face: 'regular', maxPt: 10, minPt: 5, padMm: 1, align: 'centre', color: GREY }, tm);
  const pages = placePieces([{ name: 'Nothing to print', widthMm: w, heightMm: slot.heightMm, items: fit.runs }], medium, tm);
  return { ...layout, pages };
}
