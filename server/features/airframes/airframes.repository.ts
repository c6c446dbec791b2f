import { Op, type Sequelize } from 'sequelize';
import { runSql } from '@server/db/sql';
import { draftLifetimeMs } from '@shared/schemas/checks';
import { AircraftType, Airframe, Base, CheckDraft, Hold, Tag } from '@server/db/models';

export interface LatestCheckRow {
  id: string;
  airframe_id: number;
  kind: 'pre_flight' | 'ground_run' | 'after_flight' | 'servicing';
  verdict: 'in_limits' | 'service' | 'out_of_limits';
  signed_at: Date;
  signed_by: number;
}

/** Airframes in service: one, those at some bases (by the base index), or all. */
export async function listAirframes(where: { id?: number; baseIds?: readonly number[] | undefined } = {}) {
  const [airframes, types, bases] = await Promise.all([
    Airframe.findAll({
      where: {
        active: true,
        ...(where.id ? { id: where.id } : {}),
        ...(where.baseIds ? { baseId: { [Op.in]: [...where.baseIds] } } : {}),
      },
      order: [['fleetNumber', 'ASC']],
    }),
    AircraftType.findAll(),
    Base.findAll(),
  ]);
  return {
    airframes,
    types: new Map(types.map((t) => [t.id, t])),
    bases: new Map(bases.map((b) => [b.id, b])),
  };
}

/** The newest signed check of each kind per airframe: one index range per (airframe, kind), never the whole history. */
export async function latestChecksByKind(
  sequelize: Sequelize,
  airframeIds: number[],
): Promise<LatestCheckRow[]> {
  if (airframeIds.length === 0) return [];
  return runSql<LatestCheckRow[]>(sequelize, latestChecksByKindSql, [airframeIds]);
}

/** The bench EXPLAINs this very text (explainLatestChecksByKind). */
const latestChecksByKindSql = `SELECT c.id, c.airframe_id, c.kind, c.verdict, c.signed_at, c.signed_by
       FROM checks c
       JOIN (SELECT airframe_id, kind, MAX(signed_at) AS signed_at
               FROM checks WHERE airframe_id IN (?) GROUP BY airframe_id, kind) latest
         ON latest.airframe_id = c.airframe_id AND latest.kind = c.kind AND latest.signed_at = c.signed_at`;

/**
 * What the board depends on: the audit trail's head (moved by every signed check, hold decision, acceptance,
 * fleet and limits change), the newest draft touch, and the airframes' newest id, so an airframe added behind the
 * application (a restore, a script, a test's own rows) shows on every board and tablet within a second instead of
 * when the snapshot ages out. Every board read runs this. It used to count the airframes as well, to see one deleted
 * behind the application; with 5,000 airframes that count cost the database 1.3 ms a read (against 0.13 ms for the
 * newest id, measured), and such a deletion still shows when the snapshot's records are read again (30 s at most).
 */
export async function boardFingerprint(sequelize: Sequelize): Promise<string> {
  const [row] = await runSql<
    {
      head: string | null;
      drafts: number | bigint;
      touched: Date | null;
      newest: number | null;
    }[]
  >(
    sequelize,
    `SELECT (SELECT hash FROM audit_head WHERE id = 1) AS head, COUNT(*) AS drafts, MAX(touched_at) AS touched,
            (SELECT MAX(id) FROM airframes) AS newest
       FROM check_drafts`,
  );
  return [
    row?.head ?? '',
    row?.drafts ?? 0,
    row?.touched ? new Date(row.touched).getTime() : '',
    row?.newest ?? '',
  ].join('|');
}

export async function openHolds(airframeIds: number[]) {
  if (airframeIds.length === 0) return [];
  return Hold.findAll({
    where: { airframeId: { [Op.in]: airframeIds }, releasedAt: { [Op.is]: null } },
    order: [['openedAt', 'ASC']],
  });
}

export const airframeById = (id: number) => Airframe.findByPk(id);

export async function findTag(token: string) {
  return Tag.findOne({ where: { token } });
}

/** Checks started on a tablet and touched within the draft lifetime (older: abandoned), not closed by a lead. */
export async function liveDrafts(airframeIds: number[], now: Date) {
  if (airframeIds.length === 0) return [];
  return CheckDraft.findAll({
    where: {
      airframeId: { [Op.in]: airframeIds },
      touchedAt: { [Op.gt]: new Date(now.getTime() - draftLifetimeMs) },
      closedAt: { [Op.is]: null },
    },
  });
}

/** The database's plan for the board's query, for the bench: the very text the board runs, never a copy. */
export const explainLatestChecksByKind = (sequelize: Sequelize, airframeIds: number[]) =>
  runSql<Record<string, unknown>[]>(sequelize, `EXPLAIN ${latestChecksByKindSql}`, [airframeIds]);
