import type { QueryInterface } from 'sequelize';

export async function up(qi: QueryInterface): Promise<void> {
  // The records desk searches the whole fleet by date, kind and verdict, newest first.
  await qi.addIndex('checks', ['signed_at'], { name: 'checks_signed_at' });
  await qi.addIndex('checks', ['kind', 'verdict', 'signed_at'], { name: 'checks_kind_verdict_signed_at' });
  // Each airframe's live tag is looked up on every fleet listing and reissue.
  await qi.addIndex('tags', ['airframe_id', 'revoked_at'], { name: 'tags_airframe_revoked' });
}
