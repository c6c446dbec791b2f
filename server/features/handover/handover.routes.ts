import { Router, type Request } from 'express';
import type { Sequelize } from 'sequelize';
import { handoverWindowSchema } from '@shared/schemas/handover';
import { requireRole } from '@server/middleware/session-guard';
import { AppError, badRequest, refusal } from '@server/errors/app-error';
import type { Mailer } from '@server/mail/mailer';
import { handoverSummary, sendHandover, type FleetNow } from './handover.service';

const shiftMs = 12 * 3_600_000;

/** The window asked for; by default the last 12 hours up to now. */
function windowOf(input: unknown) {
  const parsed = handoverWindowSchema.parse(input ?? {});
  const to = parsed.to ? new Date(parsed.to) : new Date();
  const from = parsed.from ? new Date(parsed.from) : new Date(to.getTime() - shiftMs);
  if (from.getTime() >= to.getTime()) throw badRequest('invalid_window', refusal('handover.startAfterEnd'));
  return { from, to };
}

/** The sent window; one sent as anything but JSON is never parsed and would silently become the default. */
function sentWindow(req: Request): unknown {
  const hasBody =
    Number(req.headers['content-length'] ?? 0) > 0 || req.headers['transfer-encoding'] !== undefined;
  if (hasBody && !req.is('application/json'))
    throw new AppError(
      415,
      'unsupported_media_type',
      refusal('handover.windowNotJson', { hours: shiftMs / 3_600_000 }),
    );
  return req.body;
}

export function handoverRoutes(sequelize: Sequelize, mailer: Mailer, fleetNow: FleetNow): Router {
  const router = Router();
  router.get('/handover', requireRole('shift_lead', 'engineering'), async (req, res) => {
    const { from, to } = windowOf(req.query);
    res.json(await handoverSummary(sequelize, from, to, fleetNow));
  });
  router.post('/handover/send', requireRole('shift_lead'), async (req, res) => {
    const { from, to } = windowOf(sentWindow(req));
    res.json(await sendHandover(sequelize, mailer, from, to, req.user!, fleetNow));
  });
  return router;
}
