import { UniqueConstraintError } from 'sequelize';

/**
 * A write refused by a unique key: the connector's ER_DUP_ENTRY from the raw-SQL path, or Sequelize's
 * UniqueConstraintError from a model call. Services map it to their own 409 without knowing which path wrote.
 */
export const isDuplicateKey = (err: unknown) =>
  err instanceof UniqueConstraintError || (err as { errno?: number } | null)?.errno === 1062;
