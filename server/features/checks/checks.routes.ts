import { Router } from 'express';
import type { Sequelize } from 'sequelize';
import { z } from 'zod';
import { checkDraftSchema, submitCheckSchema } from '@shared/schemas/checks';
import type { StoredCheck } from '@shared/schemas/checks';
import { conflict, refusal } from '@server/errors/app-error';
import { requireKiosk, requireRole, requireUser } from '@server/middleware/session-guard';
import type { LockoutPolicy } from '@server/security/credentials';
import type { UsageStepLimits } from '@shared/domain/usage';
import { loadStoredCheck, submitCheck } from './checks.service';
import { closeDraft, openDrafts, touchDraft } from './drafts.service';
import { closeDraftSchema } from '@shared/schemas/checks';

const checkIdSchema = z.uuid({ message: 'A check id is a UUID.' });

export function checkRoutes(
  sequelize: Sequelize,
  options: {
    lockout: LockoutPolicy;
    usageLimits: UsageStepLimits;
    /** After a change: a check just stored, or a draft started (no argument). */
    onChange: (stored?: StoredCheck) => void;
  },
): Router {
  const router = Router();
  router.post('/checks', requireKiosk, requireRole('mechanic'), async (req, res) => {
    const input = submitCheckSchema.parse(req.body);
    const result = await submitCheck(sequelize, input, {
      signer: req.user!,
      signerRow: req.staffRow,
      kioskId: req.kiosk?.id ?? null,
      lockout: options.lockout,
      usageLimits: options.usageLimits,
    });
    if (result.created) options.onChange(result.check);
    res
      .status(201)
      .set('Idempotent-Replay', result.created ? 'false' : 'true')
      .json(result.check);
  });
  // A signed check is a maintenance record: it is never changed or removed, only corrected by a new check.
  router.all(['/checks/:id', '/checks/:id/readings', '/checks/:id/readings/:code'], (req, _res, next) => {
    if (req.method === 'GET' || req.method === 'HEAD') return next();
    next(conflict('signed_check_immutable', refusal('checks.signedCheckImmutable')));
  });
  router.post('/check-drafts', requireKiosk, requireRole('mechanic'), async (req, res) => {
    const draft = await touchDraft(checkDraftSchema.parse(req.body), req.user!.id);
    if (draft.created) options.onChange();
    res.json(draft);
  });
  router.get('/check-drafts', requireRole('shift_lead', 'engineering'), async (_req, res) => {
    res.json(await openDrafts());
  });
  router.post('/check-drafts/:id/close', requireRole('shift_lead'), async (req, res) => {
    const id = checkIdSchema.parse(req.params.id);
    const closed = await closeDraft(sequelize, id, closeDraftSchema.parse(req.body), req.user!.id);
    options.onChange();
    res.json(closed);
  });
  router.get('/checks/:id', requireUser, async (req, res) => {
    res.json(await loadStoredCheck(checkIdSchema.parse(req.params.id)));
  });
  return router;
}
