/**
 * `npm start`'s own MariaDB is supervised: killed, it is started again with a back-off, and the same
 * app answers 503 while it is down and 200 once it is back, without being restarted itself.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import type { Express } from 'express';
import type { PrivateMariadb } from '../../scripts/mariadb.js';
import { startAppOnPrivateDb, type PrivateDbApp } from '../helpers/private-db-app.js';

let running: PrivateDbApp;
let mariadb: PrivateMariadb;
let app: Express;

beforeAll(async () => {
  running = await startAppOnPrivateDb('restart', { supervise: true });
  ({ mariadb, app } = running);
});
afterAll(async () => {
  await running?.close();
});

async function waitForStatus(status: number, timeoutMs: number): Promise<boolean> {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    if ((await request(app).get('/api/health')).status === status) return true;
    await new Promise((r) => setTimeout(r, 100));
  }
  return false;
}

describe('the private database under supervision', () => {
  it('when mariadbd is killed, then health answers 503, and 200 again once it has restarted itself, the app untouched', async () => {
    await request(app).get('/api/health').expect(200);
    const before = mariadb.pid();
    process.kill(before, 'SIGKILL');
    expect(await waitForStatus(503, 5_000)).toBe(true);
    expect(await waitForStatus(200, 30_000)).toBe(true);
    expect(mariadb.pid()).not.toBe(before);
    expect(mariadb.pid()).toBeGreaterThan(0);
  });
});
