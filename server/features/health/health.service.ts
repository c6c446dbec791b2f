import type { Sequelize } from 'sequelize';
import { pingDatabase } from './health.repository';

export type DatabaseHealth = { state: 'up'; latencyMs: number } | { state: 'down'; message: string };

export async function databaseHealth(sequelize: Sequelize): Promise<DatabaseHealth> {
  const t0 = Date.now();
  try {
    await pingDatabase(sequelize);
    return { state: 'up', latencyMs: Date.now() - t0 };
  } catch (err) {
    return { state: 'down', message: (err as Error).message };
  }
}
