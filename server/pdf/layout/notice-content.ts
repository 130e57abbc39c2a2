/**
 * What each statutory notice says and which ones a board calls for. Where BS 7671 prescribes the words
 * (514.12.1, 514.12.2, 514.14.1) the notice prints them, or the organisation's own wording when it has
 * set one (`shared/notices/prescribed-wording.ts`); the regulation number prints either way. The
 * earthing label's words are the standard's and fixed; the alternative-supply and voltage notices,
 * whose words the standard leaves open, are Waymark's.
 */
import { noticeKindList, type NoticeKind } from '../../../shared/schemas/print.js';
import type { Schedule } from '../../../shared/schemas/schedule.js';
import { givesRcdProtection, hasOwnRcd, rcdNames } from '../../../shared/schedule/derive.js';
import { supplyVoltages } from '../../../shared/schedule/voltage.js';
import type { BoardMeta } from '../types.js';
import { printedDate } from './dates.js';
import { INSPECTION_DATE_LABELS, noticeWordingFor, prescribedNotices } from '../../../shared/notices/prescribed-wording.js';
import type { NoticeWordingSet } from '../../../shared/schemas/notice-wording.js';
import { cleanText } from './text.js';

export interface NoticeContent {
  kind: NoticeKind;
  /** How warnings name the notice, whatever its wording: "Periodic inspection and testing notice". */
  name: string;
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

/** Heading and wording of an editable notice: the organisation's, else the prescribed words; one paragraph. */
function wordingOf(kind: keyof typeof prescribedNotices, own: NoticeWordingSet | undefined) {
  const w = noticeWordingFor(kind, own);
  return { title: cleanText(w.title), body: cleanText(w.body), regulation: prescribedNotices[kind].regulation };
}

/** Each notice's name in warnings (not its heading, which an organisation may reword). */
const NOTICE_NAMES: Record<NoticeKind, string> = {
  inspection: 'Periodic inspection and testing notice',
  'rcd-test': 'RCD test notice',
  earthing: 'Earthing and bonding label',
  'mixed-colours': 'Mixed wiring colours notice',
  'alternative-supply': 'Alternative supply notice',
  voltage: 'Voltage warning notice',
};

/** One notice's text for this board; `wording` is the organisation's own wording of the notices it may reword. */
export function noticeContent(kind: NoticeKind, schedule: Schedule, board: BoardMeta, wording?: NoticeWordingSet): NoticeContent {
  return { ...noticeText(kind, schedule, board, wording), name: NOTICE_NAMES[kind] };
}

function noticeText(kind: NoticeKind, schedule: Schedule, board: BoardMeta, wording?: NoticeWordingSet): Omit<NoticeContent, 'name'> {
  const b = schedule.board;
  switch (kind) {
    case 'inspection':
      return {
        kind,
        ...wordingOf(kind, wording),
        symbol: null,
        details: [
          `${INSPECTION_DATE_LABELS.last}: ${printedDate(b.lastInspectionOn) ?? BLANK}`,
          `${INSPECTION_DATE_LABELS.next}: ${printedDate(board.nextInspectionOn) ?? BLANK}`,
        ],
      };
    case 'rcd-test': {
      const names = [...rcdNames(schedule).values()];
      // Combined AFDD/RCBOs have a test button too.
      const rcbos = schedule.devices.filter(hasOwnRcd).length;
      const here = [...names, rcbos ? `${rcbos} RCBO${rcbos > 1 ? 's' : ''}` : ''].filter(Boolean).join(', ');
      return { kind, ...wordingOf(kind, wording), symbol: null, details: here ? [`On this board: ${here}`] : [] };
    }
    case 'earthing':
      return {
        kind,
        // BS 7671:2018+A2 Regulation 514.13.1 // from memory (to check against the printed standard)
        title: 'Safety Electrical Connection – Do Not Remove',
        symbol: 'earth',
        regulation: 'BS 7671 514.13.1',
        body: '',
        details: [],
      };
    case 'mixed-colours':
      return {
        kind,
        ...wordingOf(kind, wording),
        symbol: 'warning',
        // BS 7671:2018+A2 Table 51 (current colours); the older ones from memory
        details: ['Older: red, yellow, blue lines; black neutral', 'Current: brown, black, grey lines; blue neutral'],
      };
    // Our words: BS 7671 asks for the warning (514.15.1) without words we could confirm.
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
