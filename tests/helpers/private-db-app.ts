/**
 * The app on a MariaDB of its own (not the suite's shared one), for tests that stop, kill or
 * restart the database: the outage test and the supervised-restart test.
 */
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Express } from 'express';
import { startPrivateMariadb, removeDir, type PrivateMariadb } from '../../scripts/mariadb.js';
import { openDatabase, type Database } from '../../server/db/client.js';
import { migrateDatabase } from '../../server/db/migrate.js';
import { createApp } from '../../server/app.js';
import { configFromEnv } from '../../server/config.js';
import { smtpMailer } from '../../server/mail/mailer.js';

export interface PrivateDbApp {
  mariadb: PrivateMariadb;
  database: Database;
  app: Express;
  close(): Promise<void>;
}

export async function startAppOnPrivateDb(name: string, opts: { supervise?: boolean } = {}): Promise<PrivateDbApp> {
  const dataDir = mkdtempSync(join(tmpdir(), `waymark-${name}-`));
  const mariadb = await startPrivateMariadb({ dataDir, dbName: `waymark_${name}`, supervise: opts.supervise });
  const database = openDatabase(mariadb.url, { connectionLimit: 5 });
  await migrateDatabase(database);
  const config = configFromEnv({ DATABASE_URL: mariadb.url, SESSION_SECRET: `${name}-test` }, { smtp: { host: '127.0.0.1', port: 1, from: 'x@example.test' } });
  const built = createApp({ config, database, db: database.db, mailer: smtpMailer(config.smtp) });
  return {
    mariadb,
    database,
    app: built.app,
    async close() {
      await built.close().catch(() => {});
      await database.close().catch(() => {});
      await mariadb.stop();
      removeDir(dataDir);
    },
  };
}
