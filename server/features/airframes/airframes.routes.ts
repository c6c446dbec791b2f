import { Router, type RequestHandler } from 'express';
import type { Sequelize } from 'sequelize';
import { z } from 'zod';
import { checkKindSchema } from '@shared/schemas/limits';
import { requireUser } from '@server/middleware/session-guard';
import { notFound, unauthorized } from '@server/errors/app-error';
import { airframeByTag, airframeSummaries, checkCard } from './airframes.service';
import type { ChangeFeed } from './change-feed';
import { BoardSnapshots } from './board-snapshot';

const idSchema = z.coerce.number().int().positive();
const tokenSchema = z.string().regex(/^[A-Za-z0-9_-]{8,64}$/, 'That is not a tag code.');

/** The board may be read by a signed-in person or on an enrolled kiosk tablet. */
const requireViewer: RequestHandler = (req, _res, next) =>
  next(req.user || req.kiosk ? undefined : unauthorized());

/** The board itself may also be read through a read-only board link. */
const requireBoardViewer: RequestHandler = (req, _res, next) =>
  next(req.user || req.kiosk || req.boardLink ? undefined : unauthorized());

export function airframeRoutes(sequelize: Sequelize, changes: ChangeFeed): Router {
  const router = Router();
  const board = new BoardSnapshots(sequelize);
  // Changes stored through other instances reach this instance's board streams within a second.
  changes.watch(() => board.fingerprint());
  router.get('/airframes', requireBoardViewer, async (_req, res) => {
    res.type('application/json').send(await board.json());
  });
  router.get('/airframes/:id', requireViewer, async (req, res) => {
    const [summary] = await airframeSummaries(sequelize, new Date(), idSchema.parse(req.params.id));
    if (!summary) throw notFound(`No airframe with id ${req.params.id}.`);
    res.json(summary);
  });
  router.get('/airframes/:id/cards/:kind', requireUser, async (req, res) => {
    res.json(await checkCard(idSchema.parse(req.params.id), checkKindSchema.parse(req.params.kind)));
  });
  router.get('/tags/:token', requireViewer, async (req, res) => {
    res.json(await airframeByTag(tokenSchema.parse(req.params.token)));
  });
  router.get('/board/events', requireBoardViewer, (req, res) => {
    res.set({
      'Content-Type': 'text/event-stream',
      'Cache-Control': 'no-cache',
      Connection: 'keep-alive',
      'X-Accel-Buffering': 'no',
    });
    res.flushHeaders();
    res.write(`retry: 3000\nevent: hello\ndata: ${changes.current}\n\n`);
    const unsubscribe = changes.subscribe((version) => res.write(`event: change\ndata: ${version}\n\n`));
    const ping = setInterval(() => res.write(`: ping\n\n`), 20_000);
    const stopOnClose = changes.onClose(() => res.end());
    req.on('close', () => {
      clearInterval(ping);
      unsubscribe();
      stopOnClose();
    });
  });
  return router;
}
