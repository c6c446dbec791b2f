import type { Attributes, Model, Transaction } from 'sequelize';

/** Writes changes to a row a repository handed out, inside the caller's transaction when there is one. */
export async function updateRow<M extends Model>(
  row: M,
  changes: Partial<Attributes<M>>,
  transaction?: Transaction,
) {
  await row.update(changes, transaction ? { transaction } : {});
}
