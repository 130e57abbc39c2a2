/**
 * What a MariaDB error means, read from its code. Drizzle wraps the driver's error, so the code is
 * on the error or on one of its causes: each helper walks the chain.
 */

/** The error and each of its causes, outermost first. */
export function* causes(err: unknown): Generator<{ code?: unknown; message?: unknown }> {
  for (let e: unknown = err, depth = 0; e && typeof e === 'object' && depth < 10; e = (e as { cause?: unknown }).cause, depth++) {
    yield e as { code?: unknown; message?: unknown };
  }
}

const hasCode = (err: unknown, code: string) => [...causes(err)].some((e) => e.code === code);

/** A unique index refused the row (two saves racing to the same code, address or token). */
export const isDuplicateKey = (err: unknown) => hasCode(err, 'ER_DUP_ENTRY');

/** A foreign key refused the delete: another row still points at this one. */
export const isStillReferenced = (err: unknown) => hasCode(err, 'ER_ROW_IS_REFERENCED_2');

/** The statement lost a deadlock, or a Galera node's certification (reported as a deadlock): running it again may succeed. */
export const isDeadlock = (err: unknown) => hasCode(err, 'ER_LOCK_DEADLOCK');
