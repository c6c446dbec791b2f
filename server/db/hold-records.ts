import type { Sequelize } from 'sequelize';
import { runSql } from './sql';

/** The newest pilot acceptance of each airframe, with the pilot's name. */
export async function latestAcceptances(
  sequelize: Sequelize,
  airframeIds: number[],
): Promise<Map<number, { by: string; at: string }>> {
  if (airframeIds.length === 0) return new Map();
  const rows = await runSql<{ airframe_id: number; accepted_at: Date; name: string }[]>(
    sequelize,
    `SELECT a.airframe_id, a.accepted_at, s.name
       FROM acceptances a
       JOIN (SELECT airframe_id, MAX(id) AS id FROM acceptances WHERE airframe_id IN (?) GROUP BY airframe_id) latest
         ON latest.id = a.id
       JOIN staff s ON s.id = a.accepted_by`,
    [airframeIds],
  );
  return new Map(rows.map((r) => [r.airframe_id, { by: r.name, at: new Date(r.accepted_at).toISOString() }]));
}
