import { Router } from 'express';
import type { Sequelize } from 'sequelize';
import { handoverWindowSchema } from '../../../shared/schemas/holds';
import { requireRole } from '../../middleware/session-guard';
import { badRequest } from '../../errors/app-error';
import type { Mailer } from '../../mail/mailer';
import { handoverSummary, sendHandover, type FleetNow } from './handover.service';

const shiftMs = 12 * 3_600_000;

/** The window asked for; by default the last 12 hours up to now. */
function windowOf(input: unknown) {
  const parsed = handoverWindowSchema.parse(input ?? {});
  const to = parsed.to ? new Date(parsed.to) : new Date();
  const from = parsed.from ? new Date(parsed.from) : new Date(to.getTime() - shiftMs);
  if (from.getTime() >= to.getTime())
    throw badRequest('invalid_window', 'The start of the shift must come before its end.');
  return { from, to };
}

export function handoverRoutes(sequelize: Sequelize, mailer: Mailer, fleetNow: FleetNow): Router {
  const router = Router();
  router.get('/handover', requireRole('shift_lead', 'engineering'), async (req, res) => {
    const { from, to } = windowOf(req.query);
    res.json(await handoverSummary(sequelize, from, to, fleetNow));
  });
  router.post('/handover/send', requireRole('shift_lead'), async (req, res) => {
    const { from, to } = windowOf(req.body);
    res.json(await sendHandover(sequelize, mailer, from, to, req.user!, fleetNow));
  });
  return router;
}
