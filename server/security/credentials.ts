import type { Attributes, Transaction } from 'sequelize';
import { Staff } from '../db/models';
import { selectRow } from '../db/direct-sql';
import { AppError } from '../errors/app-error';
import { hashSecret, secretMatches } from './hashing';
import type { SignInThrottle } from './sign-in-throttle';

export interface LockoutPolicy {
  maxAttempts: number;
  lockMinutes: number;
  /** Failures of one badge from this many addresses lock it even when none came from an enrolled tablet. */
  lockMinAddresses?: number;
  /** Cost of the hash compared when there is no real one, so every failed sign-in takes as long. */
  bcryptCost?: number;
}

const timeOfDay = (d: Date) => d.toISOString().slice(11, 16);

export type StaffRow = Attributes<Staff>;

function lockedError(staff: Pick<StaffRow, 'badgeNumber' | 'lockedUntil'>): AppError {
  const until = staff.lockedUntil as Date;
  return new AppError(
    423,
    'badge_locked',
    `Badge ${staff.badgeNumber} is locked until ${timeOfDay(until)} UTC after too many wrong attempts. ` +
      'A shift lead or engineering can unlock it sooner.',
    { lockedUntil: until.toISOString() },
  );
}

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
  const decision = throttle.decide(badge, address);
  if ('refuseForMs' in decision) {
    const seconds = Math.ceil(decision.refuseForMs / 1000);
    throw new AppError(
      429,
      'sign_in_slowed',
      `Too many failed sign-ins for this badge or from this device. Try again in ${seconds} s.`,
      { retryAfterSeconds: seconds },
    );
  }
  throttle.begin(badge);
  try {
    if (decision.waitMs > 0) await sleep(decision.waitMs);
    const staff = await selectRow(Staff, '`badge_number` = ?', [badge]);
    const hash = staff?.active ? (which === 'pin' ? staff.pinHash : staff.passwordHash) : null;
    const matches = hash
      ? await secretMatches(secret, hash)
      : await compareWithDummy(secret, policy.bcryptCost ?? 10);
    const now = new Date();
    const dbLock = hash && staff!.lockedUntil && staff!.lockedUntil > now ? staff!.lockedUntil : null;
    const lockedUntil = dbLock ?? throttle.lockedUntil(badge);
    if (lockedUntil) throw lockedError({ badgeNumber: badge, lockedUntil });
    if (hash && matches) {
      if (staff!.failedAttempts > 0 || staff!.lockedUntil) {
        await Staff.update({ failedAttempts: 0, lockedUntil: null }, { where: { id: staff!.id } });
      }
      throttle.forget(badge);
      return staff!;
    }
    const count = throttle.recordFailure(badge, address, fromTablet);
    // A real badge's tablet failures are counted in the database with the signature failures, across instances.
    let tabletFailures = count.fromTablets;
    if (hash && fromTablet) {
      tabletFailures = staff!.failedAttempts + 1;
      await Staff.update({ failedAttempts: tabletFailures }, { where: { id: staff!.id } });
    }
    const fromMany =
      count.addresses >= (policy.lockMinAddresses ?? Infinity) && count.failures >= policy.maxAttempts;
    if (tabletFailures >= policy.maxAttempts || fromMany) {
      const until = new Date(now.getTime() + policy.lockMinutes * 60_000);
      if (hash) await Staff.update({ failedAttempts: 0, lockedUntil: until }, { where: { id: staff!.id } });
      throttle.lock(badge, until);
      throw lockedError({ badgeNumber: badge, lockedUntil: until });
    }
    throw new AppError(
      401,
      which === 'pin' ? 'wrong_pin' : 'wrong_password',
      which === 'pin'
        ? 'That badge and PIN do not match, or the badge cannot sign in. Ask a shift lead if it keeps happening.'
        : 'That badge and password do not match, or the badge has no desk sign-in.',
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
    options.known?.badgeNumber === badge
      ? options.known
      : await selectRow(Staff, '`badge_number` = ?', [badge], { transaction: options.transaction });
  const update = (values: Partial<StaffRow>) =>
    Staff.update(values, { where: { id: staff!.id }, transaction: options.transaction });
  // Made only when refusing: an Error records its stack, which every signature would pay for.
  const refused = (more = '', details?: Record<string, unknown>) =>
    new AppError(
      401,
      which === 'pin' ? 'wrong_pin' : 'wrong_password',
      `${which === 'pin' ? 'That badge and PIN do not match.' : 'That badge and password do not match.'}${more}`,
      details,
    );
  if (!staff) {
    // Spend about the same time as a real comparison so badge numbers cannot be probed by timing.
    await compareWithDummy(secret, policy.bcryptCost ?? 10);
    throw refused();
  }
  if (!staff.active) throw new AppError(403, 'badge_inactive', `Badge ${badge} is no longer active.`);
  if (staff.lockedUntil && staff.lockedUntil > now) throw lockedError(staff);
  const hash = which === 'pin' ? staff.pinHash : staff.passwordHash;
  if (!hash) {
    throw new AppError(
      403,
      'no_desk_password',
      `Badge ${badge} has no desk password. Sign in on a kiosk instead.`,
    );
  }
  if (await secretMatches(secret, hash)) {
    if (staff.failedAttempts > 0 || staff.lockedUntil) {
      await update({ failedAttempts: 0, lockedUntil: null });
    }
    // A temporary PIN was set by someone else, so it cannot be this person's signature.
    if (options.signing && which === 'pin' && staff.mustChangePin) {
      throw new AppError(
        403,
        'pin_change_required',
        'Your PIN is a temporary one. Choose your own PIN before you sign.',
      );
    }
    return staff;
  }
  const failed = staff.failedAttempts + 1;
  if (failed >= policy.maxAttempts) {
    const lockedUntil = new Date(now.getTime() + policy.lockMinutes * 60_000);
    await update({ failedAttempts: 0, lockedUntil });
    throw lockedError({ ...staff, lockedUntil });
  }
  await update({ failedAttempts: failed });
  const left = policy.maxAttempts - failed;
  throw refused(` ${left} attempt${left === 1 ? '' : 's'} left.`, { attemptsLeft: left });
}
