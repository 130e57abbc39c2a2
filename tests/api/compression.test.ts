/**
 * Dynamic responses go out compressed: brotli where the client accepts it, gzip otherwise, and
 * nothing below the threshold or already compressed (PDF, ZIP). Raw bytes are read over plain
 * node:http (supertest decodes bodies itself) and decoded with node:zlib, independently of the server.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createServer, request as httpRequest, type IncomingHttpHeaders, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { brotliDecompressSync, gunzipSync } from 'node:zlib';
import { demoSites } from '../../server/seed/demo-data.js';
import { COMPRESSION_THRESHOLD, preferredCoding } from '../../server/http/compression.js';
import { signupOwner, startTestApp, type TestApp } from '../helpers/app.js';
import { createBoard } from './public-fixture.js';
import { getBinary } from './print-support.js';

let t: TestApp;
let server: Server;
let base: string;
beforeAll(async () => {
  t = await startTestApp();
  server = createServer(t.app);
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
});
afterAll(async () => {
  await new Promise((resolve) => server?.close(resolve));
  await t?.close();
});

interface Raw {
  status: number;
  headers: IncomingHttpHeaders;
  body: Buffer;
}

/** A GET sending exactly these headers; the body comes back as sent on the wire. */
function rawGet(path: string, headers: Record<string, string>): Promise<Raw> {
  return new Promise((resolve, reject) => {
    httpRequest(base + path, { headers }, (res) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => resolve({ status: res.statusCode ?? 0, headers: res.headers, body: Buffer.concat(chunks) }));
      res.on('error', reject);
    })
      .on('error', reject)
      .end();
  });
}

/** The demo flat's main board (nine ways): its board page JSON is well over the threshold. */
const flatMain = demoSites[0].boards.find((b) => b.key === 'flat-main')!.schedule;

describe('compressed API responses', () => {
  it('when board page JSON over the threshold is asked for with br, then it comes back brotli and decodes to the same JSON', async () => {
    const owner = await signupOwner(t.app);
    const board = await createBoard(owner, flatMain, false);
    const path = `/api/public/boards/${board.token}`;
    const plain = await rawGet(path, { 'Accept-Encoding': 'identity' });
    expect(plain.status).toBe(200);
    expect(plain.headers['content-encoding']).toBeUndefined();
    expect(plain.body.length).toBeGreaterThan(COMPRESSION_THRESHOLD);

    const br = await rawGet(path, { 'Accept-Encoding': 'br' });
    expect(br.headers['content-encoding']).toBe('br');
    expect(br.headers.vary).toMatch(/accept-encoding/i);
    expect(br.headers['content-type']).toMatch(/^application\/json/);
    expect(br.body.length).toBeLessThan(plain.body.length / 2);
    expect(JSON.parse(brotliDecompressSync(br.body).toString('utf8'))).toEqual(JSON.parse(plain.body.toString('utf8')));

    // A browser lists gzip first but decodes brotli: brotli is sent.
    expect((await rawGet(path, { 'Accept-Encoding': 'gzip, deflate, br, zstd' })).headers['content-encoding']).toBe('br');
    // The entity tag still answers 304, whatever the coding.
    const etag = String(br.headers.etag);
    expect((await rawGet(path, { 'Accept-Encoding': 'br', 'If-None-Match': etag })).status).toBe(304);
  });

  it('when the client accepts only gzip, then JSON comes back gzip and decodes to the same JSON', async () => {
    const owner = await signupOwner(t.app);
    const board = await createBoard(owner, flatMain, false);
    const path = `/api/public/boards/${board.token}`;
    const plain = await rawGet(path, {});
    expect(plain.headers['content-encoding']).toBeUndefined();
    for (const accept of ['gzip', 'gzip, deflate', 'br;q=0, gzip']) {
      const gz = await rawGet(path, { 'Accept-Encoding': accept });
      expect(gz.headers['content-encoding'], accept).toBe('gzip');
      expect(JSON.parse(gunzipSync(gz.body).toString('utf8'))).toEqual(JSON.parse(plain.body.toString('utf8')));
    }
    // A signed-in member's JSON is compressed the same way.
    const schedule = await owner.get(`/api/boards/${board.id}/schedule`).set('Accept-Encoding', 'br').expect(200);
    expect(schedule.headers['content-encoding']).toBe('br');
    expect(schedule.body.circuits).toHaveLength(flatMain.circuits.length);
  });

  it('when a JSON body is below the threshold, then it goes out as it is', async () => {
    const res = await rawGet('/api/auth/csrf', { 'Accept-Encoding': 'br, gzip' });
    expect(res.status).toBe(200);
    expect(res.body.length).toBeLessThan(COMPRESSION_THRESHOLD);
    expect(res.headers['content-encoding']).toBeUndefined();
    expect(JSON.parse(res.body.toString('utf8'))).toHaveProperty('token');
  });

  it('when a PDF or the print pack ZIP is asked for by a client accepting br and gzip, then it is not compressed again', async () => {
    const owner = await signupOwner(t.app);
    const board = await createBoard(owner, flatMain, false);
    const pdf = await getBinary(owner, `/api/boards/${board.id}/pdf/chart?media=a4`).set('Accept-Encoding', 'br, gzip').expect(200);
    expect(pdf.headers['content-type']).toBe('application/pdf');
    expect(pdf.headers['content-encoding']).toBeUndefined();
    expect(Number(pdf.headers['content-length'])).toBe((pdf.body as Buffer).length);
    expect((pdf.body as Buffer).subarray(0, 5).toString('latin1')).toBe('%PDF-');
    const zip = await getBinary(owner, `/api/boards/${board.id}/pack`).set('Accept-Encoding', 'br, gzip').expect(200);
    expect(zip.headers['content-type']).toBe('application/zip');
    expect(zip.headers['content-encoding']).toBeUndefined();
    expect((zip.body as Buffer).subarray(0, 2).toString('latin1')).toBe('PK');
  });

  it('when the circuit CSV export is over the threshold, then it is compressed too', async () => {
    const owner = await signupOwner(t.app);
    const board = await createBoard(owner, flatMain, false);
    const csv = await owner.get(`/api/boards/${board.id}/circuits.csv`).set('Accept-Encoding', 'gzip').expect(200);
    expect(csv.headers['content-type']).toMatch(/^text\/csv/);
    expect(csv.headers['content-encoding']).toBe('gzip');
    expect(csv.text.split(/\r?\n/)[0]).toMatch(/^id,way,phase/);
  });
});

describe('choosing a content coding', () => {
  it('when Accept-Encoding names codings and weights, then brotli is taken over gzip, and q=0 refuses one', () => {
    expect(preferredCoding('gzip, deflate, br, zstd')).toBe('br');
    expect(preferredCoding('gzip;q=1.0, br;q=0.1')).toBe('br');
    expect(preferredCoding('gzip')).toBe('gzip');
    expect(preferredCoding('br;q=0, gzip')).toBe('gzip');
    expect(preferredCoding('*')).toBe('br');
    expect(preferredCoding('*;q=0, gzip')).toBe('gzip');
    expect(preferredCoding('identity')).toBe('identity');
    expect(preferredCoding('deflate')).toBe('identity');
    expect(preferredCoding('')).toBe('identity');
    expect(preferredCoding(undefined)).toBe('identity');
  });
});
