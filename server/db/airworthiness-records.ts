import { Op, type Sequelize } from 'sequelize';
import { runSql } from './sql';
import type { Authorisation } from '@shared/domain/authorisation';
import type {
  Authority,
  Certificate,
  Defect as StatusDefect,
  DefectEntry as StatusDefectEntry,
  Hold as StatusHold,
  SignedCheck,
} from '@shared/domain/status';
import type { Verdict } from '@shared/schemas/limits';
import {
  AirframeRelease,
  Check,
  Defect,
  DefectEntry,
  Hold,
  HoldCorrectiveAction,
  HoldCountersign,
} from './models';

/** What the state derivation knows of a checkpoint: its words, its ATA chapter and whether it needs an inspector. */
export interface CheckpointFacts {
  label: string;
  ata: string | null;
  independentInspection: boolean;
}
export type CheckpointLookup = (airframeId: number, code: string) => CheckpointFacts | undefined;

export interface AirworthinessRecords {
  checks: SignedCheck[];
  holds: StatusHold[];
  defects: StatusDefect[];
  certificates: Certificate[];
}

interface FindingRow {
  id: string;
  airframe_id: number;
  kind: SignedCheck['kind'];
  signed_at: Date;
  signed_by: number;
  verdict: Verdict;
  code: string;
  reading_verdict: Verdict;
}

export const parseAuthority = (json: string | null, legacy = false): Authority =>
  legacy ? 'legacy' : json ? (JSON.parse(json) as Authorisation) : null;

/** A fleet-wide read filters airframes in code: a long IN list makes MariaDB walk the whole index instead. */
const fewAirframes = (ids: number[]) => ids.length <= 50;

/**
 * Each signed check with a finding and its readings not in limits, kept once read: a signed check never changes,
 * and every board rebuild needs the findings of the fleet's whole history, which from cold are thousands of random
 * reads. Only the list of such checks is read each time, from the index on (verdict, airframe, signed at).
 */
const findingsOfCheck = new Map<string, FindingRow[]>();

async function loadFindings(sequelize: Sequelize, checkIds: string[]) {
  const missing = checkIds.filter((id) => !findingsOfCheck.has(id));
  if (missing.length === 0) return;
  const rows = await runSql<FindingRow[]>(
    sequelize,
    `SELECT c.id, c.airframe_id, c.kind, c.signed_at, c.signed_by, c.verdict,
            r.checkpoint_code AS code, r.verdict AS reading_verdict
       FROM checks c JOIN readings r ON r.check_id = c.id AND r.verdict <> 'in_limits'
      WHERE c.id IN (?)`,
    [missing],
  );
  for (const id of missing) findingsOfCheck.set(id, []);
  for (const row of rows) findingsOfCheck.get(row.id)!.push(row);
}

/**
 * Every signed check with a reading not in limits, with those readings, and for each checkpoint with a SERVICE
 * finding the newest check that read it in limits: all the derivation needs to tell which findings still count.
 */
