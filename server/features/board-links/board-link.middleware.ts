import type { RequestHandler } from 'express';
import { boardTokenSchema } from '@shared/schemas/board-links';
import { AppError, refusal } from '@server/errors/app-error';
import { boardLinkForToken } from './board-links.service';

export const BOARD_TOKEN_HEADER = 'X-Board-Token';

/**
 * Recognises a read-only board link (`?board=` or the X-Board-Token header) and sets req.boardLink; only the
 * board's read routes accept it. A request without a token passes untouched.
 */
export const recogniseBoardLink: RequestHandler = async (req, _res, next) => {
  const fromQuery = typeof req.query.board === 'string' ? req.query.board : undefined;
  const token = req.get(BOARD_TOKEN_HEADER) ?? fromQuery;
  if (token === undefined) return next();
  const parsed = boardTokenSchema.safeParse(token);
  if (!parsed.success) throw new AppError(401, 'board_link_unknown', refusal('boardLinks.unknown'));
  req.boardLink = await boardLinkForToken(parsed.data);
  next();
};
