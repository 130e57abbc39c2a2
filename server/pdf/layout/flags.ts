/**
 * Cable flags. A flag is [panel A][wrap zone][panel B] along the tape: the wrap zone goes once round
 * the cable (its outer perimeter plus an overlap allowance) and the two panels stick back to back.
 * Panel B carries panel A's text turned 180°, so on both faces of the folded flag the text runs
 * towards the cable the same way up.
 */
import { deviceShortText, circuitsInWayOrder, wayText } from '../../../shared/schedule/derive.js';
import type { Circuit } from '../../../shared/schemas/schedule.js';
import { mapItems, placeFrame } from '../geometry.js';
import { GREY, LIGHT_GREY, type Box, type Item, type LayoutDoc } from '../model.js';
import { LayoutError } from '../types.js';
import { cablePerimeter, DEFAULT_CSA } from './cable.js';
import { wayFilter, type LayoutContext } from './context.js';
import { fitText, type FitStyle } from './fit.js';
import { placePieces, slotFor, type Piece, type Slot } from './place.js';
import { junctionBoxFlagTexts } from './junction-flags.js';

/** Flag height when tiled on a plain sheet (mm). // common practice */
const PAGE_FLAG_HEIGHT_MM = 15;
/** Shortest panel that still carries the way number and a short label (mm). */
const MIN_PANEL_MM = 12;

export interface FlagSpec {
  circuit: Circuit;
  leg: number;
  legs: number;
  end: 'board' | 'far';
  wrapMm: number;
}

/**
 * What one flag says and how far it wraps, whatever it marks (a circuit's leg at the board, a leg
 * at a junction box): the big cell (`way`), the label, the small info line, and the name warnings use.
 */
export interface FlagText {
  name: string;
  way: string;
  label: string;
  info: string;
  wrapMm: number;
}

/** Panel length for a band height: long enough for the way number and a 24-character label. */
export function panelLengthFor(heightMm: number): number {
  return Math.min(60, Math.max(18, 18 + 1.2 * heightMm));
}

/** Legs of a circuit: the option, else the schedule (a ring final has at least two ends). */
export function legsOf(c: Circuit, override: number | undefined): number {
  if (override != null) return override;
  return c.kind === 'ring' ? Math.max(2, c.legs) : c.legs;
}

/** Every flag to print, in way order: each leg of each circuit, then the far-end set if asked. */
export function flagSpecs(ctx: LayoutContext<'flags'>): FlagSpec[] {
  const { schedule, onlyWays } = ctx.req;
  const wanted = wayFilter(onlyWays, ctx.options.ways);
  const ends: Array<'board' | 'far'> = ctx.options.bothEnds ? ['board', 'far'] : ['board'];
  const specs: FlagSpec[] = [];
  for (const end of ends) {
    for (const circuit of circuitsInWayOrder(schedule).filter(wanted)) {
      const wrap = cablePerimeter(circuit.cable);
      if (wrap.basis === 'assumed') {
        ctx.warnings.add({
          code: 'cable-size-assumed',
          label: `Way ${wayText(circuit)} flag`,
          message: `Way ${wayText(circuit)}: no cable size recorded, so the flag is sized for ${DEFAULT_CSA} mm² twin and earth`,
        });
      }
      const legs = legsOf(circuit, ctx.options.legs);
      for (let leg = 1; leg <= legs; leg++) specs.push({ circuit, leg, legs, end, wrapMm: wrap.perimeterMm + ctx.options.overlapMm });
    }
  }
  return specs;
}

function infoText(spec: FlagSpec, ctx: LayoutContext<'flags'>): string {
  const device = ctx.req.schedule.devices.find((d) => d.id === spec.circuit.deviceId);
  return [device ? deviceShortText(device) : '', ctx.req.board.code, spec.legs > 1 ? `leg ${spec.leg}/${spec.legs}` : '', spec.end === 'far' ? 'far end' : '']
    .filter(Boolean)
    .join(' · ');
}

type PanelText = Pick<FlagText, 'way' | 'label' | 'info'>;

