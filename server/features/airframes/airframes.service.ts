import type { Sequelize } from 'sequelize';
import type { AirframeSummary } from '@shared/schemas/airframes';
import type { CheckCard } from '@shared/schemas/checks';
import type { CheckKind } from '@shared/schemas/limits';
import { draftLifetimeMs } from '@shared/schemas/checks';
import {
  deriveAirframeStatus,
  findingPhrase,
  type AirframeStatus,
  type AirframeStatusInput,
  type SignedCheck,
} from '@shared/domain/status';
import { formerState, type AirframeSummary as Summary, type FluidAlert } from '@shared/schemas/airframes';
import { requiredContextKeys } from '@shared/domain/reading-input';
import { currentLimits } from '@server/db/limits-store';
import { staffNames } from '@server/db/staff-names';
import { latestAcceptances } from '@server/db/hold-records';
import { airworthinessRecords, type CheckpointFacts } from '@server/db/airworthiness-records';
import { flightsRecordedSince } from '@server/db/usage-records';
import { levelDropAlerts } from './fluid-alerts';
import { AppError, notFound, refusal } from '@server/errors/app-error';
import {
  airframeById,
  findTag,
  latestChecksByKind,
  listAirframes,
  liveDrafts,
  openHolds,
  type LatestCheckRow,
} from './airframes.repository';

const stateOrder: Record<Summary['state'], number> = {
  unserviceable: 0,
  due: 1,
  not_checked: 2,
  in_progress: 3,
  checks_in_limits: 4,
  released: 5,
};

export interface AirframeStatusDetail {
  summary: AirframeSummary;
  status: AirframeStatus;
  /** What the state was derived from, for acts that must rest on the same records (a release). */
  input: AirframeStatusInput;
  /** The newest signed check of each kind. */
  latest: LatestCheckRow[];
}

export async function airframeSummaries(
  sequelize: Sequelize,
  now = new Date(),
  only?: number,
): Promise<AirframeSummary[]> {
  return sortForBoard((await airframeStatuses(sequelize, now, only)).map((d) => d.summary));
}

/** Unserviceable first, then due, not checked, in progress, checks in limits and released; soonest due first. */
export function sortForBoard(summaries: AirframeSummary[]): AirframeSummary[] {
  return summaries.sort((a, b) => {
    const byState = stateOrder[a.state] - stateOrder[b.state];
    if (byState !== 0) return byState;
    const dueA = a.nextDue ? Date.parse(a.nextDue.at) : Infinity;
    const dueB = b.nextDue ? Date.parse(b.nextDue.at) : Infinity;
    return dueA - dueB || a.fleetNumber.localeCompare(b.fleetNumber);
  });
}

function groupBy<T>(rows: readonly T[], key: (row: T) => number): Map<number, T[]> {
  const groups = new Map<number, T[]>();
  for (const row of rows) {
    const k = key(row);
    const group = groups.get(k);
    if (group) group.push(row);
    else groups.set(k, [row]);
  }
  return groups;
}

/**
 * The instant after `now` at which the clock alone would change one of these statuses: a check or a deferral
 * running out, or a started check being abandoned. Null when nothing is waiting on the clock.
 */
export function nextClockChange(
  details: readonly AirframeStatusDetail[],
  draftTouches: readonly Date[],
  now: Date,
) {
  const t = now.getTime();
  const instants = [
    ...details.flatMap((d) => d.status.due.map((item) => item.at?.getTime() ?? Infinity)),
    // A deferral holds up to its limit and runs out one millisecond after it.
    ...details.flatMap((d) =>
      d.status.defects.map((def) =>
        def.deferral?.limit.at ? new Date(def.deferral.limit.at).getTime() + 1 : Infinity,
      ),
    ),
    ...draftTouches.map((touched) => touched.getTime() + draftLifetimeMs),
  ].filter((at) => at > t);
  const first = Math.min(...instants);
  return Number.isFinite(first) ? new Date(first) : null;
}

/** Each airframe's summary with the derivation behind it (acceptance needs the exact checks a release rests on). */
export async function airframeStatuses(
  sequelize: Sequelize,
  now = new Date(),
  only?: number,
): Promise<AirframeStatusDetail[]> {
  return (await fleetStatuses(sequelize, now, only)).details;
}

