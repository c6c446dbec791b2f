import { Router } from 'express';
import type { Sequelize } from 'sequelize';
import { z } from 'zod';
import { acceptAirframeSchema } from '@shared/schemas/acceptance';
import { requireRole } from '@server/middleware/session-guard';
import type { LockoutPolicy } from '@server/security/credentials';
import { acceptAirframe, acceptanceView, type AcceptanceDeps } from './acceptance.service';

const idSchema = z.coerce.number().int().positive();

export function acceptanceRoutes(
  sequelize: Sequelize,
  options: AcceptanceDeps & { lockout: LockoutPolicy; onChange: () => void },
): Router {
  const router = Router();
  router.get(
    '/airframes/:id/acceptance-view',
    requireRole('pilot', 'shift_lead', 'engineering'),
    async (req, res) => {
      res.json(await acceptanceView(sequelize, options, idSchema.parse(req.params.id)));
    },
  );
  router.post('/airframes/:id/accept', requireRole('pilot'), async (req, res) => {
    const id = idSchema.parse(req.params.id);
    const { pin } = acceptAirframeSchema.parse(req.body);
    const record = await acceptAirframe(sequelize, options, id, pin, {
      pilot: req.user!,
      lockout: options.lockout,
    });
    options.onChange();
    res.status(201).json(record);
  });
  return router;
}
