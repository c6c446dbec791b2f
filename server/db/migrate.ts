import { Umzug, SequelizeStorage } from 'umzug';
import type { QueryInterface, Sequelize } from 'sequelize';
import * as initial from './migrations/0001-initial';

export interface Migration {
  up(queryInterface: QueryInterface): Promise<void>;
}

const migrations: { name: string; module: Migration }[] = [{ name: '0001-initial', module: initial }];

export function createMigrator(sequelize: Sequelize) {
  return new Umzug({
    migrations: migrations.map(({ name, module }) => ({
      name,
      up: () => module.up(sequelize.getQueryInterface()),
    })),
    storage: new SequelizeStorage({ sequelize, tableName: 'schema_migrations' }),
    logger: undefined,
  });
}

export async function migrate(sequelize: Sequelize): Promise<string[]> {
  const applied = await createMigrator(sequelize).up();
  return applied.map((m) => m.name);
}
