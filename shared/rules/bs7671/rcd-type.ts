/**
 * Type AC RCDs (531.3.3 as amended by A2:2022, from memory): a Type AC RCD detects only sinusoidal
 * residual current, and may serve only fixed equipment known to draw no DC component. Electronics
 * (LED drivers, induction hobs, inverters, chargers) can leak DC that blinds it.
 * - Socket-outlets can feed anything, and a sub-main feeds a whole board: never "known", so a warning.
 * - Other fixed equipment (lighting, cookers, fixed appliances, unspecified circuits) may qualify, but
 *   the schedule cannot tell: a note to confirm the load or fit Type A.
 * - Showers and immersion heaters are resistive heating loads: no finding on their account (common practice).
 */
import type { Circuit, Device } from '../../schemas/schedule.js';
import type { Finding, Severity } from '../types.js';
import { deviceKindName, givesRcdProtection, wayText } from '../../schedule/derive.js';
import { deviceName, waysText, type CircuitFacts, type ScheduleView } from './view.js';

const RULE = 'BS 7671 531.3.3';

type Load = 'general' | 'fixed' | 'resistive';

function loadOf(c: Circuit): Load {
  if (c.socketOutlets || c.kind === 'ring' || c.kind === 'sub-main') return 'general';
  if (c.kind === 'shower' || c.kind === 'immersion') return 'resistive';
  return 'fixed';
}

/** Circuits whose residual-current protection is this device: behind an RCD, or an RCBO's own. */
function protectedBy(view: ScheduleView, d: Device): CircuitFacts[] {
  return view.circuits.filter((f) => f.rcd?.id === d.id || f.circuit.deviceId === d.id);
}

/** "RCD 2 (RCD 63 A 30 mA), Type AC"; an unlabelled RCBO is named by its kind, "RCBO B20 30 mA". */
function name(d: Device): string {
  const text = deviceName(d);
  const kind = deviceKindName(d);
  const plain = text.startsWith(kind) ? text : `${kind} ${text}`;
  return `${d.label ? `${d.label} (${plain})` : plain}, Type AC`;
}

function finding(index: number, circuits: CircuitFacts[], severity: Severity, message: string): Finding {
  const ways = [...new Set(circuits.map((f) => f.circuit.way))].sort((a, b) => a - b);
  return { severity, code: 'rcd-type-ac', rule: RULE, ways, field: `devices.${index}.rcdType`, message };
}

function checkDevice(view: ScheduleView, d: Device, index: number): Finding[] {
  const circuits = protectedBy(view, d);
  const general = circuits.filter((f) => loadOf(f.circuit) === 'general');
  const fixed = circuits.filter((f) => loadOf(f.circuit) === 'fixed');
  const texts = (list: CircuitFacts[]) => waysText(list.map((f) => wayText(f.circuit)));
  if (general.length) {
    const sockets = general.some((f) => f.circuit.kind !== 'sub-main');
    const subMain = general.some((f) => f.circuit.kind === 'sub-main');
    const what = [sockets ? 'socket-outlets' : '', subMain ? 'a sub-main' : ''].filter(Boolean).join(' and ');
    return [
      finding(
        index,
        circuits,
        'warning',
        `${name(d)}: since A2:2022 Type AC may only serve fixed equipment whose load current is known to contain no DC components, but it protects ${what} (${texts(general)}); fit Type A (or F or B where the equipment needs it)`,
      ),
    ];
  }
  if (fixed.length) {
    return [
      finding(
        index,
        circuits,
        'info',
        `${name(d)}: Type AC may only serve fixed equipment whose load current is known to contain no DC components; confirm that for ${texts(fixed)} (LED drivers, induction hobs and inverters often have them) or fit Type A`,
      ),
    ];
  }
  return [];
}

/** A finding for each Type AC RCD or RCBO, by what it protects. */
export function checkRcdType(view: ScheduleView): Finding[] {
  return view.schedule.devices.flatMap((d, i) => (d.rcdType === 'AC' && givesRcdProtection(d) ? checkDevice(view, d, i) : []));
}
