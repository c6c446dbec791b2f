import { DataTypes, type QueryInterface } from 'sequelize';

export async function up(qi: QueryInterface): Promise<void> {
  // The registration mark an auditor and a pilot know the aircraft by, printed on tags, records and exports.
  await qi.addColumn('airframes', 'registration', { type: DataTypes.STRING(16), allowNull: true });
  // Unique among airframes in service only: a mark given up by a retired airframe may be given to another one.
  // MariaDB has no partial index, so a generated column holds the mark only while the airframe is active, and a
  // unique index allows any number of NULLs.
  await qi.sequelize.query(
    `ALTER TABLE airframes
       ADD COLUMN active_registration VARCHAR(16) AS (IF(active, registration, NULL)) PERSISTENT,
       ADD UNIQUE INDEX airframes_active_registration (active_registration)`,
  );
}
