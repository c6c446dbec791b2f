import type { CreationAttributes, Transaction } from 'sequelize';
import { BoardLink } from '@server/db/models';

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
