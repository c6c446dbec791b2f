import { DataTypes, type QueryInterface } from 'sequelize';

export async function up(qi: QueryInterface): Promise<void> {
  // Sign-in limits counted in the database, so every app instance counts the same attempts (issue 16). Each row
  // carries the scope of the instances that share it (SIGN_IN_COUNT_SCOPE).
  await qi.createTable('sign_in_hits', {
    scope: { type: DataTypes.STRING(40), allowNull: false, primaryKey: true },
    key: { type: DataTypes.STRING(191), allowNull: false, primaryKey: true },
    hits: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    resets_at: { type: DataTypes.DATE(3), allowNull: false },
  });
  await qi.addIndex('sign_in_hits', ['resets_at'], { name: 'sign_in_hits_resets_at' });
  await qi.createTable('sign_in_failures', {
    id: { type: DataTypes.BIGINT.UNSIGNED, autoIncrement: true, primaryKey: true },
    scope: { type: DataTypes.STRING(40), allowNull: false },
    badge: { type: DataTypes.STRING(64), allowNull: false },
    address: { type: DataTypes.STRING(64), allowNull: false },
    from_tablet: { type: DataTypes.BOOLEAN, allowNull: false },
    at: { type: DataTypes.DATE(3), allowNull: false },
  });
  await qi.addIndex('sign_in_failures', ['scope', 'badge', 'at'], { name: 'sign_in_failures_badge' });
  await qi.addIndex('sign_in_failures', ['scope', 'address', 'at'], { name: 'sign_in_failures_address' });
  await qi.addIndex('sign_in_failures', ['at'], { name: 'sign_in_failures_at' });
  await qi.createTable('sign_in_locks', {
    scope: { type: DataTypes.STRING(40), allowNull: false, primaryKey: true },
    badge: { type: DataTypes.STRING(64), allowNull: false, primaryKey: true },
    locked_until: { type: DataTypes.DATE(3), allowNull: false },
  });
}
