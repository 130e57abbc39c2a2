/**
 * What each statutory notice says, in our own words, and which ones a board calls for.
 * BS 7671 Section 514 asks for the notice; the layout and wording here are Waymark's.
 */
import { noticeKindList, type NoticeKind } from '../../../shared/schemas/print.js';
import type { Schedule } from '../../../shared/schemas/schedule.js';
import { givesRcdProtection, hasOwnRcd, rcdNames } from '../../../shared/schedule/derive.js';
import { supplyVoltages } from '../../../shared/schedule/voltage.js';
import type { BoardMeta } from '../types.js';
import { printedDate } from './dates.js';

export interface NoticeContent {
  kind: NoticeKind;
  title: string;
  body: string;
  details: string[];
  /** The regulation the notice serves, printed on it. */
  regulation: string;
  symbol: 'warning' | 'earth' | null;
}

const SUPPLY_NAMES: Record<string, string> = {
  pv: 'solar PV',
  battery: 'a battery',
  generator: 'a generator',
  wind: 'a wind turbine',
  other: 'another source',
};
const BLANK = '____________';

/** The notices a board calls for when the user has not chosen. */
export function noticesCalledFor(schedule: Schedule, earthingCount: number): NoticeKind[] {
  const b = schedule.board;
  const hasRcd = schedule.devices.some(givesRcdProtection);
  const wanted: Record<NoticeKind, boolean> = {
    inspection: true,
    'rcd-test': hasRcd,
    earthing: earthingCount > 0,
    'mixed-colours': b.mixedWiringColours,
    'alternative-supply': b.alternativeSupply.present,
    voltage: b.phases === 3,
  };
  return noticeKindList.filter((k) => wanted[k]);
}

function sourcesText(schedule: Schedule): string {
  const kinds = schedule.board.alternativeSupply.kinds.map((k) => SUPPLY_NAMES[k]);
  if (kinds.length === 0) return 'another source';
  return kinds.length === 1 ? kinds[0] : `${kinds.slice(0, -1).join(', ')} and ${kinds[kinds.length - 1]}`;
}

/** One notice's text for this board. */
export function noticeContent(kind: NoticeKind, schedule: Schedule, board: BoardMeta): NoticeContent {
  const b = schedule.board;
  switch (kind) {
    case 'inspection':
      return {
        kind,
        title: 'Periodic inspection and testing',
        symbol: null,
        regulation: 'BS 7671 514.12.1',
        body: 'Have this electrical installation inspected and tested by a competent person at regular intervals, and keep each condition report.',
        details: [`Last inspection: ${printedDate(b.lastInspectionOn) ?? BLANK}`, `Next inspection due: ${printedDate(board.nextInspectionOn) ?? BLANK}`],
      };
    case 'rcd-test': {
      const names = [...rcdNames(schedule).values()];
      // Combined AFDD/RCBOs have a test button too.
      const rcbos = schedule.devices.filter(hasOwnRcd).length;
      const here = [...names, rcbos ? `${rcbos} RCBO${rcbos > 1 ? 's' : ''}` : ''].filter(Boolean).join(', ');
      return {
        kind,
        title: 'Test the RCDs every six months',
        symbol: null,
        regulation: 'BS 7671 514.12.2',
        body: "Press each RCD's test button (marked T or Test). It should switch off the circuits it protects; switch it back on. If it does not trip, call a competent electrician.",
        details: here ? [`On this board: ${here}`] : [],
      };
    }
    case 'earthing':
      return {
        kind,
        title: 'Safety Electrical Connection – Do Not Remove',
        symbol: 'earth',
        regulation: 'BS 7671 514.13.1',
        body: '',
        details: [],
      };
    case 'mixed-colours':
      return {
        kind,
        title: 'Caution: two wiring colour codes',
        symbol: 'warning',
        regulation: 'BS 7671 514.14.1',
        body: 'Wiring here is in the colours of both an older and the current edition of BS 7671. Before extending, altering or repairing it, identify every conductor with care.',
        details: ['Older: red, yellow, blue lines; black neutral', 'Current: brown, black, grey lines; blue neutral'],
      };
    case 'alternative-supply':
      return {
        kind,
        title: 'Warning: more than one source of supply',
        symbol: 'warning',
        regulation: 'BS 7671 514.15.1',
        body: `This installation is also supplied by ${sourcesText(schedule)}. Isolate the mains supply and every other source before working on it.`,
        details: b.alternativeSupply.description ? [b.alternativeSupply.description] : [],
      };
    case 'voltage': {
      const { toEarth, betweenPhases } = supplyVoltages(b.phases, b.supply.nominalVoltage);
      if (betweenPhases == null)
        return {
          kind,
          title: `Danger: ${toEarth} volts`,
          symbol: 'warning',
          regulation: 'BS 7671 514.10.1',
          body: `Supply ${toEarth} V to earth. Isolate the supply before removing covers.`,
          details: [],
        };
      return {
        kind,
        title: `Danger: ${betweenPhases} volts`,
        symbol: 'warning',
        regulation: 'BS 7671 514.10.1',
        body: `Three-phase supply, ${betweenPhases}/${toEarth} V: up to ${betweenPhases} V between devices on different phases. Isolate every phase before removing covers.`,
        details: [],
      };
    }
  }
}
