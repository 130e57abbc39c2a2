/**
 * Builds the public board page's data from a schedule. It copies named fields only, so the
 * client's details, private notes, device ids and anything added to the schedule later stay
 * out unless someone adds them here on purpose (and the privacy test sees them).
 * Pure: the organisation's contact, the revision date and the next inspection come in as `meta`.
 */
import type { Circuit, Device, Schedule } from '../schemas/schedule.js';
import type { PublicBoard, PublicDinPlace, PublicRcdGroup, PublicWay, PublicWayRcd } from '../schemas/public-board.js';
import { deviceKindName, deviceShortText, feedsAnotherBoard, hasOwnRcd, rcdFor, rcdGroups, rcdNames, wayText } from '../schedule/derive.js';
import { boardWays, type SpareWay } from '../schedule/ways.js';
import { boardCautions } from './cautions.js';
import { dinPlaces, publicDinRows } from './din-rows.js';
import { supplyVoltages, supplyVoltageText } from '../schedule/voltage.js';

/** The board page's address, as the QR code and the sharing screen give it. */
export function boardPageUrl(publicBaseUrl: string, token: string): string {
  return `${publicBaseUrl}/b/${token}`;
}

/** What the server adds around the schedule; all of it is public by the organisation's choice. */
export interface PublicBoardMeta {
  organisation: { name: string; contactPhone: string; contactEmail: string };
  hasLogo: boolean;
  revision: number;
  /** YYYY-MM-DD the current revision was saved. */
  revisionDate: string;
  /** YYYY-MM-DD from the rule set (last inspection + interval), or null when unknown. */
  nextInspectionOn: string | null;
}

/** Device text for a visitor: the kind spelled out ("MCB B32", "RCBO B16 30 mA"), as on the chart. */
export function publicDeviceText(d: Device): string {
  const short = deviceShortText(d);
  const kind = deviceKindName(d);
  if (d.kind === 'blank') return '';
  return short.startsWith(kind) ? short : `${kind} ${short}`.trim();
}

function wayRcd(rcd: Device | null | undefined, names: Map<string, string>): PublicWayRcd | null {
  if (!rcd) return null;
  if (hasOwnRcd(rcd)) return { kind: 'rcbo', residualMa: rcd.residualMa };
  return { kind: 'rcd', name: names.get(rcd.id) ?? 'RCD', residualMa: rcd.residualMa };
}

/** Lookups every way needs, built once per board. */
interface WayLookups {
  rcds: Map<string, Device | null>;
  names: Map<string, string>;
  places: Map<string, PublicDinPlace>;
}

function publicWay(c: Circuit, devices: Map<string, Device>, { rcds, names, places }: WayLookups): PublicWay {
  const device = c.deviceId ? devices.get(c.deviceId) : undefined;
  return {
    way: c.way,
    phase: c.phase,
    wayText: wayText(c),
    label: c.label,
    description: c.description,
    locations: [...c.locations],
    device: device ? publicDeviceText(device) : '',
    rcd: c.deviceId ? wayRcd(rcds.get(c.deviceId), names) : null,
    notes: c.notesPublic ? c.notes : '',
    feedsAnotherBoard: feedsAnotherBoard(c),
    spare: false,
    place: c.deviceId ? (places.get(c.deviceId) ?? null) : null,
  };
}

/** A spare way as a visitor sees it: numbered, called Spare, with its device and RCD. */
function publicSpare(s: SpareWay, { rcds, names, places }: WayLookups): PublicWay {
  return {
    way: s.way,
    phase: s.phase,
    wayText: s.wayText,
    label: 'Spare',
    description: '',
    locations: [],
    device: publicDeviceText(s.device),
    rcd: wayRcd(rcds.get(s.device.id), names),
    notes: '',
    feedsAnotherBoard: false,
    spare: true,
    place: places.get(s.device.id) ?? null,
  };
}

function publicRcdGroups(schedule: Schedule): PublicRcdGroup[] {
  return rcdGroups(schedule).map((g) => ({
    name: g.name,
    device: publicDeviceText(g.rcd),
    rcdType: g.rcd.rcdType,
    ways: g.circuits.map((c) => ({ wayText: wayText(c), label: c.label, feedsAnotherBoard: feedsAnotherBoard(c) })),
  }));
}

/** The public projection of one board: the only shape `GET /api/public/boards/:token` answers. */
export function toPublicBoard(schedule: Schedule, meta: PublicBoardMeta): PublicBoard {
  const { board } = schedule;
  const devices = new Map(schedule.devices.map((d) => [d.id, d]));
  const lookups: WayLookups = { rcds: rcdFor(schedule), names: rcdNames(schedule), places: dinPlaces(schedule) };
  return {
    board: { name: board.name, location: board.location, phases: board.phases },
    contractor: {
      name: meta.organisation.name,
      phone: meta.organisation.contactPhone,
      email: meta.organisation.contactEmail,
      hasLogo: meta.hasLogo,
    },
    supply: {
      earthing: board.supply.earthing,
      nominalVoltage: board.supply.nominalVoltage,
      betweenPhasesVoltage: supplyVoltages(board.phases, board.supply.nominalVoltage).betweenPhases,
      voltageText: supplyVoltageText(board.phases, board.supply.nominalVoltage),
      ze: board.supply.ze,
      pfcKa: board.supply.pfcKa,
      mainSwitchRating: board.supply.mainSwitchRating,
      alternativeSupply: {
        present: board.alternativeSupply.present,
        kinds: [...board.alternativeSupply.kinds],
        description: board.alternativeSupply.description,
      },
    },
    ways: boardWays(schedule).map((w) => (w.kind === 'circuit' ? publicWay(w.circuit, devices, lookups) : publicSpare(w.spare, lookups))),
    dinRows: publicDinRows(schedule),
    rcdGroups: publicRcdGroups(schedule),
    inspection: { lastOn: board.lastInspectionOn, nextOn: meta.nextInspectionOn },
    revision: { number: meta.revision, date: meta.revisionDate },
    publicNotes: board.publicNotes,
    cautions: boardCautions(board),
  };
}
