import { Router } from 'express';
import type { Sequelize } from 'sequelize';
import { z } from 'zod';
import { acceptAirframeSchema } from '@shared/schemas/acceptance';
import { closeFlightSchema } from '@shared/schemas/usage';
import type { UsageStepLimits } from '@shared/domain/usage';
import { requireRole } from '@server/middleware/session-guard';
import type { LockoutPolicy } from '@server/security/credentials';
import { acceptAirframe, acceptanceView, type AcceptanceDeps } from './acceptance.service';
import { closeFlight } from './flight-close.service';
import { languageOf, translatorFor } from '@server/i18n/translator';

const idSchema = z.coerce.number().int().positive();

export function acceptanceRoutes(
  sequelize: Sequelize,
  options: AcceptanceDeps & { lockout: LockoutPolicy; usageLimits: UsageStepLimits; onChange: () => void },
): Router {
  const router = Router();
  router.get(
    '/airframes/:id/acceptance-view',
    requireRole('pilot', 'shift_lead', 'engineering'),
    async (req, res) => {
      // The bands in the screen's language (the client sends it as Accept-Language).
      const t = translatorFor(languageOf(req));
      res.json(await acceptanceView(sequelize, options, idSchema.parse(req.params.id), new Date(), t));
    },
  );
  router.post('/airframes/:id/accept', requireRole('pilot'), async (req, res) => {
    const id = idSchema.parse(req.params.id);
    const input = acceptAirframeSchema.parse(req.body);
    const record = await acceptAirframe(sequelize, options, id, input, {
      pilot: req.user!,
      lockout: options.lockout,
    });
    options.onChange();
    res.status(201).json(record);
  });
  // The pilot's close of a flight: the airframe's hours, flights and landings after it.
  router.post('/airframes/:id/flight-close', requireRole('pilot'), async (req, res) => {
    const id = idSchema.parse(req.params.id);
    const input = closeFlightSchema.parse(req.body);
    const entry = await closeFlight(sequelize, id, input, {
      pilot: req.user!,
      lockout: options.lockout,
      usageLimits: options.usageLimits,
    });
    options.onChange();
    res.status(201).json(entry);
  });
  return router;
}
