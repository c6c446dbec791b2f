import { Router, type Request } from 'express';
import type { Sequelize } from 'sequelize';
import { z } from 'zod';
import { airframeInputSchema, printIdsSchema } from '@shared/schemas/fleet';
import { requireRole } from '@server/middleware/session-guard';
import { createAirframe, listBases, listFleet, reissueTag, tagSheet, updateAirframe } from './fleet.service';

const idSchema = z.coerce.number().int().positive();
const idsSchema = printIdsSchema('airframe');

/** The address the tag encodes is the one this server was reached at, so a tag printed here works here. */
const originOf = (req: Request) => `${req.protocol}://${req.get('host')}`;

export function fleetRoutes(sequelize: Sequelize): Router {
  const router = Router();
  const engineering = requireRole('engineering');
  router.get('/fleet/bases', engineering, async (_req, res) => {
    res.json(await listBases());
  });
  router.get('/fleet/airframes', engineering, async (_req, res) => {
    res.json(await listFleet());
  });
  router.post('/fleet/airframes', engineering, async (req, res) => {
    res.status(201).json(await createAirframe(sequelize, airframeInputSchema.parse(req.body), req.user!.id));
  });
  router.post('/fleet/airframes/:id', engineering, async (req, res) => {
    const id = idSchema.parse(req.params.id);
    res.json(await updateAirframe(sequelize, id, airframeInputSchema.parse(req.body), req.user!.id));
  });
  router.post('/fleet/airframes/:id/reissue-tag', engineering, async (req, res) => {
    res.json(await reissueTag(sequelize, idSchema.parse(req.params.id), req.user!.id));
  });
  router.get('/fleet/tag-sheet', engineering, async (req, res) => {
    const ids = idsSchema.parse(typeof req.query.ids === 'string' ? req.query.ids : undefined);
    res.json(await tagSheet(originOf(req), ids));
  });
  return router;
}
