import { Op, QueryTypes, type CreationAttributes, type Sequelize, type Transaction } from 'sequelize';
import { Acceptance, Airframe, Check } from '@server/db/models';
import { lockAuditHeadSql } from '@server/audit/audit-trail';

/** The newest defect, defect entry and release of the airframe: any change to them changes this mark. */
export async function techLogMark(sequelize: Sequelize, airframeId: number, transaction?: Transaction) {
  const [row] = await sequelize.query<{ mark: string }>(
    `SELECT CONCAT_WS('/',
        (SELECT MAX(id) FROM defects WHERE airframe_id = :airframeId),
        (SELECT MAX(e.id) FROM defect_entries e JOIN defects d ON d.id = e.defect_id WHERE d.airframe_id = :airframeId),
        (SELECT MAX(id) FROM airframe_releases WHERE airframe_id = :airframeId)) AS mark`,
    { replacements: { airframeId }, type: QueryTypes.SELECT, ...(transaction ? { transaction } : {}) },
  );
  return row?.mark ?? '';
}

export const checkHashes = (ids: string[]) =>
  Check.findAll({ where: { id: { [Op.in]: ids } }, attributes: ['id', 'kind', 'contentHash', 'signedAt'] });

/**
 * Every signed check and hold decision locks the audit trail's head before it commits. Holding that lock first,
 * the caller's transaction sees everything committed before it and nothing can commit in between.
 */
export async function lockAuditHead(sequelize: Sequelize, transaction: Transaction) {
  await sequelize.query(lockAuditHeadSql(), { type: QueryTypes.SELECT, transaction });
}

/** The airframe's open holds (ids in order) and how many checks were signed after `since`. */
export async function holdsAndNewerChecks(
  sequelize: Sequelize,
  airframeId: number,
  since: Date,
  transaction: Transaction,
) {
  const [changed] = await sequelize.query<{ holds: string | null; newer: number }>(
    `SELECT (SELECT GROUP_CONCAT(id ORDER BY id) FROM holds
              WHERE airframe_id = :airframeId AND released_at IS NULL) AS holds,
            (SELECT COUNT(*) FROM checks WHERE airframe_id = :airframeId AND signed_at > :since) AS newer`,
    { replacements: { airframeId, since }, type: QueryTypes.SELECT, transaction },
  );
  return { holds: changed?.holds ?? '', newer: Number(changed?.newer ?? 0) };
}

export const createAcceptance = (row: CreationAttributes<Acceptance>, transaction: Transaction) =>
  Acceptance.create(row, { transaction });

/** The acceptance signed under a screen's signing id, if any. */
export const acceptanceSignedAs = (requestId: string) => Acceptance.findOne({ where: { requestId } });

/** The airframe a pilot closes a flight of, if it is in the fleet. */
export const activeAirframe = (id: number, transaction: Transaction) =>
  Airframe.findOne({ where: { id, active: true }, attributes: ['id', 'fleetNumber'], transaction });
