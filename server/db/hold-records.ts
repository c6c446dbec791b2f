import { Op, QueryTypes, type Sequelize } from 'sequelize';
import type { Hold as StatusHold } from '../../shared/domain/status';
import { Check, Hold, HoldCountersign } from './models';

/**
 * The holds the status derivation needs for these airframes: every open one, and released ones whose check is
 * still among the latest checks (so a released out-of-limits check is not mistaken for one never held). Each
 * carries who signed the held check and its countersigns.
 */
export async function holdsForStatus(
  airframeIds: number[],
  latestCheckIds: string[],
): Promise<(StatusHold & { airframeId: number })[]> {
  if (airframeIds.length === 0) return [];
  const holds = await Hold.findAll({
    where: {
      airframeId: { [Op.in]: airframeIds },
      [Op.or]: [
        { releasedAt: { [Op.is]: null } },
        ...(latestCheckIds.length ? [{ checkId: { [Op.in]: latestCheckIds } }] : []),
      ],
    },
    order: [['openedAt', 'ASC']],
  });
  if (holds.length === 0) return [];
  const holdIds = holds.map((h) => h.id);
  const [checks, countersigns] = await Promise.all([
    Check.findAll({
      where: { id: { [Op.in]: [...new Set(holds.map((h) => h.checkId))] } },
      attributes: ['id', 'signedBy'],
    }),
    HoldCountersign.findAll({ where: { holdId: { [Op.in]: holdIds } }, order: [['signedAt', 'ASC']] }),
  ]);
  const signer = new Map(checks.map((c) => [c.id, String(c.signedBy)]));
  return holds.map((h) => ({
    id: String(h.id),
    airframeId: h.airframeId,
    checkId: h.checkId,
    openedAt: h.openedAt,
    reason: h.reason,
    raisedBy: signer.get(h.checkId) ?? '',
    countersigns: countersigns
      .filter((c) => c.holdId === h.id)
      .map((c) => ({ by: String(c.signedBy), at: c.signedAt, decision: c.decision })),
  }));
}

/** The newest pilot acceptance of each airframe, with the pilot's name. */
export async function latestAcceptances(
  sequelize: Sequelize,
  airframeIds: number[],
): Promise<Map<number, { by: string; at: string }>> {
  if (airframeIds.length === 0) return new Map();
  const rows = await sequelize.query<{ airframe_id: number; accepted_at: Date; name: string }>(
    `SELECT a.airframe_id, a.accepted_at, s.name
       FROM acceptances a
       JOIN (SELECT airframe_id, MAX(id) AS id FROM acceptances WHERE airframe_id IN (:ids) GROUP BY airframe_id) latest
         ON latest.id = a.id
       JOIN staff s ON s.id = a.accepted_by`,
    { replacements: { ids: airframeIds }, type: QueryTypes.SELECT },
  );
  return new Map(rows.map((r) => [r.airframe_id, { by: r.name, at: new Date(r.accepted_at).toISOString() }]));
}
