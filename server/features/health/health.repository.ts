import type { Sequelize } from 'sequelize';
import { runSql } from '@server/db/sql';

export async function pingDatabase(sequelize: Sequelize) {
  await runSql(sequelize, 'SELECT 1');
}
