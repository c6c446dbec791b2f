import { z } from 'zod';
import { freeText } from './free-text';

const baseCode = /^[A-Z0-9-]{2,12}$/;

/** A base as people name it: its code, e.g. "NPD". */
export const baseCodeSchema = z.string().trim().toUpperCase().regex(baseCode, 'That is not a base code.');

/** `?base=NPD,HBR`: one base or a comma-separated list. */
export const baseListSchema = z
  .string()
  .max(400)
  .transform((text) => [
    ...new Set(
      text
        .split(',')
        .map((code) => code.trim().toUpperCase())
        .filter(Boolean),
    ),
  ])
  .pipe(
    z
      .array(z.string().regex(baseCode, 'That is not a base code.'))
      .min(1, 'Name at least one base.')
      .max(50, 'A board shows at most 50 bases.'),
  );

export const createBoardLinkSchema = z
  .object({
    name: freeText('The screen name', {
      min: 1,
      minMessage: 'Name the screen, e.g. "Crew room TV".',
      max: 100,
    }),
    /** Base codes the screen shows, e.g. ["NPD"]; left out or empty, the screen shows every base. */
    bases: z.array(baseCodeSchema).max(50, 'A board link shows at most 50 bases.').optional(),
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
  /** The bases the screen shows; empty when it shows every base. */
  bases: { code: string; name: string }[];
}

/** Only answered once, on creation: the token itself is not stored. */
export interface BoardLinkCreated extends BoardLinkInfo {
  token: string;
  /** Path to open on the TV, e.g. /board?board=<token>. */
  path: string;
}
