import { Router } from 'express';
import type { Sequelize } from 'sequelize';
import { z } from 'zod';
import { createBoardLinkSchema } from '@shared/schemas/board-links';
import { requireRole } from '@server/middleware/session-guard';
import { createBoardLink, listBoardLinks, revokeBoardLink } from './board-links.service';

const idSchema = z.coerce.number().int().positive();

export function boardLinkRoutes(sequelize: Sequelize): Router {
  const router = Router();
  router.post('/board-links', requireRole('engineering'), async (req, res) => {
    const { name, bases } = createBoardLinkSchema.parse(req.body);
    res.status(201).json(await createBoardLink(sequelize, name, req.user!.id, bases ?? []));
  });
  router.get('/board-links', requireRole('engineering'), async (_req, res) => {
    res.json(await listBoardLinks());
  });
  router.post('/board-links/:id/revoke', requireRole('engineering'), async (req, res) => {
    res.json(await revokeBoardLink(sequelize, idSchema.parse(req.params.id), req.user!.id));
  });
  return router;
}
