/**
 * The editor's DIN row picture: the geometry is the board's own (shared/schedule/din-rows.ts,
 * which the board page draws with too); what is left here is the editor's alone, the RCD group
 * colours and the drag-to-reorder maths, kept pure so they can be checked with numbers.
 */
import type { Device } from '../../../shared/schemas/schedule.js';
import type { RowLayout } from '../../../shared/schedule/din-rows.js';

/** The RCD group a device belongs to, as the picture colours it. */
export interface DeviceGroup {
  name: string;
  colour: string;
}

/**
 * Where a dragged device lands: the number of other devices whose centre lies left of the
 * dragged device's centre. `dx` is the drag distance in mm.
 */
export function dropPosition(layout: RowLayout<Device>, id: string, dx: number): number {
  const dragged = layout.placed.find((p) => p.device.id === id);
  if (!dragged) return 0;
  const centre = dragged.x + dragged.width / 2 + dx;
  return layout.placed.filter((p) => p.device.id !== id && p.x + p.width / 2 < centre).length;
}
