import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { parse } from 'csv-parse/sync';
import type { Client, TestApp } from '../helpers/app.js';
import { createBoardWith, makeSchedule, startWithCast } from '../helpers/boards.js';
import { boardFileSchema } from '../../shared/schemas/schedule.js';

let t: TestApp, owner: Client, viewer: Client;
beforeAll(async () => ({ t, owner, viewer } = await startWithCast('Design Current Test Ltd', 'Elsewhere Electrical')));
afterAll(async () => t.close());

/** Reads the CSV with an independent parser (csv-parse, RFC 4180), one object per row keyed by header. */
const rowsOf = (text: string) => parse(text, { columns: true, bom: true, skip_empty_lines: true }) as Array<Record<string, string>>;

/** makeSchedule(3): c1 a ring on a B32 RCBO, c2 lighting on a B6, c3 a radial on a B32; Ib on the first two, c3's cleared (null, as the editor leaves it). */
function withIb() {
  const s = makeSchedule(3);
  s.circuits[0].designCurrent = 26;
  s.circuits[1].designCurrent = 1.5;
  s.circuits[2].designCurrent = null;
  return s;
}

describe('the design current Ib of a circuit', () => {
  it('when Ib is saved, then GET answers it, the check uses it, and the board file carries it at format 2', async () => {
    const { id } = await createBoardWith(owner, withIb());
    const read = (await viewer.get(`/api/boards/${id}/schedule`).expect(200)).body;
    expect(read.circuits.map((c: { designCurrent?: number | null }) => c.designCurrent ?? null)).toEqual([26, 1.5, null]);
    // Ib 40 A on the B32 ring is over In: 433.1.1 (Ib ≤ In) on that circuit's field
    read.circuits[0].designCurrent = 40;
    await owner.put(`/api/boards/${id}/schedule`, { ...read, baseRevision: read.revision }).expect(200);
    const { findings } = (await viewer.get(`/api/boards/${id}/check`).expect(200)).body;
    expect(findings.filter((f: { code: string }) => f.code === 'design-current-over-rating').map((f: { field: string }) => f.field)).toEqual([
      'circuits.0.designCurrent',
    ]);
    const file = (await viewer.get(`/api/boards/${id}/export`).expect(200)).body;
    expect(file.format).toBe(2); // an optional field needs no format bump
    expect(boardFileSchema.parse(file).circuits[0].designCurrent).toBe(40);
  });

  it('when Ib is out of range or not a number, then 400 names circuits.<n>.designCurrent and nothing is saved', async () => {
    const { id, revision } = await createBoardWith(owner, makeSchedule(3));
    for (const bad of [0, -1, 4001, '6']) {
      const s = makeSchedule(3) as unknown as { circuits: Array<Record<string, unknown>> };
      s.circuits[2].designCurrent = bad;
      const res = await owner.put(`/api/boards/${id}/schedule`, { ...s, baseRevision: revision }).expect(400);
      expect(Object.keys(res.body.error.fields)).toEqual(['circuits.2.designCurrent']);
    }
    expect((await owner.get(`/api/boards/${id}`).expect(200)).body.revision).toBe(revision);
  });

  it('when the circuits are exported as CSV, then design_current carries Ib, and the same file re-imports unchanged', async () => {
    const { id, revision } = await createBoardWith(owner, withIb());
    const csv = (await viewer.get(`/api/boards/${id}/circuits.csv`).expect(200)).text;
    const rows = rowsOf(csv);
    expect(rows.map((r) => r.design_current)).toEqual(['26', '1.5', '']);
    const again = await owner.post(`/api/boards/${id}/circuits/import-csv`, { csv, baseRevision: revision }).expect(200);
    expect(again.body.changed).toBe(false);
  });

  it('when a CSV sets, changes and clears Ib, then the schedule follows; a file without the column keeps Ib', async () => {
    const { id, revision } = await createBoardWith(owner, withIb());
    const csv = 'id,way,label,design_current\nc1,1,Ring,20\nc2,2,Lights,\nc3,3,Radial,"12,5"\n';
    const res = await owner.post(`/api/boards/${id}/circuits/import-csv`, { csv, baseRevision: revision }).expect(200);
    expect(res.body.changed).toBe(true);
    const after = (await owner.get(`/api/boards/${id}/schedule`).expect(200)).body;
    expect(after.circuits.map((c: { designCurrent?: number | null }) => c.designCurrent ?? null)).toEqual([20, null, 12.5]);
    const older = await owner.post(`/api/boards/${id}/circuits/import-csv`, {
      csv: 'id,way,label\nc1,1,Ring\nc2,2,Lights\nc3,3,Radial\n',
      baseRevision: after.revision,
    });
    expect(older.status).toBe(200);
    const kept = (await owner.get(`/api/boards/${id}/schedule`).expect(200)).body;
    expect(kept.circuits.map((c: { designCurrent?: number | null }) => c.designCurrent ?? null)).toEqual([20, null, 12.5]);
  });

  it('when a CSV cell holds a bad Ib, then 400 on rows.<n>.design_current and nothing is imported', async () => {
    const { id, revision } = await createBoardWith(owner, withIb());
    const csv = 'id,way,label,design_current\nc1,1,Ring,lots\nc2,2,Lights,0\nc3,3,Radial,4001\n';
    const res = await owner.post(`/api/boards/${id}/circuits/import-csv`, { csv, baseRevision: revision }).expect(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['rows.2.design_current', 'rows.3.design_current', 'rows.4.design_current']);
    expect((await owner.get(`/api/boards/${id}`).expect(200)).body.revision).toBe(revision);
  });
});
