/**
 * Two app processes on different ports sharing one database: a session made on one works on
 * the other, a save on one is seen by the other, and a stale save is refused with 409.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { ChildProcess } from 'node:child_process';
import { spawnServer } from '../../bench/load.js';
import { insertOwnerAccount, TEST_PASSWORD, uniqueEmail } from '../helpers/app.js';
import { openDatabase } from '../../server/db/client.js';

let a: { child: ChildProcess; port: number };
let b: { child: ChildProcess; port: number };

beforeAll(async () => {
  const env = { ...process.env, SESSION_SECRET: 'shared-secret-two-processes', PORT: '0', SMTP_PORT: '1' };
  [a, b] = await Promise.all([spawnServer(['server/index.ts'], env), spawnServer(['server/index.ts'], env)]);
});
afterAll(() => {
  a?.child.kill('SIGTERM');
  b?.child.kill('SIGTERM');
});

/** A minimal cookie-keeping client over fetch, aimed at one process or the other. */
function cookieJar() {
  const cookies = new Map<string, string>();
  let csrf = '';
  const call = async (port: number, method: string, path: string, body?: unknown) => {
    const headers: Record<string, string> = { 'Content-Type': 'application/json' };
    if (cookies.size) headers.Cookie = [...cookies].map(([k, v]) => `${k}=${v}`).join('; ');
    if (csrf && method !== 'GET') headers['X-CSRF-Token'] = csrf;
    const res = await fetch(`http://127.0.0.1:${port}${path}`, { method, headers, body: body === undefined ? undefined : JSON.stringify(body) });
    for (const set of res.headers.getSetCookie()) {
      const [pair] = set.split(';');
      const at = pair.indexOf('=');
      cookies.set(pair.slice(0, at), pair.slice(at + 1));
    }
    const text = await res.text();
    return { status: res.status, body: text ? JSON.parse(text) : null };
  };
  return {
    call,
    async csrfFrom(port: number) {
      csrf = (await call(port, 'GET', '/api/auth/csrf')).body.token;
    },
  };
}

describe('when two app processes share one database', () => {
  it('then a session made on one works on the other, saves are seen by both, and a stale save is refused', async () => {
    expect(a.port).not.toBe(b.port);
    const jar = cookieJar();
    await jar.csrfFrom(a.port);
    // These processes have no mail to send a sign-up link: the account is made in the shared database, then signed in on A.
    const email = uniqueEmail('twoproc');
    const database = openDatabase(process.env.DATABASE_URL!, { connectionLimit: 1 });
    await insertOwnerAccount(database, email, 'Two Process Ltd', 'Tegwen').finally(() => database.close());
    const signIn = await jar.call(a.port, 'POST', '/api/auth/login', { email, password: TEST_PASSWORD });
    expect(signIn.status).toBe(200);
    expect((await jar.call(b.port, 'GET', '/api/auth/me')).status).toBe(200);

    const created = await jar.call(a.port, 'POST', '/api/boards', { name: 'Shared board', location: 'Hall cupboard' });
    expect(created.status).toBe(201);
    const id = created.body.id as number;
    const onA = await jar.call(a.port, 'GET', `/api/boards/${id}/schedule`);
    const { id: _i, revision, updatedAt: _u, code: _c, siteId: _s, ...schedule } = onA.body;
    const saved = await jar.call(a.port, 'PUT', `/api/boards/${id}/schedule`, {
      ...schedule,
      board: { ...schedule.board, location: 'Under the stairs' },
      baseRevision: revision,
    });
    expect(saved.status).toBe(200);

    const onB = await jar.call(b.port, 'GET', `/api/boards/${id}/schedule`);
    expect(onB.body.board.location).toBe('Under the stairs');
    expect(onB.body.revision).toBe(saved.body.revision);

    const stale = await jar.call(b.port, 'PUT', `/api/boards/${id}/schedule`, {
      ...schedule,
      board: { ...schedule.board, location: 'Loft' },
      baseRevision: revision,
    });
    expect(stale.status).toBe(409);
    expect((await jar.call(a.port, 'GET', `/api/boards/${id}/schedule`)).body.board.location).toBe('Under the stairs');
  });
});
