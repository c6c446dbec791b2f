import type { CreationAttributes, Transaction } from 'sequelize';
import { AircraftType, Airframe, LimitsVersion } from '@server/db/models';

export type { AircraftType, LimitsVersion };

/** A version without its definition: what lists show. */
const summaryAttributes = ['id', 'typeId', 'version', 'status', 'publishedAt', 'publishedBy', 'createdAt'];

/** Every type, every version's summary (newest first) and the airframes in service, by type. */
export const typesWithVersions = () =>
  Promise.all([
    AircraftType.findAll({ order: [['code', 'ASC']] }),
    LimitsVersion.findAll({ attributes: summaryAttributes, order: [['version', 'DESC']] }),
    Airframe.findAll({ where: { active: true }, attributes: ['id', 'typeId'] }),
  ]);

export const typeById = (id: number) => AircraftType.findByPk(id);

export const versionSummaries = (typeId: number) =>
  LimitsVersion.findAll({ where: { typeId }, attributes: summaryAttributes, order: [['version', 'DESC']] });

export const activeAirframeCount = (typeId: number) => Airframe.count({ where: { typeId, active: true } });

export const versionById = (id: number) => LimitsVersion.findByPk(id);

export const insertType = (row: CreationAttributes<AircraftType>, transaction: Transaction) =>
  AircraftType.create(row, { transaction });

export const insertVersion = (row: CreationAttributes<LimitsVersion>, transaction: Transaction) =>
  LimitsVersion.create(row, { transaction });

export const lockLatestVersion = (typeId: number, transaction: Transaction) =>
  LimitsVersion.findOne({
    where: { typeId },
    order: [['version', 'DESC']],
    transaction,
    lock: transaction.LOCK.UPDATE,
  });

export const lockDraft = (typeId: number, transaction: Transaction) =>
  LimitsVersion.findOne({ where: { typeId, status: 'draft' }, transaction, lock: transaction.LOCK.UPDATE });
