/**
 * Fixture factories for tests that need boards: an invented schedule of any size, a board made
 * through the API, and extra members of an organisation (electrician, viewer) signed in.
 */
import { scheduleSchema, type Schedule, type ScheduleInput } from '../../shared/schemas/schedule.js';
import { hashPassword } from '../../server/auth/passwords.js';
import { users } from '../../server/db/schema.js';
import type { Role } from '../../shared/schemas/auth.js';
import { client, signupOwner, startTestApp, TEST_PASSWORD, uniqueEmail, type Client, type TestApp } from './app.js';

const ROOMS = ['Kitchen', 'Hall', 'Landing', 'Garage', 'Utility', 'Lounge', 'Bedroom 1', 'Bedroom 2', 'Bathroom', 'Loft', 'Porch', 'Study'];

/** Invented circuit number n: sockets, lighting and radials in turn, each on its own RCBO. */
function circuitFor(n: number, threePhase: boolean): ScheduleInput['circuits'][number] {
  const way = threePhase ? Math.ceil(n / 3) : n;
  const phase = threePhase ? (['L1', 'L2', 'L3'] as const)[(n - 1) % 3] : null;
  const room = ROOMS[(n - 1) % ROOMS.length];
  const kind = n % 3 === 1 ? 'ring' : n % 3 === 2 ? 'lighting' : 'radial';
  const cable = kind === 'ring' ? { liveCsa: 2.5, cpcCsa: 1.5 } : kind === 'lighting' ? { liveCsa: 1.5, cpcCsa: 1 } : { liveCsa: 2.5, cpcCsa: 1.5 };
  return {
    id: `c${n}`,
    way,
    phase,
    deviceId: `d${n}`,
    label: `${room} ${kind === 'lighting' ? 'lights' : 'sockets'} ${n}`.slice(0, 24),
    description: `${kind} circuit serving the ${room.toLowerCase()}`,
    kind,
    socketOutlets: kind !== 'lighting',
    cable: { type: 'twin-earth', ...cable, referenceMethod: 'C', lengthM: 12 + (n % 20) },
    points: 4 + (n % 6),
    locations: [room],
    legs: kind === 'ring' ? 2 : 1,
    measuredZs: 0.4 + (n % 10) / 20,
  };
}

/**
 * A valid schedule with `circuits` circuits (1 to 2000): a main switch, then one RCBO per circuit
 * (B32 for rings and radials, B6 for lighting), invented rooms, circuit ids c1, c2…. Up to 999 it is a
 * single-phase board with ways 1…n; above that (way numbers stop at 999) a three-phase board with
 * L1/L2/L3 on each way. Reused by other tests and the bench.
 */
export function makeSchedule(circuits = 10, name = 'Test consumer unit'): Schedule {
  const devices: ScheduleInput['devices'] = [{ id: 'main', row: 1, kind: 'main-switch', modules: 2, poles: 2, rating: 100 }];
  const list = [];
  const threePhase = circuits > 999;
  for (let n = 1; n <= circuits; n++) {
    const c = circuitFor(n, threePhase);
    list.push(c);
    devices.push({
      id: `d${n}`,
      row: Math.min(12, 1 + Math.floor(n / 70)),
      kind: 'rcbo',
      rating: c.kind === 'lighting' ? 6 : 32,
      curve: 'B',
      breakingCapacityKa: 6,
      residualMa: 30,
      rcdType: 'A',
    });
  }
  return scheduleSchema.parse({
    board: {
      name,
      location: 'Under the stairs, behind the coat hooks',
      rows: Math.min(12, 1 + Math.floor(circuits / 70)),
      modulesPerRow: 72,
      phases: threePhase ? 3 : 1,
      supply: { earthing: 'TN-C-S', nominalVoltage: 230, ze: 0.35, pfcKa: 1.8, mainSwitchRating: 100, tailsCsa: 25, mainEarthCsa: 16, mainBondingCsa: 10 },
      installedOn: '2021-05-14',
      lastInspectionOn: '2021-05-14',
    },
    devices,
    circuits: list,
  });
}

/** Makes a board through the API and saves a schedule into it; returns its id and revision (2). */
export async function createBoardWith(c: Client, schedule: Schedule = makeSchedule(), siteId?: number): Promise<{ id: number; revision: number }> {
  const created = await c.post('/api/boards', { name: schedule.board.name, ...(siteId ? { siteId } : {}) });
  if (created.status !== 201) throw new Error(`create board: ${created.status} ${JSON.stringify(created.body)}`);
  const id = created.body.id as number;
  const saved = await c.put(`/api/boards/${id}/schedule`, { ...schedule, baseRevision: 1 });
  if (saved.status !== 200) throw new Error(`save schedule: ${saved.status} ${JSON.stringify(saved.body)}`);
  return { id, revision: saved.body.revision as number };
}

/** Adds a member with the given role to the owner's organisation (row inserted directly) and signs them in. */
export async function addMember(t: TestApp, owner: Client, role: Role): Promise<Client & { email: string; userId: number }> {
  const me = await owner.get('/api/auth/me').expect(200);
  const email = uniqueEmail(role);
  const [row] = await t.database.db
    .insert(users)
    .values({
      organisationId: me.body.organisation.id,
      email,
      name: `Test ${role}`,
      role,
      passwordHash: await hashPassword(TEST_PASSWORD),
    })
    .$returningId();
  const c = await client(t.app);
  await c.post('/api/auth/login', { email, password: TEST_PASSWORD }).expect(200);
  return Object.assign(c, { email, userId: row.id });
}

/** The people most boards API tests need: an owner, a viewer of the same organisation, and an owner of another. */
export interface Cast {
  t: TestApp;
  owner: Client;
  viewer: Client;
  stranger: Client;
}

/** Starts a test app and signs up the cast; the caller closes `t` when done. */
export async function startWithCast(organisation: string, otherOrganisation: string): Promise<Cast> {
  const t = await startTestApp();
  const owner = await signupOwner(t.app, organisation);
  const viewer = await addMember(t, owner, 'viewer');
  const stranger = await signupOwner(t.app, otherOrganisation);
  return { t, owner, viewer, stranger };
}
