/**
 * Way labels: one strip per DIN row whose cells are exactly each device's width (modules × pitch,
 * 17.5 mm per DIN 43880 by default), so the strip lines up over the whole row. A strip longer than
 * the medium takes is split; ▼ and ▲ half-marks at the join meet when the parts are butted.
 */
import { circuitsByDevice, deviceKindName, deviceShortText, rcdNames, wayText } from '../../../shared/schedule/derive.js';
import type { Circuit, Device, Schedule } from '../../../shared/schemas/schedule.js';
import { BLACK, type Box, type Item, type LayoutDoc } from '../model.js';
import { TAPE_MAX_LENGTH_MM } from '../media.js';
import type { LayoutContext } from './context.js';
import { placePieces, slotFor, slotMaxLength, type Piece } from './place.js';
import { spareWays } from '../../../shared/schedule/ways.js';
import { cellItems, cellSizes, type CellCaps, type CellText, type DeviceLines, type RowCaps } from './way-cell.js';
import { rowDeviceLines } from './way-row-device.js';

/** Strip height when tiled on a plain sheet (mm), unless the option says otherwise. // common practice */
const PAGE_STRIP_HEIGHT_MM = 12;

export interface WayCell {
  deviceId: string;
  x: number;
  w: number;
  ways: number[];
}
export interface WayStrip {
  row: number;
  part: number;
  parts: number;
  startMm: number;
  lengthMm: number;
  cells: WayCell[];
}

/** Cells of one DIN row along the rail, from 0 mm. */
export function rowCells(devices: Device[], byDevice: Map<string, Circuit[]>, pitchMm: number): WayCell[] {
  let x = 0;
  return devices.map((d) => {
    const cell = { deviceId: d.id, x, w: d.modules * pitchMm, ways: (byDevice.get(d.id) ?? []).map((c) => c.way) };
    x += cell.w;
    return cell;
  });
}

/** Where to cut a strip of `length` into parts no longer than `max`: at a cell edge when one is available. */
export function splitPoints(cells: WayCell[], max: number): Array<[number, number]> {
  const end = cells.length ? cells[cells.length - 1].x + cells[cells.length - 1].w : 0;
  const parts: Array<[number, number]> = [];
  let start = 0;
  while (end - start > max + 1e-6) {
    const edges = cells.map((c) => c.x).filter((x) => x > start + 1e-6 && x <= start + max + 1e-6);
    const cut = edges.length ? edges[edges.length - 1] : start + max;
    parts.push([start, cut]);
    start = cut;
  }
  parts.push([start, end]);
  return parts;
}

/** Same words, ignoring case, spaces and punctuation. */
const sameText = (a: string, b: string) => a.toLowerCase().replace(/[^\p{L}\p{N}]+/gu, '') === b.toLowerCase().replace(/[^\p{L}\p{N}]+/gu, '');

function textFor(d: Device, circuits: Circuit[], rcds: Map<string, string>, spareWay: string): CellText {
  if (d.kind === 'blank') return { ways: '', device: '', main: '' };
  if (d.kind === 'rcd')
    return { ways: rcds.get(d.id) ?? 'RCD', device: '', main: deviceShortText(d).replace(/^RCD /, '') + (d.rcdType ? ` Type ${d.rcdType}` : '') };
  if (d.kind === 'main-switch' || (d.kind === 'isolator' && circuits.length === 0))
    return { ways: d.label || deviceKindName(d), device: '', main: d.rating != null ? `${d.rating} A` : '' };
  // A label that only repeats "Surge protection" is not printed twice: the short name goes on top.
  if (d.kind === 'spd') return { ways: d.label && !sameText(d.label, 'Surge protection') ? d.label : 'SPD', device: '', main: 'Surge protection' };
  const labels = [...new Set(circuits.map((c) => c.label))];
  return {
    ways: circuits.length ? circuits.map((c) => wayText(c)).join(', ') : spareWay,
    device: deviceShortText(d),
    main: labels.length ? labels.join(' / ') : 'Spare',
  };
}

