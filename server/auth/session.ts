/**
 * Sessions live in MariaDB (table `sessions`), so they survive an app restart and are
 * shared by every app process on the same database.
 */
import session from 'express-session';
import MySQLStoreFactory from 'express-mysql-session';
import type { RequestHandler } from 'express';
import { repeatableStatements, type SqlPool } from '../db/cluster.js';

export function sessionMiddleware(pool: SqlPool, secret: string): { middleware: RequestHandler; close(): Promise<void> } {
  // express-mysql-session's types describe a different express-session module shape than the one installed.
  // eslint-disable-next-line @typescript-eslint/no-explicit-any -- see above
  const MySQLStore = MySQLStoreFactory(session as any);
  const store = new MySQLStore(
    {
      createDatabaseTable: false, // the migration creates it
      clearExpired: true,
      checkExpirationInterval: 15 * 60 * 1000,
      expiration: 14 * 24 * 3600 * 1000,
      schema: { tableName: 'sessions', columnNames: { session_id: 'session_id', expires: 'expires', data: 'data' } },
      // eslint-disable-next-line @typescript-eslint/no-explicit-any -- its types want mysql (v1)'s pool; mysql2's promise pool works at run time
    },
    // Its statements (upsert by id, touch, delete) may be sent twice: retried when a cluster node goes away under one.
    repeatableStatements(pool) as any,
  );
  const middleware = session({
    name: 'waymark.sid',
    secret,
    store,
    resave: false,
    saveUninitialized: false,
    rolling: true,
    // Secure follows the request: with `trust proxy` set, https behind a proxy counts.
    cookie: { httpOnly: true, sameSite: 'lax', secure: 'auto', maxAge: 14 * 24 * 3600 * 1000 },
  });
  return { middleware, close: () => store.close() };
}