async function findingChecks(sequelize: Sequelize, ids: number[], facts: CheckpointLookup) {
  const wanted = new Set(ids);
  const withFindings = (
    await runSql<{ id: string; airframe_id: number }[]>(
      sequelize,
      `SELECT id, airframe_id FROM checks
        WHERE verdict IN ('service', 'out_of_limits')${fewAirframes(ids) ? ' AND airframe_id IN (?)' : ''}`,
      // An empty list reads as IN (NULL), as the ORM wrote it.
      fewAirframes(ids) ? [ids.length > 0 ? ids : null] : [],
    )
  ).filter((c) => wanted.has(c.airframe_id));
  await loadFindings(
    sequelize,
    withFindings.map((c) => c.id),
  );
  const findings = withFindings.flatMap((c) => findingsOfCheck.get(c.id)!);
  const serviceCodes = [
    ...new Map(
      findings
        .filter((f) => f.reading_verdict === 'service')
        .map((f) => [`${f.airframe_id}|${f.code}`, { airframeId: f.airframe_id, code: f.code }]),
    ).values(),
  ];
  const clearing = serviceCodes.length
    ? await runSql<FindingRow[]>(
        sequelize,
        `SELECT c.id, c.airframe_id, c.kind, c.signed_at, c.signed_by, c.verdict,
                wanted.code, 'in_limits' AS reading_verdict
           FROM (${serviceCodes.map(() => 'SELECT ? AS airframe_id, ? AS code').join(' UNION ALL ')}) wanted
           JOIN checks c ON c.id = (
                SELECT c2.id FROM checks c2 JOIN readings r2 ON r2.check_id = c2.id
                 WHERE c2.airframe_id = wanted.airframe_id AND r2.checkpoint_code = wanted.code
                   AND r2.verdict = 'in_limits'
                 ORDER BY c2.signed_at DESC LIMIT 1)`,
        serviceCodes.flatMap((s) => [s.airframeId, s.code]),
      )
    : [];
  const byId = new Map<
    string,
    SignedCheck & { airframeId: number; readings: SignedCheck['readings'][number][] }
  >();
  for (const row of [...findings, ...clearing]) {
    let check = byId.get(row.id);
    if (!check) {
      check = {
        id: row.id,
        airframeId: row.airframe_id,
        kind: row.kind,
        signedAt: new Date(row.signed_at),
        signedBy: String(row.signed_by),
        verdict: row.verdict,
        readings: [],
      };
      byId.set(row.id, check);
    }
    if (!check.readings.some((r) => r.code === row.code)) {
      const fact = facts(row.airframe_id, row.code);
      check.readings.push({
        code: row.code,
        label: fact?.label ?? row.code,
        verdict: row.reading_verdict,
        ata: fact?.ata ?? null,
      });
    }
  }
  return [...byId.values()];
}

async function holdsOf(
  ids: number[],
  checks: readonly { id: string; readings: SignedCheck['readings'] }[],
  facts: CheckpointLookup,
) {
  const checkIds = new Set(checks.map((c) => c.id));
  const wanted = new Set(ids);
  // Every hold of these airframes that is open or belongs to a check with a finding; filtered here, since a hold
  // table is small and long IN lists make MariaDB walk whole indexes.
  const holds = (
    await Hold.findAll({
      where: fewAirframes(ids) ? { airframeId: { [Op.in]: ids } } : {},
      order: [['openedAt', 'ASC']],
    })
  ).filter((h) => wanted.has(h.airframeId) && (h.releasedAt === null || checkIds.has(h.checkId)));
  if (holds.length === 0) return [];
  const holdIds = holds.map((h) => h.id);
  const [signers, countersigns, actions, defects] = await Promise.all([
    Check.findAll({
      where: { id: { [Op.in]: [...new Set(holds.map((h) => h.checkId))] } },
      attributes: ['id', 'signedBy'],
    }),
    HoldCountersign.findAll({ where: { holdId: { [Op.in]: holdIds } }, order: [['signedAt', 'ASC']] }),
    HoldCorrectiveAction.findAll({ where: { holdId: { [Op.in]: holdIds } } }),
    Defect.findAll({ where: { holdId: { [Op.in]: holdIds } }, attributes: ['id', 'holdId'] }),
  ]);
  const recheckIds = [
    ...new Set(countersigns.map((c) => c.recheckCheckId).filter((id): id is string => !!id)),
  ];
  const [rechecks, inspections] = await Promise.all([
    recheckIds.length
      ? Check.findAll({ where: { id: { [Op.in]: recheckIds } }, attributes: ['id', 'signedBy'] })
      : [],
    defects.length
      ? DefectEntry.findAll({
          where: { defectId: { [Op.in]: defects.map((d) => d.id) }, kind: 'inspection' },
          attributes: ['defectId', 'signedBy', 'signedAt'],
        })
      : [],
  ]);
  const signer = new Map(signers.map((c) => [c.id, String(c.signedBy)]));
  const recheckSigner = new Map(rechecks.map((c) => [c.id, String(c.signedBy)]));
  const defectOfHold = new Map(defects.map((d) => [d.holdId, d.id]));
  const readingsOf = new Map(checks.map((c) => [c.id, c.readings]));
  return holds.map((h): StatusHold & { airframeId: number } => {
    const outOfLimits = (readingsOf.get(h.checkId) ?? []).filter((r) => r.verdict === 'out_of_limits');
    const own = actions.filter((a) => a.holdId === h.id);
    return {
      id: String(h.id),
      airframeId: h.airframeId,
      checkId: h.checkId,
      openedAt: h.openedAt,
      reason: h.reason,
      raisedBy: signer.get(h.checkId) ?? '',
      chapters: outOfLimits.map((r) => facts(h.airframeId, r.code)?.ata ?? null),
      needsIndependentInspection:
        own.some((a) => a.independentInspection) ||
        outOfLimits.some((r) => facts(h.airframeId, r.code)?.independentInspection === true),
      correctiveActionsBy: own.map((a) => String(a.recordedBy)),
      inspections: inspections
        .filter((i) => i.defectId === defectOfHold.get(h.id))
        .map((i) => ({ by: String(i.signedBy), at: i.signedAt })),
      countersigns: countersigns
        .filter((c) => c.holdId === h.id)
        .map((c) => ({
          by: String(c.signedBy),
          at: c.signedAt,
          decision: c.decision,
          recheckBy: c.recheckCheckId ? (recheckSigner.get(c.recheckCheckId) ?? null) : null,
          authorisation: parseAuthority(c.authorisation, c.legacy),
        })),
    };
  });
}

