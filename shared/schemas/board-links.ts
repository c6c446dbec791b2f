import { z } from 'zod';
import { freeText } from './free-text';

const baseCode = /^[A-Z0-9-]{2,12}$/;

/** A base as people name it: its code, e.g. "NPD". */
export const baseCodeSchema = z.string().trim().toUpperCase().regex(baseCode, 'words:validation.baseCode');

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
      .array(z.string().regex(baseCode, 'words:validation.baseCode'))
      .min(1, 'words:validation.oneBase')
      .max(50, 'words:validation.boardBases'),
  );

export const createBoardLinkSchema = z
  .object({
    name: freeText('words:validation.field.screenName', {
      min: 1,
      minMessage: 'words:validation.screenName',
      max: 100,
    }),
    /** Base codes the screen shows, e.g. ["NPD"]; left out or empty, the screen shows every base. */
    bases: z.array(baseCodeSchema).max(50, 'words:validation.boardLinkBases').optional(),
  })
  .strict();
export type CreateBoardLinkInput = z.infer<typeof createBoardLinkSchema>;

/** A board link token as handed out: URL-safe base64 of 24 random bytes. */
export const boardTokenSchema = z.string().regex(/^[A-Za-z0-9_-]{20,64}$/, 'words:validation.boardLink');

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
