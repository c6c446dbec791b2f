import type { Attributes, Transaction } from 'sequelize';
import { Staff } from '../db/models';
import { selectRow } from '../db/sql';

// The staff columns a sign-in or a signature reads and the lockout writes; the rules live in lockout.ts.

export type StaffRow = Attributes<Staff>;

/** Every signature reads this, so the row comes straight from the connector. */
export const staffByBadge = (badge: string, transaction?: Transaction) =>
  selectRow(Staff, '`badge_number` = ?', [badge], { transaction });

/** The rare update of a badge's failure count or lock. */
export const storeLockout = (
  staffId: number,
  fields: Partial<Pick<StaffRow, 'failedAttempts' | 'lockedUntil'>>,
  transaction?: Transaction,
) => Staff.update(fields, { where: { id: staffId }, transaction });
