import type { Sequelize } from 'sequelize';
import { runSql } from './sql';

const exists = async (sequelize: Sequelize, sql: string, id: string) =>
  (await runSql<unknown[]>(sequelize, sql, [id])).length > 0;

/** Whether the check's airframe is in service: the only checks a pilot may read. */
export const checkOfAirframeInService = (sequelize: Sequelize, checkId: string) =>
  exists(
    sequelize,
    'SELECT 1 FROM `checks` c JOIN `airframes` a ON a.`id` = c.`airframe_id` AND a.`active` = 1 WHERE c.`id` = ?',
    checkId,
  );

/** Whether the photo belongs to a signed check of an airframe in service. */
export const photoOfAirframeInService = (sequelize: Sequelize, photoId: string) =>
  exists(
    sequelize,
    'SELECT 1 FROM `photos` p JOIN `checks` c ON c.`id` = p.`check_id` ' +
      'JOIN `airframes` a ON a.`id` = c.`airframe_id` AND a.`active` = 1 WHERE p.`id` = ?',
    photoId,
  );
