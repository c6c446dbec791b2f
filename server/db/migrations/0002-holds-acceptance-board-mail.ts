import { DataTypes, type QueryInterface } from 'sequelize';

const id = { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true };
const ref = (table: string, allowNull = false) => ({
  type: DataTypes.INTEGER.UNSIGNED,
  allowNull,
  references: { model: table, key: 'id' },
});
const checkRef = (allowNull = false) => ({
  type: DataTypes.CHAR(36),
  allowNull,
  references: { model: 'checks', key: 'id' },
});
const time = (allowNull = false) => ({ type: DataTypes.DATE(3), allowNull });

export async function up(qi: QueryInterface): Promise<void> {
  // What was done about a hold, in the words of the person who did it; rows are only ever added.
  await qi.createTable('hold_corrective_actions', {
    id,
    hold_id: ref('holds'),
    text: { type: DataTypes.TEXT, allowNull: false },
    recorded_by: ref('staff'),
    recorded_at: time(),
  });
  await qi.addIndex('hold_corrective_actions', ['hold_id', 'recorded_at']);

  // A shift lead's signed judgement on a hold: release it (resting on a passing re-check) or keep it.
  await qi.createTable('hold_countersigns', {
    id,
    hold_id: ref('holds'),
    decision: { type: DataTypes.ENUM('release', 'keep'), allowNull: false },
    reason: { type: DataTypes.TEXT, allowNull: true },
    recheck_check_id: checkRef(true),
    signed_by: ref('staff'),
    signed_at: time(),
    signed_with: { type: DataTypes.ENUM('pin', 'password'), allowNull: false },
    content_hash: { type: DataTypes.CHAR(64), allowNull: false },
    signed_content: { type: DataTypes.TEXT('long'), allowNull: false },
  });
  await qi.addIndex('hold_countersigns', ['hold_id', 'signed_at']);

  // A pilot's acceptance of an airframe and the exact checks it rested on.
  await qi.createTable('acceptances', {
    id,
    airframe_id: ref('airframes'),
    accepted_by: ref('staff'),
    accepted_at: time(),
    check_ids: { type: DataTypes.TEXT, allowNull: false },
    content_hash: { type: DataTypes.CHAR(64), allowNull: false },
    signed_content: { type: DataTypes.TEXT('long'), allowNull: false },
  });
  await qi.addIndex('acceptances', ['airframe_id', 'accepted_at']);

  // Read-only hangar board links for a TV: only the token's SHA-256 is kept.
  await qi.createTable('board_links', {
    id,
    name: { type: DataTypes.STRING(100), allowNull: false },
    token_hash: { type: DataTypes.CHAR(64), allowNull: false, unique: true },
    created_by: ref('staff'),
    created_at: time(),
    revoked_at: time(true),
    revoked_by: ref('staff', true),
    last_seen_at: time(true),
  });

  // Every e-mail the app tried to send, with its outcome; topic_key stops a hold being announced twice.
  await qi.createTable('mail_deliveries', {
    id,
    topic: { type: DataTypes.STRING(32), allowNull: false },
    topic_key: { type: DataTypes.STRING(128), allowNull: true, unique: true },
    recipients: { type: DataTypes.TEXT, allowNull: false },
    subject: { type: DataTypes.STRING(255), allowNull: false },
    text: { type: DataTypes.TEXT('long'), allowNull: false },
    status: { type: DataTypes.ENUM('pending', 'sent', 'failed'), allowNull: false },
    error: { type: DataTypes.TEXT, allowNull: true },
    created_at: time(),
    sent_at: time(true),
  });

  // Messages caught by the local fake SMTP server, so the demo shows what would have gone out.
  await qi.createTable('caught_mail', {
    id,
    recipients: { type: DataTypes.TEXT, allowNull: false },
    sender: { type: DataTypes.STRING(255), allowNull: true },
    subject: { type: DataTypes.STRING(255), allowNull: false },
    text: { type: DataTypes.TEXT('long'), allowNull: false },
    received_at: time(),
  });
  await qi.addIndex('caught_mail', ['received_at']);
}
