import { Op, type CreationAttributes, type Transaction } from 'sequelize';
import { AircraftType, Staff, StaffAuthorisation } from '@server/db/models';

export type { Staff, StaffAuthorisation };

export const allStaffByName = () => Staff.findAll({ order: [['name', 'ASC']] });

export const activeStaffByName = (ids?: number[]) =>
  Staff.findAll({
    where: { active: true, ...(ids ? { id: { [Op.in]: ids } } : {}) },
    order: [['name', 'ASC']],
  });

export const staffById = (id: number) => Staff.findByPk(id);

export const lockStaff = (id: number, transaction: Transaction) =>
  Staff.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE });

export const insertStaff = (row: CreationAttributes<Staff>, transaction: Transaction) =>
  Staff.create(row, { transaction });

export async function setPin(id: number, pinHash: string, transaction: Transaction) {
  await Staff.update({ pinHash, mustChangePin: false }, { where: { id }, transaction });
}

export async function typeCodes() {
  return new Set((await AircraftType.findAll({ attributes: ['code'] })).map((t) => t.code));
}

export const authorisationsOf = (staffId: number) =>
  StaffAuthorisation.findAll({ where: { staffId }, order: [['id', 'DESC']] });

export const insertAuthorisation = (row: CreationAttributes<StaffAuthorisation>, transaction: Transaction) =>
  StaffAuthorisation.create(row, { transaction });

export const lockAuthorisation = (id: number, staffId: number, transaction: Transaction) =>
  StaffAuthorisation.findOne({ where: { id, staffId }, transaction, lock: transaction.LOCK.UPDATE });
