import { Router } from 'express';
import { z } from 'zod';
import { kioskCreateSchema, kioskPlaceSchema, kioskRenameSchema } from '@shared/schemas/kiosks';
import { requireRole } from '@server/middleware/session-guard';
import { KIOSK_COOKIE, kioskCookieOptions } from '@server/middleware/kiosk-device';
import type { Sequelize } from 'sequelize';
import {
  createEnrolment,
  listKiosks,
  placeKiosk,
  redeemEnrolment,
  renameKiosk,
  revokeKiosk,
} from './kiosks.service';

const codeSchema = z
  .object({ code: z.string().regex(/^[A-Za-z0-9_-]{10,64}$/, 'That enrolment code is not valid.') })
  .strict();
const idSchema = z.coerce.number().int().positive();

export function kioskRoutes(options: { secureCookies: boolean; sequelize: Sequelize }): Router {
  const router = Router();
  router.get('/kiosks', requireRole('engineering'), async (_req, res) => {
    res.json(await listKiosks());
  });
  router.post('/kiosks', requireRole('engineering'), async (req, res) => {
    const { name, base } = kioskCreateSchema.parse(req.body);
    const enrolment = await createEnrolment(name, req.user!.id, new Date(), base);
    res.status(201).json(enrolment);
  });
  router.post('/kiosks/:id/revoke', requireRole('engineering'), async (req, res) => {
    res.json(await revokeKiosk(options.sequelize, idSchema.parse(req.params.id), req.user!.id));
  });
  router.post('/kiosks/:id/rename', requireRole('engineering'), async (req, res) => {
    const { name } = kioskRenameSchema.parse(req.body);
    res.json(await renameKiosk(options.sequelize, idSchema.parse(req.params.id), name, req.user!.id));
  });
  router.post('/kiosks/:id/base', requireRole('engineering'), async (req, res) => {
    const { base } = kioskPlaceSchema.parse(req.body);
    res.json(await placeKiosk(options.sequelize, idSchema.parse(req.params.id), base, req.user!.id));
  });
  router.post('/kiosks/enrol', async (req, res) => {
    const { code } = codeSchema.parse(req.body);
    const { token, device } = await redeemEnrolment(code);
    res.cookie(KIOSK_COOKIE, token, kioskCookieOptions(options.secureCookies));
    res.json({ kiosk: device });
  });
  return router;
}
