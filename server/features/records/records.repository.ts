import { Op, type Sequelize } from 'sequelize';
import { AuditEvent, Airframe, Check, Reading, ServicingEntry } from '@server/db/models';
import { runSql } from '@server/db/sql';
import type { RecordRow, RecordSearch } from '@shared/schemas/records';

interface Row {
  id: string;
  signed_at: Date;
  airframe_id: number;
  fleet_number: string;
  registration: string | null;
  kind: RecordRow['kind'];
  verdict: RecordRow['verdict'];
  signer_name: string;
  badge_number: string;
  licence_number: string | null;
  type_code: string;
  version: number;
  limits_version_id: number;
  airframe_hours: string | number | null;
  content_hash: string;
  corrects_check_id: string | null;
}

/** Whole UTC days, both ends included: "to 2025-03-02" takes everything signed that day. */
const signedInDays = (table: string, filters: RecordSearch): [string, unknown][] => [
  [`${table}.signed_at >= ?`, filters.from && new Date(`${filters.from}T00:00:00.000Z`)],
  [`${table}.signed_at < ?`, filters.to && new Date(Date.parse(`${filters.to}T00:00:00.000Z`) + 86_400_000)],
];

function where(filters: RecordSearch) {
  const conditions: [string, unknown][] = [
    ['c.airframe_id = ?', filters.airframeId],
    ['c.signed_by = ?', filters.staffId],
    ['c.kind = ?', filters.kind],
    ['c.verdict = ?', filters.verdict],
    ...signedInDays('c', filters),
  ];
  const used = conditions.filter(([, value]) => Boolean(value));
  return {
    sql: used.length ? `WHERE ${used.map(([clause]) => clause).join(' AND ')}` : '',
    values: used.map(([, value]) => value),
  };
}

const fromJoins = `FROM checks c
  JOIN airframes a ON a.id = c.airframe_id
  JOIN staff s ON s.id = c.signed_by
  JOIN limits_versions lv ON lv.id = c.limits_version_id
  JOIN aircraft_types t ON t.id = lv.type_id`;

const toRecordRow = (r: Row): RecordRow => ({
  id: r.id,
  signedAt: new Date(r.signed_at).toISOString(),
  airframeId: r.airframe_id,
  fleetNumber: r.fleet_number,
  registration: r.registration,
  kind: r.kind,
  verdict: r.verdict,
  signedBy: r.signer_name,
  badgeNumber: r.badge_number,
  licenceNumber: r.licence_number,
  typeCode: r.type_code,
  limitsVersion: r.version,
  limitsVersionId: r.limits_version_id,
  airframeHours: r.airframe_hours === null ? null : Number(r.airframe_hours),
  contentHash: r.content_hash,
  correctsCheckId: r.corrects_check_id,
});

/** Newest first; the id breaks ties so pages never overlap or skip. */
export async function searchChecks(
  sequelize: Sequelize,
  filters: RecordSearch,
  limit: number,
  offset: number,
): Promise<{ rows: RecordRow[]; total: number }> {
  const { sql, values } = where(filters);
  const [count] = await runSql<{ total: number | string | bigint }[]>(
    sequelize,
    `SELECT COUNT(*) AS total ${fromJoins} ${sql}`,
    values,
  );
  const rows = await runSql<Row[]>(
    sequelize,
    `SELECT c.id, c.signed_at, c.airframe_id, a.fleet_number, a.registration, c.kind, c.verdict, s.name AS signer_name,
            s.badge_number, s.licence_number, t.code AS type_code, lv.version, c.limits_version_id,
            c.airframe_hours, c.content_hash, c.corrects_check_id
       ${fromJoins} ${sql}
      ORDER BY c.signed_at DESC, c.id DESC
      LIMIT ? OFFSET ?`,
    [...values, limit, offset],
  );
  return { rows: rows.map(toRecordRow), total: Number(count?.total ?? 0) };
}

export async function tableExists(sequelize: Sequelize, table: string): Promise<boolean> {
  const rows = await runSql<unknown[]>(
    sequelize,
    'SELECT 1 FROM information_schema.tables WHERE table_schema = DATABASE() AND table_name = ?',
    [table],
  );
  return rows.length > 0;
}

export interface CountersignRow {
  decision: string;
  reason: string | null;
  signed_at: Date;
  content_hash: string;
  name: string;
  licence_number: string | null;
}

/** Countersigns of the hold this check opened; the table belongs to the holds feature and may not exist yet. */
export async function countersignsForHold(sequelize: Sequelize, holdId: number): Promise<CountersignRow[]> {
  if (!(await tableExists(sequelize, 'hold_countersigns'))) return [];
  return runSql<CountersignRow[]>(
    sequelize,
    `SELECT hc.decision, hc.reason, hc.signed_at, hc.content_hash, s.name, s.licence_number
       FROM hold_countersigns hc JOIN staff s ON s.id = hc.signed_by
      WHERE hc.hold_id = ? ORDER BY hc.signed_at ASC, hc.id ASC`,
    [holdId],
  );
}

