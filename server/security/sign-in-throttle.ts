/**
 * Failed sign-ins counted per badge and per address for a window, in a FailureStore: the database, so that every
 * app instance counts the same failures, or this process's memory for a single instance and the unit tests. A badge number
 * is counted whether or not it belongs to anyone, so the slowing down and the lock answer the same for a badge
 * that does not exist (OWASP Authentication Cheat Sheet: the same answer for an unknown user and a wrong
 * password; throttle before locking out).
 */
export interface ThrottlePolicy {
  windowMs: number;
  /** The first wait after one failure of a badge; it doubles with each further failure. */
  badgeFirstDelayMs: number;
  badgeMaxDelayMs: number;
  /** Failures from one address before its attempts are slowed (a hangar's tablets may share one address). */
  addressFreeFailures: number;
  addressFirstDelayMs: number;
  addressMaxDelayMs: number;
  /** A wait longer than this is not sat out: the attempt is refused with the time to come back. */
  longestWaitMs: number;
  /** At most this many badges and addresses are remembered; the oldest are forgotten first. */
  maxEntries: number;
}

export const defaultThrottlePolicy: ThrottlePolicy = {
  windowMs: 15 * 60_000,
  badgeFirstDelayMs: 250,
  badgeMaxDelayMs: 30_000,
  addressFreeFailures: 20,
  addressFirstDelayMs: 100,
  addressMaxDelayMs: 10_000,
  longestWaitMs: 10_000,
  maxEntries: 50_000,
};

export interface Failure {
  at: number;
  address: string;
  fromTablet: boolean;
}

/** What the throttle knows of a badge and an address within the window. */
export interface RecentFailures {
  badge: Failure[];
  /** When each failure from the address happened, oldest first. */
  address: number[];
  /** 0 when the badge is not locked by the throttle. */
  lockedUntil: number;
}

/**
 * Where failures are kept: in this process (`MemoryFailureStore`), or in the database so that every app instance
 * counts the same failures (`server/db/sign-in-counts.ts`). Badge keys arrive already normalised.
 */
export interface FailureStore {
  recent(badge: string, address: string, since: number, now: number): Promise<RecentFailures>;
  add(badge: string, failure: Failure): Promise<void>;
  lock(badge: string, until: number): Promise<void>;
  forget(badge: string): Promise<void>;
}

export type ThrottleDecision = { waitMs: number } | { refuseForMs: number };

export interface FailureCount {
  failures: number;
  fromTablets: number;
  addresses: number;
}

const doubling = (first: number, max: number, step: number) => Math.min(max, first * 2 ** step);

/** Badge numbers are matched without regard to case by the database, so they are counted the same way. */
const badgeKey = (badge: string) => badge.trim().toUpperCase();

export class SignInThrottle {
  /** Attempts being checked now, per badge; a second at the same moment is refused (per instance). */
  private readonly inFlight = new Set<string>();

  constructor(
    private readonly policy: ThrottlePolicy = defaultThrottlePolicy,
    private readonly clock: () => number = Date.now,
    private readonly store: FailureStore = new MemoryFailureStore(policy.maxEntries),
  ) {}

  private recent(badge: string, address: string) {
    const now = this.clock();
    return this.store.recent(badgeKey(badge), address, now - this.policy.windowMs, now);
  }

  /** How long this attempt waits before its secret is compared, or that it is refused outright. */
  async decide(badge: string, address: string): Promise<ThrottleDecision> {
    if (this.inFlight.has(badgeKey(badge))) return { refuseForMs: this.policy.badgeFirstDelayMs };
    const now = this.clock();
    const recent = await this.recent(badge, address);
    let readyAt = now;
    if (recent.badge.length > 0) {
      const last = recent.badge[recent.badge.length - 1]!.at;
      const step = recent.badge.length - 1;
      readyAt = Math.max(
        readyAt,
        last + doubling(this.policy.badgeFirstDelayMs, this.policy.badgeMaxDelayMs, step),
      );
    }
    const over = recent.address.length - this.policy.addressFreeFailures;
    if (over >= 0) {
      const last = recent.address[recent.address.length - 1]!;
      readyAt = Math.max(
        readyAt,
        last + doubling(this.policy.addressFirstDelayMs, this.policy.addressMaxDelayMs, over),
      );
    }
    const waitMs = readyAt - now;
    return waitMs > this.policy.longestWaitMs ? { refuseForMs: waitMs } : { waitMs };
  }

  /** One attempt per badge at a time: a second one sent while the first is checked is refused. */
  begin(badge: string) {
    this.inFlight.add(badgeKey(badge));
  }

  end(badge: string) {
    this.inFlight.delete(badgeKey(badge));
  }

  async recordFailure(badge: string, address: string, fromTablet: boolean): Promise<FailureCount> {
    await this.store.add(badgeKey(badge), { at: this.clock(), address, fromTablet });
    const failures = (await this.recent(badge, address)).badge;
    return {
      failures: failures.length,
      fromTablets: failures.filter((f) => f.fromTablet).length,
      addresses: new Set(failures.map((f) => f.address)).size,
    };
  }

  lock(badge: string, until: Date) {
    return this.store.lock(badgeKey(badge), until.getTime());
  }

  async lockedUntil(badge: string): Promise<Date | null> {
    const until = (await this.recent(badge, '')).lockedUntil;
    return until > this.clock() ? new Date(until) : null;
  }

  /** After a right secret, or when a lead or engineering lifts the lock. */
  forget(badge: string) {
    return this.store.forget(badgeKey(badge));
  }
}

interface BadgeEntry {
  failures: Failure[];
  lockedUntil: number;
}

/** Failures in this process's memory: at most `maxEntries` badges and addresses, the oldest forgotten first. */
export class MemoryFailureStore implements FailureStore {
  private readonly badges = new Map<string, BadgeEntry>();
  private readonly addresses = new Map<string, number[]>();

  constructor(private readonly maxEntries: number) {}

  recent(badge: string, address: string, since: number) {
    const entry = this.badges.get(badge);
    const failures = (entry?.failures ?? []).filter((f) => f.at > since);
    if (entry) entry.failures = failures;
    return Promise.resolve({
      badge: failures,
      address: (this.addresses.get(address) ?? []).filter((at) => at > since),
      lockedUntil: entry?.lockedUntil ?? 0,
    });
  }

  add(badge: string, failure: Failure) {
    const entry = this.badges.get(badge) ?? { failures: [], lockedUntil: 0 };
    entry.failures.push(failure);
    this.remember(this.badges, badge, entry);
    const own = this.addresses.get(failure.address) ?? [];
    own.push(failure.at);
    this.remember(this.addresses, failure.address, own);
    return Promise.resolve();
  }

  lock(badge: string, until: number) {
    const entry = this.badges.get(badge) ?? { failures: [], lockedUntil: 0 };
    entry.lockedUntil = until;
    this.remember(this.badges, badge, entry);
    return Promise.resolve();
  }

  forget(badge: string) {
    this.badges.delete(badge);
    return Promise.resolve();
  }

  private remember<T>(map: Map<string, T>, key: string, value: T) {
    map.delete(key);
    map.set(key, value);
    while (map.size > this.maxEntries) map.delete(map.keys().next().value!);
  }
}
