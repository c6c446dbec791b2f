/**
 * Failed sign-ins counted per badge and per address, kept in this process's memory for a window. A badge number
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

interface Failure {
  at: number;
  address: string;
  fromTablet: boolean;
}

interface BadgeEntry {
  failures: Failure[];
  inFlight: boolean;
  lockedUntil: number;
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
  private readonly badges = new Map<string, BadgeEntry>();
  private readonly addresses = new Map<string, number[]>();

  constructor(
    private readonly policy: ThrottlePolicy = defaultThrottlePolicy,
    private readonly clock: () => number = Date.now,
  ) {}

  /** How long this attempt waits before its secret is compared, or that it is refused outright. */
  decide(badge: string, address: string): ThrottleDecision {
    const now = this.clock();
    const entry = this.badgeEntry(badge, now);
    const own = this.addressFailures(address, now);
    if (entry?.inFlight) return { refuseForMs: this.policy.badgeFirstDelayMs };
    let readyAt = now;
    if (entry && entry.failures.length > 0) {
      const last = entry.failures[entry.failures.length - 1]!.at;
      const step = entry.failures.length - 1;
      readyAt = Math.max(
        readyAt,
        last + doubling(this.policy.badgeFirstDelayMs, this.policy.badgeMaxDelayMs, step),
      );
    }
    const over = own.length - this.policy.addressFreeFailures;
    if (over >= 0) {
      const last = own[own.length - 1]!;
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
    this.entryFor(badge).inFlight = true;
  }

  end(badge: string) {
    const entry = this.badges.get(badgeKey(badge));
    if (entry) entry.inFlight = false;
  }

  recordFailure(badge: string, address: string, fromTablet: boolean): FailureCount {
    const now = this.clock();
    const entry = this.entryFor(badge);
    entry.failures.push({ at: now, address, fromTablet });
    const own = this.addressFailures(address, now);
    own.push(now);
    this.remember(this.addresses, address, own);
    return {
      failures: entry.failures.length,
      fromTablets: entry.failures.filter((f) => f.fromTablet).length,
      addresses: new Set(entry.failures.map((f) => f.address)).size,
    };
  }

  lock(badge: string, until: Date) {
    this.entryFor(badge).lockedUntil = until.getTime();
  }

  lockedUntil(badge: string): Date | null {
    const until = this.badges.get(badgeKey(badge))?.lockedUntil ?? 0;
    return until > this.clock() ? new Date(until) : null;
  }

  /** After a right secret, or when a lead or engineering lifts the lock. */
  forget(badge: string) {
    this.badges.delete(badgeKey(badge));
  }

  private badgeEntry(badge: string, now: number): BadgeEntry | undefined {
    const entry = this.badges.get(badgeKey(badge));
    if (entry) entry.failures = entry.failures.filter((f) => now - f.at < this.policy.windowMs);
    return entry;
  }

  private entryFor(badge: string): BadgeEntry {
    const now = this.clock();
    const entry = this.badgeEntry(badge, now) ?? { failures: [], inFlight: false, lockedUntil: 0 };
    this.remember(this.badges, badgeKey(badge), entry);
    return entry;
  }

  private addressFailures(address: string, now: number): number[] {
    return (this.addresses.get(address) ?? []).filter((at) => now - at < this.policy.windowMs);
  }

  private remember<T>(map: Map<string, T>, key: string, value: T) {
    map.delete(key);
    map.set(key, value);
    while (map.size > this.policy.maxEntries) map.delete(map.keys().next().value!);
  }
}