/** Checks that correct this one, oldest first. */
export const correctionsOf = (checkId: string) =>
  Check.findAll({
    where: { correctsCheckId: checkId },
    attributes: ['id', 'signedAt'],
    order: [['signedAt', 'ASC']],
  });

export const signingEventOf = (checkId: string) =>
  AuditEvent.findOne({ where: { entity: 'check', entityId: checkId, action: 'check.signed' } });

export const airframeById = (id: number) => Airframe.findByPk(id);

/** An airframe's checks signed in (since, until], oldest first, with their readings and servicing entries. */
export async function checksWithReadings(airframeId: number, since: Date, until: Date) {
  const checks = await Check.findAll({
    where: { airframeId, signedAt: { [Op.gt]: since, [Op.lte]: until } },
    order: [['signedAt', 'ASC']],
  });
  const ids = checks.map((c) => c.id);
  const [readings, servicing] = await Promise.all([
    ids.length ? Reading.findAll({ where: { checkId: { [Op.in]: ids } } }) : Promise.resolve([]),
    ids.length ? ServicingEntry.findAll({ where: { checkId: { [Op.in]: ids } } }) : Promise.resolve([]),
  ]);
  return { checks, readings, servicing };
}

export const newestAuditEvents = (limit: number) => AuditEvent.findAll({ order: [['id', 'DESC']], limit });

/** A signed check as the exports read it: its signed content, and the airframe's serial and mark as now. */
export interface SignedCheckExportRow {
  id: string;
  verdict: RecordRow['verdict'];
  contentHash: string;
  signedContent: string | null;
  limitsVersionId: number;
  serial: string;
  registration: string | null;
}

/** The checks a search matches, oldest first (a spreadsheet reads down in time), with their signed content. */
export async function signedChecksMatching(
  sequelize: Sequelize,
  filters: RecordSearch,
  limit: number,
): Promise<{ rows: SignedCheckExportRow[]; total: number }> {
  const { sql, values } = where(filters);
  const [count] = await runSql<{ total: number | string | bigint }[]>(
    sequelize,
    `SELECT COUNT(*) AS total ${fromJoins} ${sql}`,
    values,
  );
  const rows = await runSql<SignedCheckExportRow[]>(
    sequelize,
    `SELECT c.id, c.verdict, c.content_hash AS contentHash, c.signed_content AS signedContent,
            c.limits_version_id AS limitsVersionId, a.serial, a.registration
       ${fromJoins} ${sql}
      ORDER BY c.signed_at ASC, c.id ASC
      LIMIT ?`,
    [...values, limit],
  );
  return { rows, total: Number(count?.total ?? 0) };
}

export interface HoldExportRow {
  id: number;
  checkId: string;
  releasedAt: Date | null;
}

export const holdsOfChecks = (sequelize: Sequelize, checkIds: string[]) =>
  checkIds.length === 0
    ? Promise.resolve([] as HoldExportRow[])
    : runSql<HoldExportRow[]>(
        sequelize,
        `SELECT id, check_id AS checkId, released_at AS releasedAt FROM holds WHERE check_id IN (?) ORDER BY id`,
        [checkIds],
      );

export const correctiveActionsOfHolds = (sequelize: Sequelize, holdIds: number[]) =>
  holdIds.length === 0
    ? Promise.resolve([])
    : runSql<{ holdId: number; text: string; recordedAt: Date; name: string }[]>(
        sequelize,
        `SELECT ca.hold_id AS holdId, ca.text, ca.recorded_at AS recordedAt, s.name
           FROM hold_corrective_actions ca JOIN staff s ON s.id = ca.recorded_by
          WHERE ca.hold_id IN (?) ORDER BY ca.recorded_at, ca.id`,
        [holdIds],
      );

export const countersignsOfHolds = (sequelize: Sequelize, holdIds: number[]) =>
  holdIds.length === 0
    ? Promise.resolve([])
    : runSql<{ holdId: number; contentHash: string; signedContent: string }[]>(
        sequelize,
        `SELECT hold_id AS holdId, content_hash AS contentHash, signed_content AS signedContent
           FROM hold_countersigns WHERE hold_id IN (?) ORDER BY signed_at, id`,
        [holdIds],
      );

/** Certificates of release to service of an airframe (or all), signed in the search's days. */
export function airframeReleasesMatching(sequelize: Sequelize, filters: RecordSearch) {
  const conditions: [string, unknown][] = [
    ['r.airframe_id = ?', filters.airframeId],
    ['r.signed_by = ?', filters.staffId],
    ...signedInDays('r', filters),
  ];
  const used = conditions.filter(([, value]) => Boolean(value));
  return runSql<
    { contentHash: string; signedContent: string; registration: string | null; typeName: string }[]
  >(
    sequelize,
    `SELECT r.content_hash AS contentHash, r.signed_content AS signedContent, a.registration, t.name AS typeName
       FROM airframe_releases r JOIN airframes a ON a.id = r.airframe_id JOIN aircraft_types t ON t.id = a.type_id
      ${used.length ? `WHERE ${used.map(([c]) => c).join(' AND ')}` : ''}
      ORDER BY r.signed_at, r.id`,
    used.map(([, v]) => v),
  );
}
