import mysql from 'mysql2/promise';
import { drizzle, type MySql2Database } from 'drizzle-orm/mysql2';
import * as schema from './schema.js';

export type Db = MySql2Database<typeof schema>;

export interface Database {
  db: Db;
  pool: mysql.Pool;
  /** Number of SQL statements sent through this pool (the benchmark reads it). */
  queryCount(): number;
  close(): Promise<void>;
}

/** Opens a pool on a `mysql://` URL. The pool reconnects by itself after an outage. */
export function openDatabase(url: string, opts: { connectionLimit?: number } = {}): Database {
  const pool = mysql.createPool({
    uri: url,
    connectionLimit: opts.connectionLimit ?? 20,
    dateStrings: false,
    timezone: 'Z',
    enableKeepAlive: true,
    connectTimeout: 5000,
    supportBigNumbers: true,
  });
  let count = 0;
  const countingPool = new Proxy(pool, {
    get(target, prop, receiver) {
      if (prop === 'query' || prop === 'execute') {
        return (...args: unknown[]) => {
          count++;
          return (target[prop] as (...a: unknown[]) => unknown).apply(target, args);
        };
      }
      const value = Reflect.get(target, prop, receiver);
      return typeof value === 'function' ? value.bind(target) : value;
    },
  });
  const db = drizzle(countingPool as mysql.Pool, { schema, mode: 'default', casing: 'snake_case' });
  return {
    db,
    pool,
    queryCount: () => count,
    close: () => pool.end(),
  };
}

/**
 * Runs work in one transaction; the callback gets the transaction as a `Db` (drizzle types it as its own
 * transaction class, which has every query method a `Db` has). The one place that cast is made.
 */
export function inTransaction<T>(db: Db, work: (tx: Db) => Promise<T>): Promise<T> {
  return db.transaction((tx) => work(tx as unknown as Db));
}
