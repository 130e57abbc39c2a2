/**
 * Recognisable mistakes in the circuit data: they usually mean a typing slip, and left alone
 * they print wrong labels or hide a real problem from the other checks.
 */
import type { Finding } from '../types.js';
import { wayText } from '../../schedule/derive.js';
import { TWIN_EARTH_CPC } from './tables.js';
import { circuitFinding, circuitName, deviceName, isOvercurrentDevice, num, type CircuitFacts, type ScheduleView } from './view.js';

const RULE = 'Data check';

/** Two circuits clash on a way when the board is single-phase, or they share a phase, or either uses all three. */
function clash(view: ScheduleView, a: CircuitFacts, b: CircuitFacts): boolean {
  if (a.circuit.way !== b.circuit.way) return false;
  if (view.schedule.board.phases === 1) return true;
  return a.circuit.phase == null || b.circuit.phase == null || a.circuit.phase === b.circuit.phase;
}

function duplicateWays(view: ScheduleView): Finding[] {
  const out: Finding[] = [];
  view.circuits.forEach((f, i) => {
    const earlier = view.circuits.slice(0, i).find((e) => clash(view, e, f));
    if (!earlier) return;
    out.push(
      circuitFinding(
        f,
        'error',
        'way-used-twice',
        RULE,
        'way',
        `${circuitName(f.circuit)}: way ${wayText(f.circuit)} is already used by ${earlier.circuit.label}`,
      ),
    );
  });
  return out;
}

function deviceProblems(f: CircuitFacts): Finding[] {
  const { circuit, device } = f;
  const name = circuitName(circuit);
  if (circuit.deviceId == null) {
    return [
      circuitFinding(
        f,
        'warning',
        'circuit-without-device',
        RULE,
        'deviceId',
        `${name}: no protective device is recorded, so its rating, cable and Zs cannot be checked`,
      ),
    ];
  }
  if (!device) {
    return [circuitFinding(f, 'error', 'unknown-device', RULE, 'deviceId', `${name}: device "${circuit.deviceId}" is not on the board`)];
  }
  if (!isOvercurrentDevice(device)) {
    return [
      circuitFinding(
        f,
        'warning',
        'device-gives-no-overcurrent-protection',
        'BS 7671 433.1.1',
        'deviceId',
        `${name}: its device (${deviceName(device)}) gives no overcurrent protection; a circuit needs an MCB, RCBO or fuse`,
      ),
    ];
  }
  return [];
}

/** Cables whose cpc is a core of the cable itself, never larger than the live cores (BS 6004 twin-and-earth, flex). */
const INTEGRAL_CPC = new Set(['twin-earth', 'flex']);

function cableProblems(f: CircuitFacts): Finding[] {
  const { type, liveCsa, cpcCsa } = f.circuit.cable;
  // Twin-and-earth always has a cpc; without its size the cpc cannot be judged (fault current, R1+R2).
  // Only once the live csa is recorded: a blank cable already gets "record the live conductor csa".
  if (type === 'twin-earth' && liveCsa != null && cpcCsa == null) {
    const usual = TWIN_EARTH_CPC[liveCsa];
    return [
      circuitFinding(
        f,
        'info',
        'cpc-not-recorded',
        RULE,
        'cable.cpcCsa',
        `${circuitName(f.circuit)}: record the cpc csa of its twin-and-earth${usual != null ? ` (${num(liveCsa)} mm² twin-and-earth usually has ${num(usual)} mm²)` : ''}; without it the cpc cannot be judged for Zs or the adiabatic check (543.1.3)`,
      ),
    ];
  }
  // SWA armour or a separate cpc in conduit may rightly be larger than the live conductors.
  if (!INTEGRAL_CPC.has(type) || liveCsa == null || cpcCsa == null || cpcCsa <= liveCsa) return [];
  return [
    circuitFinding(
      f,
      'warning',
      'cpc-larger-than-live',
      RULE,
      'cable.cpcCsa',
      `${circuitName(f.circuit)}: cpc ${num(cpcCsa)} mm² is larger than the live conductors (${num(liveCsa)} mm²); the two sizes may be swapped`,
    ),
  ];
}

function linkProblems(view: ScheduleView, f: CircuitFacts): Finding[] {
  const out: Finding[] = [];
  if (f.circuit.feedsBoardId != null && f.circuit.kind !== 'sub-main') {
    out.push(
      circuitFinding(
        f,
        'warning',
        'feeds-board-on-final-circuit',
        RULE,
        'feedsBoardId',
        `${circuitName(f.circuit)}: it names a board it feeds but is not a sub-main; set its kind to sub-main or clear the link`,
      ),
    );
  }
  if (view.schedule.board.phases === 1 && f.circuit.phase != null && f.circuit.phase !== 'L1') {
    out.push(
      circuitFinding(
        f,
        'warning',
        'phase-on-single-phase-board',
        RULE,
        'phase',
        `${circuitName(f.circuit)}: phase ${f.circuit.phase} is recorded on a single-phase board`,
      ),
    );
  }
  return out;
}

function duplicateIds(view: ScheduleView): Finding[] {
  const seen = new Set<string>();
  return view.circuits.flatMap((f) => {
    if (!seen.has(f.circuit.id)) {
      seen.add(f.circuit.id);
      return [];
    }
    return [circuitFinding(f, 'error', 'circuit-id-twice', RULE, 'id', `${circuitName(f.circuit)}: id "${f.circuit.id}" is used by another circuit`)];
  });
}

/** Mistakes in ways, device links, cable sizes and board links. */
export function checkCircuitData(view: ScheduleView): Finding[] {
  return [
    ...duplicateWays(view),
    ...duplicateIds(view),
    ...view.circuits.flatMap((f) => [...deviceProblems(f), ...cableProblems(f), ...linkProblems(view, f)]),
  ];
}
