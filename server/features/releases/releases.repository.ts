import { Op, type CreationAttributes, type Transaction } from 'sequelize';
import { AirframeRelease, Check, Staff } from '@server/db/models';

export const releasesOf = (airframeId: number) =>
  AirframeRelease.findAll({ where: { airframeId }, order: [['signedAt', 'DESC']], limit: 50 });

export const peopleNamed = async (ids: number[]) =>
  new Map(
    (
      await Staff.findAll({ where: { id: { [Op.in]: ids } }, attributes: ['id', 'name', 'licenceNumber'] })
    ).map((s) => [s.id, s]),
  );

export const checkHashes = (ids: string[]) =>
  ids.length === 0
    ? Promise.resolve([])
    : Check.findAll({ where: { id: { [Op.in]: ids } }, attributes: ['id', 'kind', 'contentHash'] });

export const createRelease = (row: CreationAttributes<AirframeRelease>, transaction: Transaction) =>
  AirframeRelease.create(row, { transaction });

/** The release signed under a screen's signing id, if any. */
export const releaseSignedAs = (requestId: string) => AirframeRelease.findOne({ where: { requestId } });
