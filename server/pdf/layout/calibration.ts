/**
 * The calibration page: a 100 mm ruler with millimetre ticks and crosshairs at stated distances from
 * the edges, so a user can check the printer's scale and feed offset with a ruler of their own.
 * On a die-cut sheet it also outlines every label, to hold against the sheet up to the light.
 */
import { mapItems } from '../geometry.js';
import { BLACK, GREY, type Box, type Item, type LayoutDoc, type LayoutPage, type Point } from '../model.js';
import { isLabelPage } from '../media.js';
import { LayoutError } from '../types.js';
import type { LayoutContext } from './context.js';
import { fitText, type FitStyle } from './fit.js';
import { placePieces } from './place.js';

export const RULER_MM = 100;
/** Distance of the corner crosshairs from the page edges (mm). */
export const CROSS_INSET_MM = 10;

/** A ruler along +x from `at`, ticks downwards: 1 mm short, 5 mm longer, 10 mm longest and numbered. */
export function ruler(at: Point, tickMm: number, ctx: LayoutContext<'calibration'>, numbers = true): Item[] {
  const items: Item[] = [{ kind: 'line', from: at, to: { x: at.x + RULER_MM, y: at.y }, lineMm: 0.15, color: BLACK }];
  for (let mm = 0; mm <= RULER_MM; mm++) {
    const len = mm % 10 === 0 ? tickMm : mm % 5 === 0 ? tickMm * 0.7 : tickMm * 0.4;
    items.push({ kind: 'line', from: { x: at.x + mm, y: at.y }, to: { x: at.x + mm, y: at.y + len }, lineMm: 0.1, color: BLACK });
    if (numbers && mm % 10 === 0) {
      const cell: Box = { x: at.x + mm - 4, y: at.y + tickMm + 0.3, w: 8, h: Math.min(3, tickMm) };
      items.push(...fitText(String(mm), cell, { face: 'regular', maxPt: 6, minPt: 4, maxLines: 1, align: 'centre' }, ctx.tm).runs);
    }
  }
  return items;
}

/** A crosshair centred on `c`, arms `arm` mm long, with a small circle so the centre is easy to find. */
export function crosshair(c: Point, arm: number): Item[] {
  return [
    { kind: 'line', from: { x: c.x - arm, y: c.y }, to: { x: c.x + arm, y: c.y }, lineMm: 0.1, color: BLACK },
    { kind: 'line', from: { x: c.x, y: c.y - arm }, to: { x: c.x, y: c.y + arm }, lineMm: 0.1, color: BLACK },
    { kind: 'circle', centre: c, radiusMm: arm * 0.4, stroke: BLACK, lineMm: 0.1 },
  ];
}

function text(t: string, box: Box, ctx: LayoutContext<'calibration'>, extra: Partial<FitStyle> = {}): Item[] {
  return fitText(t, box, { face: 'regular', maxPt: 9, minPt: 5, align: 'left', ...extra }, ctx.tm).runs;
}

function describe(ctx: LayoutContext<'calibration'>, w: number, h: number): string {
  const { xMm, yMm } = ctx.req.offset;
  const sign = (v: number) => `${v >= 0 ? '+' : '−'}${Math.abs(v).toFixed(1)}`;
  return `${ctx.req.medium.id}: ${w} × ${h} mm · printer offset x ${sign(xMm)} mm, y ${sign(yMm)} mm`;
}

