/** Printer profiles: stored per organisation, saved against their revision, and used by the images route. */
import { PNG } from 'pngjs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signupOwner, startTestApp, type TestApp } from '../helpers/app.js';
import { addMember, createBoardWith, makeSchedule } from '../helpers/boards.js';
import { readZipEntries } from '../helpers/zip.js';
import { getBinary } from './print-support.js';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => {
  await t.close();
});

const MM_PER_INCH = 25.4; // ISO 80000-1: 1 in = 25.4 mm exactly
/** An invented handheld printer: 12 mm tape printed on a 7 mm band, 3 mm left at each end. */
const handheld = { name: 'Van printer', dpi: 180, bands: { '12': 7 }, endMarginMm: 3, cutsBetweenLabels: false };

describe('printer profiles', () => {
  it('when an owner adds, changes and removes a profile, then each answer carries the revision and a stale save is 409', async () => {
    const owner = await signupOwner(t.app);
    const made = (await owner.post('/api/printer-profiles').send(handheld).expect(201)).body;
    expect(made).toMatchObject({ ...handheld, revision: 1 });
    const changed = (
      await owner
        .put(`/api/printer-profiles/${made.id}`)
        .send({ ...handheld, dpi: 360, baseRevision: 1 })
        .expect(200)
    ).body;
    expect(changed).toMatchObject({ dpi: 360, revision: 2 });
    const stale = await owner
      .put(`/api/printer-profiles/${made.id}`)
      .send({ ...handheld, dpi: 203, baseRevision: 1 })
      .expect(409);
    expect(stale.body).toMatchObject({ error: { code: 'stale' }, revision: 2 });
    await owner.put(`/api/printer-profiles/${made.id}`).send(handheld).expect(400);
    expect((await owner.get('/api/printer-profiles').expect(200)).body.items).toHaveLength(1);
    await owner.delete(`/api/printer-profiles/${made.id}`).expect(204);
    await owner.get(`/api/printer-profiles/${made.id}`).expect(404);
  });

  it('when a profile is wrong, then 400 names each field', async () => {
    const owner = await signupOwner(t.app);
    const res = await owner
      .post('/api/printer-profiles')
      .send({ name: '', dpi: 20, bands: { '12': 14, '7': 5 }, endMarginMm: -1, cutsBetweenLabels: 'maybe' })
      .expect(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['bands', 'bands.12', 'cutsBetweenLabels', 'dpi', 'endMarginMm', 'name'].sort());
  });

  it('when a viewer or another organisation reaches for a profile, then viewers read only and strangers find nothing', async () => {
    const owner = await signupOwner(t.app);
    const made = (await owner.post('/api/printer-profiles').send(handheld).expect(201)).body;
    const viewer = await addMember(t, owner, 'viewer');
    expect((await viewer.get('/api/printer-profiles').expect(200)).body.items).toHaveLength(1);
    await viewer.post('/api/printer-profiles').send(handheld).expect(403);
    await viewer.delete(`/api/printer-profiles/${made.id}`).expect(403);
    const stranger = await signupOwner(t.app, 'Other Electrical');
    await stranger.get(`/api/printer-profiles/${made.id}`).expect(404);
    await stranger
      .put(`/api/printer-profiles/${made.id}`)
      .send({ ...handheld, baseRevision: 1 })
      .expect(404);
    const { id } = await createBoardWith(stranger, makeSchedule(2));
    await stranger.get(`/api/boards/${id}/image/flags?media=tape-12&profile=${made.id}`).expect(404);
  });
});

describe('images drawn for a profile', () => {
  it('when flags are printed with a profile, then its dpi sizes them and nothing is black outside its 7 mm band', async () => {
    const owner = await signupOwner(t.app);
    const profile = (await owner.post('/api/printer-profiles').send(handheld).expect(201)).body;
    const { id } = await createBoardWith(owner, makeSchedule(2));
    const zip = await getBinary(owner, `/api/boards/${id}/image/flags?media=tape-12&profile=${profile.id}`).expect(200);
    const entries = readZipEntries(zip.body);
    expect(entries[0].name).toMatch(/-tape-12-180dpi-01\.png$/);
    const scale = 180 / MM_PER_INCH;
    // The band is centred on the 12 mm tape: 2.5 mm unprinted each side.
    const [top, bottom] = [2.5 * scale, 9.5 * scale];
    for (const e of entries) {
      const png = PNG.sync.read(e.data);
      expect(png.height).toBe(Math.round(12 * scale));
      let outside = 0;
      let inside = 0;
      for (let y = 0; y < png.height; y++)
        for (let x = 0; x < png.width; x++) {
          if (png.data[(y * png.width + x) * 4] !== 0) continue;
          if (y + 1 <= top || y >= bottom) outside++;
          else inside++;
        }
      expect(outside).toBe(0);
      expect(inside).toBeGreaterThan(100);
    }
  });

  it('when the calibration image is asked for with a profile, then it is drawn at the profile dpi, and dpi= overrides it', async () => {
    const owner = await signupOwner(t.app);
    const profile = (
      await owner
        .post('/api/printer-profiles')
        .send({ ...handheld, dpi: 300 })
        .expect(201)
    ).body;
    const png = PNG.sync.read((await getBinary(owner, `/api/print-settings/calibration/image?media=tape-12&profile=${profile.id}`).expect(200)).body);
    expect(png.height).toBe(Math.round((12 * 300) / MM_PER_INCH)); // 12 mm tape at 300 dpi
    const other = PNG.sync.read((await getBinary(owner, `/api/print-settings/calibration/image?media=tape-12&profile=${profile.id}&dpi=203`).expect(200)).body);
    expect(other.height).toBe(Math.round((12 * 203) / MM_PER_INCH));
  });
});
