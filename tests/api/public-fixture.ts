/**
 * Fixtures for the board page, report, upload and handover tests: an invented domestic board
 * whose every private field carries a marker string (so a privacy test can search the public
 * JSON for "zqpriv"), stored through the sites and boards API as a user would.
 */
import type { ScheduleInput } from '../../shared/schemas/schedule.js';
import { putAtCurrentRevision, signupOwner, uniqueEmail, type Client } from '../helpers/app.js';
import type { Express } from 'express';

/** Every private value below contains this; none may reach the public JSON. */
export const PRIVATE_MARK = 'zqpriv';

export const markedSite = {
  reference: 'ZQPRIV-SITE-REF',
  clientName: 'Zqpriv Client Name',
  address: '12 Zqpriv Lane, Nowhere',
  clientEmail: 'zqpriv-client@example.test',
  clientPhone: 'zqpriv 01632 960999',
  notes: 'ZQPRIV site notes: key under the mat',
};

/**
 * A split-load board: RCD 1 protects ways 1–2, RCD 2 protects way 3, way 4 has its own RCBO.
 * Device and circuit ids (internal keys) carry the marker too.
 */
export function markedSchedule(): ScheduleInput {
  return {
    board: {
      name: 'Hallway consumer unit',
      location: 'Under the stairs',
      supply: { earthing: 'TN-C-S', ze: 0.28, pfcKa: 1.6, mainSwitchRating: 100 },
      lastInspectionOn: '2024-03-11',
      installationType: 'domestic',
      privateNotes: 'ZQPRIV board notes: alarm code 4471',
      publicNotes: 'Spare fuses are in the drawer by the back door.',
    },
    devices: [
      { id: 'zqprivMS', row: 1, kind: 'main-switch', modules: 2, poles: 2, rating: 100 },
      { id: 'zqprivRCD1', row: 1, kind: 'rcd', modules: 2, poles: 2, rating: 63, residualMa: 30, rcdType: 'A' },
      { id: 'zqprivB32', row: 1, kind: 'mcb', rating: 32, curve: 'B' },
      { id: 'zqprivB6', row: 1, kind: 'mcb', rating: 6, curve: 'B' },
      { id: 'zqprivRCD2', row: 1, kind: 'rcd', modules: 2, poles: 2, rating: 63, residualMa: 30, rcdType: 'A' },
      { id: 'zqprivB16', row: 1, kind: 'mcb', rating: 16, curve: 'B' },
      { id: 'zqprivRCBO', row: 1, kind: 'rcbo', rating: 40, curve: 'B', residualMa: 30, rcdType: 'A' },
    ],
    circuits: [
      {
        id: 'zqprivC1',
        way: 1,
        deviceId: 'zqprivB32',
        label: 'Kitchen sockets',
        kind: 'ring',
        socketOutlets: true,
        legs: 2,
        locations: ['Kitchen', 'Utility'],
        description: 'Ring final, worktop and appliance sockets',
        notes: 'ZQPRIV circuit note: client refused RCD upgrade',
        notesPublic: false,
        previousReference: 'ZQPRIV-OLD-7',
      },
      {
        id: 'zqprivC2',
        way: 2,
        deviceId: 'zqprivB6',
        label: 'Lights downstairs',
        kind: 'lighting',
        locations: ['Hall', 'Lounge'],
        notes: 'Junction box in the loft above the landing',
        notesPublic: true,
      },
      { id: 'zqprivC3', way: 3, deviceId: 'zqprivB16', label: 'Garage sockets', kind: 'radial', socketOutlets: true, locations: ['Garage'] },
      {
        id: 'zqprivC4',
        way: 4,
        deviceId: 'zqprivRCBO',
        label: 'Garden studio',
        kind: 'sub-main',
        locations: ['Studio', 'Garden'],
        description: 'Sub-main to the studio board',
      },
    ],
  };
}

/** Signs up an organisation whose owner's name carries the marker, with a public contact set. */
export async function signupMarkedOwner(app: Express, withContactEmail = true): Promise<Client & { email: string; contactEmail: string }> {
  const c = await signupOwner(app, 'Lanternfield Electrical', 'Zqpriv Owner Name');
  const contactEmail = withContactEmail ? uniqueEmail('office') : '';
  await putAtCurrentRevision(c, '/api/organisation', { name: 'Lanternfield Electrical', contactPhone: '01632 960123', contactEmail });
  return Object.assign(c, { contactEmail });
}

export interface StoredBoard {
  id: number;
  token: string;
  code: string;
  revision: number;
}

/**
 * Creates a board (on a new marked site) through the API, saves the schedule into it and switches
 * its page on (a new board's page starts off).
 */
export async function createBoard(owner: Client, schedule: ScheduleInput = markedSchedule(), withSite = true): Promise<StoredBoard> {
  const siteId = withSite ? ((await owner.post('/api/sites', markedSite).expect(201)).body.id as number) : null;
  const created = await owner.post('/api/boards', { name: schedule.board.name, siteId }).expect(201);
  const id = created.body.id as number;
  const current = await owner.get(`/api/boards/${id}/schedule`).expect(200);
  const saved = await owner.put(`/api/boards/${id}/schedule`, { ...schedule, baseRevision: current.body.revision }).expect(200);
  await owner.patch(`/api/boards/${id}/public`, { enabled: true }).expect(200);
  const summary = await owner.get(`/api/boards/${id}`).expect(200);
  return { id, token: summary.body.publicToken, code: summary.body.code, revision: saved.body.revision };
}
