import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { publicBoardSchema } from '../../shared/schemas/public-board.js';
import { devicePlaceText, wayPlaceSentence } from '../../shared/public/device-place.js';
import type { ScheduleInput } from '../../shared/schemas/schedule.js';
import { startTestApp, type TestApp } from '../helpers/app.js';
import { createBoard, markedSchedule, PRIVATE_MARK, signupMarkedOwner } from './public-fixture.js';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => {
  await t.close();
});

/** The marked board with a second row whose RCD test times and manual RCD link are recorded: both stay private. */
function twoRowMarkedSchedule(): ScheduleInput {
  const base = markedSchedule();
  return {
    ...base,
    board: { ...base.board, rows: 2, rcdMode: 'manual' },
    devices: [
      ...base.devices.map((d) => (d.kind === 'mcb' ? { ...d, protectedBy: d.id === 'zqprivB16' ? 'zqprivRCD2' : 'zqprivRCD1' } : d)),
      { id: 'zqprivRCD3', row: 2, kind: 'rcd', modules: 2, poles: 2, rating: 40, residualMa: 30, rcdType: 'A', rcdTrip: { atRated: 23, atFiveTimes: 11 } },
      { id: 'zqprivB20', row: 2, kind: 'mcb', rating: 20, curve: 'B', breakingCapacityKa: 6, protectedBy: 'zqprivRCD3' },
    ],
    circuits: [...base.circuits, { id: 'zqprivC5', way: 5, deviceId: 'zqprivB20', label: 'Workshop sockets', locations: ['Shed'] }],
  };
}

describe('the board page’s DIN rows in the public JSON', () => {
  it('when a board is read by token, then it carries every device’s kind, width, poles, name and face in rail order, and each way its place', async () => {
    const owner = await signupMarkedOwner(t.app);
    const board = await createBoard(owner, twoRowMarkedSchedule());
    const page = publicBoardSchema.parse((await request(t.app).get(`/api/public/boards/${board.token}`).expect(200)).body);
    expect(page.dinRows.modulesPerRow).toBe(18);
    expect(page.dinRows.rows.map((r) => r.devices.map((d) => [d.kind, d.modules, d.poles]))).toEqual([
      [
        ['main-switch', 2, 2],
        ['rcd', 2, 2],
        ['mcb', 1, 1],
        ['mcb', 1, 1],
        ['rcd', 2, 2],
        ['mcb', 1, 1],
        ['rcbo', 1, 1],
      ],
      [
        ['rcd', 2, 2],
        ['mcb', 1, 1],
      ],
    ]);
    expect(page.dinRows.rows[0].devices.map((d) => d.label)).toEqual(['', 'RCD 1', '', '', 'RCD 2', '', '']);
    expect(page.dinRows.rows[0].devices[5].face).toEqual({ main: 'B16', sub: '' });
    expect(page.ways.map((w) => [w.wayText, w.place])).toEqual([
      ['1', { row: 1, index: 2 }],
      ['2', { row: 1, index: 3 }],
      ['3', { row: 1, index: 5 }],
      ['4', { row: 1, index: 6 }],
      ['5', { row: 2, index: 1 }],
    ]);
    // The words come from the JSON alone: the garage way sits after RCD 2 on the top row.
    const garage = page.ways.find((w) => w.label === 'Garage sockets')!;
    expect(wayPlaceSentence(garage, page.dinRows.rows)).toBe(
      'The switch for way 3 (Garage sockets) is the MCB B16, 6th from the left on the top row, after RCD 2.',
    );
    expect(devicePlaceText(page.dinRows.rows, page.ways[4].place!)).toBe('2nd and last from the left on the 2nd row, after RCD 3');
  });

  it('when the rows are read, then no device carries an id, an RCD link, test readings or anything marked private', async () => {
    const owner = await signupMarkedOwner(t.app);
    const board = await createBoard(owner, twoRowMarkedSchedule());
    const body = (await request(t.app).get(`/api/public/boards/${board.token}`).expect(200)).body;
    // The private values are really stored: members see the test times and links.
    const stored = JSON.stringify((await owner.get(`/api/boards/${board.id}/schedule`).expect(200)).body);
    expect(stored).toContain('"atFiveTimes":11');
    expect(stored).toContain('"protectedBy":"zqprivRCD3"');
    expect(JSON.stringify(body).toLowerCase()).not.toContain(PRIVATE_MARK);
    for (const row of body.dinRows.rows)
      for (const device of row.devices) {
        expect(Object.keys(device).sort()).toEqual(['face', 'kind', 'label', 'modules', 'poles']);
        expect(Object.keys(device.face).sort()).toEqual(['main', 'sub']);
      }
    for (const way of body.ways) expect(way.place === null || Object.keys(way.place).sort().join() === 'index,row').toBe(true);
    expect(JSON.stringify(body.dinRows)).not.toMatch(/rcdTrip|atRated|protectedBy|breakingCapacity|"id"/);
  });
});