/** Every row the fleet's statuses are derived from, read once and grouped by airframe. */
async function loadFleet(sequelize: Sequelize, now: Date, only?: number, baseIds?: readonly number[]) {
  const { airframes, types, bases } = await listAirframes({ ...(only ? { id: only } : {}), baseIds });
  const ids = airframes.map((a) => a.id);
  const [latest, holds, drafts] = await Promise.all([
    latestChecksByKind(sequelize, ids),
    openHolds(ids),
    liveDrafts(ids, now),
  ]);
  const limitsByType = new Map(
    await Promise.all(
      [...types.keys()].map(async (typeId) => [typeId, await currentLimits(typeId)] as const),
    ),
  );
  const checkpointsByType = new Map(
    [...limitsByType].map(([typeId, limits]) => [
      typeId,
      new Map(
        (limits?.definition.checkpoints ?? []).map((c): [string, CheckpointFacts] => [
          c.code,
          { label: c.label, ata: c.ata, independentInspection: c.independentInspection === true },
        ]),
      ),
    ]),
  );
  const typeOf = new Map(airframes.map((a) => [a.id, a.typeId]));
  // Flights recorded since the oldest of the newest checks: enough to count them against any check's validity.
  const oldestLatest = Math.min(...latest.map((c) => new Date(c.signed_at).getTime()));
  const [names, records, acceptances, flightsOf] = await Promise.all([
    staffNames(latest.map((c) => c.signed_by)),
    airworthinessRecords(sequelize, ids, (airframeId, code) =>
      checkpointsByType.get(typeOf.get(airframeId) ?? 0)?.get(code),
    ),
    latestAcceptances(sequelize, ids),
    Number.isFinite(oldestLatest) ? flightsRecordedSince(ids, new Date(oldestLatest)) : new Map(),
  ]);
  const certifiers = await staffNames(
    [...records.values()].flatMap((r) => [
      ...r.certificates.map((c) => Number(c.by)),
      ...r.holds.flatMap((h) => (h.countersigns ?? []).map((c) => Number(c.by))),
      ...r.defects.flatMap((d) => d.entries.map((e) => Number(e.by))),
    ]),
  );
  // One pass to group each kind of row by airframe, instead of filtering every list once per airframe.
  return {
    airframes,
    types,
    bases,
    drafts,
    limitsByType,
    names,
    records,
    acceptances,
    certifiers,
    flightsOf: flightsOf as Awaited<ReturnType<typeof flightsRecordedSince>>,
    checksOf: groupBy(latest, (c) => c.airframe_id),
    holdsOf: groupBy(holds, (h) => h.airframeId),
    draftsOf: groupBy(drafts, (d) => d.airframeId),
  };
}

type Fleet = Awaited<ReturnType<typeof loadFleet>>;
type FleetAirframe = Fleet['airframes'][number];

/** What the serviceability rule is given for one airframe: its findings, the newest check of each kind, and the rest. */
function statusInputOf(fleet: Fleet, airframe: FleetAirframe, checks: LatestCheckRow[], now: Date) {
  const limits = fleet.limitsByType.get(airframe.typeId);
  const record = fleet.records.get(airframe.id)!;
  const withFindings = new Map(record.checks.map((c) => [c.id, c]));
  const flights = fleet.flightsOf.get(airframe.id) ?? [];
  // Flights recorded after the check was signed (an after-flight check's own flight came before its signature).
  const flightsSince = (signedAt: Date | string) =>
    flights
      .filter((f) => f.at.getTime() > new Date(signedAt).getTime())
      .reduce((total, f) => total + f.flights, 0);
  const signed: SignedCheck[] = [
    ...record.checks,
    ...checks
      .filter((c) => !withFindings.has(c.id))
      .map((c) => ({
        id: c.id,
        kind: c.kind,
        signedAt: new Date(c.signed_at),
        signedBy: String(c.signed_by),
        verdict: c.verdict,
        readings: [],
      })),
  ].map((c) => ({ ...c, flightsSince: flightsSince(c.signedAt) }));
  return {
    now,
    timeZone: limits?.definition.timeZone ?? 'UTC',
    typeCode: fleet.types.get(airframe.typeId)!.code,
    validity: limits?.definition.validity ?? {},
    checks: signed,
    defects: record.defects,
    certificates: record.certificates,
    usage: { hours: Number(airframe.hours), flights: Number(airframe.flights ?? 0) },
    inProgress: (fleet.draftsOf.get(airframe.id) ?? []).map((d) => ({
      id: d.id,
      kind: d.kind,
      startedAt: d.startedAt,
      startedBy: String(d.startedBy),
    })),
    holds: record.holds,
  } satisfies AirframeStatusInput;
}

