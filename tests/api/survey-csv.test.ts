import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { parse } from 'csv-parse/sync';
import type { Client, TestApp } from '../helpers/app.js';
import { createBoardWith, makeSchedule, startWithCast } from '../helpers/boards.js';
import { bungalowBoard } from '../../server/seed/demo-bungalow.js';

let t: TestApp, owner: Client, viewer: Client, stranger: Client;
beforeAll(async () => ({ t, owner, viewer, stranger } = await startWithCast('Survey CSV Test Ltd', 'Elsewhere Electrical')));
afterAll(async () => t.close());

/** Reads the CSV with an independent parser (csv-parse, RFC 4180), one object per row keyed by header. */
const rowsOf = (text: string) => parse(text, { columns: true, bom: true, skip_empty_lines: true }) as Array<Record<string, string>>;

describe('the survey CSV and the readings columns of the circuit CSV', () => {
  it('when a surveyed board is exported, then each old way is a row with its readings, plan and verdict', async () => {
    const { id } = await createBoardWith(owner, structuredClone(bungalowBoard.schedule));
    const res = await viewer.get(`/api/boards/${id}/survey.csv`).expect(200);
    expect(res.headers['content-type']).toMatch(/^text\/csv/);
    expect(res.headers['content-disposition']).toMatch(/-survey\.csv"$/);
    const rows = rowsOf(res.text);
    expect(rows.map((r) => r.reference)).toEqual(['Fuse 1 (red dot)', 'Fuse 2', 'Fuse 3', 'Fuse 4', 'Fuse 5', 'Fuse 6', 'Fuse 7 (no label)']);
    const front = rows[0]!;
    expect(front).toMatchObject({ device: 'fuse', fuse_standard: 'BS 3036', rating_a: '30', live_csa: '2.5', ring_r1: '0.48', zs: '0.68', action: 'keep' });
    expect(front.new_ways).toBe('3 Sockets front (RCBO B32 30 mA; leg 2 via JB1)');
    // The back ring's Zs (1.52 Ω) is over the 1.37 Ω of the planned B32 (BS 7671:2018+A2 Table 41.3)
    expect(rows[1]!.verdict).toBe('fix before changeover');
    expect(rows[1]!.findings).toContain('1.37 Ω');
    expect(rows[6]).toMatchObject({ action: 'retire', new_ways: '', verdict: 'ok' });
  });

  it("when a board has no survey, then 400 on survey; another organisation's board is 404", async () => {
    const { id } = await createBoardWith(owner, makeSchedule(2));
    const res = await owner.get(`/api/boards/${id}/survey.csv`).expect(400);
    expect(res.body.error.fields).toHaveProperty('survey');
    const surveyed = await createBoardWith(owner, structuredClone(bungalowBoard.schedule));
    await stranger.get(`/api/boards/${surveyed.id}/survey.csv`).expect(404);
  });

  it("when a circuit's readings are exported and imported, then they come back; a board without readings re-imports unchanged", async () => {
    const s = makeSchedule(3);
    s.circuits[0]!.readings = {
      insulation: { testVoltage: 500, lineLine: 200, lineEarth: 150, neutralEarth: 120 },
      r1PlusR2: 0.32,
      r2: null,
      ring: { r1: 0.48, rn: 0.49, r2: 0.8 },
      polarity: 'correct',
      zs: null,
    };
    const { id, revision } = await createBoardWith(owner, s);
    const csv = (await owner.get(`/api/boards/${id}/circuits.csv`).expect(200)).text;
    const rows = rowsOf(csv);
    expect(rows[0]).toMatchObject({ ir_test_voltage: '500', ir_line_earth: '150', r1_plus_r2: '0.32', ring_rn: '0.49', polarity: 'correct' });
    expect(rows[1]).toMatchObject({ ir_line_earth: '', polarity: '' });
    // Re-importing the same file changes nothing: no reading appears on circuits that had none.
    const again = await owner.post(`/api/boards/${id}/circuits/import-csv`).send({ csv, baseRevision: revision }).expect(200);
    expect(again.body.changed).toBe(false);
    // A changed reading in the file is taken; a bad one is refused by its cell.
    const edited = csv.replace(',0.32,', ',0.35,');
    const saved = await owner.post(`/api/boards/${id}/circuits/import-csv`).send({ csv: edited, baseRevision: revision }).expect(200);
    expect(saved.body.changed).toBe(true);
    const read = await owner.get(`/api/boards/${id}/schedule`).expect(200);
    expect(read.body.circuits[0].readings.r1PlusR2).toBe(0.35);
    expect(read.body.circuits[1].readings ?? null).toBeNull();
    const bad = csv.replace(',500,', ',750,');
    const refused = await owner
      .post(`/api/boards/${id}/circuits/import-csv`)
      .send({ csv: bad, baseRevision: revision + 1 })
      .expect(400);
    expect(refused.body.error.fields).toHaveProperty('rows.2.ir_test_voltage');
  });
});
