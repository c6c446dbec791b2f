import type { Attributes, CreationAttributes, Transaction } from 'sequelize';
import { Tool } from '@server/db/models';

export type ToolRow = Attributes<Tool>;

export const allTools = () => Tool.findAll({ order: [['number', 'ASC']] });

export const insertTool = (row: CreationAttributes<Tool>, transaction: Transaction) =>
  Tool.create(row, { transaction });

export const lockTool = (id: number, transaction: Transaction) =>
  Tool.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE });
