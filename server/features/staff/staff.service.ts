import type { Sequelize } from 'sequelize';
import { randomInt } from 'node:crypto';
import QRCode from 'qrcode';
import type { BadgeCard, StaffEdit, StaffMember, TemporaryPin } from '@shared/schemas/staff';
import { staffEditSchema, staffInputSchema, type StaffInput } from '@shared/schemas/staff';
import { roleSchema, type Role } from '@shared/schemas/auth';
import { toLanguage } from '@shared/i18n/languages';
import { isDuplicateKey } from '@server/db/unique-violation';
import { updateRow } from '@server/db/rows';
import {
  activeStaffByName,
  allStaffByName,
  insertStaff,
  lockStaff,
  setPin,
  type Staff,
} from './staff.repository';
import { appendAuditEvent, updateAudited } from '@server/audit/audit-trail';
import { hashSecret } from '@server/security/hashing';
import { verifyCredential, type LockoutPolicy } from '@server/security/credentials';
import type { SignInThrottle } from '@server/security/sign-in-throttle';
import { badRequest, conflict, notFound, refusal } from '@server/errors/app-error';
import { inTransaction } from '@server/db/retry';

const rolesOf = (stored: string): Role[] =>
  stored
    .split(',')
    .map((r) => r.trim())
    .filter((r): r is Role => roleSchema.safeParse(r).success);

function member(s: Staff): StaffMember {
  return {
    id: s.id,
    badgeNumber: s.badgeNumber,
    name: s.name,
    licenceNumber: s.licenceNumber,
    roles: rolesOf(s.roles),
    preferredLanguage: toLanguage(s.preferredLanguage) ?? null,
    active: Boolean(s.active),
    mustChangePin: Boolean(s.mustChangePin),
    hasDeskPassword: s.passwordHash !== null,
    lockedUntil: s.lockedUntil?.toISOString() ?? null,
    createdAt: s.createdAt.toISOString(),
  };
}

/** Six digits, none of the all-same or running patterns a person might guess first. */
function temporaryPin(): string {
  for (;;) {
    const pin = String(randomInt(0, 1_000_000)).padStart(6, '0');
    if (/^(\d)\1+$/.test(pin) || '0123456789'.includes(pin) || '9876543210'.includes(pin)) continue;
    return pin;
  }
}

const deskRoles: Role[] = ['shift_lead', 'engineering'];

export interface StaffOptions {
  bcryptCost: number;
  lockout: LockoutPolicy;
  signInThrottle: SignInThrottle;
}

export async function listStaff(): Promise<StaffMember[]> {
  return (await allStaffByName()).map(member);
}

export async function createStaff(
  sequelize: Sequelize,
  raw: StaffInput,
  actorId: number,
  options: StaffOptions,
): Promise<TemporaryPin> {
  const input = staffInputSchema.parse(raw);
  if (input.deskPassword && !input.roles.some((r) => deskRoles.includes(r))) {
    throw badRequest('desk_password_not_allowed', refusal('staff.deskPasswordRoles'), {
      path: 'deskPassword',
    });
  }
  const pin = temporaryPin();
  const [pinHash, passwordHash] = await Promise.all([
    hashSecret(pin, options.bcryptCost),
    input.deskPassword ? hashSecret(input.deskPassword, options.bcryptCost) : Promise.resolve(null),
  ]);
  try {
    const staff = await inTransaction(sequelize, async (transaction) => {
      const row = await insertStaff(
        {
          badgeNumber: input.badgeNumber,
          name: input.name,
          licenceNumber: input.licenceNumber,
          roles: input.roles.join(','),
          preferredLanguage: input.preferredLanguage,
          pinHash,
          passwordHash,
          lockedUntil: null,
          mustChangePin: true,
        },
        transaction,
      );
      await appendAuditEvent(sequelize, transaction, {
        actorId,
        action: 'staff.created',
        entity: 'staff',
        entityId: String(row.id),
        payload: {
          badge: row.badgeNumber,
          name: row.name,
          licence: row.licenceNumber,
          roles: input.roles,
          preferredLanguage: input.preferredLanguage,
          deskPassword: passwordHash !== null,
        },
      });
      return row;
    });
    return { staff: member(staff), temporaryPin: pin };
  } catch (err) {
    if (isDuplicateKey(err))
      throw conflict('badge_taken', refusal('staff.badgeTaken', { badge: input.badgeNumber }), {
        path: 'badgeNumber',
      });
    throw err;
  }
}

