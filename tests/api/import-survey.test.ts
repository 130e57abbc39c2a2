import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Client, TestApp } from '../helpers/app.js';
import { createBoardWith, makeSchedule, startWithCast } from '../helpers/boards.js';

let t: TestApp, owner: Client;
beforeAll(async () => ({ t, owner } = await startWithCast('Survey File Test Ltd', 'Elsewhere Electrical')));
afterAll(async () => t.close());

/** A survey of an old rewireable board with one ring through a junction box (invented test data). */
function surveyed() {
  const s = makeSchedule(2) as any;
  s.survey = {
    oldBoard: 'Rewireable fuse board',
    ways: [
      {
        id: 'old1',
        reference: '1',
        feeds: 'Sockets, front rooms',
        kind: 'ring',
        legs: 2,
        device: { kind: 'fuse', fuseStandard: 'BS 3036', rating: 30 },
        readings: { insulation: { testVoltage: 500, lineEarth: 2.5 }, ring: { r1: 0.52, rn: 0.53, r2: 0.86 } },
        action: 'keep',
        targets: [{ circuitId: 'c1', way: 1, label: 'Sockets', kind: 'ring', legs: [{ leg: 1 }, { leg: 2, junctionBoxId: 'jb1' }] }],
      },
    ],
    junctionBoxes: [{ id: 'jb1', name: 'JB1', location: 'under the stairs' }],
  };
  return s;
}

describe('the survey in the board file', () => {
  it('when a board with a survey is exported and imported, then the survey comes back whole', async () => {
    const { id } = await createBoardWith(owner, surveyed());
    const exported = await owner.get(`/api/boards/${id}/export`).expect(200);
    expect(exported.body.format).toBe(2);
    const imported = await owner.post('/api/boards/import', exported.body).expect(201);
    const [a, b] = await Promise.all([owner.get(`/api/boards/${id}/schedule`), owner.get(`/api/boards/${imported.body.id}/schedule`)]);
    expect(b.body.survey).toEqual(a.body.survey);
    expect(b.body.survey.ways[0].device.fuseStandard).toBe('BS 3036');
    expect(b.body.survey.ways[0].targets[0].legs[1].junctionBoxId).toBe('jb1');
  });

  it('when a format 1 file (written before surveys) is imported, then it reads as it was, with no survey', async () => {
    const s = makeSchedule(2);
    const res = await owner.post('/api/boards/import', { format: 1, kind: 'waymark-board', ...s }).expect(201);
    const read = await owner.get(`/api/boards/${res.body.id}/schedule`).expect(200);
    expect(read.body.survey ?? null).toBeNull();
    expect(read.body.circuits).toHaveLength(s.circuits.length);
  });

  it('when a survey reading is out of range or a name has a line break, then 400 names the field', async () => {
    const s = surveyed();
    s.survey.ways[0].readings.insulation.testVoltage = 750;
    s.survey.junctionBoxes[0].name = 'JB1\nReview it';
    const res = await owner.post('/api/boards/import', { format: 2, kind: 'waymark-board', ...s }).expect(400);
    expect(Object.keys(res.body.error.fields)).toEqual(
      expect.arrayContaining(['survey.ways.0.readings.insulation.testVoltage', 'survey.junctionBoxes.0.name']),
    );
  });
});
