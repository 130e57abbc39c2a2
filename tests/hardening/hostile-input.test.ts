/**
 * Hostile input on every write route outside the boards component (which has its own property
 * tests): random and malformed JSON, huge strings, wrong types, unknown fields. Only 4xx answers
 * with a reason come back, never a 5xx, and a refused request writes nothing.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { count, eq } from 'drizzle-orm';
import { signupOwner, startTestApp, type Client, type TestApp } from '../helpers/app.js';
import { createBoardWith, makeSchedule } from '../helpers/boards.js';
import { handovers, invitations, organisations, reports, sheetLayouts, sites, users, boards } from '../../server/db/schema.js';

let t: TestApp;
let owner: Client;
let organisationId: number;
let boardId: number;
let token: string;
let memberId: number;

beforeAll(async () => {
  t = await startTestApp({
    rateLimits: { loginPerAccount: 10_000, loginPerIp: 10_000, publicPerMinute: 10_000, reportsPerHour: 10_000, sendsPerHour: 10_000 },
  });
  owner = await signupOwner(t.app, 'Hostile Routes Ltd');
  const me = (await owner.get('/api/auth/me').expect(200)).body;
  organisationId = me.organisation.id;
  memberId = me.user.id;
  boardId = (await createBoardWith(owner, makeSchedule(4))).id;
  token = (await owner.get(`/api/boards/${boardId}`).expect(200)).body.publicToken;
});
afterAll(async () => {
  await t.close();
});

/** What the organisation has stored: a refused request must leave every figure as it was. */
async function fingerprint() {
  const db = t.database.db;
  const n = async (table: any, col: any, value: number) => (await db.select({ n: count() }).from(table).where(eq(col, value)))[0].n;
  const [org] = await db.select().from(organisations).where(eq(organisations.id, organisationId));
  const [me] = await db.select({ role: users.role, disabled: users.disabled, hash: users.passwordHash }).from(users).where(eq(users.id, memberId));
  const [board] = await db.select({ revision: boards.revision, publicEnabled: boards.publicEnabled }).from(boards).where(eq(boards.id, boardId));
  return {
    org,
    me,
    board,
    users: await n(users, users.organisationId, organisationId),
    invitations: await n(invitations, invitations.organisationId, organisationId),
    sites: await n(sites, sites.organisationId, organisationId),
    sheetLayouts: await n(sheetLayouts, sheetLayouts.organisationId, organisationId),
    reports: await n(reports, reports.boardId, boardId),
    handovers: await n(handovers, handovers.boardId, boardId),
  };
}

const hugeString = fc.string({ minLength: 20_000, maxLength: 40_000 });
/** Random JSON, objects with the routes' own keys given wrong types or huge strings, and unknown keys. */
const hostileBody = fc.oneof(
  fc.jsonValue({ maxDepth: 3 }),
  fc.record(
    {
      email: fc.oneof(fc.string(), fc.integer(), hugeString, fc.constant(null)),
      role: fc.oneof(fc.string(), fc.constantFrom('admin', 'OWNER', ''), fc.integer()),
      name: fc.oneof(hugeString, fc.integer(), fc.array(fc.string())),
      password: fc.oneof(fc.string({ maxLength: 9 }), hugeString, fc.boolean()),
      token: fc.oneof(fc.string(), fc.integer()),
      message: fc.oneof(hugeString, fc.integer(), fc.constant('')),
      status: fc.oneof(fc.string(), fc.integer()),
      to: fc.oneof(fc.string(), fc.integer()),
      xMm: fc.oneof(fc.double(), fc.string(), fc.constant(1e9)),
      pageWidthMm: fc.oneof(fc.double(), fc.string()),
      unknownField: fc.anything(),
    },
    { requiredKeys: ['unknownField'] },
  ),
);

const routes = (): Array<['post' | 'put' | 'patch', string]> => [
  ['post', '/api/auth/signup'],
  ['post', '/api/auth/login'],
  ['post', '/api/auth/forgot'],
  ['post', '/api/auth/reset'],
  ['post', '/api/members/invitations'],
  ['patch', `/api/members/${memberId}`],
  ['post', '/api/invitations/accept'],
  ['put', '/api/organisation'],
  ['post', '/api/sheet-layouts'],
  ['put', '/api/print-settings/offset'],
  ['post', `/api/public/boards/${token}/reports`],
  ['post', `/api/boards/${boardId}/handover`],
  ['patch', `/api/boards/${boardId}/reports/999999`],
  ['patch', `/api/boards/${boardId}/photos/999999`],
];

describe('hostile input on the other write routes', () => {
  it('when random or malformed bodies arrive, then answers are 4xx with a reason and nothing is written', async () => {
    const before = await fingerprint();
    await fc.assert(
      fc.asyncProperty(fc.constantFrom(...routes()), hostileBody, async ([method, path], body) => {
        const res = await owner.agent[method](path).set('X-CSRF-Token', owner.csrf).set('Content-Type', 'application/json').send(JSON.stringify(body));
        const label = `${method.toUpperCase()} ${path} ${JSON.stringify(body).slice(0, 160)}`;
        expect(res.status, label).toBeGreaterThanOrEqual(400);
        expect(res.status, label).toBeLessThan(500);
        expect(typeof res.body.error?.message, label).toBe('string');
        if (res.status === 400) expect(res.body.error.fields, label).toBeTypeOf('object');
      }),
      { numRuns: 150 },
    );
    expect(await fingerprint()).toEqual(before);
  });

  it('when the body is not JSON at all, then every write route answers 400 naming the body', async () => {
    for (const [method, path] of routes()) {
      const res = await owner.agent[method](path).set('X-CSRF-Token', owner.csrf).set('Content-Type', 'application/json').send('{"email": "a@b.c", ');
      expect(res.status, `${method} ${path}`).toBe(400);
      expect(res.body.error.fields?.body, `${method} ${path}`).toBeTruthy();
    }
  });
});
