import { Router } from 'express';
import type { Sequelize } from 'sequelize';
import { z } from 'zod';
import { submitCheckSchema } from '../../../shared/schemas/checks';
import { requireKiosk, requireRole, requireUser } from '../../middleware/session-guard';
import type { LockoutPolicy } from '../../security/credentials';
import { loadStoredCheck, submitCheck } from './checks.service';

const checkIdSchema = z.uuid({ message: 'A check id is a UUID.' });

export function checkRoutes(
  sequelize: Sequelize,
  options: { lockout: LockoutPolicy; onChange: () => void },
): Router {
  const router = Router();
  router.post('/checks', requireKiosk, requireRole('mechanic'), async (req, res) => {
    const input = submitCheckSchema.parse(req.body);
    const result = await submitCheck(sequelize, input, {
      signer: req.user!,
      kioskId: req.kiosk?.id ?? null,
      lockout: options.lockout,
    });
    if (result.created) options.onChange();
    res
      .status(201)
      .set('Idempotent-Replay', result.created ? 'false' : 'true')
      .json(result.check);
  });
  router.get('/checks/:id', requireUser, async (req, res) => {
    res.json(await loadStoredCheck(checkIdSchema.parse(req.params.id)));
  });
  return router;
}
