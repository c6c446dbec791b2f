import type { Transaction } from 'sequelize';
import { staffByBadge, storeLockout, type StaffRow } from './credentials.repository';
import { AppError, refusal } from '../errors/app-error';
import { attemptOutcome, hashToCompare, lockedError, wrongSecretError, type LockoutPolicy } from './lockout';
import { hashSecret, secretMatches } from './hashing';
import type { SignInThrottle } from './sign-in-throttle';

// Callers name the policy through this module; the rules of a signing attempt live in lockout.ts, free of the
// database.
export type { LockoutPolicy, StaffRow };

/** A hash of the configured cost to compare against when a badge has no real one; made once per cost. */
const dummyHashes = new Map<number, Promise<string>>();
const compareWithDummy = async (secret: string, cost: number) => {
  if (!dummyHashes.has(cost)) dummyHashes.set(cost, hashSecret('not-a-pin', cost));
  return secretMatches(secret, await dummyHashes.get(cost)!);
};

const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

export interface SignInAttempt {
  badge: string;
  secret: string;
  which: 'pin' | 'password';
  /** The client's address as the app trusts it (TRUST_PROXY). */
  address: string;
  /** Sent from an enrolled kiosk tablet: only such failures, or failures from many addresses, lock a badge. */
  fromTablet: boolean;
}

/**
 * A sign-in. An unknown badge, a wrong secret, an inactive badge and a badge with no desk password get the same
 * answer after the same work (one bcrypt comparison, against a dummy hash when there is no real one). Failures
 * slow the badge and the address down, doubling each time; a hard lock needs failures from enrolled tablets or
 * from many addresses, so an outsider cannot lock a badge from one address.
 */
export async function checkSignIn(
  attempt: SignInAttempt,
  policy: LockoutPolicy,
  throttle: SignInThrottle,
): Promise<StaffRow> {
  const { badge, secret, which, address, fromTablet } = attempt;
  const decision = await throttle.decide(badge, address);
  if ('refuseForMs' in decision) {
    const seconds = Math.ceil(decision.refuseForMs / 1000);
    throw new AppError(429, 'sign_in_slowed', refusal('access.signInSlowed', { count: seconds }), {
      retryAfterSeconds: seconds,
    });
  }
  throttle.begin(badge);
  try {
    if (decision.waitMs > 0) await sleep(decision.waitMs);
    const staff = await staffByBadge(badge);
    const hash = staff?.active ? (which === 'pin' ? staff.pinHash : staff.passwordHash) : null;
    const matches = hash
      ? await secretMatches(secret, hash)
      : await compareWithDummy(secret, policy.bcryptCost ?? 10);
    const now = new Date();
    const dbLock = hash && staff!.lockedUntil && staff!.lockedUntil > now ? staff!.lockedUntil : null;
    const lockedUntil = dbLock ?? (await throttle.lockedUntil(badge));
    if (lockedUntil) throw lockedError(badge, lockedUntil);
    if (hash && matches) {
      if (staff!.failedAttempts > 0 || staff!.lockedUntil) {
        await storeLockout(staff!.id, { failedAttempts: 0, lockedUntil: null });
      }
      await throttle.forget(badge);
      return staff!;
    }
    const count = await throttle.recordFailure(badge, address, fromTablet);
    // A real badge's tablet failures are counted in the database with the signature failures, across instances.
    let tabletFailures = count.fromTablets;
    if (hash && fromTablet) {
      tabletFailures = staff!.failedAttempts + 1;
      await storeLockout(staff!.id, { failedAttempts: tabletFailures });
    }
    const fromMany =
      count.addresses >= (policy.lockMinAddresses ?? Infinity) && count.failures >= policy.maxAttempts;
    if (tabletFailures >= policy.maxAttempts || fromMany) {
      const until = new Date(now.getTime() + policy.lockMinutes * 60_000);
      if (hash) await storeLockout(staff!.id, { failedAttempts: 0, lockedUntil: until });
      await throttle.lock(badge, until);
      throw lockedError(badge, until);
    }
    throw new AppError(
      401,
      which === 'pin' ? 'wrong_pin' : 'wrong_password',
      refusal(which === 'pin' ? 'access.pinRefused' : 'access.passwordRefused'),
    );
  } finally {
    throttle.end(badge);
  }
}

/**
 * Checks a badge's PIN or password, counting wrong attempts. The lock is on the badge, not the device,
 * so guessing from several tablets adds up. Unknown badges and wrong secrets give the same answer.
 */
export async function verifyCredential(
  badge: string,
  secret: string,
  which: 'pin' | 'password',
  policy: LockoutPolicy,
  options: {
    now?: Date;
    transaction?: Transaction;
    signing?: boolean;
    /** The badge's row as this request already read it (req.staffRow), so it is not read twice. */
    known?: StaffRow;
  } = {},
): Promise<StaffRow> {
  const now = options.now ?? new Date();
  // Every signature runs this, so the row comes straight from the connector; the rare updates go through the model.
  const staff =
    options.known?.badgeNumber === badge ? options.known : await staffByBadge(badge, options.transaction);
  if (!staff) {
    // Spend about the same time as a real comparison so badge numbers cannot be probed by timing.
    await compareWithDummy(secret, policy.bcryptCost ?? 10);
    throw wrongSecretError(which);
  }
  const hash = hashToCompare(staff, which, now);
  const { store, refusal } = attemptOutcome(staff, await secretMatches(secret, hash), which, policy, {
    now,
    signing: options.signing,
  });
  if (store) await storeLockout(staff.id, store, options.transaction);
  if (refusal) throw refusal;
  return staff;
}
