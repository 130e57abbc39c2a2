/**
 * Board-page reads under a crowd: reads that arrive together share statements, yet each one
 * answers for its own token and nothing answers from before a change that finished first.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { AddressInfo, Server } from 'node:net';
import type { Request } from 'express';
import request from 'supertest';
import type { ServerConfig } from '../../server/config.js';
import { addressKey } from '../../server/http/limits.js';
import { startTestApp, type TestApp } from '../helpers/app.js';
import { createBoard, markedSchedule, signupMarkedOwner, type StoredBoard } from './public-fixture.js';

let t: TestApp;
let server: Server;
let base: string;
beforeAll(async () => {
  t = await startTestApp({ rateLimits: { publicPerMinute: 100_000 } as ServerConfig['rateLimits'] });
  server = t.app.listen(0, '127.0.0.1');
  await new Promise((r) => server.once('listening', r));
  base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
});
afterAll(async () => {
  await new Promise((r) => server.close(r));
  await t.close();
});

const read = (token: string) => fetch(`${base}/api/public/boards/${token}`);

describe('board page reads arriving together', () => {
  it('when sixty reads of three pages, an unknown token and a switched-off page arrive at once, then each gets its own answer in fewer statements than reads', async () => {
    const owner = await signupMarkedOwner(t.app);
    const boards: (StoredBoard & { name: string })[] = [];
    for (const name of ['Kitchen board', 'Garage board', 'Loft board']) {
      const schedule = markedSchedule();
      schedule.board.name = name;
      boards.push({ name, ...(await createBoard(owner, schedule, false)) });
    }
    const off = await createBoard(owner, markedSchedule(), false);
    await owner.patch(`/api/boards/${off.id}/public`, { enabled: false }).expect(200);
    const unknown = 'C'.repeat(32);
    // Warm the built pages so the count below is the per-request statements only.
    for (const b of boards) expect((await read(b.token)).status).toBe(200);

    const asked = Array.from({ length: 60 }, (_, i) => [...boards.map((b) => b.token), unknown, off.token][i % 5]!);
    const before = t.database.queryCount();
    const answers = await Promise.all(
      asked.map(async (token) => {
        const res = await read(token);
        return { token, status: res.status, name: res.ok ? ((await res.json()) as { board: { name: string } }).board.name : null };
      }),
    );
    const statements = t.database.queryCount() - before;

    for (const a of answers) {
      const board = boards.find((b) => b.token === a.token);
      if (board) expect(a, a.token).toEqual({ token: a.token, status: 200, name: board.name });
      else expect(a.status, a.token).toBe(404);
    }
    // Each read is also counted against the shared per-address limit (one statement per batch of hits, as the
    // reads): one by one that would be two statements a read.
    expect(statements).toBeLessThan(2 * asked.length);
  });

  it('when a token is rotated during a crowd of reads, then every read sent after the rotation was answered gets 404', async () => {
    const owner = await signupMarkedOwner(t.app);
    const board = await createBoard(owner, undefined, false);
    let rotated = false;
    const crowd = (async () => {
      const late: number[] = [];
      while (!rotated) await Promise.all(Array.from({ length: 10 }, () => read(board.token).then((r) => r.arrayBuffer())));
      for (let i = 0; i < 5; i++) {
        const statuses = await Promise.all(Array.from({ length: 20 }, () => read(board.token).then((r) => r.status)));
        late.push(...statuses);
      }
      return late;
    })();
    await new Promise((r) => setTimeout(r, 50));
    await owner.post(`/api/boards/${board.id}/token/rotate`).expect(200);
    rotated = true;
    const late = await crowd;
    expect(late.length).toBe(100);
    expect(new Set(late)).toEqual(new Set([404]));
  });

  it('when a reader sends back the entity tag it was given, then 304 until the schedule changes', async () => {
    const owner = await signupMarkedOwner(t.app);
    const board = await createBoard(owner, undefined, false);
    // supertest, not fetch: fetch adds "Cache-Control: no-cache" to conditional requests, which asks for a full answer.
    const url = `/api/public/boards/${board.token}`;
    const etag = (await request(t.app).get(url).expect(200)).headers.etag as string;
    expect(etag).toMatch(/^"[\w-]+"$/);
    // RFC 9110 §13.1.2: a matching If-None-Match on GET answers 304 Not Modified.
    await request(t.app).get(url).set('If-None-Match', etag).expect(304);
    const current = (await owner.get(`/api/boards/${board.id}/schedule`).expect(200)).body;
    const { id: _i, revision, updatedAt: _u, code: _c, siteId: _s, ...schedule } = current;
    schedule.circuits[0].label = 'Renamed way';
    await owner.put(`/api/boards/${board.id}/schedule`, { ...schedule, baseRevision: revision }).expect(200);
    const after = await request(t.app).get(url).set('If-None-Match', etag).expect(200);
    expect(after.headers.etag).not.toBe(etag);
    expect(JSON.stringify(after.body)).toContain('Renamed way');
  });
});

describe('the address a public limit counts against', () => {
  const key = (ip: string) => addressKey({ ip } as Request);
  it('when the client is IPv4, plain or IPv4-mapped, then the key is the IPv4 address', () => {
    // RFC 4291 §2.5.5.2: ::ffff:a.b.c.d is the IPv4 address a.b.c.d seen by an IPv6 socket.
    expect(key('203.0.113.7')).toBe('203.0.113.7');
    expect(key('::ffff:203.0.113.7')).toBe('203.0.113.7');
    expect(key('::ffff:203.0.113.8')).not.toBe(key('::ffff:203.0.113.7'));
  });
  it('when the client is IPv6, then addresses in one /56 share a key and other /56s do not', () => {
    // RFC 3849: 2001:db8::/32 is the documentation prefix. The /56 grouping is the library's default.
    expect(key('2001:db8:0:1::1')).toBe(key('2001:db8:0:2::9'));
    expect(key('2001:db8:0:100::1')).not.toBe(key('2001:db8:0:1::1'));
  });
});
