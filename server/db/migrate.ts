import { Umzug, SequelizeStorage } from 'umzug';
import { readdirSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import type { QueryInterface, Sequelize } from 'sequelize';

export interface Migration {
  up(queryInterface: QueryInterface): Promise<void>;
}

const folder = join(dirname(fileURLToPath(import.meta.url)), 'migrations');

/** Every `NNNN-name.ts` in migrations/, in name order; applied ones are recorded in `schema_migrations`. */
export function createMigrator(sequelize: Sequelize) {
  const files = readdirSync(folder)
    .filter((f) => /^\d{4}-[a-z0-9-]+\.ts$/.test(f))
    .sort();
  return new Umzug({
    migrations: files.map((file) => ({
      name: file.replace(/\.ts$/, ''),
      up: async () => {
        const module = (await import(pathToFileURL(join(folder, file)).href)) as Migration;
        await module.up(sequelize.getQueryInterface());
      },
    })),
    storage: new SequelizeStorage({ sequelize, tableName: 'schema_migrations' }),
    logger: undefined,
  });
}

export async function migrate(sequelize: Sequelize): Promise<string[]> {
  const applied = await createMigrator(sequelize).up();
  return applied.map((m) => m.name);
}
