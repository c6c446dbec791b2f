import type { Sequelize, Transaction } from 'sequelize';

/**
 * Errors after which the transaction is known to have been rolled back whole, so running it again cannot store
 * anything twice:
 * - 1213, a deadlock, and on a Galera cluster a certification failure: two nodes committed writes to the same
 *   rows (every signature writes the audit trail's one-row head), and the later one is refused at commit;
 * - 1205, a lock wait timeout (InnoDB rolls back the statement; our compound statements and Sequelize's
 *   managed transactions then roll back the rest);
 * - 1047, "WSREP has not yet prepared node for application use": the node is joining or resyncing and took no
 *   write.
 * A lost connection is not here: whether its COMMIT landed is unknown, so that is the tablet's resend with the
 * same check id to settle, never a blind retry.
 */
const TRANSIENT = new Set([1213, 1205, 1047]);

export function isTransient(err: unknown): boolean {
  const e = err as { errno?: number; parent?: { errno?: number }; original?: { errno?: number } } | null;
  const errno = e?.errno ?? e?.parent?.errno ?? e?.original?.errno;
  return errno !== undefined && TRANSIENT.has(errno);
}

export interface RetryPolicy {
  tries: number;
  /** The first wait; each further one doubles up to `longestDelayMs`, and each is drawn between half and all of it. */
  firstDelayMs: number;
  longestDelayMs?: number;
}

export const defaultRetryPolicy: RetryPolicy = { tries: 10, firstDelayMs: 20, longestDelayMs: 500 };

const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

/** How many times work was run again after a transient failure, for the tests and the health of a cluster. */
export const retryCount = { total: 0 };

/**
 * Runs `work` again, with the same inputs, after a transient failure, at most `tries` times in all with jittered,
 * doubling waits (so two nodes' conflicting writers do not collide again in step). The work must be a whole
 * transaction that decides everything it writes from its arguments and what it reads inside itself: the same
 * ids, the same signed content, a new audit link under the new head.
 */
export async function retryTransient<T>(
  work: (attempt: number) => Promise<T>,
  policy: RetryPolicy = defaultRetryPolicy,
): Promise<T> {
  for (let attempt = 1; ; attempt += 1) {
    try {
      return await work(attempt);
    } catch (err) {
      if (!isTransient(err)) throw err;
      if (attempt >= policy.tries) {
        // Said in the log line of the 500 that follows, so a run can tell a lost race from a write nobody retries.
        if (err && typeof err === 'object') Object.assign(err, { triedTimes: attempt });
        throw err;
      }
      retryCount.total += 1;
      const ceiling = Math.min(policy.firstDelayMs * 2 ** (attempt - 1), policy.longestDelayMs ?? Infinity);
      await sleep(ceiling / 2 + Math.random() * (ceiling / 2));
    }
  }
}

/** A Sequelize managed transaction, run again whole after a deadlock or a certification failure. */
export function inTransaction<T>(
  sequelize: Sequelize,
  work: (transaction: Transaction) => Promise<T>,
  policy: RetryPolicy = defaultRetryPolicy,
): Promise<T> {
  return retryTransient(() => sequelize.transaction(work), policy);
}
