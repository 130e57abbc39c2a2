/**
 * Recognisable mistakes in the devices along the DIN rails: more modules than a row holds, a row
 * the board does not have, a rating no breaker is made in, missing IΔn or curve, a broken RCD link.
 */
import type { Device } from '../../schemas/schedule.js';
import type { Finding } from '../types.js';
import { BREAKER_RATINGS, RESIDUAL_RATINGS_MA } from './tables.js';
import { deviceName, num, waysOfDevice, type ScheduleView } from './view.js';
import { givesRcdProtection } from '../../schedule/derive.js';

const RULE = 'Data check';

function deviceFinding(
  view: ScheduleView,
  d: Device,
  index: number,
  severity: Finding['severity'],
  code: string,
  field: string,
  message: string,
  rule = RULE,
): Finding {
  return { severity, code, rule, ways: waysOfDevice(view, d.id), field: `devices.${index}.${field}`, message };
}

function who(d: Device): string {
  return d.label ? `${d.label} (${deviceName(d)})` : deviceName(d);
}

function rowProblems(view: ScheduleView): Finding[] {
  const { board, devices } = view.schedule;
  const out: Finding[] = [];
  const used = new Map<number, number>();
  const flagged = new Set<number>();
  devices.forEach((d, i) => {
    if (d.row > board.rows) {
      out.push(
        deviceFinding(
          view,
          d,
          i,
          'error',
          'device-beyond-rows',
          'row',
          `Device ${who(d)} is on row ${d.row} but the board has ${board.rows} row${board.rows === 1 ? '' : 's'}`,
        ),
      );
      return;
    }
    const total = (used.get(d.row) ?? 0) + d.modules;
    used.set(d.row, total);
    if (total > board.modulesPerRow && !flagged.has(d.row)) {
      flagged.add(d.row);
      out.push(
        deviceFinding(
          view,
          d,
          i,
          'error',
          'row-over-capacity',
          'modules',
          `Row ${d.row} holds ${board.modulesPerRow} modules but its devices take more (${num(total)} by ${who(d)})`,
        ),
      );
    }
  });
  return out;
}

function ratingProblems(view: ScheduleView, d: Device, i: number): Finding[] {
  const out: Finding[] = [];
  const breaker = d.kind === 'mcb' || d.kind === 'rcbo';
  if (breaker && d.rating != null && !(BREAKER_RATINGS as readonly number[]).includes(d.rating)) {
    out.push(
      deviceFinding(
        view,
        d,
        i,
        'warning',
        'rating-not-made',
        'rating',
        `Device ${who(d)}: no breaker is made in ${num(d.rating)} A (usual ratings 6, 10, 16, 20, 25, 32, 40, 50, 63 A); check the rating`,
      ),
    );
  }
  if (breaker && d.curve == null) {
    out.push(
      deviceFinding(view, d, i, 'warning', 'breaker-without-curve', 'curve', `Device ${who(d)}: record its curve (B, C or D) so its maximum Zs can be found`),
    );
  }
  if ((d.kind === 'rcd' || d.kind === 'rcbo') && d.residualMa == null) {
    out.push(deviceFinding(view, d, i, 'warning', 'rcd-without-residual', 'residualMa', `Device ${who(d)}: record its IΔn (e.g. 30 mA)`));
  } else if (givesRcdProtection(d) && d.residualMa != null && !(RESIDUAL_RATINGS_MA as readonly number[]).includes(d.residualMa)) {
    out.push(
      deviceFinding(
        view,
        d,
        i,
        'warning',
        'residual-not-made',
        'residualMa',
        `Device ${who(d)}: no RCD is made with IΔn ${num(d.residualMa)} mA (usual 30, 100, 300 mA); check the value`,
      ),
    );
  }
  return out;
}

function linkProblems(view: ScheduleView, d: Device, i: number): Finding[] {
  if (view.schedule.board.rcdMode !== 'manual' || d.protectedBy == null) return [];
  const target = view.devicesById.get(d.protectedBy);
  if (target?.kind === 'rcd') return [];
  return [
    deviceFinding(
      view,
      d,
      i,
      'warning',
      'protected-by-not-rcd',
      'protectedBy',
      `Device ${who(d)}: it is set to be protected by "${d.protectedBy}", which is not an RCD on this board`,
    ),
  ];
}

function duplicateIds(view: ScheduleView): Finding[] {
  const seen = new Set<string>();
  return view.schedule.devices.flatMap((d, i) => {
    if (!seen.has(d.id)) {
      seen.add(d.id);
      return [];
    }
    return [deviceFinding(view, d, i, 'error', 'device-id-twice', 'id', `Device ${who(d)}: id "${d.id}" is used by another device`)];
  });
}

/** Mistakes along the DIN rails. */
export function checkDeviceData(view: ScheduleView): Finding[] {
  return [
    ...rowProblems(view),
    ...duplicateIds(view),
    ...view.schedule.devices.flatMap((d, i) => [...ratingProblems(view, d, i), ...linkProblems(view, d, i)]),
  ];
}
