import type { Attributes, Transaction } from 'sequelize';
import { Staff } from '../db/models';
import { selectRow } from '../db/direct-sql';
import { hashSecret, secretMatches } from './hashing';
import { attemptOutcome, hashToCompare, wrongSecretError, type LockoutPolicy } from './lockout';

let dummyHash: string | undefined;

// Callers name the policy through this module; the rules of an attempt live in lockout.ts, free of the database.
export type { LockoutPolicy };

export type StaffRow = Attributes<Staff>;

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
  if (!staff) {
    // Spend about the same time as a real comparison so badge numbers cannot be probed by timing.
    dummyHash ??= await hashSecret('not-a-pin', 10);
    await secretMatches(secret, dummyHash);
    throw wrongSecretError(which);
  }
  const hash = hashToCompare(staff, which, now);
  const { store, refusal } = attemptOutcome(staff, await secretMatches(secret, hash), which, policy, {
    now,
    signing: options.signing,
  });
  if (store) await Staff.update(store, { where: { id: staff.id }, transaction: options.transaction });
  if (refusal) throw refusal;
  return staff;
}