/**
 * No label on a strip is set larger than the smallest every other label of the row fits at, so the
 * row reads evenly; but no lower than EVEN_FLOOR_PT, so one long label cannot shrink the whole row to
 * its size: it shrinks (or wraps) alone. Cells set turned (half modules) share a pair of their own.
 */
const EVEN_FLOOR_PT = 7;

function rowCaps(
  cells: WayCell[],
  heightMm: number,
  texts: Map<string, CellText>,
  devices: Map<string, DeviceLines>,
  ctx: LayoutContext<'way-labels'>,
): RowCaps {
  const measured = cells.map((c) => cellSizes(texts.get(c.deviceId)!, { x: 0, y: 0, w: c.w, h: heightMm }, ctx, devices.get(c.deviceId)));
  const capsOf = (turned: boolean): CellCaps => {
    const sizes = measured.filter((m) => m.turned === turned).map((m) => m.sizes);
    return {
      ways: Math.max(EVEN_FLOOR_PT, Math.min(...sizes.map((z) => z.ways))),
      main: Math.max(EVEN_FLOOR_PT, Math.min(...sizes.map((z) => z.main))),
    };
  };
  return { upright: capsOf(false), turned: capsOf(true) };
}

/** "▼▲ meet part 2", "… parts 1 and 3", "… part 2": each part names the parts its marks meet. */
function joinCaption(part: number, parts: number): string {
  const near = [part - 1, part + 1].filter((p) => p >= 1 && p <= parts);
  return near.length === 2 ? `▼▲ meet parts ${near[0]} and ${near[1]}` : `▼▲ meet part ${near[0]}`;
}

interface StripPlan {
  strips: WayStrip[];
  pieces: Piece[];
}

function segmentPiece(
  strip: WayStrip,
  heightMm: number,
  devices: Map<string, Device>,
  texts: Map<string, CellText>,
  ctx: LayoutContext<'way-labels'>,
  joins: { left: boolean; right: boolean },
  caps: RowCaps,
  deviceLines: Map<string, DeviceLines>,
): Piece {
  const mark = Math.min(2, heightMm / 4);
  const name = `Row ${strip.row} way labels${strip.parts > 1 ? ` (part ${strip.part} of ${strip.parts})` : ''}`;
  const items: Item[] = [
    { kind: 'line', from: { x: 0, y: 0 }, to: { x: strip.lengthMm, y: 0 }, lineMm: 0.2, color: BLACK },
    { kind: 'line', from: { x: 0, y: heightMm }, to: { x: strip.lengthMm, y: heightMm }, lineMm: 0.2, color: BLACK },
  ];
  for (const cell of strip.cells) {
    const box: Box = { x: cell.x, y: 0, w: cell.w, h: heightMm };
    items.push({ kind: 'line', from: { x: cell.x, y: 0 }, to: { x: cell.x, y: heightMm }, lineMm: 0.2, color: BLACK });
    const textBox = { ...box };
    if (joins.left && cell.x < 1e-6) {
      textBox.x += mark;
      textBox.w -= mark;
    }
    if (joins.right && cell.x + cell.w > strip.lengthMm - 1e-6) textBox.w -= mark;
    const t = texts.get(cell.deviceId)!;
    const cellName = /^\d/.test(t.ways) ? `Way ${t.ways} label` : `${devices.get(cell.deviceId)?.label || t.ways || 'Device'} label`;
    items.push(...cellItems(t, textBox, ctx, cellName, caps, deviceLines.get(cell.deviceId)));
  }
  items.push({ kind: 'line', from: { x: strip.lengthMm, y: 0 }, to: { x: strip.lengthMm, y: heightMm }, lineMm: 0.2, color: BLACK });
  const half = (x: number, dir: 1 | -1): Item[] => [
    {
      kind: 'polygon',
      points: [
        { x, y: 0 },
        { x, y: mark },
        { x: x + dir * mark, y: 0 },
      ],
      fill: BLACK,
    },
    {
      kind: 'polygon',
      points: [
        { x, y: heightMm },
        { x, y: heightMm - mark },
        { x: x + dir * mark, y: heightMm },
      ],
      fill: BLACK,
    },
  ];
  if (joins.left) items.push(...half(0, 1));
  if (joins.right) items.push(...half(strip.lengthMm, -1));
  const pitch = ctx.options.pitchMm;
  const caption =
    strip.parts > 1
      ? `Row ${strip.row} · part ${strip.part} of ${strip.parts} (${joinCaption(strip.part, strip.parts)}) · ${pitch} mm`
      : `Row ${strip.row} · ${pitch} mm modules`;
  return { name, widthMm: strip.lengthMm, heightMm, items, caption };
}

