import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { findFreePort, startLocalMariadb } from '@server/db/local-server';
import { createSequelize } from '@server/db/connection';
import { initModels } from '@server/db/models';
import { migrate } from '@server/db/migrate';

/**
 * The URL the test command started for this project; run straight from vitest, a throw-away server of its own.
 * Either way the schema is migrated before any test runs.
 */
export async function testDatabase(envName: 'TEST_DATABASE_URL_API' | 'TEST_DATABASE_URL_E2E', name: string) {
  let url = process.env[envName];
  let stop = async () => {};
  if (!url) {
    const db = await startLocalMariadb({
      dataDir: mkdtempSync(join(tmpdir(), `gaugewalk-${name}-`)),
      port: await findFreePort(0),
      database: name,
      ephemeral: true,
      quiet: true,
    });
    url = db.url;
    stop = db.stop;
  }
  const sequelize = createSequelize(url);
  initModels(sequelize);
  await migrate(sequelize);
  return { url, sequelize, stop };
}
