import type { CreationAttributes, Model, ModelStatic } from 'sequelize';

/** A DATETIME(3) literal in UTC, as the connection's time zone (+00:00) reads it. */
export const sqlTime = (d: Date) => d.toISOString().slice(0, 23).replace('T', ' ');

export interface Statement {
  sql: string;
  values: unknown[];
}

const expression = Symbol('sql expression');

/** A value written as SQL, not bound: for a user variable set earlier in the same compound statement. */
export interface SqlExpression {
  [expression]: string;
}
export const sqlVariable = (name: string): SqlExpression => {
  if (!/^@[a-z_][a-z0-9_]*$/.test(name)) throw new Error(`${name} is not a user variable.`);
  return { [expression]: name };
};
const isExpression = (value: unknown): value is SqlExpression =>
  typeof value === 'object' && value !== null && expression in value;

/**
 * One multi-row INSERT for rows whose every value is known. The hot path of a signed check uses it: the ORM's
 * create validates, clones and generates per row, which costs more than the database's work. Columns come from
 * the model, so the table's mapping stays in one place.
 */
export function insertStatement<M extends Model>(
  model: ModelStatic<M>,
  rows: CreationAttributes<M>[],
): Statement {
  if (rows.length === 0) throw new Error(`No ${model.name} rows to insert.`);
  const attributes = model.getAttributes() as Record<string, { field?: string }>;
  const keys = Object.keys(rows[0]!);
  const columns = keys.map((k) => {
    const field = attributes[k]?.field;
    if (!field) throw new Error(`${model.name} has no attribute ${k}.`);
    return `\`${field}\``;
  });
  const valueOf = (row: CreationAttributes<M>, k: string) => (row as Record<string, unknown>)[k];
  const tuple = (row: CreationAttributes<M>) =>
    `(${keys
      .map((k) => {
        const v = valueOf(row, k);
        return isExpression(v) ? v[expression] : '?';
      })
      .join(',')})`;
  return {
    sql: `INSERT INTO \`${model.getTableName() as string}\` (${columns.join(',')}) VALUES ${rows.map(tuple).join(',')}`,
    values: rows.flatMap((row) =>
      keys
        .map((k) => valueOf(row, k))
        .filter((value) => !isExpression(value))
        .map((value) => (value instanceof Date ? sqlTime(value) : (value ?? null))),
    ),
  };
}
