import type { Attributes, Model, Transaction } from 'sequelize';

/** Writes changes to a row a repository handed out, inside the caller's transaction when there is one. */
export async function updateRow<M extends Model>(
  row: M,
  changes: Partial<Attributes<M>>,
  transaction?: Transaction,
) {
  await row.update(changes, transaction ? { transaction } : {});
}

/** The fields whose value differs between two versions of a row, and the audit payload naming each as { from, to }. */
export function fieldChanges<T extends object>(before: T, after: T) {
  const changed = (Object.keys(before) as (keyof T & string)[]).filter((k) => before[k] !== after[k]);
  return { changed, payload: Object.fromEntries(changed.map((k) => [k, { from: before[k], to: after[k] }])) };
}
