import type { Attributes, CreationAttributes, Model, ModelStatic, Transaction } from 'sequelize';
import { runSql } from './direct-sql';

/** A DATETIME(3) literal in UTC, as the connection's time zone (+00:00) reads it. */
export const sqlTime = (d: Date) => d.toISOString().slice(0, 23).replace('T', ' ');

/**
 * One multi-row INSERT for rows whose every value is known, returned as the plain rows without reading them back.
 * The hot path of a signed check uses it: the ORM's create validates, clones and generates per row, which costs
 * more than the database's work. Columns come from the model, so the table's mapping stays in one place.
 */
export async function insertRows<M extends Model>(
  model: ModelStatic<M>,
  rows: CreationAttributes<M>[],
  transaction: Transaction,
): Promise<Attributes<M>[]> {
  if (rows.length === 0) return [];
  const attributes = model.getAttributes() as Record<string, { field?: string }>;
  const keys = Object.keys(rows[0]!);
  const columns = keys.map((k) => {
    const field = attributes[k]?.field;
    if (!field) throw new Error(`${model.name} has no attribute ${k}.`);
    return `\`${field}\``;
  });
  const one = `(${keys.map(() => '?').join(',')})`;
  const values = rows.flatMap((row) =>
    keys.map((k) => {
      const value = (row as Record<string, unknown>)[k];
      return value instanceof Date ? sqlTime(value) : (value ?? null);
    }),
  );
  await runSql(
    model.sequelize!,
    `INSERT INTO \`${model.getTableName() as string}\` (${columns.join(',')}) VALUES ${rows.map(() => one).join(',')}`,
    values,
    transaction,
  );
  return rows as Attributes<M>[];
}