function summaryOf(
  fleet: Fleet,
  airframe: FleetAirframe,
  checks: LatestCheckRow[],
  status: AirframeStatus,
  fluidAlerts: FluidAlert[],
): AirframeSummary {
  const type = fleet.types.get(airframe.typeId)!;
  const base = fleet.bases.get(airframe.baseId)!;
  const record = fleet.records.get(airframe.id)!;
  const defectHold = new Map(record.defects.map((d) => [d.id, d.holdId ? Number(d.holdId) : null]));
  const newest = [...checks].sort(
    (a, b) => new Date(b.signed_at).getTime() - new Date(a.signed_at).getTime(),
  )[0];
  const upcoming = status.due
    .filter((d) => d.at !== null)
    .sort((a, b) => (a.at as Date).getTime() - (b.at as Date).getTime())[0];
  return {
    id: airframe.id,
    fleetNumber: airframe.fleetNumber,
    registration: airframe.registration ?? null,
    serial: airframe.serial,
    type: { id: type.id, code: type.code, name: type.name },
    base: { id: base.id, code: base.code, name: base.name, timeZone: base.timeZone },
    hours: Number(airframe.hours),
    flights: Number(airframe.flights ?? 0),
    state: status.state,
    formerState: formerState(status.state, status.causes),
    causes: status.causes,
    stateReasons: status.reasons,
    defects: status.defects.map((d) => ({
      id: Number(d.id),
      number: d.number,
      holdId: defectHold.get(d.id) ?? null,
      description: d.description,
      status: d.status as Summary['defects'][number]['status'],
      reason: d.reason,
      deferredUntil: d.deferral?.limit.at ? new Date(d.deferral.limit.at).toISOString() : null,
    })),
    findings: status.findings.map((f) => ({
      label: f.label,
      verdict: f.verdict,
      kind: f.kind,
      signedAt: f.signedAt.toISOString(),
      held: record.holds.some((h) => h.checkId === f.checkId),
      phrase: findingPhrase(f),
    })),
    release: status.release
      ? {
          by: fleet.certifiers.get(Number(status.release.by)) ?? 'unknown',
          at: status.release.at.toISOString(),
        }
      : null,
    lastCheck: newest
      ? {
          id: newest.id,
          kind: newest.kind,
          verdict: newest.verdict,
          signedAt: new Date(newest.signed_at).toISOString(),
          signedBy: fleet.names.get(newest.signed_by) ?? 'unknown',
        }
      : null,
    nextDue: upcoming ? { kind: upcoming.kind, at: (upcoming.at as Date).toISOString() } : null,
    openHolds: (fleet.holdsOf.get(airframe.id) ?? []).map((h) => ({
      id: h.id,
      reason: h.reason,
      openedAt: h.openedAt.toISOString(),
    })),
    lastAcceptance: fleet.acceptances.get(airframe.id) ?? null,
    fluidAlerts,
  };
}

/**
 * The statuses and, for a cache, the next instant the clock alone changes them; of one airframe, of the airframes at
 * some bases (a base's board), or of the whole fleet.
 */
/**
 * The records a board is judged from, read once: the database part of a board's cost. Level-drop alerts are read
 * with them; they sit beside the state, never part of it (the serviceability rule does not see them).
 */
export async function loadFleetRecords(
  sequelize: Sequelize,
  now = new Date(),
  only?: number,
  baseIds?: readonly number[],
) {
  const fleet = await loadFleet(sequelize, now, only, baseIds);
  const alerts = await levelDropAlerts(
    sequelize,
    { airframes: fleet.airframes, definitionOf: (typeId) => fleet.limitsByType.get(typeId)?.definition },
    now,
  );
  return { fleet, alerts };
}
export type FleetRecords = Awaited<ReturnType<typeof loadFleetRecords>>;

/** A fleet judged at one instant, and for each airframe the first later instant at which the clock alone changes it. */
export interface FleetJudgement {
  details: AirframeStatusDetail[];
  nextClockChange: Date | null;
  /** By airframe id: its detail, and when the clock alone next changes it (Infinity: never). */
  byAirframe: Map<number, { detail: AirframeStatusDetail; changesAt: number }>;
}

