import type { Sequelize } from 'sequelize';
import {
  allDevices,
  claimEnrolment,
  insertDevice,
  kioskDatabase,
  lockDevice,
  pendingEnrolment,
  unrevokedDeviceByEnrolCode,
  updateDevice,
} from './kiosks.repository';
import { randomToken, sha256 } from '@server/security/hashing';
import { AppError, notFound, refusal } from '@server/errors/app-error';
import { appendAuditEvent } from '@server/audit/audit-trail';
import { inTransaction } from '@server/db/retry';
import { baseNames, basesNamed } from '@server/db/base-codes';

const ENROL_VALID_HOURS = 24;

/**
 * A one-time enrolment link for a new tablet. Making one is a change to who may sign records, so it goes on the
 * audit trail (with no actor when a start-up script or a test makes it).
 */
export async function createEnrolment(
  name: string,
  createdBy: number | null,
  now = new Date(),
  baseCode?: string,
) {
  const [base] = await basesNamed(baseCode ? [baseCode] : [], 'base');
  const code = randomToken(18);
  const sequelize = kioskDatabase();
  return inTransaction(sequelize, async (transaction) => {
    const device = await insertDevice(
      {
        name,
        tokenHash: null,
        enrolCodeHash: sha256(code),
        enrolExpiresAt: new Date(now.getTime() + ENROL_VALID_HOURS * 3_600_000),
        enrolledAt: null,
        revokedAt: null,
        lastSeenAt: null,
        createdBy,
        baseId: base?.id ?? null,
      },
      transaction,
    );
    await appendAuditEvent(sequelize, transaction, {
      actorId: createdBy,
      action: 'kiosk.enrolment_created',
      entity: 'kiosk',
      entityId: String(device.id),
      payload: {
        name: device.name,
        enrolExpiresAt: device.enrolExpiresAt!.toISOString(),
        base: base?.code ?? null,
      },
    });
    return {
      id: device.id,
      name: device.name,
      code,
      enrolPath: `/enrol/${code}`,
      expiresAt: device.enrolExpiresAt!,
    };
  });
}

const enrolmentUsed = () => notFound(refusal('kiosks.enrolmentInvalid'), 'enrolment_invalid');

/**
 * Turns a one-time enrolment code into a device token; the code cannot be used again, even by two browsers at
 * once. The moment a tablet joins is on the audit trail beside who made its link.
 */
export async function redeemEnrolment(code: string, now = new Date()) {
  const device = await unrevokedDeviceByEnrolCode(sha256(code));
  if (!device) throw enrolmentUsed();
  if (device.enrolExpiresAt && device.enrolExpiresAt < now) {
    throw new AppError(410, 'enrolment_expired', refusal('kiosks.enrolmentExpired'));
  }
  const token = randomToken(32);
  const sequelize = kioskDatabase();
  await inTransaction(sequelize, async (transaction) => {
    const changes = { tokenHash: sha256(token), enrolledAt: now, lastSeenAt: now };
    if (!(await claimEnrolment(device.id, sha256(code), changes, transaction))) throw enrolmentUsed();
    await appendAuditEvent(sequelize, transaction, {
      actorId: null,
      action: 'kiosk.enrolled',
      entity: 'kiosk',
      entityId: String(device.id),
      payload: { name: device.name },
      at: now,
    });
  });
  return { token, device: { id: device.id, name: device.name } };
}

export async function listKiosks(now = new Date()) {
  const [devices, bases] = await Promise.all([allDevices(), baseNames()]);
  return devices.map((d) => ({
    id: d.id,
    name: d.name,
    base: d.baseId ? (bases.get(d.baseId) ?? null) : null,
    state: d.revokedAt
      ? 'revoked'
      : d.enrolledAt
        ? 'enrolled'
        : d.enrolExpiresAt && d.enrolExpiresAt <= now
          ? 'link_expired'
          : 'awaiting_enrolment',
    enrolledAt: d.enrolledAt?.toISOString() ?? null,
    lastSeenAt: d.lastSeenAt?.toISOString() ?? null,
    revokedAt: d.revokedAt?.toISOString() ?? null,
    enrolExpiresAt: d.enrolExpiresAt?.toISOString() ?? null,
  }));
}

/** Revoking stops the tablet at once; the first revocation is an audit event, a repeat changes nothing. */
export async function revokeKiosk(sequelize: Sequelize, id: number, actorId: number, now = new Date()) {
  return inTransaction(sequelize, async (transaction) => {
    const device = await lockDevice(id, transaction);
    if (!device) throw notFound(refusal('kiosks.tabletGone'));
    if (!device.revokedAt) {
      await updateDevice(device, { revokedAt: now, tokenHash: null, enrolCodeHash: null }, transaction);
      await appendAuditEvent(sequelize, transaction, {
        actorId,
        action: 'kiosk.revoked',
        entity: 'kiosk',
        entityId: String(id),
        payload: { name: device.name, revokedAt: device.revokedAt!.toISOString() },
      });
    }
    return { id: device.id, name: device.name, revokedAt: device.revokedAt!.toISOString() };
  });
}

/** Renaming keeps the device token: the tablet on the wall keeps working under its new name. */
export async function renameKiosk(sequelize: Sequelize, id: number, name: string, actorId: number) {
  return inTransaction(sequelize, async (transaction) => {
    const device = await lockDevice(id, transaction);
    if (!device) throw notFound(refusal('kiosks.tabletGone'));
    if (device.name !== name) {
      await appendAuditEvent(sequelize, transaction, {
        actorId,
        action: 'kiosk.renamed',
        entity: 'kiosk',
        entityId: String(id),
        payload: { from: device.name, to: name },
      });
      await updateDevice(device, { name }, transaction);
    }
    return { id: device.id, name: device.name };
  });
}

/** When a still unused enrolment code runs out; null when it is used, revoked, expired or unknown. */
export async function pendingEnrolmentExpiry(code: string, now = new Date()): Promise<Date | null> {
  return (await pendingEnrolment(sha256(code), now))?.enrolExpiresAt ?? null;
}

/** Moves a tablet to a base (or off any base); on the audit trail like a rename. */
export async function placeKiosk(sequelize: Sequelize, id: number, baseCode: string | null, actorId: number) {
  const [base] = await basesNamed(baseCode ? [baseCode] : [], 'base');
  return inTransaction(sequelize, async (transaction) => {
    const device = await lockDevice(id, transaction);
    if (!device) throw notFound(refusal('kiosks.tabletGone'));
    await updateDevice(device, { baseId: base?.id ?? null }, transaction);
    await appendAuditEvent(sequelize, transaction, {
      actorId,
      action: 'kiosk.placed',
      entity: 'kiosk',
      entityId: String(device.id),
      payload: { name: device.name, base: base?.code ?? null },
    });
    return { id: device.id, name: device.name, base: base ? { code: base.code, name: base.name } : null };
  });
}
