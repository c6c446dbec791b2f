import { Router } from 'express';
import type { Sequelize } from 'sequelize';
import { z } from 'zod';
import { changePinSchema } from '@shared/schemas/staff';
import { printIdsSchema } from '@shared/schemas/fleet';
import { requireRole, requireUser } from '@server/middleware/session-guard';
import {
  badgeCards,
  changePin,
  createStaff,
  deactivateStaff,
  listStaff,
  resetPin,
  unlockStaff,
  updateStaff,
  type StaffOptions,
} from './staff.service';
import { grantAuthorisation, listAuthorisations, revokeAuthorisation } from './authorisations.service';
import { grantAuthorisationSchema } from '@shared/schemas/staff';

const idSchema = z.coerce.number().int().positive();
const idsSchema = printIdsSchema('staff');

export function staffRoutes(sequelize: Sequelize, options: StaffOptions): Router {
  const router = Router();
  const engineering = requireRole('engineering');
  router.get('/staff', engineering, async (_req, res) => {
    res.json(await listStaff());
  });
  router.post('/staff', engineering, async (req, res) => {
    res.status(201).json(await createStaff(sequelize, req.body, req.user!.id, options));
  });
  router.get('/staff/badge-cards', engineering, async (req, res) => {
    res.json(
      await badgeCards(idsSchema.parse(typeof req.query.ids === 'string' ? req.query.ids : undefined)),
    );
  });
  router.post('/staff/:id', engineering, async (req, res) => {
    res.json(await updateStaff(sequelize, idSchema.parse(req.params.id), req.body, req.user!.id));
  });
  router.post('/staff/:id/reset-pin', engineering, async (req, res) => {
    res.json(await resetPin(sequelize, idSchema.parse(req.params.id), req.user!.id, options));
  });
  router.post('/staff/:id/unlock', requireRole('shift_lead', 'engineering'), async (req, res) => {
    res.json(await unlockStaff(sequelize, idSchema.parse(req.params.id), req.user!.id, options));
  });
  router.post('/staff/:id/deactivate', engineering, async (req, res) => {
    res.json(await deactivateStaff(sequelize, idSchema.parse(req.params.id), req.user!.id));
  });
  router.get('/staff/:id/authorisations', requireRole('engineering', 'shift_lead'), async (req, res) => {
    res.json(await listAuthorisations(idSchema.parse(req.params.id)));
  });
  router.post('/staff/:id/authorisations', engineering, async (req, res) => {
    const input = grantAuthorisationSchema.parse(req.body);
    res
      .status(201)
      .json(await grantAuthorisation(sequelize, idSchema.parse(req.params.id), input, req.user!.id));
  });
  router.post('/staff/:id/authorisations/:authorisationId/revoke', engineering, async (req, res) => {
    res.json(
      await revokeAuthorisation(
        sequelize,
        idSchema.parse(req.params.id),
        idSchema.parse(req.params.authorisationId),
        req.user!.id,
      ),
    );
  });
  router.post('/auth/change-pin', requireUser, async (req, res) => {
    const { currentPin, newPin } = changePinSchema.parse(req.body);
    res.json(await changePin(sequelize, req.user!, currentPin, newPin, options));
  });
  return router;
}
