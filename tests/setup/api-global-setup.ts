import type { TestProject } from 'vitest/node';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { testDatabase } from './test-database';
import { findFreePort } from '@server/db/local-server';
import { startFakeObjectStore } from '@server/storage/fake-object-store';

declare module 'vitest' {
  export interface ProvidedContext {
    databaseUrl: string;
    /** The PHOTO_STORE_* settings of the local fake object store the API tests keep photos in. */
    photoStoreEnv: Record<string, string>;
  }
}

export default async function setup(project: TestProject) {
  const db = await testDatabase('TEST_DATABASE_URL_API', 'gaugewalk_api');
  await db.sequelize.close();
  project.provide('databaseUrl', db.url);
  const objects = mkdtempSync(join(tmpdir(), 'gaugewalk-api-objects-'));
  const store = await startFakeObjectStore({ directory: objects, port: await findFreePort(0) });
  project.provide('photoStoreEnv', store.env);
  return async () => {
    await store.stop();
    rmSync(objects, { recursive: true, force: true });
    await db.stop();
  };
}
