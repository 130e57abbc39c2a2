/** The private MariaDB keeps full durability for `npm start`'s data; only throw-away databases relax it. */
import { afterAll, describe, expect, it } from 'vitest';
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import mysql from 'mysql2/promise';
import { removeDir, startPrivateMariadb, type PrivateMariadb } from '../../scripts/mariadb.js';

const started: Array<{ db: PrivateMariadb; dir: string }> = [];
afterAll(async () => {
  for (const s of started) {
    await s.db.stop();
    removeDir(s.dir);
  }
});

async function flushSetting(durable?: boolean): Promise<number> {
  const dir = mkdtempSync(join(tmpdir(), 'waymark-durable-'));
  const db = await startPrivateMariadb({ dataDir: dir, dbName: 'durable_check', ...(durable === undefined ? {} : { durable }) });
  started.push({ db, dir });
  const conn = await mysql.createConnection(db.url);
  const [rows] = await conn.query('SELECT @@innodb_flush_log_at_trx_commit AS v');
  await conn.end();
  return Number((rows as Array<{ v: number }>)[0].v);
}

describe('durability of the private database', () => {
  it('when started as npm start starts it, then every commit is flushed (innodb_flush_log_at_trx_commit = 1); a throw-away one uses 2', async () => {
    expect(await flushSetting()).toBe(1); // MariaDB default: log written and flushed at each commit
    expect(await flushSetting(false)).toBe(2);
  });
});
