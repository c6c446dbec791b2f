import { DataTypes, type QueryInterface } from 'sequelize';

export async function up(qi: QueryInterface): Promise<void> {
  // The exact signed document beside its hash: names may change later, the signature must still be checkable.
  await qi.addColumn('checks', 'signed_content', { type: DataTypes.TEXT('long'), allowNull: true });
  // Fluid added during a check: which system, how much, which fluid and batch, and the level before and after.
  await qi.createTable('servicing_entries', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    check_id: { type: DataTypes.CHAR(36), allowNull: false, references: { model: 'checks', key: 'id' } },
    airframe_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      allowNull: false,
      references: { model: 'airframes', key: 'id' },
    },
    checkpoint_code: { type: DataTypes.STRING(64), allowNull: false },
    system: { type: DataTypes.STRING(32), allowNull: true },
    quantity_l: { type: DataTypes.DOUBLE, allowNull: false },
    entered_value: { type: DataTypes.DOUBLE, allowNull: false },
    entered_unit: { type: DataTypes.STRING(8), allowNull: false },
    fluid_spec: { type: DataTypes.STRING(64), allowNull: false },
    batch: { type: DataTypes.STRING(64), allowNull: false },
    level_before: { type: DataTypes.TEXT, allowNull: false },
    added_at: { type: DataTypes.DATE(3), allowNull: false },
  });
  await qi.addIndex('servicing_entries', ['airframe_id', 'added_at']);
  await qi.addIndex('servicing_entries', ['check_id']);

  await qi.createTable('photos', {
    id: { type: DataTypes.CHAR(36), primaryKey: true },
    check_id: { type: DataTypes.CHAR(36), allowNull: true, references: { model: 'checks', key: 'id' } },
    checkpoint_code: { type: DataTypes.STRING(64), allowNull: true },
    stored_name: { type: DataTypes.STRING(64), allowNull: false },
    mime_type: { type: DataTypes.STRING(32), allowNull: false },
    size_bytes: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    sha256: { type: DataTypes.CHAR(64), allowNull: false },
    uploaded_by: {
      type: DataTypes.INTEGER.UNSIGNED,
      allowNull: false,
      references: { model: 'staff', key: 'id' },
    },
    uploaded_at: { type: DataTypes.DATE(3), allowNull: false },
  });
  await qi.addIndex('photos', ['check_id']);

  // A check someone has started on a tablet and not yet signed: the board shows the airframe "in progress".
  await qi.createTable('check_drafts', {
    id: { type: DataTypes.CHAR(36), primaryKey: true },
    airframe_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      allowNull: false,
      references: { model: 'airframes', key: 'id' },
    },
    kind: { type: DataTypes.ENUM('pre_flight', 'ground_run', 'after_flight', 'servicing'), allowNull: false },
    started_by: {
      type: DataTypes.INTEGER.UNSIGNED,
      allowNull: false,
      references: { model: 'staff', key: 'id' },
    },
    started_at: { type: DataTypes.DATE(3), allowNull: false },
    touched_at: { type: DataTypes.DATE(3), allowNull: false },
  });
  await qi.addIndex('check_drafts', ['airframe_id', 'touched_at']);
}