export async function updateStaff(sequelize: Sequelize, id: number, raw: StaffEdit, actorId: number) {
  const input = staffEditSchema.parse(raw);
  return inTransaction(sequelize, async (transaction) => {
    const staff = await lockStaff(id, transaction);
    if (!staff) throw notFound(refusal('staff.personGone'));
    const before = {
      name: staff.name,
      licenceNumber: staff.licenceNumber,
      roles: rolesOf(staff.roles).join(','),
      preferredLanguage: staff.preferredLanguage,
    };
    const after = {
      name: input.name,
      licenceNumber: input.licenceNumber,
      roles: input.roles.join(','),
      preferredLanguage:
        input.preferredLanguage === undefined ? staff.preferredLanguage : input.preferredLanguage,
    };
    await updateAudited(
      sequelize,
      transaction,
      staff,
      { before, after },
      {
        actorId,
        action: 'staff.changed',
        entity: 'staff',
        entityId: String(id),
      },
    );
    return member(staff);
  });
}

/** A new temporary PIN, shown once; the badge must choose its own before it can do anything else at a kiosk. */
export async function resetPin(
  sequelize: Sequelize,
  id: number,
  actorId: number,
  options: StaffOptions,
): Promise<TemporaryPin> {
  const pin = temporaryPin();
  const pinHash = await hashSecret(pin, options.bcryptCost);
  const staff = await inTransaction(sequelize, async (transaction) => {
    const row = await lockStaff(id, transaction);
    if (!row) throw notFound(refusal('staff.personGone'));
    if (!row.active) throw conflict('staff_inactive', refusal('staff.pinForInactive', { name: row.name }));
    await updateRow(row, { pinHash, mustChangePin: true, failedAttempts: 0, lockedUntil: null }, transaction);
    await appendAuditEvent(sequelize, transaction, {
      actorId,
      action: 'staff.pin_reset',
      entity: 'staff',
      entityId: String(id),
      payload: { badge: row.badgeNumber },
    });
    return row;
  });
  return { staff: member(staff), temporaryPin: pin };
}

/**
 * A shift lead or engineering lifts a lock before it runs out (the holder was seen, or the failures were someone
 * else's): the lock, the failure count and the slowing down of the badge end, and the trail says who did it.
 */
export async function unlockStaff(sequelize: Sequelize, id: number, actorId: number, options: StaffOptions) {
  const staff = await inTransaction(sequelize, async (transaction) => {
    const row = await lockStaff(id, transaction);
    if (!row) throw notFound(refusal('staff.personGone'));
    const lockedUntil = row.lockedUntil;
    if (!lockedUntil || lockedUntil <= new Date()) {
      throw conflict('not_locked', refusal('staff.notLocked', { badge: row.badgeNumber }));
    }
    await updateRow(row, { failedAttempts: 0, lockedUntil: null }, transaction);
    await appendAuditEvent(sequelize, transaction, {
      actorId,
      action: 'staff.unlocked',
      entity: 'staff',
      entityId: String(id),
      payload: { badge: row.badgeNumber, lockedUntil: lockedUntil.toISOString() },
    });
    return row;
  });
  await options.signInThrottle.forget(staff.badgeNumber);
  return member(staff);
}

/** The badge stops working; the row stays, so every record signed with it keeps the name and licence. */
export async function deactivateStaff(sequelize: Sequelize, id: number, actorId: number) {
  if (id === actorId) throw conflict('cannot_deactivate_self', refusal('staff.cannotDeactivateSelf'));
  return inTransaction(sequelize, async (transaction) => {
    const staff = await lockStaff(id, transaction);
    if (!staff) throw notFound(refusal('staff.personGone'));
    if (staff.active) {
      await updateRow(staff, { active: false }, transaction);
      await appendAuditEvent(sequelize, transaction, {
        actorId,
        action: 'staff.deactivated',
        entity: 'staff',
        entityId: String(id),
        payload: { badge: staff.badgeNumber, name: staff.name },
      });
    }
    return member(staff);
  });
}

/** The badge holder replaces a temporary PIN with one only they know. */
export async function changePin(
  sequelize: Sequelize,
  user: Express.User,
  currentPin: string,
  newPin: string,
  options: StaffOptions,
) {
  const staff = await verifyCredential(user.badgeNumber, currentPin, 'pin', options.lockout);
  const pinHash = await hashSecret(newPin, options.bcryptCost);
  await inTransaction(sequelize, async (transaction) => {
    await setPin(staff.id, pinHash, transaction);
    await appendAuditEvent(sequelize, transaction, {
      actorId: staff.id,
      action: 'staff.pin_changed',
      entity: 'staff',
      entityId: String(staff.id),
      payload: { badge: staff.badgeNumber, wasTemporary: Boolean(staff.mustChangePin) },
    });
  });
  return { mustChangePin: false };
}

export async function badgeCards(ids?: number[]): Promise<BadgeCard[]> {
  const staff = await activeStaffByName(ids);
  return Promise.all(
    staff.map(async (s) => ({
      id: s.id,
      badgeNumber: s.badgeNumber,
      name: s.name,
      licenceNumber: s.licenceNumber,
      roles: rolesOf(s.roles),
      qrSvg: await QRCode.toString(s.badgeNumber, { type: 'svg', errorCorrectionLevel: 'M', margin: 2 }),
    })),
  );
}
