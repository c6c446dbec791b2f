import type { Sequelize } from 'sequelize';
import type { BoardLinkCreated, BoardLinkInfo } from '@shared/schemas/board-links';
import {
  allBoardLinks,
  basesOfBoardLinks,
  baseIdsOfBoardLink,
  boardLinkByTokenHash,
  insertBoardLinkBases,
  insertBoardLink,
  lockBoardLink,
  unrevokedBoardLinkByTokenHash,
  updateBoardLink,
  type BoardLink,
} from './board-links.repository';
import { staffNames } from '@server/db/staff-names';
import { basesNamed } from '@server/db/base-codes';
import { appendAuditEvent } from '@server/audit/audit-trail';
import { randomToken, sha256 } from '@server/security/hashing';
import { AppError, conflict, notFound, refusal } from '@server/errors/app-error';
import { inTransaction } from '@server/db/retry';

async function toInfo(links: BoardLink[]): Promise<BoardLinkInfo[]> {
  const [people, basesOf] = await Promise.all([
    staffNames(links.map((l) => l.createdBy)),
    basesOfBoardLinks(links.map((l) => l.id)),
  ]);
  return links.map((l) => ({
    id: l.id,
    name: l.name,
    createdAt: l.createdAt.toISOString(),
    createdBy: people.get(l.createdBy) ?? 'unknown',
    revokedAt: l.revokedAt?.toISOString() ?? null,
    lastSeenAt: l.lastSeenAt?.toISOString() ?? null,
    bases: (basesOf.get(l.id) ?? []).map(({ code, name }) => ({ code, name })),
  }));
}

export async function createBoardLink(
  sequelize: Sequelize,
  name: string,
  by: number,
  baseCodes: string[] = [],
): Promise<BoardLinkCreated> {
  const bases = await basesNamed(baseCodes);
  const token = randomToken(24);
  const link = await inTransaction(sequelize, async (transaction) => {
    const created = await insertBoardLink(
      {
        name,
        tokenHash: sha256(token),
        createdBy: by,
        createdAt: new Date(),
        revokedAt: null,
        revokedBy: null,
        lastSeenAt: null,
      },
      transaction,
    );
    if (bases.length > 0)
      await insertBoardLinkBases(
        created.id,
        bases.map((b) => b.id),
        transaction,
      );
    await appendAuditEvent(sequelize, transaction, {
      actorId: by,
      action: 'board_link.created',
      entity: 'board_link',
      entityId: String(created.id),
      payload: { name, bases: bases.map((b) => b.code) },
    });
    return created;
  });
  const [info] = await toInfo([link]);
  return { ...info!, token, path: `/board?board=${token}` };
}

export async function listBoardLinks(): Promise<BoardLinkInfo[]> {
  return toInfo(await allBoardLinks());
}

export async function revokeBoardLink(sequelize: Sequelize, id: number, by: number): Promise<BoardLinkInfo> {
  const link = await inTransaction(sequelize, async (transaction) => {
    const found = await lockBoardLink(id, transaction);
    if (!found) throw notFound(refusal('boardLinks.linkGone'));
    if (found.revokedAt)
      throw conflict(
        'board_link_already_revoked',
        refusal('boardLinks.alreadyRevoked', { name: found.name }),
      );
    await updateBoardLink(found, { revokedAt: new Date(), revokedBy: by }, transaction);
    await appendAuditEvent(sequelize, transaction, {
      actorId: by,
      action: 'board_link.revoked',
      entity: 'board_link',
      entityId: String(found.id),
      payload: { name: found.name },
    });
    return found;
  });
  const [info] = await toInfo([link]);
  return info!;
}

/** The link a board token belongs to; a revoked or unknown token is refused, so a TV shows why it went blank. */
export async function boardLinkForToken(
  token: string,
): Promise<{ id: number; name: string; baseIds: number[] | null }> {
  const link = await boardLinkByTokenHash(sha256(token));
  if (!link) throw new AppError(401, 'board_link_unknown', refusal('boardLinks.unknown'));
  if (link.revokedAt) throw new AppError(401, 'board_link_revoked', refusal('boardLinks.revoked'));
  const now = new Date();
  if (!link.lastSeenAt || now.getTime() - link.lastSeenAt.getTime() > 60_000)
    await updateBoardLink(link, { lastSeenAt: now });
  const baseIds = await baseIdsOfBoardLink(link.id);
  return { id: link.id, name: link.name, baseIds: baseIds.length > 0 ? baseIds : null };
}

/** Whether a token opens a board link that was not revoked (without marking it seen). */
export const isLiveBoardToken = async (token: string) =>
  (await unrevokedBoardLinkByTokenHash(sha256(token))) !== null;
