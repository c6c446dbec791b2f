import { Op, type CreationAttributes, type Transaction } from 'sequelize';
import { KioskDevice } from '@server/db/models';

export type { KioskDevice };

/** The database the devices live in, for the callers (a start-up script, a test) that bring no handle of their own. */
export const kioskDatabase = () => KioskDevice.sequelize!;

export const insertDevice = (row: CreationAttributes<KioskDevice>, transaction: Transaction) =>
  KioskDevice.create(row, { transaction });

export const unrevokedDeviceByEnrolCode = (enrolCodeHash: string) =>
  KioskDevice.findOne({ where: { enrolCodeHash, revokedAt: { [Op.is]: null } } });

/** Turns the enrolment into a device token only if the code is still unused; whether it was. */
export async function claimEnrolment(
  id: number,
  enrolCodeHash: string,
  changes: Pick<KioskDevice, 'tokenHash' | 'enrolledAt' | 'lastSeenAt'>,
  transaction: Transaction,
) {
  const [claimed] = await KioskDevice.update(
    { ...changes, enrolCodeHash: null, enrolExpiresAt: null },
    { where: { id, enrolCodeHash, revokedAt: { [Op.is]: null } }, transaction },
  );
  return claimed === 1;
}

export const allDevices = () => KioskDevice.findAll({ order: [['createdAt', 'DESC']] });

export const lockDevice = (id: number, transaction: Transaction) =>
  KioskDevice.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE });

export async function updateDevice(
  device: KioskDevice,
  changes: Partial<Pick<KioskDevice, 'name' | 'revokedAt' | 'tokenHash' | 'enrolCodeHash' | 'baseId'>>,
  transaction: Transaction,
) {
  await device.update(changes, { transaction });
}

/** A device whose enrolment code is unused, unrevoked and not yet run out. */
export const pendingEnrolment = (enrolCodeHash: string, now: Date) =>
  KioskDevice.findOne({
    where: { enrolCodeHash, enrolledAt: null, revokedAt: null, enrolExpiresAt: { [Op.gt]: now } },
  });