/** The text of a flag at the board: way number, circuit label, device, board code and leg. */
export function boardFlagText(spec: FlagSpec, ctx: LayoutContext<'flags'>): FlagText {
  return { name: `Way ${wayText(spec.circuit)} flag`, way: wayText(spec.circuit), label: spec.circuit.label, info: infoText(spec, ctx), wrapMm: spec.wrapMm };
}

/** Points of size whose line (ascender + descender) fills `heightMm`. // DejaVu: 1.164 em */
const ptFilling = (heightMm: number) => heightMm / (1.164 * (25.4 / 72));

/** Preferred sizes: the way number fills its cell; label and info share the rest (two rows when there is height). */
function preferredSizes(areaH: number, two: boolean) {
  return {
    way: Math.min(40, ptFilling(areaH)),
    label: Math.min(14, ptFilling(two ? areaH * 0.58 : areaH)),
    info: Math.min(9, ptFilling(two ? areaH * 0.42 : areaH * 0.8)),
  };
}

function wantedWidths(t: PanelText, areaH: number, two: boolean, ctx: LayoutContext<'flags'>) {
  const size = preferredSizes(areaH, two);
  const m = ctx.tm.measure;
  return { way: m(t.way, 'bold', size.way) + 1, label: m(t.label, 'bold', size.label * 0.9), info: m(t.info, 'regular', size.info * 0.9) };
}

/** Panel length that shows the text near its preferred size on a free (tape or sheet) slot. */
function neededPanel(t: PanelText, heightMm: number, endMarginMm: number, ctx: LayoutContext<'flags'>): number {
  const areaH = heightMm - 0.6;
  const two = areaH >= 7;
  const want = wantedWidths(t, areaH, two, ctx);
  const needed = two
    ? endMarginMm + Math.min(areaH * 1.1, want.way) + 1.6 + Math.max(want.label, want.info)
    : endMarginMm + want.way + want.label + want.info + 2.4;
  return Math.min(60, Math.max(panelLengthFor(heightMm) * 0.75, needed));
}

/** The way, label and info cells of a panel's text area. */
function panelCells(t: PanelText, area: Box, ctx: LayoutContext<'flags'>): { way: Box; label: Box; info: Box; divider: number } {
  const two = area.h >= 7;
  const want = wantedWidths(t, area.h, two, ctx);
  if (area.h >= 14 && area.h > area.w * 0.6) {
    // A deep panel (a tall die-cut label): way number, label and info stacked, each the full width.
    const at = (from: number, share: number): Box => ({ x: area.x, y: area.y + area.h * from, w: area.w, h: area.h * share });
    return { way: at(0, 0.4), label: at(0.42, 0.34), info: at(0.77, 0.23), divider: -1 };
  }
  if (two) {
    const wayW = Math.min(area.w * 0.38, area.h * 1.1, Math.max(want.way, area.h * 0.6));
    const x = area.x + wayW + 0.8;
    const w = area.x + area.w - x;
    return {
      way: { ...area, w: wayW },
      label: { x, y: area.y, w, h: area.h * 0.58 },
      info: { x, y: area.y + area.h * 0.58, w, h: area.h * 0.42 },
      divider: x - 0.4,
    };
  }
  const free = area.w - 1.6;
  const total = want.way + want.label + want.info;
  const scale = Math.min(1, free / total);
  const wayW = Math.max(want.way * scale, Math.min(want.way, free * 0.25));
  const rest = free - wayW;
  const labelW = rest * (want.label / (want.label + want.info || 1));
  const x = area.x + wayW + 0.8;
  return { way: { ...area, w: wayW }, label: { ...area, x, w: labelW }, info: { ...area, x: x + labelW + 0.8, w: rest - labelW }, divider: x - 0.4 };
}

