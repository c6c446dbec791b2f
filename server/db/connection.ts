import { Sequelize } from 'sequelize';
import { initModels } from './models';

export interface DatabaseOptions {
  logging?: boolean;
  pool?: number;
  /**
   * `wsrep_sync_wait` for every connection when the server is a Galera node (ignored otherwise): 1 makes each read
   * wait until the node has applied every write the cluster certified before it, so a tablet that signs through
   * one instance and reads through another sees its own check. 0 turns it off.
   */
  syncWait?: number;
}

/** Galera only: a server without wsrep leaves the setting at 0, and one built without it has no such variable. */
async function setSyncWait(connection: unknown, level: number) {
  const query = (connection as { query: (sql: string, values?: unknown[]) => Promise<unknown> }).query;
  try {
    await query.call(connection, 'SET SESSION wsrep_sync_wait = IF(@@wsrep_on, ?, 0)', [level]);
  } catch (err) {
    if ((err as { errno?: number }).errno !== 1193) throw err;
  }
}

/**
 * MariaDB rewrites an IN list of 1,000 values or more into a join against a derived table, which loses the
 * loose index scan the board's "newest check of each kind" query relies on: with 1,100 airframes it examined
 * 170,551 checks instead of 5,500, and reading the fleet's records took twice as long (measured, see
 * DEVELOPERS.md). 0 keeps IN lists as range scans on the index, as they are below that size.
 */
async function keepInLists(connection: unknown) {
  const query = (connection as { query: (sql: string) => Promise<unknown> }).query;
  try {
    await query.call(connection, 'SET SESSION in_predicate_conversion_threshold = 0');
  } catch (err) {
    if ((err as { errno?: number }).errno !== 1193) throw err;
  }
}

export function createSequelize(url: string, options: DatabaseOptions = {}): Sequelize {
  const syncWait = options.syncWait ?? 1;
  return new Sequelize(url, {
    dialect: 'mariadb',
    logging: options.logging ? (sql) => process.stdout.write(`${sql}\n`) : false,
    pool: { max: options.pool ?? 10, min: 0, idle: 10_000, acquire: 20_000 },
    dialectOptions: { connectTimeout: 5_000 },
    timezone: '+00:00',
    define: { underscored: true, timestamps: false },
    hooks: {
      afterConnect: async (connection) => {
        await setSyncWait(connection, syncWait);
        await keepInLists(connection);
      },
    },
  });
}

/** A connection with every model bound to it: what the app, the start-up scripts and the bench open. */
export function openDatabase(url: string, options: DatabaseOptions = {}): Sequelize {
  const sequelize = createSequelize(url, options);
  initModels(sequelize);
  return sequelize;
}
