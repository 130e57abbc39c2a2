/**
 * Counting rate-limit hits in `rate_limit_counters`, the table every app process shares. Hits that
 * arrive while a count is on the wire wait for it and then go together in one statement (as the
 * board page's reads do), so a crowd of scans costs one round trip per batch, not one each. The
 * statement is one atomic `INSERT … ON DUPLICATE KEY UPDATE … RETURNING`: the row's lock orders
 * racing processes, and a key hit n times in the batch is raised by n, its hits numbered
 * total − n + 1 … total, so every hit gets its own count and exactly `limit` of them pass.
 */
import DataLoader from 'dataloader';
import { sql } from 'drizzle-orm';
import type { ClientRateLimitInfo } from 'express-rate-limit';
import type { Db } from '../db/client.js';
import { withNodeRetry } from '../db/cluster.js';

export interface Hit {
  /** The full counter key (limit name and key, at most 255 characters). */
  counterKey: string;
  /** The window a new count opens, in microseconds (MariaDB's INTERVAL unit with millisecond precision). */
  windowUs: number;
}

/** Most hits in one statement. */
const MAX_BATCH = 500;

export type CounterRow = { counter_key?: string; hits: number | string; reset_at: Date | string };

/** Drizzle's driver hands DATETIME back as text (`2026-12-04 20:15:24.156`, UTC here, as UTC_TIMESTAMP wrote it). */
const asDate = (value: Date | string) => (value instanceof Date ? value : new Date(`${value.replace(' ', 'T')}Z`));

export const infoOf = (row: CounterRow): ClientRateLimitInfo => ({ totalHits: Number(row.hits), resetTime: asDate(row.reset_at) });

/**
 * Sends a count again when it surely did not apply (a lost deadlock or certification conflict, an unsynced node) or
 * when its node went away mid-statement: a hit counted twice only makes a limit a little stricter, while a hit that
 * fails is a 500 for a visitor. The same retry the cluster gives repeatable statements (server/db/cluster.ts).
 */
export const retried = <T>(work: () => Promise<T>): Promise<T> => withNodeRetry(work, true);

/** One statement for a batch: each distinct key once (in key order, so racing batches lock rows in the same order). */
async function countHits(db: Db, hits: readonly Hit[]): Promise<ClientRateLimitInfo[]> {
  const perKey = new Map<string, { n: number; windowUs: number }>();
  for (const h of hits) perKey.set(h.counterKey, { n: (perKey.get(h.counterKey)?.n ?? 0) + 1, windowUs: h.windowUs });
  const keys = [...perKey.keys()].sort();
  const values = sql.join(
    keys.map((k) => sql`(${k}, ${perKey.get(k)!.n}, UTC_TIMESTAMP(3) + INTERVAL ${perKey.get(k)!.windowUs} MICROSECOND)`),
    sql`, `,
  );
  // Assignments run left to right: both IFs read the old reset_at, so an ended window restarts at this batch's hits.
  const result = await retried(() =>
    db.execute(sql`
      INSERT INTO rate_limit_counters (counter_key, hits, reset_at) VALUES ${values}
      ON DUPLICATE KEY UPDATE
        hits = IF(reset_at <= UTC_TIMESTAMP(3), VALUES(hits), hits + VALUES(hits)),
        reset_at = IF(reset_at <= UTC_TIMESTAMP(3), VALUES(reset_at), reset_at)
      RETURNING counter_key, hits, reset_at`),
  );
  const rows = new Map((result as unknown as [CounterRow[]])[0].map((r) => [r.counter_key!, infoOf(r)]));
  const given = new Map<string, number>();
  return hits.map((h) => {
    const total = rows.get(h.counterKey)!;
    const earlier = given.get(h.counterKey) ?? 0;
    given.set(h.counterKey, earlier + 1);
    return { totalHits: total.totalHits - perKey.get(h.counterKey)!.n + 1 + earlier, resetTime: total.resetTime };
  });
}

function buildHitLoader(db: Db): DataLoader<Hit, ClientRateLimitInfo> {
  let onWire: Promise<unknown> | null = null;
  return new DataLoader(
    (hits) => {
      const counted = countHits(db, hits);
      const settled = counted.then(
        () => undefined,
        () => undefined,
      );
      onWire = settled;
      void settled.then(() => {
        if (onWire === settled) onWire = null;
      });
      return counted;
    },
    {
      cache: false,
      maxBatchSize: MAX_BATCH,
      batchScheduleFn: (dispatch) => {
        if (onWire) void onWire.then(() => setImmediate(dispatch));
        else setImmediate(dispatch);
      },
    },
  );
}

const loaders = new WeakMap<Db, DataLoader<Hit, ClientRateLimitInfo>>();

/** Counts one hit and answers the count it made (its place in the window) and when the window ends. */
export function countHit(db: Db, hit: Hit): Promise<ClientRateLimitInfo> {
  let loader = loaders.get(db);
  if (!loader) loaders.set(db, (loader = buildHitLoader(db)));
  return loader.load(hit);
}
