/**
 * Arc fault detection (421.1.7, A2:2022): AFDDs to BS EN 62606 on single-phase final circuits
 * supplying socket-outlets up to 32 A. Required in HMOs (and in higher-risk residential buildings,
 * student accommodation and care homes, which the schedule does not tell apart); recommended
 * everywhere else, so there it is one note for the board rather than a mark on every way.
 */
import type { Finding } from '../types.js';
import { wayText } from '../../schedule/derive.js';
import { SOCKET_RCD_MAX_RATING } from './tables.js';
import { circuitFinding, circuitName, waysText, type CircuitFacts, type ScheduleView } from './view.js';

const RULE = 'BS 7671 421.1.7';

/** A single-phase socket-outlet final circuit up to 32 A whose device is not an AFDD. */
function lacksAfdd(f: CircuitFacts): boolean {
  const { circuit, device } = f;
  if (!device || circuit.kind === 'sub-main') return false;
  const sockets = circuit.socketOutlets || circuit.kind === 'ring';
  const singlePhase = device.poles < 3;
  const upTo32 = device.rating == null || device.rating <= SOCKET_RCD_MAX_RATING;
  return sockets && singlePhase && upTo32 && device.kind !== 'afdd';
}

export function checkArcFault(view: ScheduleView): Finding[] {
  const missing = view.circuits.filter(lacksAfdd);
  if (!missing.length) return [];
  if (view.schedule.board.installationType === 'hmo') {
    return missing.map((f) =>
      circuitFinding(
        f,
        'warning',
        'sockets-need-afdd',
        RULE,
        'deviceId',
        `${circuitName(f.circuit)}: in a house in multiple occupation, socket-outlet circuits up to 32 A need an AFDD (BS EN 62606); its device is not one`,
      ),
    );
  }
  const ways = [...new Set(missing.map((f) => f.circuit.way))].sort((a, b) => a - b);
  // The message names each way as printed ("4 L1"), so a three-phase board's ways can be told apart.
  const named = [...missing].sort((a, b) => a.circuit.way - b.circuit.way || (a.circuit.phase ?? '').localeCompare(b.circuit.phase ?? ''));
  const printed = [...new Set(named.map((f) => wayText(f.circuit)))];
  return [
    {
      severity: 'info',
      code: 'afdd-recommended',
      rule: RULE,
      ways,
      field: `circuits.${missing[0]!.index}.deviceId`,
      message: `${waysText(printed, true)}: AFDDs (BS EN 62606) are recommended for socket-outlet circuits up to 32 A`,
    },
  ];
}
