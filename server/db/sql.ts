import type { Connection } from 'mariadb';
import {
  DataTypes,
  type Attributes,
  type CreationAttributes,
  type Model,
  type ModelStatic,
  type Sequelize,
  type Transaction,
} from 'sequelize';

import { sqlTime } from './sql-time';

/**
 * The one home of raw SQL and of the Sequelize internals it leans on (a transaction's `connection`, the
 * `connectionManager`, the bare mariadb connector); `sql.test.ts` fails if an upgrade moves them.
 *
 * Statements sent straight to the mariadb connector, for the few queries every request or every signed check
 * runs. Sequelize's query path costs more CPU than the database's work for a one-row lookup (it builds the SQL,
 * captures a stack trace and post-processes every result); on the hot path that made the app, not the database,
 * the limit. Connections still come from Sequelize's pool, and inside a Sequelize transaction the statements use
 * that transaction's connection, so commit and rollback stay where they were.
 */

const connectionOf = (transaction: Transaction) =>
  (transaction as unknown as { connection: Connection }).connection;

export async function runSql<T = unknown>(
  sequelize: Sequelize,
  sql: string,
  values: unknown[] = [],
  transaction?: Transaction,
): Promise<T> {
  if (transaction) return (await connectionOf(transaction).query(sql, values)) as T;
  return withConnection(sequelize, async (connection) => (await connection.query(sql, values)) as T);
}

const selectLists = new WeakMap<object, Map<string, { list: string; booleans: string[] }>>();

/**
 * `column AS attribute` for every attribute of the model, and which attributes are booleans (stored as 0/1). With
 * an alias, for a joined table: `alias.column AS "alias.attribute"`.
 */
function selectListOf(model: ModelStatic<Model>, alias = '') {
  let byAlias = selectLists.get(model);
  if (!byAlias) {
    byAlias = new Map();
    selectLists.set(model, byAlias);
  }
  let cached = byAlias.get(alias);
  if (!cached) {
    const attributes = Object.entries(
      model.getAttributes() as Record<string, { field?: string; type: unknown }>,
    );
    const from = alias ? `\`${alias}\`.` : '';
    const as = alias ? `${alias}.` : '';
    cached = {
      list: attributes.map(([name, a]) => `${from}\`${a.field ?? name}\` AS \`${as}${name}\``).join(', '),
      booleans: attributes.filter(([, a]) => a.type instanceof DataTypes.BOOLEAN).map(([name]) => name),
    };
    byAlias.set(alias, cached);
  }
  return cached;
}

/**
 * A model's row read through a LEFT JOIN, in one statement with other tables' columns: the select list for the
 * joined table under `alias`, and the plain row taken back out of a result row (null when the join found none).
 */
export function joinedModel<M extends Model>(model: ModelStatic<M>, alias: string) {
  const { list, booleans } = selectListOf(model, alias);
  const names = Object.keys(model.getAttributes());
  const key = `${alias}.${model.primaryKeyAttribute}`;
  return {
    list,
    rowOf(result: Record<string, unknown>): Attributes<M> | null {
      if (result[key] === null || result[key] === undefined) return null;
      const row: Record<string, unknown> = {};
      for (const name of names) row[name] = result[`${alias}.${name}`];
      for (const name of booleans) if (row[name] !== null) row[name] = Boolean(row[name]);
      return row as Attributes<M>;
    },
  };
}

interface SelectOptions {
  transaction?: Transaction;
  /** More select-list entries after the model's columns, such as a scalar subquery `(...) AS name`. */
  also?: string;
}

/**
 * Plain rows of a model's table (every attribute, named as the model names it) where `condition` holds. Values
 * come back as the model would give them: DATETIME as Date, DECIMAL as string, BOOLEAN as boolean.
 */
export async function selectRows<M extends Model, Extra extends object = object>(
  model: ModelStatic<M>,
  condition: string,
  values: unknown[],
  options: SelectOptions = {},
): Promise<(Attributes<M> & Extra)[]> {
  const { list, booleans } = selectListOf(model);
  const table = model.getTableName() as string;
  const rows = await runSql<Record<string, unknown>[]>(
    model.sequelize!,
    `SELECT ${list}${options.also ? `, ${options.also}` : ''} FROM \`${table}\` WHERE ${condition}`,
    values,
    options.transaction,
  );
  return rows.map((row) => {
    for (const name of booleans) if (row[name] !== null) row[name] = Boolean(row[name]);
    return row as Attributes<M> & Extra;
  });
}

export async function selectRow<M extends Model, Extra extends object = object>(
  model: ModelStatic<M>,
  condition: string,
  values: unknown[],
  options: SelectOptions = {},
): Promise<(Attributes<M> & Extra) | null> {
  return (await selectRows<M, Extra>(model, `${condition} LIMIT 1`, values, options))[0] ?? null;
}

/** One pooled connection of the connector's own, for statements that must share it (a transaction). */
export async function withConnection<T>(sequelize: Sequelize, work: (connection: Connection) => Promise<T>) {
  const manager = sequelize.connectionManager;
  const connection = (await manager.getConnection({ type: 'write' })) as unknown as Connection;
  try {
    return await work(connection);
  } finally {
    manager.releaseConnection(connection as never);
  }
}

/**
 * Several statements sent as one MariaDB compound statement (`BEGIN NOT ATOMIC ... END`): one round trip instead
 * of one per statement, without allowing multiple statements on the connection. The first error rolls the open
 * transaction back before it is raised, so a block that ends with COMMIT commits all of it or nothing.
 */
export function atomicBlock(statements: { sql: string; values: unknown[] }[]) {
  return {
    sql:
      'BEGIN NOT ATOMIC\nDECLARE EXIT HANDLER FOR SQLEXCEPTION BEGIN ROLLBACK; RESIGNAL; END;\n' +
      statements.map((s) => `${s.sql};\n`).join('') +
      'END',
    values: statements.flatMap((s) => s.values),
  };
}

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
