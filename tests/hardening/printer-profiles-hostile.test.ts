/**
 * Hostile input on the printer profile writes and the images route's query: random and malformed
 * JSON, wrong types, huge strings and numbers, unknown fields. Only 4xx answers with a reason come
 * back, never a 5xx, and a refused profile write stores nothing.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { count, eq } from 'drizzle-orm';
import { signupOwner, startTestApp, type Client, type TestApp } from '../helpers/app.js';
import { createBoardWith, makeSchedule } from '../helpers/boards.js';
import { printerProfiles } from '../../server/db/schema.js';

let t: TestApp;
let owner: Client;
let organisationId: number;
let boardId: number;
let profileId: number;

beforeAll(async () => {
  t = await startTestApp();
  owner = await signupOwner(t.app, 'Hostile Printers Ltd');
  organisationId = (await owner.get('/api/auth/me').expect(200)).body.organisation.id;
  boardId = (await createBoardWith(owner, makeSchedule(2))).id;
  const made = await owner.post('/api/printer-profiles').send({ name: 'Kept', dpi: 180, bands: {}, endMarginMm: 2, cutsBetweenLabels: true }).expect(201);
  profileId = made.body.id;
});
afterAll(async () => {
  await t.close();
});

async function stored() {
  const db = t.database.db;
  const [{ n }] = await db.select({ n: count() }).from(printerProfiles).where(eq(printerProfiles.organisationId, organisationId));
  const [row] = await db.select().from(printerProfiles).where(eq(printerProfiles.id, profileId));
  return { n, row };
}

const number = fc.oneof(fc.double(), fc.integer(), fc.string(), fc.constant(1e308), fc.constant(-0), fc.constant(null));
const hostileProfile = fc.oneof(
  fc.jsonValue({ maxDepth: 3 }),
  fc.record(
    {
      name: fc.oneof(fc.string({ minLength: 81, maxLength: 20_000 }), fc.integer(), fc.constant(''), fc.constant('a\nb')),
      dpi: number,
      bands: fc.oneof(fc.dictionary(fc.string(), number), fc.array(number), fc.string(), fc.record({ '12': fc.double({ min: 12.01, max: 1e6 }) })),
      endMarginMm: number,
      cutsBetweenLabels: fc.oneof(fc.string(), fc.integer(), fc.constant(null)),
      baseRevision: number,
      unknownField: fc.anything(),
    },
    { requiredKeys: ['unknownField'] },
  ),
);

describe('hostile printer profiles', () => {
  it('when random bodies are sent to add or change a profile, then answers are 4xx with a reason and nothing is stored', async () => {
    const before = await stored();
    await fc.assert(
      fc.asyncProperty(
        fc.constantFrom<['post' | 'put', string]>(['post', '/api/printer-profiles'], ['put', `/api/printer-profiles/${profileId}`]),
        hostileProfile,
        async ([method, path], body) => {
          const res = await owner[method](path).set('Content-Type', 'application/json').send(JSON.stringify(body));
          const label = `${method.toUpperCase()} ${path} ${JSON.stringify(body).slice(0, 160)}`;
          expect(res.status, label).toBeGreaterThanOrEqual(400);
          expect(res.status, label).toBeLessThan(500);
          if (res.status === 400) expect(res.body.error.fields, label).toBeTypeOf('object');
        },
      ),
      { numRuns: 120 },
    );
    expect(await stored()).toEqual(before);
  });

  it('when the images route gets hostile query values, then it answers 4xx, never 5xx', async () => {
    const value = fc.oneof(
      fc.string({ maxLength: 40 }),
      fc.constant('1e400'),
      fc.constant('-1'),
      fc.constant('0x10'),
      fc.constant(' 180 '),
      fc.constant('NaN'),
    );
    await fc.assert(
      fc.asyncProperty(fc.constantFrom('dpi', 'profile', 'media', 'copies', 'record'), value, async (key, v) => {
        const res = await owner.get(`/api/boards/${boardId}/image/tag?${new URLSearchParams({ [key]: v })}`);
        if (res.status === 200) return; // a value that happens to be valid
        expect(res.status, `${key}=${v}`).toBeGreaterThanOrEqual(400);
        expect(res.status, `${key}=${v}`).toBeLessThan(500);
      }),
      { numRuns: 60 },
    );
  });
});
