import { z } from 'zod';
import { freeText } from './free-text';

export const createBoardLinkSchema = z
  .object({
    name: freeText('The screen name', {
      min: 1,
      minMessage: 'Name the screen, e.g. "Crew room TV".',
      max: 100,
    }),
  })
  .strict();
export type CreateBoardLinkInput = z.infer<typeof createBoardLinkSchema>;

/** A board link token as handed out: URL-safe base64 of 24 random bytes. */
export const boardTokenSchema = z.string().regex(/^[A-Za-z0-9_-]{20,64}$/, 'That is not a board link.');

export interface BoardLinkInfo {
  id: number;
  name: string;
  createdAt: string;
  createdBy: string;
  revokedAt: string | null;
  lastSeenAt: string | null;
}

/** Only answered once, on creation: the token itself is not stored. */
export interface BoardLinkCreated extends BoardLinkInfo {
  token: string;
  /** Path to open on the TV, e.g. /board?board=<token>. */
  path: string;
}
