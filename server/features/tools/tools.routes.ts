import { Router } from 'express';
import type { Sequelize } from 'sequelize';
import { z } from 'zod';
import { createToolSchema, updateToolSchema } from '@shared/schemas/tools';
import { requireRole } from '@server/middleware/session-guard';
import { createTool, listTools, retireTool, updateTool } from './tools.service';

const idSchema = z.coerce.number().int().positive();

/**
 * The tools register: engineering keeps it; a mechanic's kiosk reads it to offer the tools of a reading. Whether a
 * tool may be used is decided again at signing, not by this list.
 */
export function toolRoutes(sequelize: Sequelize): Router {
  const router = Router();
  const engineering = requireRole('engineering');
  router.get('/tools', requireRole('engineering', 'mechanic'), async (_req, res) => {
    res.json(await listTools());
  });
  router.post('/tools', engineering, async (req, res) => {
    res.status(201).json(await createTool(sequelize, createToolSchema.parse(req.body), req.user!.id));
  });
  router.post('/tools/:id', engineering, async (req, res) => {
    const id = idSchema.parse(req.params.id);
    res.json(await updateTool(sequelize, id, updateToolSchema.parse(req.body), req.user!.id));
  });
  router.post('/tools/:id/retire', engineering, async (req, res) => {
    res.json(await retireTool(sequelize, idSchema.parse(req.params.id), req.user!.id));
  });
  return router;
}