/**
 * Every airframe's state at `now`, from records already read: between two changes to the records only the clock
 * moves a state (a pre-flight runs out, a deferral ends, a started check is abandoned), so a board judges again
 * without reading. Given an earlier judgement of the same records, an airframe the clock has not
 * changed since (none of its checks, deferrals or started checks ran out) keeps its detail: on a base of hundreds of
 * airframes the clock changes one at a time, and judging them all again each time held every reader of the board.
 */
export function judgeFleet(
  { fleet: loaded, alerts }: FleetRecords,
  now: Date,
  earlier?: FleetJudgement,
): FleetJudgement {
  const t = now.getTime();
  const live = loaded.drafts.filter((d) => d.touchedAt.getTime() + draftLifetimeMs > t);
  const fleet =
    live.length === loaded.drafts.length
      ? loaded
      : { ...loaded, drafts: live, draftsOf: groupBy(live, (d) => d.airframeId) };
  const byAirframe: FleetJudgement['byAirframe'] = new Map();
  const details = fleet.airframes.map((airframe): AirframeStatusDetail => {
    const kept = earlier?.byAirframe.get(airframe.id);
    if (kept && t < kept.changesAt) {
      byAirframe.set(airframe.id, kept);
      return kept.detail;
    }
    const checks = fleet.checksOf.get(airframe.id) ?? [];
    const input = statusInputOf(fleet, airframe, checks, now);
    const status = deriveAirframeStatus(input);
    const summary = summaryOf(fleet, airframe, checks, status, alerts.get(airframe.id) ?? []);
    const detail = { summary, status, input, latest: checks };
    const drafts = (fleet.draftsOf.get(airframe.id) ?? []).map((d) => d.touchedAt);
    byAirframe.set(airframe.id, {
      detail,
      changesAt: nextClockChange([detail], drafts, now)?.getTime() ?? Infinity,
    });
    return detail;
  });
  // A loop, not Math.min(...list): a spread of every airframe's instant is one argument per airframe.
  let first = Infinity;
  for (const judged of byAirframe.values()) first = Math.min(first, judged.changesAt);
  return { details, nextClockChange: Number.isFinite(first) ? new Date(first) : null, byAirframe };
}

export async function fleetStatuses(
  sequelize: Sequelize,
  now = new Date(),
  only?: number,
  baseIds?: readonly number[],
) {
  return judgeFleet(await loadFleetRecords(sequelize, now, only, baseIds), now);
}

export async function airframeByTag(token: string) {
  const tag = await findTag(token);
  if (!tag) throw notFound(refusal('airframes.tagUnknown'), 'tag_unknown');
  if (tag.revokedAt) {
    throw new AppError(410, 'tag_revoked', refusal('airframes.tagReplaced'));
  }
  const airframe = await airframeById(tag.airframeId);
  if (!airframe || !airframe.active) throw notFound(refusal('airframes.tagAirframeGone'), 'tag_unknown');
  return { airframeId: airframe.id, fleetNumber: airframe.fleetNumber };
}

export async function checkCard(airframeId: number, kind: CheckKind): Promise<CheckCard> {
  const airframe = await airframeById(airframeId);
  if (!airframe || !airframe.active) throw notFound(refusal('airframes.airframeGone'));
  const limits = await currentLimits(airframe.typeId);
  if (!limits)
    throw new AppError(
      409,
      'no_limits',
      refusal('airframes.noLimitsYet', { fleetNumber: airframe.fleetNumber }),
    );
  const codes = limits.definition.cards[kind];
  if (!codes)
    throw notFound(
      refusal('airframes.noCard', { type: limits.definition.code, kind: { checkKind: kind } }),
      'no_card',
    );
  const byCode = new Map(limits.definition.checkpoints.map((c) => [c.code, c]));
  const checkpoints = codes.map((code) => byCode.get(code)!).filter(Boolean);
  const requires = [...new Set(checkpoints.flatMap((c) => requiredContextKeys(c)))];
  return {
    airframeId,
    kind,
    limitsVersion: {
      id: limits.id,
      version: limits.version,
      publishedAt: limits.publishedAt?.toISOString() ?? null,
    },
    type: { code: limits.definition.code, name: limits.definition.name },
    requires,
    checkpoints,
    fluids: limits.definition.fluid.allowed,
    ...(kind === 'after_flight'
      ? {
          lastUsage: {
            hours: Number(airframe.hours),
            flights: Number(airframe.flights ?? 0),
            landings: Number(airframe.landings ?? 0),
          },
        }
      : {}),
  };
}
