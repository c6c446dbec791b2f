import { DataTypes, type QueryInterface } from 'sequelize';

// A release, an acceptance and a countersign carry the id the screen gave that one act of signing. A resend of it
// (the answer was lost on the way back, or a double tap) finds the row already there and is answered as the first,
// instead of signing a second certificate. Unique, so two copies arriving at once cannot both be stored. Null for
// rows signed before this migration, and for callers that send no id.
const tables = ['airframe_releases', 'acceptances', 'hold_countersigns'] as const;

export async function up(qi: QueryInterface): Promise<void> {
  for (const table of tables) {
    await qi.addColumn(table, 'request_id', { type: DataTypes.CHAR(36), allowNull: true });
    await qi.addIndex(table, ['request_id'], { name: `${table}_request_id`, unique: true });
  }
}
