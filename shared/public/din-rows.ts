/**
 * The board's DIN rows as the board page draws them, and where each device sits on them, so a
 * visitor who found "way 3" can be shown which switch it is. Copies named fields only (kind,
 * modules, poles, a label, the face text), never a device's id, RCD links or test readings.
 * Rows are numbered and ordered as the editor draws them. Pure.
 */
import type { Device, Schedule } from '../schemas/schedule.js';
import type { PublicDinDevice, PublicDinPlace, PublicDinRows } from '../schemas/public-board.js';
import { rcdNames } from '../schedule/derive.js';
import { deviceFace } from '../schedule/din-rows.js';

/** The board's rows, 1 to the last row it has or a device sits on, each with its devices in rail order. */
function rowsOf(schedule: Schedule): Device[][] {
  const last = Math.max(schedule.board.rows, ...schedule.devices.map((d) => d.row));
  const rows: Device[][] = Array.from({ length: last }, () => []);
  for (const d of schedule.devices) rows[d.row - 1].push(d);
  return rows;
}

function publicDinDevice(d: Device, names: Map<string, string>): PublicDinDevice {
  const { main, sub } = deviceFace(d);
  return { kind: d.kind, modules: d.modules, poles: d.poles, label: names.get(d.id) ?? d.label, face: { main, sub } };
}

/** `dinRows` of the board page: every row top first, devices from the left. */
export function publicDinRows(schedule: Schedule): PublicDinRows {
  const names = rcdNames(schedule);
  return {
    modulesPerRow: schedule.board.modulesPerRow,
    rows: rowsOf(schedule).map((devices) => ({ devices: devices.map((d) => publicDinDevice(d, names)) })),
  };
}

/** Each device's place on those rows, by device id (the id itself stays on the server). */
export function dinPlaces(schedule: Schedule): Map<string, PublicDinPlace> {
  const places = new Map<string, PublicDinPlace>();
  rowsOf(schedule).forEach((devices, r) => devices.forEach((d, index) => places.set(d.id, { row: r + 1, index })));
  return places;
}
