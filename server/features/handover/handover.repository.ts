import { Op } from 'sequelize';
import { Airframe, Check, Hold } from '@server/db/models';

export const activeAirframes = (ids?: number[]) =>
  Airframe.findAll({ where: { active: true, ...(ids ? { id: { [Op.in]: ids } } : {}) } });

/** The newest checks (up to 200) of an airframe signed by `to` with its hours recorded, newest first. */
export const recordedHours = (airframeId: number, to: Date) =>
  Check.findAll({
    where: { airframeId, signedAt: { [Op.lte]: to }, airframeHours: { [Op.ne]: null } },
    attributes: ['signedAt', 'airframeHours'],
    order: [['signedAt', 'DESC']],
    limit: 200,
  });

/** What happened in (from, to]: checks signed, holds opened and released; and how many holds are open now. */
export function shiftRecords(from: Date, to: Date) {
  const inWindow = { [Op.gt]: from, [Op.lte]: to };
  return Promise.all([
    Check.findAll({ where: { signedAt: inWindow }, attributes: ['id', 'kind', 'verdict'] }),
    Hold.findAll({ where: { openedAt: inWindow }, order: [['openedAt', 'ASC']] }),
    Hold.findAll({ where: { releasedAt: inWindow }, order: [['releasedAt', 'ASC']] }),
    Hold.count({ where: { releasedAt: { [Op.is]: null } } }),
  ]);
}
