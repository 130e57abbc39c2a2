import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { noticeWordingListSchema } from '../../shared/schemas/notice-wording.js';
import { prescribedNotices } from '../../shared/notices/prescribed-wording.js';
import { signupOwner, startTestApp, type Client, type TestApp } from '../helpers/app.js';
import { addMember, createBoardWith, makeSchedule } from '../helpers/boards.js';
import { getPdf, pdfPages } from './print-support.js';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => {
  await t.close();
});

const OWN = { title: 'Monthly RCD check', body: 'Press T on every RCD on the first of each month. If one does not trip, ring Kernow Circuits.' };

async function noticeText(c: Client, boardId: number, kinds = 'rcd-test'): Promise<string> {
  const res = await getPdf(c, `/api/boards/${boardId}/pdf/notices?media=a4&kinds=${kinds}`).expect(200);
  return (await pdfPages(res.body)).join(' ');
}

async function revisionOf(c: Client): Promise<number> {
  return noticeWordingListSchema.parse((await c.get('/api/organisation/notice-wording').expect(200)).body).revision;
}

describe('notice wording per organisation', () => {
  it('when nothing is set, then every member reads the prescribed words with each regulation, and notices print them', async () => {
    const owner = await signupOwner(t.app, 'Prescribed Ltd');
    const viewer = await addMember(t, owner, 'viewer');
    const list = noticeWordingListSchema.parse((await viewer.get('/api/organisation/notice-wording').expect(200)).body);
    expect(list.notices.map((n) => [n.kind, n.regulation, n.custom])).toEqual([
      ['inspection', 'BS 7671 514.12.1', null], // BS 7671:2018+A2 514.12.1
      ['rcd-test', 'BS 7671 514.12.2', null], // BS 7671:2018+A2 514.12.2
      ['mixed-colours', 'BS 7671 514.14.1', null], // BS 7671:2018+A2 514.14.1
    ]);
    const board = await createBoardWith(owner, makeSchedule(3));
    expect(await noticeText(viewer, board.id)).toContain('Test six-monthly by pressing the relevant test button(s)'); // BS 7671 514.12.2 (from memory)
  });

  it('when the owner sets a wording, then every board of the organisation prints it with the regulation number, and another organisation does not', async () => {
    const owner = await signupOwner(t.app, 'Kernow Circuits Ltd');
    const electrician = await addMember(t, owner, 'electrician');
    const stranger = await signupOwner(t.app, 'Elsewhere Ltd');
    const [b1, b2] = [await createBoardWith(owner, makeSchedule(3)), await createBoardWith(electrician, makeSchedule(4, 'Garage board'))];
    const theirs = await createBoardWith(stranger, makeSchedule(3));

    const saved = await owner.put('/api/organisation/notice-wording', { kind: 'rcd-test', wording: OWN, baseRevision: await revisionOf(owner) }).expect(200);
    expect(noticeWordingListSchema.parse(saved.body).notices.find((n) => n.kind === 'rcd-test')!.custom).toEqual(OWN);

    for (const id of [b1.id, b2.id]) {
      const text = await noticeText(electrician, id);
      expect(text).toContain(OWN.title);
      expect(text).toContain('Press T on every RCD on the first of each month.');
      expect(text).toContain('BS 7671 514.12.2'); // the regulation prints whatever the wording
      expect(text).not.toContain('Test six-monthly');
    }
    const other = await noticeText(stranger, theirs.id);
    expect(other).not.toContain(OWN.title);
    expect(other).toContain('Test six-monthly'); // BS 7671 514.12.2 (from memory)
    // The other notices keep the prescribed words.
    expect(await noticeText(owner, b1.id, 'inspection')).toContain(prescribedNotices.inspection.wording.body.slice(0, 50));
  });

  it('when the owner resets a notice, then it prints the prescribed words again', async () => {
    const owner = await signupOwner(t.app, 'Reset Ltd');
    const board = await createBoardWith(owner, makeSchedule(3));
    await owner.put('/api/organisation/notice-wording', { kind: 'rcd-test', wording: OWN, baseRevision: await revisionOf(owner) }).expect(200);
    const reset = await owner.put('/api/organisation/notice-wording', { kind: 'rcd-test', wording: null, baseRevision: await revisionOf(owner) }).expect(200);
    expect(reset.body.notices.every((n: { custom: unknown }) => n.custom === null)).toBe(true);
    const text = await noticeText(owner, board.id);
    expect(text).not.toContain(OWN.title);
    expect(text).toContain('Test six-monthly'); // BS 7671 514.12.2 (from memory)
  });

  it('when an electrician or a viewer tries to change the wording, then 403 and nothing changes', async () => {
    const owner = await signupOwner(t.app, 'Roles Ltd');
    for (const role of ['electrician', 'viewer'] as const) {
      const member = await addMember(t, owner, role);
      const res = await member.put('/api/organisation/notice-wording', { kind: 'inspection', wording: OWN, baseRevision: await revisionOf(owner) });
      expect(res.status).toBe(403);
    }
    const list = noticeWordingListSchema.parse((await owner.get('/api/organisation/notice-wording').expect(200)).body);
    expect(list.notices.every((n) => n.custom === null)).toBe(true);
  });

  it('when the input is bad, then 400 with the field paths and nothing is stored', async () => {
    const owner = await signupOwner(t.app, 'Hostile Ltd');
    const baseRevision = await revisionOf(owner);
    const cases: Array<[object, string]> = [
      [{ kind: 'rcd-test', wording: { title: 'x', body: 'y'.repeat(501) }, baseRevision }, 'wording.body'],
      [{ kind: 'rcd-test', wording: { title: '', body: 'Press T' }, baseRevision }, 'wording.title'],
      [{ kind: 'rcd-test', wording: { title: 'Two\nlines', body: 'Press T' }, baseRevision }, 'wording.title'],
      [{ kind: 'voltage', wording: OWN, baseRevision }, 'kind'],
      [{ kind: 'rcd-test', wording: { ...OWN, colour: 'red' }, baseRevision }, 'wording'],
      [{ kind: 'rcd-test', wording: OWN }, 'baseRevision'],
      [{ kind: 'rcd-test', wording: OWN, baseRevision, extra: 1 }, '(body)'],
    ];
    for (const [body, field] of cases) {
      const res = await owner.put('/api/organisation/notice-wording', body).expect(400);
      expect(Object.keys(res.body.error.fields ?? {})).toContain(field);
    }
    expect(await revisionOf(owner)).toBe(baseRevision);
  });

  it('when a wording is saved from an old revision, then 409 stale with the current revision', async () => {
    const owner = await signupOwner(t.app, 'Stale Ltd');
    const first = await revisionOf(owner);
    await owner.put('/api/organisation', { name: 'Stale Two Ltd', contactPhone: '', contactEmail: '', baseRevision: first }).expect(200);
    const res = await owner.put('/api/organisation/notice-wording', { kind: 'inspection', wording: OWN, baseRevision: first }).expect(409);
    expect(res.body).toMatchObject({ error: { code: 'stale' }, revision: first + 1 });
  });
});
