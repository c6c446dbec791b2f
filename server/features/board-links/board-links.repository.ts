import type { CreationAttributes, Transaction } from 'sequelize';
import { Op } from 'sequelize';
import { Base, BoardLink, BoardLinkBase } from '@server/db/models';

export type { BoardLink };

export const insertBoardLink = (row: CreationAttributes<BoardLink>, transaction: Transaction) =>
  BoardLink.create(row, { transaction });

export const allBoardLinks = () => BoardLink.findAll({ order: [['createdAt', 'DESC']] });

export const lockBoardLink = (id: number, transaction: Transaction) =>
  BoardLink.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE });

export const boardLinkByTokenHash = (tokenHash: string) => BoardLink.findOne({ where: { tokenHash } });

export async function updateBoardLink(
  link: BoardLink,
  changes: Partial<Pick<BoardLink, 'revokedAt' | 'revokedBy' | 'lastSeenAt'>>,
  transaction?: Transaction,
) {
  await link.update(changes, transaction ? { transaction } : {});
}

export const unrevokedBoardLinkByTokenHash = (tokenHash: string) =>
  BoardLink.findOne({ where: { tokenHash, revokedAt: null } });

export const insertBoardLinkBases = (boardLinkId: number, baseIds: number[], transaction: Transaction) =>
  BoardLinkBase.bulkCreate(
    baseIds.map((baseId) => ({ boardLinkId, baseId })),
    { transaction },
  );

/** One link's base ids, for every request of its screen (one read of the link's own rows); empty: every base. */
export async function baseIdsOfBoardLink(linkId: number): Promise<number[]> {
  const rows = await BoardLinkBase.findAll({ where: { boardLinkId: linkId }, attributes: ['baseId'] });
  return rows.map((r) => r.baseId).sort((a, b) => a - b);
}

/** Each link's bases as code and name; a link missing from the map shows every base. */
export async function basesOfBoardLinks(
  linkIds: number[],
): Promise<Map<number, { id: number; code: string; name: string }[]>> {
  const out = new Map<number, { id: number; code: string; name: string }[]>();
  if (linkIds.length === 0) return out;
  const [rows, bases] = await Promise.all([
    BoardLinkBase.findAll({ where: { boardLinkId: { [Op.in]: linkIds } } }),
    Base.findAll(),
  ]);
  const byId = new Map(bases.map((b) => [b.id, b]));
  for (const row of rows) {
    const base = byId.get(row.baseId);
    if (!base) continue;
    const list = out.get(row.boardLinkId) ?? [];
    list.push({ id: base.id, code: base.code, name: base.name });
    out.set(
      row.boardLinkId,
      list.sort((a, b) => a.code.localeCompare(b.code)),
    );
  }
  return out;
}