/** A sheet or page: rulers both ways, crosshairs 10 mm in from each corner and at the centre. */
function pageCalibration(ctx: LayoutContext<'calibration'>, w: number, h: number, labels: Box[]): LayoutPage {
  if (w < RULER_MM + 2 * CROSS_INSET_MM || h < 60)
    throw new LayoutError(`The calibration page needs at least ${RULER_MM + 2 * CROSS_INSET_MM} × 60 mm`, 'media');
  const items: Item[] = labels.map((box): Item => ({ kind: 'rect', box, stroke: GREY, lineMm: 0.15 }));
  const i = CROSS_INSET_MM;
  for (const c of [
    { x: i, y: i },
    { x: w - i, y: i },
    { x: i, y: h - i },
    { x: w - i, y: h - i },
    { x: w / 2, y: h / 2 },
  ])
    items.push(...crosshair(c, 4));
  const left = (w - RULER_MM) / 2;
  items.push(...ruler({ x: left, y: 24 }, 5, ctx));
  if (h >= RULER_MM + 60) items.push(...mapItems(ruler({ x: 0, y: 0 }, 5, ctx), { x: 26, y: (h - RULER_MM) / 2, rotation: 90 }));
  const lines = [
    `Calibration · ${describe(ctx, w, h)}`,
    'Print at actual size (100 %, no “fit to page”). The ruler above should measure exactly 100 mm.',
    `The corner crosshairs should sit ${i} mm from both nearby edges and the middle one at the centre.`,
    'If every crosshair is shifted the same way, enter the shift as the printer offset and print again.',
  ];
  lines.forEach((l, n) =>
    items.push(...text(l, { x: left, y: 36 + n * 5, w: w - left - 12, h: 4.5 }, ctx, { maxPt: 7.5, maxLines: 1, face: n === 0 ? 'bold' : 'regular' })),
  );
  return { widthMm: w, heightMm: h, items };
}

/** On tape: the ruler along the tape from 10 to 110 mm, crosshairs at 5 and 115 mm, the medium named under the ruler. */
function tapeCalibration(ctx: LayoutContext<'calibration'>, band: number): LayoutDoc {
  const length = RULER_MM + 2 * CROSS_INSET_MM;
  const tick = band * 0.3;
  const numbers = band >= 6.5;
  const items: Item[] = [...ruler({ x: CROSS_INSET_MM, y: 0.3 }, tick, ctx, numbers)];
  for (const x of [CROSS_INSET_MM / 2, length - CROSS_INSET_MM / 2]) items.push(...crosshair({ x, y: band / 2 }, Math.min(2.5, band * 0.4)));
  const textTop = 0.3 + tick + (numbers ? Math.min(3, tick) + 0.5 : 0.3);
  const widthMm = ctx.req.medium.kind === 'tape' ? ctx.req.medium.widthMm : 0;
  items.push(
    ...text(describe(ctx, widthMm, length), { x: CROSS_INSET_MM + 2, y: textTop, w: RULER_MM - 4, h: band - textTop - 0.2 }, ctx, {
      align: 'centre',
      maxLines: 2,
    }),
  );
  const pages = placePieces([{ name: 'Calibration', widthMm: length, heightMm: band, items }], ctx.req.medium, ctx.tm);
  return { title: 'Calibration', pages, warnings: ctx.warnings.list };
}

export function layoutCalibration(ctx: LayoutContext<'calibration'>): LayoutDoc {
  const m = ctx.req.medium;
  if (m.kind === 'tape') return tapeCalibration(ctx, m.printableMm);
  if (m.kind === 'page' && isLabelPage(m)) {
    throw new LayoutError(`The calibration page needs at least ${RULER_MM + 2 * CROSS_INSET_MM} mm across: print it on A4 or A5`, 'media');
  }
  const page =
    m.kind === 'sheet'
      ? pageCalibration(ctx, m.layout.pageWidthMm, m.layout.pageHeightMm, labelBoxes(m.layout))
      : pageCalibration(ctx, m.widthMm, m.heightMm, []);
  return { title: 'Calibration', pages: [page], warnings: ctx.warnings.list };
}

function labelBoxes(l: Extract<LayoutContext['req']['medium'], { kind: 'sheet' }>['layout']): Box[] {
  const boxes: Box[] = [];
  for (let r = 0; r < l.rows; r++) {
    for (let c = 0; c < l.columns; c++)
      boxes.push({
        x: l.marginLeftMm + c * (l.labelWidthMm + l.gapXMm),
        y: l.marginTopMm + r * (l.labelHeightMm + l.gapYMm),
        w: l.labelWidthMm,
        h: l.labelHeightMm,
      });
  }
  return boxes;
}
