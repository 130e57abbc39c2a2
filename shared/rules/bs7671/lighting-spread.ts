/**
 * Lighting behind one RCD: when every lighting circuit shares a single RCD, one earth fault
 * anywhere on that RCD leaves the whole premises dark. Common practice spreads lighting across
 * RCDs (or uses RCBOs) so a trip never takes out every light at once (see also 314.1).
 */
import type { Finding } from '../types.js';
import { rcdNames } from '../../schedule/derive.js';
import type { ScheduleView } from './view.js';

/** Warns when all lighting circuits depend on the same RCD. */
export function checkLightingSpread(view: ScheduleView): Finding[] {
  const lighting = view.circuits.filter((f) => f.circuit.kind === 'lighting');
  if (lighting.length === 0) return [];
  const first = lighting[0].rcd;
  if (!first || first.kind !== 'rcd' || !lighting.every((f) => f.rcd?.id === first.id)) return [];
  const name = rcdNames(view.schedule).get(first.id) ?? 'one RCD';
  const sharing = view.circuits.filter((f) => f.rcd?.id === first.id && f.circuit.kind !== 'lighting').length;
  const ways = lighting.map((f) => f.circuit.way).sort((a, b) => a - b);
  const all = lighting.length === 1 ? 'The only lighting circuit is' : `All ${lighting.length} lighting circuits are`;
  return [
    {
      severity: 'warning',
      code: 'lighting-behind-one-rcd',
      rule: 'Common practice',
      ways,
      field: `circuits.${lighting[0].index}.deviceId`,
      message: `${all} behind ${name}${sharing ? ` with ${sharing} other circuit${sharing === 1 ? '' : 's'}` : ''}: a single trip leaves the premises dark; spread lighting across RCDs or use RCBOs`,
    },
  ];
}
