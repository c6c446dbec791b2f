import { DataTypes, type QueryInterface } from 'sequelize';

export async function up(qi: QueryInterface): Promise<void> {
  // The kiosk and the board show the base's own clock, with its zone named; records stay in UTC.
  await qi.addColumn('bases', 'time_zone', {
    type: DataTypes.STRING(64),
    allowNull: false,
    defaultValue: 'UTC',
  });
}
