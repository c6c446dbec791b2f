import { Router } from 'express';
import { z } from 'zod';
import { requireRole } from '@server/middleware/session-guard';
import { caughtMail, deliveries } from './mail.service';

const limitSchema = z.coerce.number().int().min(1).max(500).default(100);

export function mailRoutes(): Router {
  const router = Router();
  router.get('/mail/outbox', requireRole('engineering'), async (req, res) => {
    res.json(await caughtMail(limitSchema.parse(req.query.limit)));
  });
  router.get('/mail/deliveries', requireRole('engineering'), async (req, res) => {
    res.json(await deliveries(limitSchema.parse(req.query.limit)));
  });
  return router;
}
