import { Router } from 'express';
import type { Sequelize } from 'sequelize';

export function healthRoutes(sequelize: Sequelize, startedAt: Date): Router {
  const router = Router();
  router.get('/health', async (_req, res) => {
    const t0 = Date.now();
    let database: { state: 'up' | 'down'; latencyMs?: number; message?: string };
    try {
      await sequelize.query('SELECT 1');
      database = { state: 'up', latencyMs: Date.now() - t0 };
    } catch (err) {
      database = { state: 'down', message: (err as Error).message };
    }
    const ok = database.state === 'up';
    res.status(ok ? 200 : 503).json({
      app: { state: 'up', startedAt: startedAt.toISOString(), uptimeSeconds: Math.round(process.uptime()) },
      database,
    });
  });
  return router;
}
