import { Router, type Request, type RequestHandler } from 'express';
import type { Sequelize } from 'sequelize';
import { z } from 'zod';
import { checkKindSchema } from '@shared/schemas/limits';
import { requireUser } from '@server/middleware/session-guard';
import { forbidden, notFound, refusal, unauthorized } from '@server/errors/app-error';
import { baseIdsNamed } from '@server/db/base-codes';
import { baseListSchema } from '@shared/schemas/board-links';
import { airframeByTag, airframeSummaries, checkCard } from './airframes.service';
import type { ChangeFeed } from './change-feed';
import { BoardSnapshots, ownBaseFirst } from './board-snapshot';
import { sendEncodedJson } from './encoded-json';

const idSchema = z.coerce.number().int().positive();

/** `GET /api/airframes?base=NP,HH&limit=50&offset=100`: a base's board, a page at a time when asked. */
const boardQuerySchema = z.object({
  base: baseListSchema.optional(),
  limit: z.coerce
    .number()
    .int()
    .min(1, 'A page holds at least 1 airframe.')
    .max(500, 'A page holds at most 500 airframes.')
    .optional(),
  offset: z.coerce.number().int().min(0, 'A page cannot start before the first airframe.').default(0),
});

/**
 * Which bases a request's board shows. A board link bound to bases shows those and no others: a `?base=` may narrow
 * it but never widen it. Without a link, `?base=` names the bases, and without that the board shows every base.
 */
async function boardScope(req: Request, codes: string[] | undefined): Promise<readonly number[] | undefined> {
  const asked = codes ? await baseIdsNamed(codes, 'base') : undefined;
  const allowed = req.boardLink?.baseIds ?? null;
  if (!allowed) return asked;
  if (asked?.some((id) => !allowed.includes(id))) throw forbidden(refusal('boardLinks.baseNotShown'));
  return asked ?? allowed;
}

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
  router.get('/airframes', requireBoardViewer, async (req, res) => {
    const query = boardQuerySchema.parse(req.query);
    const scope = await boardScope(req, query.base);
    const ownBase = req.kiosk?.baseId ?? null;
    if (query.limit === undefined && query.offset === 0) {
      await sendEncodedJson(req, res, await board.encoded(new Date(), scope, ownBase));
      return;
    }
    const all = await board.summaries(new Date(), scope);
    const ordered = ownBase === null ? all : ownBaseFirst(all, ownBase);
    const end = query.limit === undefined ? ordered.length : query.offset + query.limit;
    res.set('X-Total-Count', String(ordered.length));
    if (end < ordered.length) {
      const next = new URLSearchParams({
        ...(query.base ? { base: query.base.join(',') } : {}),
        limit: String(query.limit),
        offset: String(end),
      });
      res.set('Link', `</api/airframes?${next.toString()}>; rel="next"`);
    }
    res.json(ordered.slice(query.offset, end));
  });
  router.get('/airframes/:id', requireViewer, async (req, res) => {
    const [summary] = await airframeSummaries(sequelize, new Date(), idSchema.parse(req.params.id));
    if (!summary) throw notFound(refusal('airframes.airframeGone'));
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
