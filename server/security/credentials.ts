import type { Attributes, Transaction } from 'sequelize';
import { Staff } from '../db/models';
import { selectRow } from '../db/direct-sql';
import { AppError } from '../errors/app-error';
import { hashSecret, secretMatches } from './hashing';

let dummyHash: string | undefined;

export interface LockoutPolicy {
  maxAttempts: number;
  lockMinutes: number;
}

const timeOfDay = (d: Date) => d.toISOString().slice(11, 16);

export type StaffRow = Attributes<Staff>;

function lockedError(staff: StaffRow): AppError {
  const until = staff.lockedUntil as Date;
  return new AppError(
    423,
    'badge_locked',
    `Badge ${staff.badgeNumber} is locked until ${timeOfDay(until)} UTC after too many wrong attempts. ` +
      'Ask a shift lead if you need in sooner.',
    { lockedUntil: until.toISOString() },
  );
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
    dummyHash ??= await hashSecret('not-a-pin', 10);
    await secretMatches(secret, dummyHash);
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