export function statusEntry(e: DefectEntry): StatusDefectEntry {
  const base = { at: e.signedAt, by: String(e.signedBy) };
  switch (e.kind) {
    case 'work':
      return { ...base, kind: 'work', independentInspection: e.independentInspection };
    case 'inspection':
      return { ...base, kind: 'inspection' };
    case 'certification':
      return { ...base, kind: 'certification', authorisation: parseAuthority(e.authorisation) };
    case 'deferral':
      return {
        ...base,
        kind: 'deferral',
        authorisation: parseAuthority(e.authorisation),
        limit: {
          at: e.limitAt,
          hours: e.limitHours === null ? null : Number(e.limitHours),
          flights: e.limitFlights,
        },
      };
  }
}

export function statusDefect(d: Defect, entries: readonly DefectEntry[]): StatusDefect {
  return {
    id: String(d.id),
    number: d.id,
    raisedAt: d.raisedAt,
    raisedBy: String(d.raisedBy),
    description: d.description,
    chapter: d.chapter,
    holdId: d.holdId === null ? null : String(d.holdId),
    needsIndependentInspection: d.needsIndependentInspection,
    entries: entries.filter((e) => e.defectId === d.id).map(statusEntry),
  };
}

/** The records behind the state of each of these airframes, grouped by airframe. */
export async function airworthinessRecords(
  sequelize: Sequelize,
  airframeIds: number[],
  facts: CheckpointLookup,
): Promise<Map<number, AirworthinessRecords>> {
  const result = new Map<number, AirworthinessRecords>(
    airframeIds.map((id) => [id, { checks: [], holds: [], defects: [], certificates: [] }]),
  );
  if (airframeIds.length === 0) return result;
  // Rows of other airframes are dropped below (result has no entry for them).
  const byAirframe = fewAirframes(airframeIds) ? { airframeId: { [Op.in]: airframeIds } } : {};
  const [checks, defects, releases] = await Promise.all([
    findingChecks(sequelize, airframeIds, facts),
    Defect.findAll({ where: byAirframe, order: [['id', 'ASC']] }),
    AirframeRelease.findAll({
      where: byAirframe,
      attributes: ['airframeId', 'signedBy', 'signedAt', 'authorisation', 'chapters'],
    }),
  ]);
  const [holds, entries] = await Promise.all([
    holdsOf(airframeIds, checks, facts),
    defects.length
      ? DefectEntry.findAll({
          where: fewAirframes(airframeIds) ? { defectId: { [Op.in]: defects.map((d) => d.id) } } : {},
          order: [['signedAt', 'ASC']],
        })
      : [],
  ]);
  for (const check of checks) result.get(check.airframeId)?.checks.push(check);
  for (const hold of holds) result.get(hold.airframeId)?.holds.push(hold);
  for (const defect of defects)
    if (result.has(defect.airframeId))
      result.get(defect.airframeId)!.defects.push(statusDefect(defect, entries));
  for (const r of releases) {
    result.get(r.airframeId)?.certificates.push({
      at: r.signedAt,
      by: String(r.signedBy),
      authorisation: parseAuthority(r.authorisation),
      chapters: JSON.parse(r.chapters) as (string | null)[],
    });
  }
  return result;
}
