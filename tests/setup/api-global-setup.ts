import type { TestProject } from 'vitest/node';
import { testDatabase } from './test-database';

declare module 'vitest' {
  export interface ProvidedContext {
    databaseUrl: string;
  }
}

export default async function setup(project: TestProject) {
  const db = await testDatabase('TEST_DATABASE_URL_API', 'gaugewalk_api');
  await db.sequelize.close();
  project.provide('databaseUrl', db.url);
  return db.stop;
}
