import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { signupOwner, startTestApp, type Client, type TestApp } from '../helpers/app.js';
import { createBoardWith, makeSchedule } from '../helpers/boards.js';

let t: TestApp;
let owner: Client;
let boardId: number;
beforeAll(async () => {
  t = await startTestApp();
  owner = await signupOwner(t.app, 'Hostile Input Ltd');
  boardId = (await createBoardWith(owner, makeSchedule(3))).id;
});
afterAll(async () => {
  await t.close();
});

/** Any JSON value, with huge strings and deep-ish nesting now and then. */
const anyJson = fc.oneof(
  fc.jsonValue({ maxDepth: 4 }),
  fc.record({ name: fc.string({ maxLength: 5000 }), location: fc.anything(), siteId: fc.oneof(fc.integer(), fc.double(), fc.string()) }, { requiredKeys: [] }),
);

/** A valid schedule with one field somewhere replaced by something of the wrong kind. */
const brokenSchedule = fc
  .tuple(fc.constantFrom('board', 'devices', 'circuits'), fc.nat(2), fc.string({ maxLength: 20 }), fc.anything())
  .map(([part, i, key, value]) => {
    const s: any = structuredClone(makeSchedule(3));
    if (part === 'board') s.board[key || 'name'] = value;
    else s[part][i][key || 'id'] = value;
    return { ...s, baseRevision: 2 };
  });

async function expectRefused(res: { status: number; body: any }, label: string) {
  expect(res.status, label).toBeGreaterThanOrEqual(400);
  expect(res.status, label).toBeLessThan(500);
}

describe('hostile input on the boards write routes', () => {
  it('when random JSON is sent to every write route, then only 4xx answers with a reason come back and the schedule is unchanged', async () => {
    const before = (await owner.get(`/api/boards/${boardId}/schedule`).expect(200)).body;
    const routes: Array<['post' | 'put' | 'patch', string]> = [
      ['post', '/api/boards'],
      ['post', '/api/boards/import'],
      ['put', `/api/boards/${boardId}/schedule`],
      ['patch', `/api/boards/${boardId}`],
      ['patch', `/api/boards/${boardId}/public`],
      ['post', `/api/boards/${boardId}/circuits/import-csv`],
      ['post', '/api/sites'],
    ];
    await fc.assert(
      fc.asyncProperty(fc.constantFrom(...routes), anyJson, async ([method, path], body) => {
        // sent as raw JSON text: supertest cannot send a bare number, string or boolean itself
        const res = await owner.agent[method](path).set('X-CSRF-Token', owner.csrf).set('Content-Type', 'application/json').send(JSON.stringify(body));
        if (res.status < 400) {
          // a few random bodies are valid (e.g. an empty PATCH, a name for a new board): those may succeed
          expect([200, 201, 204], `${method} ${path} ${JSON.stringify(body).slice(0, 200)}`).toContain(res.status);
          return;
        }
        await expectRefused(res, `${method} ${path}`);
        expect(res.body.error.fields ?? res.body.error.message).toBeTruthy();
      }),
      { numRuns: 80 },
    );
    const after = (await owner.get(`/api/boards/${boardId}/schedule`).expect(200)).body;
    expect(after).toEqual(before);
    await fc.assert(
      fc.asyncProperty(brokenSchedule, async (body) => {
        const res = await owner.put(`/api/boards/${boardId}/schedule`, body);
        if (res.status === 200) return; // the change happened to be valid (e.g. a new label)
        await expectRefused(res, JSON.stringify(body).slice(0, 200));
      }),
      { numRuns: 40 },
    );
  });

  it('when the CSV text is random, then the import answers 400 or 200, never 5xx, and a refused file writes nothing', async () => {
    await fc.assert(
      fc.asyncProperty(fc.string({ maxLength: 400 }), async (csv) => {
        const { revision } = (await owner.get(`/api/boards/${boardId}`).expect(200)).body;
        const res = await owner.post(`/api/boards/${boardId}/circuits/import-csv`, { csv: `way,label\n${csv}`, baseRevision: revision });
        expect([200, 400], csv).toContain(res.status);
        if (res.status === 400) expect((await owner.get(`/api/boards/${boardId}`).expect(200)).body.revision).toBe(revision);
      }),
      { numRuns: 50 },
    );
  });
});
