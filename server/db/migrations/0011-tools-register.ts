import { DataTypes, type QueryInterface } from 'sequelize';

const toolRef = {
  type: DataTypes.INTEGER.UNSIGNED,
  allowNull: true,
  references: { model: 'tools', key: 'id' },
};
/** The tool as it stood in the register at signing (number, kind, description, serial, calibration due), as JSON. */
const toolAsSigned = { type: DataTypes.TEXT, allowNull: true };

export async function up(qi: QueryInterface): Promise<void> {
  // Engineering's register of the tools readings are taken with (Part-145 145.A.40, from memory): gauges,
  // nitrogen charging kits and servicing carts, each with the day its calibration runs out. A tool is retired,
  // never deleted, because signed checks name it.
  await qi.createTable('tools', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    number: { type: DataTypes.STRING(20), allowNull: false, unique: true },
    kind: {
      type: DataTypes.ENUM('pressure_gauge', 'nitrogen_charging_kit', 'servicing_cart'),
      allowNull: false,
    },
    description: { type: DataTypes.STRING(200), allowNull: false },
    serial: { type: DataTypes.STRING(64), allowNull: false },
    calibration_due: { type: DataTypes.DATEONLY, allowNull: false },
    retired_at: { type: DataTypes.DATE(3), allowNull: true },
    created_at: { type: DataTypes.DATE(3), allowNull: false },
  });
  await qi.addColumn('readings', 'tool_id', toolRef);
  await qi.addColumn('readings', 'tool', toolAsSigned);
  // The fluid is recorded once, with its top-up: the day its can was opened joins the specification and batch.
  // Top-ups stored before this migration have no day (null).
  await qi.addColumn('servicing_entries', 'can_opened_on', { type: DataTypes.DATEONLY, allowNull: true });
  await qi.addColumn('servicing_entries', 'tool_id', toolRef);
  await qi.addColumn('servicing_entries', 'tool', toolAsSigned);
}
