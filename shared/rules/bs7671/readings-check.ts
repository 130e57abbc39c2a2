/** The new board's own readings: each circuit's tests and each RCD's operating times. */
import type { Finding } from '../types.js';
import { judgeRcdTrip, judgeReadings } from './readings.js';
import { circuitName, deviceName, waysOfDevice, type ScheduleView } from './view.js';

export function checkReadings(view: ScheduleView): Finding[] {
  const ze = view.schedule.board.supply.ze;
  const out: Finding[] = [];
  for (const f of view.circuits) {
    const r = f.circuit.readings;
    if (!r) continue;
    const issues = judgeReadings(r, {
      ring: f.circuit.kind === 'ring',
      ze,
      behindRcd: f.rcd != null,
      zs: { value: f.circuit.measuredZs, field: '../measuredZs' },
      liveCsa: f.circuit.cable.liveCsa,
      cpcCsa: f.circuit.cable.cpcCsa,
    });
    for (const i of issues) {
      const field = i.field === '../measuredZs' ? `circuits.${f.index}.measuredZs` : `circuits.${f.index}.readings.${i.field}`;
      out.push({ severity: i.severity, code: i.code, rule: i.rule, ways: [f.circuit.way], field, message: `${circuitName(f.circuit)}: ${i.message}` });
    }
  }
  view.schedule.devices.forEach((d, index) => {
    if (!d.rcdTrip) return;
    for (const i of judgeRcdTrip(d.rcdTrip, d.residualMa)) {
      out.push({
        severity: i.severity,
        code: i.code,
        rule: i.rule,
        ways: waysOfDevice(view, d.id),
        field: `devices.${index}.rcdTrip.${i.field}`,
        message: `${d.label || deviceName(d)}: ${i.message}`,
      });
    }
  });
  return out;
}
