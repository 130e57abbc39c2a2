/**
 * Uploads that declare a huge or empty image: refused at upload with the limit named, so no print
 * ever decodes one. A normal logo is stored once at its print size.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import sharp from 'sharp';
import { PNG } from 'pngjs';
import type { Client } from '../helpers/app.js';
import { signupOwner, startTestApp, type TestApp } from '../helpers/app.js';
import { createBoardWith, makeSchedule } from '../helpers/boards.js';
import { LOGO_STORED_SIDE_PX, MAX_SIDE_PX } from '../../server/uploads/pixels.js';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => {
  await t.close();
});

const putLogo = (c: Client, data: Buffer) =>
  c.agent.put('/api/organisation/logo').set('X-CSRF-Token', c.csrf).attach('file', data, { filename: 'logo.png', contentType: 'image/png' });

/** A PNG header (signature and IHDR, PNG spec 5.2 and 11.2.2) declaring the given size, with no image data after it. */
function pngHeader(width: number, height: number): Buffer {
  const ihdr = Buffer.alloc(13);
  ihdr.writeUInt32BE(width, 0);
  ihdr.writeUInt32BE(height, 4);
  ihdr.set([8, 2, 0, 0, 0], 8);
  const len = Buffer.alloc(4);
  len.writeUInt32BE(13);
  return Buffer.concat([Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]), len, Buffer.from('IHDR'), ihdr, Buffer.alloc(4)]);
}

describe('image sizes at upload', () => {
  it('when a small file declares 8000 × 8000 pixels, then 400 names the limit and nothing is stored', async () => {
    const owner = await signupOwner(t.app);
    const huge = await sharp({ create: { width: 8000, height: 8000, channels: 3, background: '#ffffff' } })
      .png({ compressionLevel: 9 })
      .toBuffer();
    expect(huge.length).toBeLessThan(2 * 1024 * 1024);
    const res = await putLogo(owner, huge).expect(400);
    expect(res.body.error.fields.file).toContain(String(MAX_SIDE_PX));
    expect((await owner.get('/api/organisation').expect(200)).body.hasLogo).toBe(false);
  });

  it('when a PNG header says width 0, then 400 and the charts still print', async () => {
    const owner = await signupOwner(t.app);
    await putLogo(owner, pngHeader(0, 100)).expect(400);
    const { id } = await createBoardWith(owner, makeSchedule(3));
    await owner.get(`/api/boards/${id}/pdf/chart?media=a4`).expect(200);
  });

  it('when a 2000 × 1000 logo is uploaded, then it is stored at its print size and a chart prints with it', async () => {
    const owner = await signupOwner(t.app);
    const png = new PNG({ width: 2000, height: 1000 });
    png.data.fill(0x40);
    await putLogo(owner, PNG.sync.write(png)).expect(201);
    const back = await owner.get('/api/organisation/logo').buffer(true).expect(200);
    const meta = await sharp(back.body as Buffer).metadata();
    expect([meta.width, meta.height]).toEqual([LOGO_STORED_SIDE_PX, LOGO_STORED_SIDE_PX / 2]);
    const { id } = await createBoardWith(owner, makeSchedule(3));
    await owner.get(`/api/boards/${id}/pdf/chart?media=a4`).expect(200);
  });
});
