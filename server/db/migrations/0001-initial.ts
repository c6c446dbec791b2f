import { DataTypes, type QueryInterface } from 'sequelize';

const id = { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true };
const ref = (table: string, allowNull = false) => ({
  type: DataTypes.INTEGER.UNSIGNED,
  allowNull,
  references: { model: table, key: 'id' },
});
const time = (allowNull = false) => ({ type: DataTypes.DATE(3), allowNull });

export async function up(qi: QueryInterface): Promise<void> {
  await qi.createTable('bases', {
    id,
    code: { type: DataTypes.STRING(32), allowNull: false, unique: true },
    name: { type: DataTypes.STRING(100), allowNull: false },
  });
  await qi.createTable('aircraft_types', {
    id,
    code: { type: DataTypes.STRING(32), allowNull: false, unique: true },
    name: { type: DataTypes.STRING(100), allowNull: false },
    created_at: time(),
  });
  await qi.createTable('staff', {
    id,
    badge_number: { type: DataTypes.STRING(32), allowNull: false, unique: true },
    name: { type: DataTypes.STRING(100), allowNull: false },
    licence_number: { type: DataTypes.STRING(64), allowNull: true },
    roles: { type: DataTypes.STRING(200), allowNull: false },
    pin_hash: { type: DataTypes.STRING(100), allowNull: false },
    password_hash: { type: DataTypes.STRING(100), allowNull: true },
    failed_attempts: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    locked_until: time(true),
    must_change_pin: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
    created_at: time(),
  });
  await qi.createTable('limits_versions', {
    id,
    type_id: ref('aircraft_types'),
    version: { type: DataTypes.INTEGER, allowNull: false },
    status: { type: DataTypes.ENUM('draft', 'published'), allowNull: false },
    definition: { type: DataTypes.TEXT('long'), allowNull: false },
    published_at: time(true),
    published_by: ref('staff', true),
    created_at: time(),
  });
  await qi.addIndex('limits_versions', ['type_id', 'version'], { unique: true });
  await qi.createTable('airframes', {
    id,
    fleet_number: { type: DataTypes.STRING(32), allowNull: false, unique: true },
    serial: { type: DataTypes.STRING(64), allowNull: false },
    type_id: ref('aircraft_types'),
    base_id: ref('bases'),
    hours: { type: DataTypes.DECIMAL(10, 1), allowNull: false, defaultValue: 0 },
    active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
    created_at: time(),
  });
  await qi.createTable('tags', {
    id,
    airframe_id: ref('airframes'),
    token: { type: DataTypes.STRING(64), allowNull: false, unique: true },
    issued_at: time(),
    revoked_at: time(true),
  });
  await qi.createTable('kiosk_devices', {
    id,
    name: { type: DataTypes.STRING(100), allowNull: false },
    token_hash: { type: DataTypes.CHAR(64), allowNull: true, unique: true },
    enrol_code_hash: { type: DataTypes.CHAR(64), allowNull: true, unique: true },
    enrol_expires_at: time(true),
    enrolled_at: time(true),
    revoked_at: time(true),
    last_seen_at: time(true),
    created_by: ref('staff', true),
    created_at: time(),
  });
  await qi.createTable('checks', {
    id: { type: DataTypes.CHAR(36), primaryKey: true },
    airframe_id: ref('airframes'),
    kind: { type: DataTypes.ENUM('pre_flight', 'ground_run', 'after_flight', 'servicing'), allowNull: false },
    limits_version_id: ref('limits_versions'),
    context: { type: DataTypes.TEXT, allowNull: false },
    verdict: { type: DataTypes.ENUM('in_limits', 'service', 'out_of_limits'), allowNull: false },
    note: { type: DataTypes.TEXT, allowNull: true },
    airframe_hours: { type: DataTypes.DECIMAL(10, 1), allowNull: true },
    signed_by: ref('staff'),
    signed_at: time(),
    content_hash: { type: DataTypes.CHAR(64), allowNull: false },
    submission_hash: { type: DataTypes.CHAR(64), allowNull: false },
    corrects_check_id: {
      type: DataTypes.CHAR(36),
      allowNull: true,
      references: { model: 'checks', key: 'id' },
    },
    kiosk_device_id: ref('kiosk_devices', true),
    created_at: time(),
  });
  await qi.addIndex('checks', ['airframe_id', 'signed_at']);
  await qi.addIndex('checks', ['airframe_id', 'kind', 'signed_at']);
  await qi.addIndex('checks', ['signed_by', 'signed_at']);
  await qi.createTable('readings', {
    id: { type: DataTypes.BIGINT.UNSIGNED, autoIncrement: true, primaryKey: true },
    check_id: { type: DataTypes.CHAR(36), allowNull: false, references: { model: 'checks', key: 'id' } },
    seq: { type: DataTypes.INTEGER, allowNull: false },
    checkpoint_code: { type: DataTypes.STRING(64), allowNull: false },
    entry: { type: DataTypes.TEXT, allowNull: false },
    value: { type: DataTypes.DOUBLE, allowNull: true },
    unit: { type: DataTypes.STRING(8), allowNull: true },
    verdict: { type: DataTypes.ENUM('in_limits', 'service', 'out_of_limits'), allowNull: false },
    band_id: { type: DataTypes.STRING(64), allowNull: false },
    message: { type: DataTypes.TEXT, allowNull: false },
    action: { type: DataTypes.TEXT, allowNull: false },
    expected: { type: DataTypes.DOUBLE, allowNull: true },
  });
  await qi.addIndex('readings', ['check_id', 'seq'], { unique: true });
  await qi.createTable('holds', {
    id,
    airframe_id: ref('airframes'),
    check_id: { type: DataTypes.CHAR(36), allowNull: false, references: { model: 'checks', key: 'id' } },
    reason: { type: DataTypes.TEXT, allowNull: false },
    opened_at: time(),
    released_at: time(true),
    released_by: ref('staff', true),
  });
  await qi.addIndex('holds', ['airframe_id', 'released_at']);
  await qi.createTable('audit_events', {
    id: { type: DataTypes.BIGINT.UNSIGNED, autoIncrement: true, primaryKey: true },
    at: time(),
    actor_id: ref('staff', true),
    action: { type: DataTypes.STRING(64), allowNull: false },
    entity: { type: DataTypes.STRING(32), allowNull: false },
    entity_id: { type: DataTypes.STRING(64), allowNull: false },
    payload: { type: DataTypes.TEXT('long'), allowNull: false },
    prev_hash: { type: DataTypes.CHAR(64), allowNull: false },
    hash: { type: DataTypes.CHAR(64), allowNull: false },
  });
  await qi.addIndex('audit_events', ['entity', 'entity_id']);
  // One row holding the chain's newest hash: appends lock it, so concurrent events chain in a single line.
  await qi.createTable('audit_head', {
    id: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true },
    last_event_id: { type: DataTypes.BIGINT.UNSIGNED, allowNull: true },
    hash: { type: DataTypes.CHAR(64), allowNull: false },
  });
  await qi.bulkInsert('audit_head', [{ id: 1, last_event_id: null, hash: '0'.repeat(64) }]);
  await qi.createTable('sessions', {
    sid: { type: DataTypes.STRING(64), primaryKey: true },
    expires: { type: DataTypes.DATE, allowNull: true },
    data: { type: DataTypes.TEXT, allowNull: true },
  });
  await qi.addIndex('sessions', ['expires']);
}
