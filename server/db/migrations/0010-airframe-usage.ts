import { DataTypes, type QueryInterface } from 'sequelize';

const ref = (table: string, allowNull = false) => ({
  type: DataTypes.INTEGER.UNSIGNED,
  allowNull,
  references: { model: table, key: 'id' },
});
const count = { type: DataTypes.INTEGER.UNSIGNED, allowNull: false };
const hours = { type: DataTypes.DECIMAL(10, 1), allowNull: false };

export async function up(qi: QueryInterface): Promise<void> {
  // Flight hours, flights and landings as recorded at an after-flight check or at the pilot's close of a flight:
  // the figures read from the aircraft and what they add to the ones before. Rows are never edited.
  await qi.createTable('airframe_usage', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    airframe_id: ref('airframes'),
    source: { type: DataTypes.ENUM('after_flight_check', 'flight_close'), allowNull: false },
    check_id: { type: DataTypes.CHAR(36), allowNull: true },
    hours,
    flights: count,
    landings: count,
    hours_flown: hours,
    flights_flown: count,
    landings_made: count,
    recorded_by: ref('staff'),
    recorded_at: { type: DataTypes.DATE(3), allowNull: false },
    // A flight close is its own signed act; an after-flight check's figures are covered by the check's signature.
    signed_with: { type: DataTypes.ENUM('pin', 'password'), allowNull: true },
    content_hash: { type: DataTypes.CHAR(64), allowNull: true },
    signed_content: { type: DataTypes.TEXT('long'), allowNull: true },
  });
  await qi.addIndex('airframe_usage', ['airframe_id', 'recorded_at'], { name: 'airframe_usage_airframe_at' });
  await qi.addIndex('airframe_usage', ['check_id'], { name: 'airframe_usage_check', unique: true });

  // Landings add up like flights; a check stamps the flights as it stamps the hours, for validity in flights.
  await qi.addColumn('airframes', 'landings', {
    type: DataTypes.INTEGER.UNSIGNED,
    allowNull: false,
    defaultValue: 0,
  });
  await qi.addColumn('checks', 'airframe_flights', { type: DataTypes.INTEGER.UNSIGNED, allowNull: true });
}
