/**
 * An express-rate-limit store on MariaDB (`rate_limit_counters`), so every app process counts the
 * same hits: two processes behind one balancer do not double a limit. Hits are counted atomically,
 * several to a statement (`limit-hits.ts`), so none is lost and each gets its own count. Windows are
 * fixed: the first hit opens one for `windowMs` (database clock, so processes on different machines
 * agree) and the first hit after it ends opens the next. Expired rows are deleted at most once per
 * SWEEP_EVERY_MS per process, by whichever hit comes next.
 */
import { createHash } from 'node:crypto';
import { sql } from 'drizzle-orm';
import type { ClientRateLimitInfo, Options, Store } from 'express-rate-limit';
import type { Db } from '../db/client.js';
import { countHit, infoOf, retried, type CounterRow } from './limit-hits.js';

/** The column's length (`counter_key varchar(255)`); longer keys are stored as their SHA-256. */
const KEY_MAX = 255;
/**
 * Keys the column's collation compares exactly as JavaScript does, kept readable: utf8mb4_unicode_ci is blind to
 * case and accents and ignores trailing spaces, so `aB` and `Ab` (two board-page tokens) would share one row, and the
 * row would come back under the other spelling. Any other key is stored as its SHA-256 in lower-case hex.
 */
const PLAIN_KEY = /^[a-z0-9.:|@_+/-]*$/;
/** How often each process deletes rows whose window has ended. */
const SWEEP_EVERY_MS = 5 * 60_000;
/** Rows one sweep deletes at most, so a sweep is never one long lock. */
const SWEEP_BATCH = 5000;

/** The first sweep comes SWEEP_EVERY_MS after the process starts, not on its first hit. */
let lastSweep = Date.now();

/** One store per limiter (the library refuses a shared one); `prefix` keeps each limiter's keys apart in the one table. */
export class SharedLimitStore implements Store {
  readonly localKeys = false;
  private windowMs = 60_000;

  constructor(
    private readonly db: Db,
    readonly prefix: string,
  ) {}

  init(options: Options): void {
    this.windowMs = options.windowMs;
  }

  private counterKey(key: string): string {
    const full = this.prefix + key;
    return PLAIN_KEY.test(key) && full.length <= KEY_MAX ? full : `${this.prefix}sha256:${createHash('sha256').update(full).digest('hex')}`.slice(0, KEY_MAX);
  }

  increment(key: string): Promise<ClientRateLimitInfo> {
    this.sweepNowAndThen();
    return countHit(this.db, { counterKey: this.counterKey(key), windowUs: this.windowMs * 1000 });
  }

  async get(key: string): Promise<ClientRateLimitInfo | undefined> {
    const result = await this.db.execute(
      sql`SELECT hits, reset_at FROM rate_limit_counters WHERE counter_key = ${this.counterKey(key)} AND reset_at > UTC_TIMESTAMP(3)`,
    );
    const [row] = (result as unknown as [CounterRow[]])[0];
    return row ? infoOf(row) : undefined;
  }

  async decrement(key: string): Promise<void> {
    await retried(() =>
      this.db.execute(
        sql`UPDATE rate_limit_counters SET hits = GREATEST(hits, 1) - 1 WHERE counter_key = ${this.counterKey(key)} AND reset_at > UTC_TIMESTAMP(3)`,
      ),
    );
  }

  async resetKey(key: string): Promise<void> {
    await this.db.execute(sql`DELETE FROM rate_limit_counters WHERE counter_key = ${this.counterKey(key)}`);
  }

  /** Deletes ended windows in the background; a failure (database away) waits for the next sweep. */
  private sweepNowAndThen(): void {
    const now = Date.now();
    if (now - lastSweep < SWEEP_EVERY_MS) return;
    lastSweep = now;
    deleteExpiredCounters(this.db).catch(() => {});
  }
}

/** Deletes rows whose window has ended (at most SWEEP_BATCH); returns how many went. */
export async function deleteExpiredCounters(db: Db): Promise<number> {
  const result = await db.execute(sql`DELETE FROM rate_limit_counters WHERE reset_at <= UTC_TIMESTAMP(3) LIMIT ${SWEEP_BATCH}`);
  return (result as unknown as [{ affectedRows: number }])[0].affectedRows;
}
