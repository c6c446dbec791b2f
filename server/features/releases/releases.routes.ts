import { Router } from 'express';
import type { Sequelize } from 'sequelize';
import { z } from 'zod';
import { releaseAirframeSchema } from '@shared/schemas/releases';
import { requireRole } from '@server/middleware/session-guard';
import type { LockoutPolicy } from '@server/security/credentials';
import { airframeReleases, releaseAirframe, type ReleaseStatusOf } from './releases.service';

const idSchema = z.coerce.number().int().positive();

export function releaseRoutes(
  sequelize: Sequelize,
  options: { lockout: LockoutPolicy; statusOf: ReleaseStatusOf; onChange: () => void },
): Router {
  const router = Router();
  router.get(
    '/airframes/:id/releases',
    requireRole('mechanic', 'shift_lead', 'engineering', 'pilot'),
    async (req, res) => {
      res.json(await airframeReleases(idSchema.parse(req.params.id)));
    },
  );
  router.post('/airframes/:id/release', requireRole('mechanic', 'shift_lead'), async (req, res) => {
    const input = releaseAirframeSchema.parse(req.body);
    const release = await releaseAirframe(sequelize, options.statusOf, idSchema.parse(req.params.id), input, {
      signer: req.user!,
      channel: req.session.channel,
      lockout: options.lockout,
    });
    options.onChange();
    res.status(201).json(release);
  });
  return router;
}