/** Cells clipped to one part of the strip, shifted so the part starts at 0. */
function cellsIn(cells: WayCell[], a: number, b: number): WayCell[] {
  return cells
    .filter((c) => c.x < b - 1e-6 && c.x + c.w > a + 1e-6)
    .map((c) => ({ ...c, x: Math.max(c.x, a) - a, w: Math.min(c.x + c.w, b) - Math.max(c.x, a) }));
}

/** Strips (and their pieces) for the rows, or single cells for the changed ways only. */
export function wayLabelPlan(ctx: LayoutContext<'way-labels'>): StripPlan {
  const schedule: Schedule = ctx.req.schedule;
  const slot = slotFor(ctx.req.medium, ctx.options.heightMm ?? PAGE_STRIP_HEIGHT_MM);
  const max = Math.min(ctx.options.maxLengthMm ?? (ctx.req.medium.kind === 'tape' ? TAPE_MAX_LENGTH_MM : Infinity), slotMaxLength(slot));
  const byDevice = circuitsByDevice(schedule);
  const rcds = rcdNames(schedule);
  const devices = new Map(schedule.devices.map((d) => [d.id, d]));
  const spares = new Map(spareWays(schedule, byDevice).map((s) => [s.device.id, s.wayText]));
  const texts = new Map(schedule.devices.map((d) => [d.id, textFor(d, byDevice.get(d.id) ?? [], rcds, spares.get(d.id) ?? '')]));
  const only = ctx.req.onlyWays ? new Set(ctx.req.onlyWays) : null;
  const rows = [...new Set(schedule.devices.map((d) => d.row))].sort((a, b) => a - b);
  const strips: WayStrip[] = [];
  const pieces: Piece[] = [];
  for (const row of rows) {
    let cells = rowCells(
      schedule.devices.filter((d) => d.row === row),
      byDevice,
      ctx.options.pitchMm,
    );
    const deviceLines = rowDeviceLines(row, cells, slot.heightMm, texts, ctx);
    const caps = rowCaps(cells, slot.heightMm, texts, deviceLines, ctx);
    const groups = only ? cells.filter((c) => c.ways.some((w) => only.has(w))).map((c) => [{ ...c, x: 0 }]) : [cells];
    for (cells of groups) {
      const parts = splitPoints(cells, max);
      parts.forEach(([a, b], i) => {
        const strip: WayStrip = { row, part: i + 1, parts: parts.length, startMm: a, lengthMm: b - a, cells: cellsIn(cells, a, b) };
        strips.push(strip);
        pieces.push(segmentPiece(strip, slot.heightMm, devices, texts, ctx, { left: i > 0, right: i < parts.length - 1 }, caps, deviceLines));
      });
    }
  }
  return { strips, pieces };
}

export function layoutWayLabels(ctx: LayoutContext<'way-labels'>): LayoutDoc {
  const { pieces } = wayLabelPlan(ctx);
  if (pieces.length === 0) ctx.warnings.add({ code: 'nothing-to-print', message: 'No devices match: there are no way labels to print' });
  return { title: `${ctx.req.board.code} way labels`, pages: placePieces(pieces, ctx.req.medium, ctx.tm), warnings: ctx.warnings.list };
}