/** Panel A's text in a `panelMm × heightMm` frame; text runs towards the wrap zone (+x). */
function panelItems(t: PanelText, name: string, panelMm: number, heightMm: number, endMarginMm: number, ctx: LayoutContext<'flags'>): Item[] {
  const minPt = ctx.req.medium.kind === 'tape' ? 5 : 6;
  const area: Box = { x: endMarginMm, y: 0.3, w: panelMm - endMarginMm - 0.8, h: heightMm - 0.6 };
  const cells = panelCells(t, area, ctx);
  const size = preferredSizes(area.h, area.h >= 7);
  const items: Item[] =
    cells.divider < 0
      ? []
      : [{ kind: 'line', from: { x: cells.divider, y: area.y + 0.3 }, to: { x: cells.divider, y: area.y + area.h - 0.3 }, lineMm: 0.15, color: LIGHT_GREY }];
  const parts: Array<[string, Box, FitStyle]> = [
    [t.way, cells.way, { face: 'bold', maxPt: size.way, minPt, align: 'centre', maxLines: 1 }],
    [t.label, cells.label, { face: 'bold', maxPt: size.label, minPt, wrapBelowPt: 7, align: 'left', maxLines: 2, lineSpacing: 1.18 }],
    [t.info, cells.info, { face: 'regular', maxPt: size.info, minPt, wrapBelowPt: 6, align: 'left', maxLines: 2 }],
  ];
  for (const [text, cell, style] of parts) {
    const fit = fitText(text, cell, style, ctx.tm);
    if (fit.cut) ctx.warnings.cut(name, text);
    items.push(...fit.runs);
  }
  return items;
}

/** Short grey ticks at the top and bottom edge where the flag folds round the cable. */
function foldTicks(x: number, heightMm: number): Item[] {
  const len = Math.min(1.5, heightMm / 4);
  return [
    { kind: 'line', from: { x, y: 0 }, to: { x, y: len }, lineMm: 0.2, color: GREY },
    { kind: 'line', from: { x, y: heightMm - len }, to: { x, y: heightMm }, lineMm: 0.2, color: GREY },
  ];
}

/** One flag as a piece sized for the slot. */
export function flagPiece(flag: FlagText, slot: Slot, ctx: LayoutContext<'flags'>): Piece {
  const { name, wrapMm } = flag;
  const text: PanelText = { way: flag.way, label: flag.label, info: flag.info };
  const h = slot.heightMm;
  let panel = neededPanel(text, h, slot.endMarginMm, ctx);
  if (slot.kind === 'fixed') {
    panel = (slot.widthMm - wrapMm) / 2;
    if (panel < MIN_PANEL_MM)
      throw new LayoutError(
        `${name} needs labels at least ${(wrapMm + 2 * MIN_PANEL_MM).toFixed(0)} mm long (wrap ${wrapMm.toFixed(1)} mm round the cable plus two panels); these are ${slot.widthMm} mm`,
        'media',
      );
  }
  const length = 2 * panel + wrapMm;
  if (slot.kind === 'free' && length > slot.maxLengthMm + 1e-6)
    throw new LayoutError(`${name} is ${length.toFixed(0)} mm long and does not fit across ${ctx.req.medium.id}: use a wider page or tape`, 'media');
  const a = panelItems(text, name, panel, h, slot.endMarginMm, ctx);
  const b = mapItems(a, placeFrame(panel, h, { x: panel + wrapMm, y: 0, w: panel, h }, 180));
  return { name, widthMm: length, heightMm: h, items: [...a, ...b, ...foldTicks(panel, h), ...foldTicks(panel + wrapMm, h)] };
}

/**
 * Cable flags on tape (page per flag or one strip) or tiled on sheets: for the circuits asked for at
 * the board, or (`at=junction-boxes`) for each planned leg extended through a junction box.
 */
export function layoutFlags(ctx: LayoutContext<'flags'>): LayoutDoc {
  const slot = slotFor(ctx.req.medium, PAGE_FLAG_HEIGHT_MM);
  const atBoxes = ctx.options.at === 'junction-boxes';
  const flags = atBoxes ? junctionBoxFlagTexts(ctx) : flagSpecs(ctx).map((s) => boardFlagText(s, ctx));
  const pieces = flags.map((f) => flagPiece(f, slot, ctx));
  if (pieces.length === 0) {
    const message = atBoxes
      ? 'No planned leg goes through a junction box: there are no junction-box flags to print'
      : 'No circuits match: there are no cable flags to print';
    ctx.warnings.add({ code: 'nothing-to-print', message });
  }
  const pages = placePieces(pieces, ctx.req.medium, ctx.tm, ctx.options.layout === 'strip');
  return { title: `${ctx.req.board.code} cable flags`, pages, warnings: ctx.warnings.list };
}
