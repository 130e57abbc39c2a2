import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Client, TestApp } from '../helpers/app.js';
import { createBoardWith, startWithCast } from '../helpers/boards.js';
import { bungalowBoard } from '../../server/seed/demo-bungalow.js';

let t: TestApp, owner: Client, viewer: Client, stranger: Client;
beforeAll(async () => ({ t, owner, viewer, stranger } = await startWithCast('Changeover Test Ltd', 'Elsewhere Electrical')));
afterAll(async () => t.close());

const surveyed = () => structuredClone(bungalowBoard.schedule);
const apply = (c: Client, id: number, body: unknown) => c.post(`/api/boards/${id}/changeover/apply`).send(body as object);

describe('POST /api/boards/:id/changeover/apply', () => {
  it('when the owner applies a whole plan, then one revision makes the planned circuits, and a second apply changes nothing', async () => {
    const { id, revision } = await createBoardWith(owner, surveyed());
    const res = await apply(owner, id, { baseRevision: revision }).expect(200);
    expect(res.body).toMatchObject({ revision: revision + 1, changed: true, updated: [] });
    expect([...res.body.created].sort()).toEqual(['cooker', 'kitchen-radial', 'lights', 'sockets-back', 'sockets-front']);
    const read = await owner.get(`/api/boards/${id}/schedule`).expect(200);
    expect(read.body.circuits.map((c: { way: number }) => c.way).sort()).toEqual([2, 3, 4, 5, 6]);
    expect(read.body.survey.ways).toHaveLength(7); // the survey stays with the board
    const history = await owner.get(`/api/boards/${id}/revisions`).expect(200);
    expect(JSON.stringify(history.body)).toContain('Sockets front');
    const again = await apply(owner, id, { baseRevision: revision + 1 }).expect(200);
    expect(again.body).toMatchObject({ revision: revision + 1, changed: false, created: [] });
  });

  it('when the board moved on since it was opened, then 409 stale and nothing is applied', async () => {
    const { id, revision } = await createBoardWith(owner, surveyed());
    const s = surveyed();
    s.board.location = 'Moved';
    await owner
      .put(`/api/boards/${id}/schedule`)
      .send({ ...s, baseRevision: revision })
      .expect(200);
    const res = await apply(owner, id, { baseRevision: revision }).expect(409);
    expect(res.body).toMatchObject({ error: { code: 'stale' }, revision: revision + 1 });
    expect((await owner.get(`/api/boards/${id}/schedule`)).body.circuits).toEqual([]);
  });

  it('when the plan has a gap, then 400 names the survey fields and the board is unchanged', async () => {
    const s = surveyed();
    s.survey!.ways[0]!.action = null;
    s.survey!.ways[1]!.targets[0]!.legs = [{ leg: 1, junctionBoxId: null }];
    const { id, revision } = await createBoardWith(owner, s);
    const res = await apply(owner, id, { baseRevision: revision }).expect(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['survey.ways.0.action', 'survey.ways.1.targets']);
    const read = await owner.get(`/api/boards/${id}/schedule`).expect(200);
    expect(read.body).toMatchObject({ revision, circuits: [] });
  });

  it('when the body is missing or odd, then 400 on baseRevision; a board without a survey is 400 on survey', async () => {
    const { id } = await createBoardWith(owner, surveyed());
    expect((await apply(owner, id, {}).expect(400)).body.error.fields).toHaveProperty('baseRevision');
    expect((await apply(owner, id, { baseRevision: 'x', extra: 1 }).expect(400)).body.error.fields).toHaveProperty('baseRevision');
    const plain = surveyed();
    delete plain.survey;
    const other = await createBoardWith(owner, plain);
    const res = await apply(owner, other.id, { baseRevision: other.revision }).expect(400);
    expect(res.body.error.fields).toEqual({ survey: 'This board has no survey of an old board to plan from' });
  });

  it("when a viewer applies, then 403; another organisation's owner gets 404; neither changes the board", async () => {
    const { id, revision } = await createBoardWith(owner, surveyed());
    await apply(viewer, id, { baseRevision: revision }).expect(403);
    await apply(stranger, id, { baseRevision: revision }).expect(404);
    const read = await owner.get(`/api/boards/${id}/schedule`).expect(200);
    expect(read.body).toMatchObject({ revision, circuits: [] });
  });
});
