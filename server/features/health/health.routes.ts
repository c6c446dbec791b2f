import { Router } from 'express';
import type { Sequelize } from 'sequelize';
import { databaseHealth } from './health.service';

export function healthRoutes(sequelize: Sequelize, startedAt: Date): Router {
  const router = Router();
  router.get('/health', async (_req, res) => {
    const database = await databaseHealth(sequelize);
    res.status(database.state === 'up' ? 200 : 503).json({
      app: { state: 'up', startedAt: startedAt.toISOString(), uptimeSeconds: Math.round(process.uptime()) },
      database,
    });
  });
  return router;
}
