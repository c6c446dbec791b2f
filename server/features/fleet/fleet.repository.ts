import { Op, type CreationAttributes, type Transaction } from 'sequelize';
import { AircraftType, Airframe, Base, Tag } from '@server/db/models';

export type { Airframe, Tag };

export const basesByCode = () => Base.findAll({ order: [['code', 'ASC']] });

/** Every airframe (in service or not) with the types, bases and tags the fleet list names. */
export const fleetRows = () =>
  Promise.all([
    Airframe.findAll({ order: [['fleetNumber', 'ASC']] }),
    AircraftType.findAll(),
    Base.findAll(),
    Tag.findAll({ order: [['issuedAt', 'DESC']] }),
  ]);

export const typeAndBase = (typeId: number, baseId: number) =>
  Promise.all([AircraftType.findByPk(typeId), Base.findByPk(baseId)]);

export const insertAirframe = (row: CreationAttributes<Airframe>, transaction: Transaction) =>
  Airframe.create(row, { transaction });

export const lockAirframe = (id: number, transaction: Transaction) =>
  Airframe.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE });

export const insertTag = (row: CreationAttributes<Tag>, transaction: Transaction) =>
  Tag.create(row, { transaction });

export const liveTags = (airframeId: number, transaction: Transaction) =>
  Tag.findAll({ where: { airframeId, revokedAt: { [Op.is]: null } }, transaction });

export const activeAirframeWithRegistration = (registration: string) =>
  Airframe.findOne({ where: { registration, active: true }, attributes: ['id', 'fleetNumber'] });
