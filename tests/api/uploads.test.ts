import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { and, eq } from 'drizzle-orm';
import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { PNG } from 'pngjs';
import { PDFDocument } from 'pdf-lib';
import { files } from '../../server/db/schema.js';
import { photoListSchema } from '../../shared/schemas/photos.js';
import { client, startTestApp, type Client, type TestApp } from '../helpers/app.js';
import { addMember } from '../helpers/accounts.js';
import { createBoard, signupMarkedOwner } from './public-fixture.js';

let t: TestApp;
let jpeg: Buffer;
beforeAll(async () => {
  t = await startTestApp();
  jpeg = await realJpeg();
});
afterAll(async () => {
  await t.close();
});

/** A real PNG from pngjs (an encoder independent of the sniffing code). */
function realPng(width = 8, height = 8): Buffer {
  const png = new PNG({ width, height });
  png.data.fill(0x80);
  return PNG.sync.write(png);
}

/** A real JPEG: a one-page PDF rendered by poppler's pdftoppm. */
async function realJpeg(): Promise<Buffer> {
  const doc = await PDFDocument.create();
  doc.addPage([20, 20]);
  const dir = mkdtempSync(join(tmpdir(), 'waymark-jpeg-'));
  try {
    writeFileSync(join(dir, 'in.pdf'), await doc.save());
    execFileSync('pdftoppm', ['-jpeg', '-r', '36', '-singlefile', join(dir, 'in.pdf'), join(dir, 'out')]);
    return readFileSync(join(dir, 'out.jpg'));
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

const orgIdOf = async (c: Client) => (await c.get('/api/auth/me').expect(200)).body.organisation.id as number;
const storedFiles = async (organisationId: number, kind: 'logo' | 'photo') =>
  t.database.db
    .select({ id: files.id, mime: files.mime, size: files.size })
    .from(files)
    .where(and(eq(files.organisationId, organisationId), eq(files.kind, kind)));

const putLogo = (c: Client, data: Buffer, filename: string, contentType: string) =>
  c.agent.put('/api/organisation/logo').set('X-CSRF-Token', c.csrf).attach('file', data, { filename, contentType });
const postPhoto = (c: Client, boardId: number, data: Buffer, filename: string, contentType: string, caption = '') =>
  c.agent.post(`/api/boards/${boardId}/photos`).set('X-CSRF-Token', c.csrf).field('caption', caption).attach('file', data, { filename, contentType });

describe('organisation logo', () => {
  it('when the owner uploads a PNG, then the stored copy is served back and shown on the board page', async () => {
    const owner = await signupMarkedOwner(t.app);
    const board = await createBoard(owner, undefined, false);
    const png = realPng();
    expect((await owner.get('/api/organisation').expect(200)).body.hasLogo).toBe(false);
    const put = (await putLogo(owner, png, 'logo.png', 'image/png').expect(201)).body;
    expect(put).toMatchObject({ mime: 'image/png' });
    expect((await owner.get('/api/organisation').expect(200)).body.hasLogo).toBe(true);
    const back = await owner.get('/api/organisation/logo').buffer(true).expect(200);
    expect(back.headers['content-type']).toBe('image/png');
    // Stored re-encoded at most at print size (a small logo is never enlarged): same pixels, decoded by pngjs.
    expect(back.body.length).toBe(put.size);
    expect(PNG.sync.read(back.body as Buffer).data).toEqual(PNG.sync.read(png).data);
    const page = await request(t.app).get(`/api/public/boards/${board.token}`).expect(200);
    expect(page.body.contractor.hasLogo).toBe(true);
    const pub = await request(t.app).get(`/api/public/boards/${board.token}/logo`).buffer(true).expect(200);
    expect(Buffer.compare(pub.body as Buffer, back.body as Buffer)).toBe(0);
    await owner.patch(`/api/boards/${board.id}/public`, { enabled: false }).expect(200);
    await request(t.app).get(`/api/public/boards/${board.token}/logo`).expect(404);
    await owner.delete('/api/organisation/logo').expect(204);
    expect((await owner.get('/api/organisation').expect(200)).body.hasLogo).toBe(false);
    await owner.get('/api/organisation/logo').expect(404);
  });

  it('when a PNG is named .jpg and declared as JPEG, then it is still stored as a PNG; a real JPEG as a JPEG', async () => {
    const owner = await signupMarkedOwner(t.app);
    const orgId = await orgIdOf(owner);
    await putLogo(owner, realPng(), 'photo.jpg', 'image/jpeg').expect(201);
    expect((await storedFiles(orgId, 'logo')).map((f) => f.mime)).toEqual(['image/png']);
    await putLogo(owner, jpeg, 'logo.png', 'image/png').expect(201);
    // A new logo replaces the old one.
    expect((await storedFiles(orgId, 'logo')).map((f) => f.mime)).toEqual(['image/jpeg']);
    expect((await owner.get('/api/organisation/logo').expect(200)).headers['content-type']).toBe('image/jpeg');
  });

  it('when a text file is named .png, then 400 saying it must be a PNG or JPEG, and nothing is kept', async () => {
    const owner = await signupMarkedOwner(t.app);
    const res = await putLogo(owner, Buffer.from('<svg onload="alert(1)">not an image</svg>'), 'logo.png', 'image/png').expect(400);
    expect(res.body.error.message).toMatch(/PNG or JPEG/);
    expect(res.body.error.fields.file).toBeTruthy();
    expect(await storedFiles(await orgIdOf(owner), 'logo')).toEqual([]);
    await owner.get('/api/organisation/logo').expect(404);
  });

  it('when the logo is over 2 MB, then 413 with a clear message and nothing is kept', async () => {
    const owner = await signupMarkedOwner(t.app);
    const png = realPng();
    const big = Buffer.concat([png, Buffer.alloc(2 * 1024 * 1024 + 1 - png.length)]);
    const res = await putLogo(owner, big, 'big.png', 'image/png').expect(413);
    expect(res.body.error.message).toMatch(/larger than 2 MB/);
    expect(await storedFiles(await orgIdOf(owner), 'logo')).toEqual([]);
    // Exactly 2 MB is allowed.
    await putLogo(owner, big.subarray(0, 2 * 1024 * 1024), 'ok.png', 'image/png').expect(201);
  });

  it('when no file or two files are sent, then 400; an electrician may not change the logo; signed out 401', async () => {
    const owner = await signupMarkedOwner(t.app);
    expect((await owner.agent.put('/api/organisation/logo').set('X-CSRF-Token', owner.csrf).field('caption', 'x').expect(400)).body.error.fields.file).toBe(
      'Required',
    );
    await owner.agent
      .put('/api/organisation/logo')
      .set('X-CSRF-Token', owner.csrf)
      .attach('file', realPng(), 'a.png')
      .attach('file', realPng(), 'b.png')
      .expect(400);
    const electrician = await addMember(t, owner, 'electrician');
    await putLogo(electrician, realPng(), 'logo.png', 'image/png').expect(403);
    await electrician.get('/api/organisation/logo').expect(404);
    const anonymous = await client(t.app);
    await putLogo(anonymous, realPng(), 'logo.png', 'image/png').expect(401);
    expect(await storedFiles(await orgIdOf(owner), 'logo')).toEqual([]);
  });
});

describe('board photos', () => {
  it('when an electrician adds a captioned photo, then members list and fetch it; the public page never shows it', async () => {
    const owner = await signupMarkedOwner(t.app);
    const board = await createBoard(owner, undefined, false);
    const electrician = await addMember(t, owner, 'electrician');
    const created = await postPhoto(electrician, board.id, jpeg, 'before.jpeg', 'image/jpeg', 'Before: old fuse box').expect(201);
    expect(created.body).toMatchObject({ caption: 'Before: old fuse box', mime: 'image/jpeg' });
    const viewer = await addMember(t, owner, 'viewer');
    const list = photoListSchema.parse((await viewer.get(`/api/boards/${board.id}/photos`).expect(200)).body);
    expect(list.items.map((p) => p.caption)).toEqual(['Before: old fuse box']);
    const bytes = await viewer.get(`/api/boards/${board.id}/photos/${created.body.id}`).buffer(true).expect(200);
    expect(bytes.headers['content-type']).toBe('image/jpeg');
    expect(bytes.headers['cache-control']).toBe('private, no-store');
    expect(bytes.body.length).toBe(created.body.size);
    expect((bytes.body as Buffer).subarray(0, 3)).toEqual(Buffer.from([0xff, 0xd8, 0xff])); // JPEG SOI and marker (ITU-T T.81 B.1.1.3)
    await viewer.patch(`/api/boards/${board.id}/photos/${created.body.id}`, { caption: 'x' }).expect(403);
    await postPhoto(viewer, board.id, jpeg, 'v.jpg', 'image/jpeg').expect(403);

    const page = await request(t.app).get(`/api/public/boards/${board.token}`).expect(200);
    expect(JSON.stringify(page.body)).not.toContain('old fuse box');
    await request(t.app).get(`/api/public/boards/${board.token}/photos/${created.body.id}`).expect(404);
    await request(t.app).get(`/api/boards/${board.id}/photos/${created.body.id}`).expect(401);
  });

  it('when a photo is recaptioned and deleted, then the list follows; another organisation gets 404 throughout', async () => {
    const owner = await signupMarkedOwner(t.app);
    const board = await createBoard(owner, undefined, false);
    const photo = (await postPhoto(owner, board.id, realPng(), 'after.png', 'image/png', 'After').expect(201)).body;
    const other = await signupMarkedOwner(t.app);
    const otherBoard = await createBoard(other, undefined, false);
    await other.get(`/api/boards/${board.id}/photos`).expect(404);
    await other.get(`/api/boards/${board.id}/photos/${photo.id}`).expect(404);
    await other.get(`/api/boards/${otherBoard.id}/photos/${photo.id}`).expect(404);
    await other.delete(`/api/boards/${otherBoard.id}/photos/${photo.id}`).expect(404);
    await postPhoto(other, board.id, realPng(), 'x.png', 'image/png').expect(404);

    await owner.patch(`/api/boards/${board.id}/photos/${photo.id}`, { caption: 'After: new consumer unit' }).expect(204);
    expect((await owner.get(`/api/boards/${board.id}/photos`).expect(200)).body.items[0].caption).toBe('After: new consumer unit');
    expect((await owner.patch(`/api/boards/${board.id}/photos/${photo.id}`, { caption: 'x'.repeat(201) }).expect(400)).body.error.fields.caption).toBeTruthy();
    await owner.delete(`/api/boards/${board.id}/photos/${photo.id}`).expect(204);
    expect((await owner.get(`/api/boards/${board.id}/photos`).expect(200)).body.items).toEqual([]);
    await owner.delete(`/api/boards/${board.id}/photos/${photo.id}`).expect(404);
  });

  it('when a photo is over 10 MB, not an image, or has a bad caption, then 413/400 and nothing is kept', async () => {
    const owner = await signupMarkedOwner(t.app);
    const board = await createBoard(owner, undefined, false);
    const orgId = await orgIdOf(owner);
    const big = Buffer.concat([jpeg, Buffer.alloc(10 * 1024 * 1024 + 1 - jpeg.length)]);
    expect((await postPhoto(owner, board.id, big, 'big.jpg', 'image/jpeg').expect(413)).body.error.message).toMatch(/larger than 10 MB/);
    expect((await postPhoto(owner, board.id, Buffer.from('%PDF-1.7 not a photo'), 'photo.jpg', 'image/jpeg').expect(400)).body.error.fields.file).toBeTruthy();
    expect((await postPhoto(owner, board.id, realPng(), 'ok.png', 'image/png', 'x'.repeat(201)).expect(400)).body.error.fields.caption).toBeTruthy();
    await owner.agent
      .post(`/api/boards/${board.id}/photos`)
      .set('X-CSRF-Token', owner.csrf)
      .field('caption', 'a')
      .field('path', '../../etc/passwd')
      .attach('file', realPng(), '../../evil.png')
      .expect(400);
    expect(await storedFiles(orgId, 'photo')).toEqual([]);
    await owner.get(`/api/boards/${board.id}/photos/abc`).expect(400);
  });
});
