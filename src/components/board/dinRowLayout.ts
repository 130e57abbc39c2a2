/**
 * Geometry of a DIN row picture, in millimetres: each device at its width in modules of
 * 17.5 mm (DIN 43880), on a 35 mm top-hat rail (IEC 60715). Pure, so the drawing and the
 * drag-to-reorder maths agree and can be checked with numbers.
 */
import type { Device } from '../../../shared/schemas/schedule.js';

/** DIN 43880: one module is 17.5 mm wide. */
export const MODULE_MM = 17.5;
/** IEC 60715 top-hat rail: 35 mm high. */
export const RAIL_MM = 35;
/** Drawn height of a device body; a common modular device is about 80–90 mm tall (common practice). */
export const DEVICE_MM = 80;
export const MARGIN_MM = 6;
/** Room above the devices for way numbers. */
export const HEAD_MM = 9;

/** The RCD group a device belongs to, as the picture colours it. */
export interface DeviceGroup {
  name: string;
  colour: string;
}

export interface PlacedDevice {
  device: Device;
  x: number;
  width: number;
}
export interface RowLayout {
  placed: PlacedDevice[];
  usedModules: number;
  capacityModules: number;
  /** Width of the row's space for devices (its capacity), mm. */
  capacityMm: number;
  /** Overall drawing width including any devices past the capacity, mm. */
  widthMm: number;
  heightMm: number;
}

export function layoutRow(devices: Device[], capacityModules: number): RowLayout {
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

/**
 * Where a dragged device lands: the number of other devices whose centre lies left of the
 * dragged device's centre. `dx` is the drag distance in mm.
 */
export function dropPosition(layout: RowLayout, id: string, dx: number): number {
  const dragged = layout.placed.find((p) => p.device.id === id);
  if (!dragged) return 0;
  const centre = dragged.x + dragged.width / 2 + dx;
  return layout.placed.filter((p) => p.device.id !== id && p.x + p.width / 2 < centre).length;
}

/** The short lines printed on a device's face: kind, rating and the residual current (an AFDD's too, when it has an RCBO built in). */
export function deviceFace(d: Device): { kind: string; main: string; sub: string } {
  const kind: Record<Device['kind'], string> = {
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
  const breaker = d.kind === 'mcb' || d.kind === 'rcbo' || d.kind === 'afdd';
  const main = d.rating == null ? '' : breaker ? `${d.curve ?? ''}${d.rating}` : `${d.rating} A`;
  // A fuse's face names its standard under the rating: the limits differ by standard.
  const sub =
    d.residualMa != null && (d.kind === 'rcd' || d.kind === 'rcbo' || d.kind === 'afdd') ? `${d.residualMa} mA${d.rcdType ? ` ${d.rcdType}` : ''}` : '';
  return { kind: kind[d.kind], main, sub: d.kind === 'fuse' ? (d.fuseStandard ?? '') : sub };
}
