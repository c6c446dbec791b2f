import { Sequelize } from 'sequelize';
import { initModels } from './models';

export function createSequelize(url: string, options: { logging?: boolean; pool?: number } = {}): Sequelize {
  return new Sequelize(url, {
    dialect: 'mariadb',
    logging: options.logging ? (sql) => process.stdout.write(`${sql}\n`) : false,
    pool: { max: options.pool ?? 10, min: 0, idle: 10_000, acquire: 20_000 },
    dialectOptions: { connectTimeout: 5_000 },
    timezone: '+00:00',
    define: { underscored: true, timestamps: false },
  });
}

/** A connection with every model bound to it: what the app, the start-up scripts and the bench open. */
export function openDatabase(url: string, options: { logging?: boolean; pool?: number } = {}): Sequelize {
  const sequelize = createSequelize(url, options);
  initModels(sequelize);
  return sequelize;
}
