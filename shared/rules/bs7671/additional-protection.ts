/**
 * Additional protection by a 30 mA RCD (415.1.1) where BS 7671 asks for it: socket-outlets up to
 * 32 A (411.3.3), luminaires in dwellings (411.3.4), cables concealed in walls (522.6.202/203).
 */
import type { Finding, Severity } from '../types.js';
import { ADDITIONAL_PROTECTION_MA, DWELLINGS, SOCKET_RCD_MAX_RATING } from './tables.js';
import { circuitFinding, circuitName, num, type CircuitFacts, type ScheduleView } from './view.js';

type Cover = 'yes' | 'no' | 'unknown';

/** Whether a 30 mA (or more sensitive) RCD covers the circuit; unknown when its IΔn is not recorded. */
function thirtyMaCover(f: CircuitFacts): Cover {
  if (!f.rcd) return 'no';
  if (f.rcd.residualMa == null) return 'unknown';
  return f.rcd.residualMa <= ADDITIONAL_PROTECTION_MA ? 'yes' : 'no';
}

function coverText(f: CircuitFacts): string {
  if (!f.rcd) return 'it has no RCD protection';
  if (f.rcd.residualMa == null) return "its RCD's IΔn is not recorded, so 30 mA protection cannot be confirmed";
  return `its RCD trips at ${num(f.rcd.residualMa)} mA, more than 30 mA`;
}

function need(f: CircuitFacts, severity: Severity, code: string, rule: string, why: string): Finding {
  const cover = thirtyMaCover(f);
  return circuitFinding(
    f,
    cover === 'unknown' ? 'warning' : severity,
    code,
    rule,
    'deviceId',
    `${circuitName(f.circuit)}: ${why} need 30 mA RCD additional protection, but ${coverText(f)}`,
  );
}

function checkCircuit(view: ScheduleView, f: CircuitFacts): Finding[] {
  if (!f.device || thirtyMaCover(f) === 'yes') return [];
  const { circuit, device } = f;
  const dwelling = DWELLINGS.has(view.schedule.board.installationType);
  const out: Finding[] = [];
  const sockets = circuit.socketOutlets || circuit.kind === 'ring';
  if (sockets && (device.rating == null || device.rating <= SOCKET_RCD_MAX_RATING)) {
    // Outside dwellings 411.3.3 allows a documented risk assessment instead, so it is a warning there.
    out.push(
      need(
        f,
        dwelling ? 'error' : 'warning',
        'sockets-need-rcd',
        'BS 7671 411.3.3',
        dwelling ? 'socket-outlets up to 32 A' : 'socket-outlets up to 32 A (unless a documented risk assessment outside a dwelling says otherwise)',
      ),
    );
  }
  if (circuit.kind === 'lighting' && dwelling) {
    out.push(need(f, 'error', 'lighting-needs-rcd', 'BS 7671 411.3.4', 'final circuits supplying luminaires in a dwelling'));
  }
  // Armoured cable with earthed armour counts as otherwise protected (522.6.204).
  if (circuit.concealedInWall && circuit.cable.type !== 'swa') {
    out.push(
      need(f, 'error', 'concealed-cable-needs-rcd', 'BS 7671 522.6.202/203', 'cables concealed in a wall less than 50 mm deep, or in a wall with metal parts,'),
    );
  }
  return out;
}

/** 30 mA RCD protection wherever the circuit's kind, use or route asks for it. */
export function checkAdditionalProtection(view: ScheduleView): Finding[] {
  return view.circuits.flatMap((f) => checkCircuit(view, f));
}
