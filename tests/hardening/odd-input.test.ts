/** Odd input that used to reach a 500: a lone surrogate in a name, a non-ASCII CSRF header, and a made-up link token that cost a password hash. */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { hashPassword } from '../../server/auth/passwords.js';
import { client, signupOwner, startTestApp, TEST_PASSWORD, type TestApp } from '../helpers/app.js';
import { makeSchedule } from '../helpers/boards.js';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => {
  await t.close();
});

describe('odd input', () => {
  it('when a board name holds a lone UTF-16 surrogate, then create and save answer 400 naming the field', async () => {
    const owner = await signupOwner(t.app);
    const created = await owner.post('/api/boards', { name: 'a\ud800b' }).expect(400);
    expect(created.body.error.fields.name).toMatch(/surrogate/);
    const { id } = (await owner.post('/api/boards', { name: 'Fine' }).expect(201)).body;
    const schedule = makeSchedule(1);
    schedule.board.name = 'x\udc00';
    const saved = await owner.put(`/api/boards/${id}/schedule`, { ...schedule, baseRevision: 1 }).expect(400);
    expect(saved.body.error.fields['board.name']).toMatch(/surrogate/);
  });

  it('when the X-CSRF-Token header is non-ASCII of the right length, then 403 with the reason, not 500', async () => {
    const owner = await signupOwner(t.app);
    const res = await owner.agent.post('/api/boards').set('X-CSRF-Token', 'é'.repeat(owner.csrf.length)).send({ name: 'x' });
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('csrf');
  });

  it('when reset and accept get made-up tokens, then they answer 400 without hashing the password (faster than the hashes alone)', async () => {
    const anon = await client(t.app);
    const tries = 6;
    // Baseline in the same run: what six hashes cost on this machine now.
    const hashStart = performance.now();
    for (let i = 0; i < tries; i++) await hashPassword(TEST_PASSWORD);
    const hashMs = performance.now() - hashStart;
    const start = performance.now();
    for (let i = 0; i < tries; i++) {
      await anon.post('/api/auth/reset', { token: `made-up-token-${i}-xxxxxxxx`, password: TEST_PASSWORD }).expect(400);
      await anon.post('/api/invitations/accept', { token: `made-up-token-${i}-xxxxxxxx`, name: 'Nobody', password: TEST_PASSWORD }).expect(400);
    }
    const requestsMs = performance.now() - start;
    // Twelve requests that each hashed would take at least twice the six hashes.
    expect(requestsMs).toBeLessThan(hashMs);
  });
});
