import mysql from 'mysql2/promise';
import { drizzle, type MySql2Database } from 'drizzle-orm/mysql2';
import * as schema from './schema.js';
import { openPoolCluster, splitDatabaseUrl, type SqlPool } from './cluster.js';

export type Db = MySql2Database<typeof schema>;

export interface Database {
  db: Db;
  /** One pool, or a pool cluster over every node the URL lists (server/db/cluster.ts). */
  pool: SqlPool;
  /** Number of SQL statements sent through this pool (the benchmark reads it). */
  queryCount(): number;
  close(): Promise<void>;
}

/**
 * Opens a pool on a `mysql://` URL. The pool reconnects by itself after an outage. A URL listing several hosts
 * opens a pool cluster instead: `connectionLimit` connections to each node.
 */
export function openDatabase(url: string, opts: { connectionLimit?: number } = {}): Database {
  const options: mysql.PoolOptions = {
    connectionLimit: opts.connectionLimit ?? 20,
    dateStrings: false,
    timezone: 'Z',
    enableKeepAlive: true,
    connectTimeout: 5000,
    supportBigNumbers: true,
  };
  const urls = splitDatabaseUrl(url);
  const pool: SqlPool = urls.length > 1 ? openPoolCluster(urls, options) : mysql.createPool({ ...options, uri: url });
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
