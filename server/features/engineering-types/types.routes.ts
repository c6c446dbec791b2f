import { Router } from 'express';
import type { Sequelize } from 'sequelize';
import { z } from 'zod';
import { createTypeSchema, saveDraftSchema } from '@shared/schemas/engineering-types';
import { requireRole } from '@server/middleware/session-guard';
import { diffDefinitions } from './limits-diff';
import {
  createType,
  editVersion,
  listTypes,
  publishDraft,
  saveDraft,
  typeDetail,
  versionDetail,
} from './types.service';

const idSchema = z.coerce.number().int().positive();
const diffQuerySchema = z.object({ from: idSchema, to: idSchema });

/** Aircraft types, their check cards and limits: drafts, publication and the difference between versions. */
export function engineeringTypeRoutes(sequelize: Sequelize): Router {
  const router = Router();
  const engineering = requireRole('engineering');
  router.get('/types', engineering, async (_req, res) => {
    res.json(await listTypes());
  });
  router.post('/types', engineering, async (req, res) => {
    res.status(201).json(await createType(sequelize, createTypeSchema.parse(req.body), req.user!.id));
  });
  router.get('/types/:id', engineering, async (req, res) => {
    res.json(await typeDetail(idSchema.parse(req.params.id)));
  });
  router.get('/types/:id/versions/:versionId', engineering, async (req, res) => {
    res.json(await versionDetail(idSchema.parse(req.params.id), idSchema.parse(req.params.versionId)));
  });
  router.post('/types/:id/draft', engineering, async (req, res) => {
    const { definition } = saveDraftSchema.parse(req.body);
    res.json(await saveDraft(sequelize, idSchema.parse(req.params.id), definition, req.user!.id));
  });
  router.post('/types/:id/versions/:versionId', engineering, async (req, res) => {
    const typeId = idSchema.parse(req.params.id);
    const versionId = idSchema.parse(req.params.versionId);
    const { definition } = saveDraftSchema.parse(req.body);
    res.json(await editVersion(sequelize, typeId, versionId, definition, req.user!.id));
  });
  router.post('/types/:id/draft/publish', engineering, async (req, res) => {
    res.json(await publishDraft(sequelize, idSchema.parse(req.params.id), req.user!.id));
  });
  router.get('/types/:id/diff', engineering, async (req, res) => {
    const typeId = idSchema.parse(req.params.id);
    const { from, to } = diffQuerySchema.parse(req.query);
    const [a, b] = await Promise.all([versionDetail(typeId, from), versionDetail(typeId, to)]);
    res.json(
      diffDefinitions(
        { id: a.id, version: a.version, status: a.status },
        a.definition,
        { id: b.id, version: b.version, status: b.status },
        b.definition,
      ),
    );
  });
  return router;
}
