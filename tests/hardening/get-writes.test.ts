/** A GET changes nothing: a cross-site link that makes a browser fetch a print or a pack records no print. */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signupOwner, startTestApp, type TestApp } from '../helpers/app.js';
import { createBoardWith, makeSchedule } from '../helpers/boards.js';
import { getBinary, postBinary } from '../api/print-support.js';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => {
  await t.close();
});

describe('print recording needs a POST', () => {
  it('when a GET asks to record a print or fetches the pack, then no print is recorded', async () => {
    const owner = await signupOwner(t.app);
    const { id } = await createBoardWith(owner, makeSchedule(2));
    const refused = await owner.get(`/api/boards/${id}/pdf/chart?media=a4&record=1`).expect(400);
    expect(refused.body.error.fields.record).toMatch(/POST/);
    await getBinary(owner, `/api/boards/${id}/pack`).expect(200);
    expect((await owner.get(`/api/boards/${id}/prints`).expect(200)).body.items).toEqual([]);
  });

  it('when the POST comes without the CSRF token, then 403 and nothing is recorded; with it, one print', async () => {
    const owner = await signupOwner(t.app);
    const { id } = await createBoardWith(owner, makeSchedule(2));
    await owner.agent.post(`/api/boards/${id}/pdf/chart?media=a4`).expect(403);
    await owner.agent.post(`/api/boards/${id}/pack`).expect(403);
    expect((await owner.get(`/api/boards/${id}/prints`).expect(200)).body.items).toEqual([]);
    await postBinary(owner, `/api/boards/${id}/pdf/chart?media=a4`).expect(200);
    expect((await owner.get(`/api/boards/${id}/prints`).expect(200)).body.items).toHaveLength(1);
  });
});
