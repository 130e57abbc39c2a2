/**
 * Geometry of a board's DIN rows, in millimetres: each device at its width in modules of
 * 17.5 mm (DIN 43880), on a 35 mm top-hat rail (IEC 60715). One geometry for the editor's
 * picture and the board page's, so both draw a board the same way. Pure, no I/O; it ships in
 * the board page's chunk, so it imports types only.
 */
import type { Device, DeviceKind } from '../schemas/schedule.js';

/** DIN 43880: one module is 17.5 mm wide. */
export const MODULE_MM = 17.5;
/** IEC 60715 top-hat rail: 35 mm high. */
export const RAIL_MM = 35;
/** Drawn height of a device body; a common modular device is about 80–90 mm tall (common practice). */
export const DEVICE_MM = 80;
export const MARGIN_MM = 6;
/** Room above the devices for way numbers. */
export const HEAD_MM = 9;
/** Space between two rows when a whole board is drawn in one picture (our own choice, not a board's real pitch). */
export const ROW_GAP_MM = 4;

/** Only the width matters to the geometry, so the editor's devices and the board page's both fit. */
export interface ModularDevice {
  modules: number;
}

export interface PlacedDevice<D extends ModularDevice = Device> {
  device: D;
  x: number;
  width: number;
}
export interface RowLayout<D extends ModularDevice = Device> {
  placed: PlacedDevice<D>[];
  usedModules: number;
  capacityModules: number;
  /** Width of the row's space for devices (its capacity), mm. */
  capacityMm: number;
  /** Overall drawing width including any devices past the capacity, mm. */
  widthMm: number;
  heightMm: number;
}

/** One row: its devices side by side from the left margin, in the order they sit on the rail. */
export function layoutRow<D extends ModularDevice>(devices: readonly D[], capacityModules: number): RowLayout<D> {
  let x = MARGIN_MM;
  const placed = devices.map((device) => {
    const width = device.modules * MODULE_MM;
    const p = { device, x, width };
    x += width;
    return p;
  });
  const usedModules = devices.reduce((sum, d) => sum + d.modules, 0);
  const capacityMm = capacityModules * MODULE_MM;
  return {
    placed,
    usedModules,
    capacityModules,
    capacityMm,
    widthMm: Math.max(capacityMm, usedModules * MODULE_MM) + 2 * MARGIN_MM,
    heightMm: HEAD_MM + DEVICE_MM + MARGIN_MM,
  };
}

/** A row of a whole-board picture and the y of its top edge, mm. */
export interface StackedRow<D extends ModularDevice> {
  layout: RowLayout<D>;
  y: number;
}
export interface BoardLayout<D extends ModularDevice> {
  rows: StackedRow<D>[];
  /** The widest row's width, so every row starts at the same left edge, as on a board. */
  widthMm: number;
  heightMm: number;
}

/** Every row of a board in one picture, top row first, each laid out as `layoutRow` lays out the editor's rows. */
export function layoutRows<D extends ModularDevice>(rows: readonly (readonly D[])[], capacityModules: number): BoardLayout<D> {
  let y = 0;
  const stacked = rows.map((devices) => {
    const layout = layoutRow(devices, capacityModules);
    const row = { layout, y };
    y += layout.heightMm + ROW_GAP_MM;
    return row;
  });
  return {
    rows: stacked,
    widthMm: Math.max(2 * MARGIN_MM + capacityModules * MODULE_MM, ...stacked.map((r) => r.layout.widthMm)),
    heightMm: Math.max(0, y - ROW_GAP_MM),
  };
}

/** The word on a device's face for each kind, as the picture prints it. */
export const FACE_KIND: Record<DeviceKind, string> = {
  'main-switch': 'MAIN',
  rcd: 'RCD',
  rcbo: 'RCBO',
  mcb: 'MCB',
  fuse: 'FUSE',
  afdd: 'AFDD',
  spd: 'SPD',
  isolator: 'ISOL',
  timer: 'TIMER',
  blank: '',
};

/** The short lines printed on a device's face: kind, rating and the residual current (an AFDD's too, when it has an RCBO built in). */
export function deviceFace(d: Device): { kind: string; main: string; sub: string } {
  const breaker = d.kind === 'mcb' || d.kind === 'rcbo' || d.kind === 'afdd';
  const main = d.rating == null ? '' : breaker ? `${d.curve ?? ''}${d.rating}` : `${d.rating} A`;
  // A fuse's face names its standard under the rating: the limits differ by standard.
  const sub =
    d.residualMa != null && (d.kind === 'rcd' || d.kind === 'rcbo' || d.kind === 'afdd') ? `${d.residualMa} mA${d.rcdType ? ` ${d.rcdType}` : ''}` : '';
  return { kind: FACE_KIND[d.kind], main, sub: d.kind === 'fuse' ? (d.fuseStandard ?? '') : sub };
}
