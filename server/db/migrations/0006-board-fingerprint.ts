import type { QueryInterface } from 'sequelize';

export async function up(qi: QueryInterface): Promise<void> {
  // The board's cache asks for the newest draft touch on every read; this keeps that to one index lookup.
  await qi.addIndex('check_drafts', ['touched_at'], { name: 'check_drafts_touched_at' });
}
