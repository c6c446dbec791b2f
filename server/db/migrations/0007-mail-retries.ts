import { DataTypes, type QueryInterface } from 'sequelize';

export async function up(qi: QueryInterface): Promise<void> {
  // A hold or consumption e-mail that could not go out is tried again; these say how often and when last.
  await qi.addColumn('mail_deliveries', 'attempts', {
    type: DataTypes.INTEGER.UNSIGNED,
    allowNull: false,
    defaultValue: 1,
  });
  await qi.addColumn('mail_deliveries', 'last_attempt_at', { type: DataTypes.DATE(3), allowNull: true });
  await qi.addIndex('mail_deliveries', ['status', 'created_at'], { name: 'mail_deliveries_status_created' });
}
