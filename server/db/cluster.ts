/**
 * Several database nodes behind one pool: a `DATABASE_URL` that lists hosts
 * (`mysql://u:p@127.0.0.1:3401,127.0.0.1:3402,127.0.0.1:3403/waymark`) opens a mysql2 pool cluster, one pool per
 * node, handed out in turn. A node that refuses connections is skipped for a while and tried again later (mysql2's
 * `removeNodeErrorCount` / `restoreNodeTimeout`), so the app moves to the others when a node goes away and back
 * when it returns. Built for a MariaDB Galera cluster, where every node takes writes.
 */
import mysql from 'mysql2/promise';
import { causes, isDeadlock } from './errors.js';
import { isDatabaseDown } from '../errors.js';

/** What drizzle and the session store need of a pool: statements, a connection for a transaction, and an end. */
export type SqlPool = Pick<mysql.Pool, 'query' | 'execute' | 'getConnection' | 'end'>;

/** The host list of a `mysql://` URL, and the URL for each host alone (credentials, database and options kept). */
export function splitDatabaseUrl(url: string): string[] {
  const m = /^(mysql:\/\/(?:[^@/]*@)?)([^/?#]+)(.*)$/.exec(url);
  if (!m) return [url];
  return m[2].split(',').map((host) => `${m[1]}${host.trim()}${m[3]}`);
}

/** Seconds a node that refused a connection is left out before it is tried again. */
const RESTORE_NODE_MS = 2000;
const ATTEMPTS = 3;

/**
 * True when the statement surely did not change anything, so it may be sent again: a Galera node not yet synced
 * refuses it ("WSREP has not yet prepared node for application use", 1047), and a statement that lost a
 * deadlock or a certification conflict was rolled back.
 */
function refusedUnrun(err: unknown): boolean {
  return isDeadlock(err) || [...causes(err)].some((e) => e.code === 'ER_UNKNOWN_COM_ERROR');
}

const sqlText = (statement: unknown) => (typeof statement === 'string' ? statement : String((statement as { sql?: unknown })?.sql ?? ''));
/** Reads may be sent again even when the node went away with the answer on its way. */
const isRead = (statement: unknown) => /^\s*\(?\s*(select|show|with)\b/i.test(sqlText(statement));

/**
 * Runs `send` again (on the next node: the cluster hands nodes out in turn) when the node refused the statement or,
 * for a statement that is safe to repeat, went away during it. Three tries, a short pause between.
 */
export async function withNodeRetry<T>(send: () => Promise<T>, repeatable: boolean): Promise<T> {
  for (let attempt = 1; ; attempt++) {
    try {
      return await send();
    } catch (err) {
      const again = refusedUnrun(err) || (repeatable && isDatabaseDown(err));
      if (!again || attempt >= ATTEMPTS) throw err;
      await new Promise((r) => setTimeout(r, 100 * attempt));
    }
  }
}

/**
 * The pool cluster as the one pool the app uses. drizzle takes it as it takes a pool (it only asks for `query`,
 * `execute` and `getConnection`); a mysql2 `PoolCluster` itself has no working `query`, so statements go through its
 * namespace of every node. Transactions hold one connection from `getConnection` and are retried by their use-case.
 */
export function openPoolCluster(urls: string[], options: mysql.PoolOptions): SqlPool {
  const cluster = mysql.createPoolCluster({ canRetry: true, removeNodeErrorCount: 1, restoreNodeTimeout: RESTORE_NODE_MS, defaultSelector: 'RR' });
  urls.forEach((uri, i) => cluster.add(`node${i + 1}`, { ...options, uri }));
  const nodes = cluster.of('*', 'RR');
  const pool = {
    query: (statement: unknown, values?: unknown) => withNodeRetry(() => nodes.query(statement as string, values as never), isRead(statement)),
    execute: (statement: unknown, values?: unknown) => withNodeRetry(() => nodes.execute(statement as string, values as never), isRead(statement)),
    getConnection: () => nodes.getConnection(),
    end: () => cluster.end(),
  };
  return pool as unknown as SqlPool;
}

/**
 * The same pool for a caller whose every statement may be sent twice (the session store: upsert by id, touch,
 * delete), so a session survives the node that held its connection going away mid-statement.
 */
export function repeatableStatements(pool: SqlPool): SqlPool {
  const repeat = {
    query: (statement: unknown, values?: unknown) => withNodeRetry(() => pool.query(statement as string, values as never), true),
    execute: (statement: unknown, values?: unknown) => withNodeRetry(() => pool.execute(statement as string, values as never), true),
    getConnection: () => pool.getConnection(),
    end: () => pool.end(),
  };
  return repeat as unknown as SqlPool;
}

/**
 * True when a transaction failed without a known outcome that running it again from the start settles: a Galera
 * certification conflict or deadlock (rolled back), a node not ready, or the node gone mid-transaction (rolled
 * back, or committed just before: a use-case that re-checks its guard, like the revision of a save, finds out).
 */
export const mayRetryTransaction = (err: unknown) => refusedUnrun(err) || isDatabaseDown(err);
