import { Op, type CreationAttributes, type Transaction } from 'sequelize';
import type { LastUsage } from '@shared/domain/usage';
import type { FlightHoursEntry } from '@shared/domain/consumption';
import type { UsageFigures } from '@shared/schemas/usage';
import { insertStatement, runSql, type Statement } from './sql';
import { Airframe, UsageEntry } from './models';

// The flight hours, flights and landings recorded at after-flight checks and at pilots' closes of flights. The
// checks write theirs inside their own compound statement; the flight close in a Sequelize transaction. Several
// features read them: the trends and the handover (hours flown), the airframe state (flights since a check).

/** Raised inside a check's compound statement when the airframe's figures moved since they were read. */
export const USAGE_MOVED_SQLSTATE = '45002';

export type UsageRow = CreationAttributes<UsageEntry>;

/** The airframe's figures now and when they were last recorded from a flight; null for no such airframe. */
export async function lastUsage(airframeId: number, transaction?: Transaction): Promise<LastUsage | null> {
  const airframe = await Airframe.findByPk(airframeId, {
    attributes: ['hours', 'flights', 'landings'],
    ...(transaction ? { transaction, lock: transaction.LOCK.UPDATE } : {}),
  });
  if (!airframe) return null;
  const newest = await UsageEntry.findOne({
    where: { airframeId },
    order: [['recordedAt', 'DESC']],
    attributes: ['recordedAt'],
    ...(transaction ? { transaction } : {}),
  });
  return {
    hours: Number(airframe.hours),
    flights: Number(airframe.flights ?? 0),
    landings: Number(airframe.landings ?? 0),
    recordedAt: newest?.recordedAt ?? null,
  };
}

const airframeUpdate = (row: UsageRow, last: UsageFigures): Statement => ({
  sql:
    'UPDATE `airframes` SET `hours` = ?, `flights` = ?, `landings` = ? ' +
    'WHERE `id` = ? AND `hours` = ? AND `flights` = ? AND `landings` = ?',
  values: [row.hours, row.flights, row.landings, row.airframeId, last.hours, last.flights, last.landings],
});

/**
 * The statements that record the figures and move the airframe's, for a check's compound statement. They only
 * apply to the figures the entry was judged against (the row is locked while it is compared): if another entry
 * landed in between, nothing is kept. ROW_COUNT() cannot tell, as it counts a row set to the same figures as
 * unchanged.
 */
export function usageStatements(row: UsageRow, last: UsageFigures): Statement[] {
  return [
    {
      sql:
        'SELECT COUNT(*) INTO @usage_as_judged FROM `airframes` ' +
        'WHERE `id` = ? AND `hours` = ? AND `flights` = ? AND `landings` = ? FOR UPDATE;\n' +
        `IF @usage_as_judged <> 1 THEN SIGNAL SQLSTATE '${USAGE_MOVED_SQLSTATE}' SET MESSAGE_TEXT = 'usage moved'; END IF`,
      values: [row.airframeId, last.hours, last.flights, last.landings],
    },
    insertStatement(UsageEntry, [row]),
    airframeUpdate(row, last),
  ];
}

/** Records the figures in the caller's transaction, in which lastUsage locked the airframe's row. */
export async function storeUsage(row: UsageRow, last: UsageFigures, transaction: Transaction) {
  const entry = await UsageEntry.create(row, { transaction });
  const update = airframeUpdate(row, last);
  await runSql(Airframe.sequelize!, update.sql, update.values, transaction);
  return entry.get({ plain: true });
}

/** Hours flown recorded in (from, to], oldest first: what the consumption per flight hour divides by. */
export async function flightHoursBetween(
  airframeId: number,
  from: Date,
  to: Date,
): Promise<FlightHoursEntry[]> {
  const rows = await UsageEntry.findAll({
    where: { airframeId, recordedAt: { [Op.gt]: from, [Op.lte]: to }, hoursFlown: { [Op.gt]: 0 } },
    attributes: ['recordedAt', 'hoursFlown'],
    order: [['recordedAt', 'ASC']],
  });
  return rows.map((r) => ({ at: r.recordedAt, flightHours: Number(r.hoursFlown) }));
}

/** Flights recorded after `since` for each airframe, with their times, for the validity of checks in flights. */
export async function flightsRecordedSince(airframeIds: number[], since: Date) {
  if (airframeIds.length === 0) return new Map<number, { at: Date; flights: number }[]>();
  const rows = await UsageEntry.findAll({
    where: {
      airframeId: { [Op.in]: airframeIds },
      recordedAt: { [Op.gt]: since },
      flightsFlown: { [Op.gt]: 0 },
    },
    attributes: ['airframeId', 'recordedAt', 'flightsFlown'],
  });
  const byAirframe = new Map<number, { at: Date; flights: number }[]>();
  for (const r of rows) {
    const list = byAirframe.get(r.airframeId) ?? [];
    list.push({ at: r.recordedAt, flights: Number(r.flightsFlown) });
    byAirframe.set(r.airframeId, list);
  }
  return byAirframe;
}

/**
 * Hours flown in (from, to] as the flight log says, or null when the airframe has no log up to `to` (nobody has
 * recorded a flight of it yet): then "nothing recorded" is not "nothing flown".
 */
export async function loggedFlightHours(airframeId: number, from: Date, to: Date): Promise<number | null> {
  const kept = await UsageEntry.count({ where: { airframeId, recordedAt: { [Op.lte]: to } } });
  if (kept === 0) return null;
  const flown = await flightHoursBetween(airframeId, from, to);
  return Math.round(flown.reduce((total, f) => total + f.flightHours, 0) * 10) / 10;
}

/** Hours flown recorded in (from, to] for each of the airframes. */
export async function fleetFlightHours(airframeIds: number[], from: Date, to: Date) {
  const byAirframe = new Map<number, FlightHoursEntry[]>();
  if (airframeIds.length === 0) return byAirframe;
  const rows = await UsageEntry.findAll({
    where: {
      airframeId: { [Op.in]: airframeIds },
      recordedAt: { [Op.gt]: from, [Op.lte]: to },
      hoursFlown: { [Op.gt]: 0 },
    },
    attributes: ['airframeId', 'recordedAt', 'hoursFlown'],
  });
  for (const r of rows) {
    const list = byAirframe.get(r.airframeId) ?? [];
    list.push({ at: r.recordedAt, flightHours: Number(r.hoursFlown) });
    byAirframe.set(r.airframeId, list);
  }
  return byAirframe;
}
