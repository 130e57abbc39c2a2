/** What every route module is built with: config, database and mailer, passed in (never imported globals). */
import type { ServerConfig } from './config.js';
import type { Database, Db } from './db/client.js';
import type { Mailer } from './mail/mailer.js';

export interface AppContext {
  config: ServerConfig;
  database: Database;
  db: Db;
  mailer: Mailer;
}
