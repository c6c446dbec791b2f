import type { Sequelize } from 'sequelize';
import type { ClientRateLimitInfo, Options, Store } from 'express-rate-limit';
import { runSql } from '../db/sql';
import { sqlTime } from '../db/sql-time';
import { retryTransient } from '../db/retry';
import type { Failure, FailureStore, RecentFailures } from './sign-in-throttle';

// Sign-in counts in the database, so that every app instance behind a load balancer counts the same attempts: the
// per-address rate limit (express-rate-limit's store) and the failures behind the slowing down and the lock. Rows
// carry the scope of the instances that share them (SIGN_IN_COUNT_SCOPE). Two nodes of a Galera cluster may
// count the same key at once; the loser's certification failure is retried like any other write.

interface HitRow {
  hits: number;
  resets_at: Date;
}

/** express-rate-limit's store on the `sign_in_hits` table: a fixed window per key, reset when it has passed. */
export class DatabaseRateLimitStore implements Store {
  localKeys = false;
  private windowMs = 60_000;

  constructor(
    private readonly sequelize: Sequelize,
    private readonly scope: string,
  ) {}

  init(options: Options) {
    this.windowMs = options.windowMs;
  }

  async get(key: string): Promise<ClientRateLimitInfo | undefined> {
    const [row] = await runSql<HitRow[]>(
      this.sequelize,
      'SELECT hits, resets_at FROM sign_in_hits WHERE scope = ? AND `key` = ? AND resets_at > ?',
      [this.scope, key, sqlTime(new Date())],
    );
    return row ? { totalHits: Number(row.hits), resetTime: new Date(row.resets_at) } : undefined;
  }

  async increment(key: string): Promise<ClientRateLimitInfo> {
    const now = new Date();
    const resetsAt = new Date(now.getTime() + this.windowMs);
    await retryTransient(() =>
      runSql(
        this.sequelize,
        `INSERT INTO sign_in_hits (scope, \`key\`, hits, resets_at) VALUES (?, ?, 1, ?)
         ON DUPLICATE KEY UPDATE hits = IF(resets_at <= ?, 1, hits + 1),
                                 resets_at = IF(resets_at <= ?, VALUES(resets_at), resets_at)`,
        [this.scope, key, sqlTime(resetsAt), sqlTime(now), sqlTime(now)],
      ),
    );
    if (Math.random() < 0.02) await this.prune(now);
    return (await this.get(key)) ?? { totalHits: 1, resetTime: resetsAt };
  }

  async decrement(key: string) {
    await retryTransient(() =>
      runSql(
        this.sequelize,
        'UPDATE sign_in_hits SET hits = GREATEST(hits, 1) - 1 WHERE scope = ? AND `key` = ?',
        [this.scope, key],
      ),
    );
  }

  async resetKey(key: string) {
    await runSql(this.sequelize, 'DELETE FROM sign_in_hits WHERE scope = ? AND `key` = ?', [this.scope, key]);
  }

  /** Windows that ended long ago are of no use to anyone. */
  private async prune(now: Date) {
    await runSql(this.sequelize, 'DELETE FROM sign_in_hits WHERE resets_at < ? LIMIT 500', [
      sqlTime(new Date(now.getTime() - 3_600_000)),
    ]).catch(() => {});
  }
}

interface FailureRow {
  kind: 'badge' | 'address' | 'lock';
  at: Date;
  address: string | null;
  from_tablet: number | null;
}

/** The throttle's failures on `sign_in_failures` and its locks of badge numbers on `sign_in_locks`. */
export class DatabaseFailureStore implements FailureStore {
  constructor(
    private readonly sequelize: Sequelize,
    private readonly scope: string,
    /** Failures older than this are deleted as new ones come in (the throttle's window). */
    private readonly keepMs: number,
  ) {}

  async recent(badge: string, address: string, since: number): Promise<RecentFailures> {
    const from = sqlTime(new Date(since));
    const rows = await runSql<FailureRow[]>(
      this.sequelize,
      `SELECT 'badge' AS kind, at, address, from_tablet FROM sign_in_failures WHERE scope = ? AND badge = ? AND at > ?
       UNION ALL
       SELECT 'address', at, NULL, NULL FROM sign_in_failures WHERE scope = ? AND address = ? AND at > ?
       UNION ALL
       SELECT 'lock', locked_until, NULL, NULL FROM sign_in_locks WHERE scope = ? AND badge = ?
       ORDER BY at, kind`,
      [this.scope, badge.slice(0, 64), from, this.scope, address, from, this.scope, badge.slice(0, 64)],
    );
    const ms = (row: FailureRow) => new Date(row.at).getTime();
    return {
      badge: rows
        .filter((r) => r.kind === 'badge')
        .map((r) => ({ at: ms(r), address: r.address!, fromTablet: Boolean(r.from_tablet) })),
      address: rows.filter((r) => r.kind === 'address').map(ms),
      lockedUntil: Math.max(0, ...rows.filter((r) => r.kind === 'lock').map(ms)),
    };
  }

  async add(badge: string, failure: Failure) {
    await runSql(
      this.sequelize,
      'INSERT INTO sign_in_failures (scope, badge, address, from_tablet, at) VALUES (?, ?, ?, ?, ?)',
      [
        this.scope,
        badge.slice(0, 64),
        failure.address.slice(0, 64),
        failure.fromTablet,
        sqlTime(new Date(failure.at)),
      ],
    );
    await runSql(this.sequelize, 'DELETE FROM sign_in_failures WHERE at < ? LIMIT 100', [
      sqlTime(new Date(failure.at - this.keepMs)),
    ]).catch(() => {});
  }

  async lock(badge: string, until: number) {
    await retryTransient(() =>
      runSql(
        this.sequelize,
        `INSERT INTO sign_in_locks (scope, badge, locked_until) VALUES (?, ?, ?)
         ON DUPLICATE KEY UPDATE locked_until = VALUES(locked_until)`,
        [this.scope, badge.slice(0, 64), sqlTime(new Date(until))],
      ),
    );
  }

  async forget(badge: string) {
    await retryTransient(async () => {
      await runSql(this.sequelize, 'DELETE FROM sign_in_failures WHERE scope = ? AND badge = ?', [
        this.scope,
        badge.slice(0, 64),
      ]);
      await runSql(this.sequelize, 'DELETE FROM sign_in_locks WHERE scope = ? AND badge = ?', [
        this.scope,
        badge.slice(0, 64),
      ]);
    });
  }
}
