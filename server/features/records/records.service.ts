import type { Sequelize } from 'sequelize';
import type {
  FullRecord,
  RecordPage,
  RecordSearch,
  TrailReport,
  Trends,
  TrendSystem,
} from '@shared/schemas/records';
import {
  consumptionOverWindow,
  unexplainedLevelDrops,
  type FlightHoursEntry,
  type LevelCheck,
  type ServicingEvent,
} from '@shared/domain/consumption';
import { countedOnce, fluidAddedSuffix } from '@shared/domain/servicing';
import { convert } from '@shared/domain/units';
import type { AircraftTypeDefinition } from '@shared/schemas/limits';
import { currentLimits } from '@server/db/limits-store';
import { staffNames } from '@server/db/staff-names';
import { flightHoursBetween } from '@server/db/usage-records';
import { loadCheckRows, readingView, servicingView } from '@server/db/check-records';
import { checkRecordProblem, verifyRecords } from '@server/audit/record-integrity';
import { AppError, notFound, refusal } from '@server/errors/app-error';
import {
  airframeById,
  checksWithReadings,
  correctionsOf,
  countersignsForHold,
  newestAuditEvents,
  searchChecks,
  signingEventOf,
} from './records.repository';

export async function searchRecords(sequelize: Sequelize, filters: RecordSearch): Promise<RecordPage> {
  const { rows, total } = await searchChecks(
    sequelize,
    filters,
    filters.pageSize,
    (filters.page - 1) * filters.pageSize,
  );
  return { rows, total, page: filters.page, pageSize: filters.pageSize };
}

export async function fullRecord(sequelize: Sequelize, id: string): Promise<FullRecord> {
  const { check, airframe, signer, readings, limits, hold, servicing, photos } = await loadCheckRows(id);
  const [corrections, event, problem] = await Promise.all([
    correctionsOf(id),
    signingEventOf(id),
    checkRecordProblem(id),
  ]);
  const checkpoints = new Map(limits.definition.checkpoints.map((c) => [c.code, c]));
  const countersigns = hold ? await countersignsForHold(sequelize, hold.id) : [];
  return {
    id: check.id,
    airframe: {
      id: airframe.id,
      fleetNumber: airframe.fleetNumber,
      serial: airframe.serial,
      registration: airframe.registration ?? null,
    },
    type: { code: limits.definition.code, name: limits.definition.name },
    kind: check.kind,
    verdict: check.verdict,
    context: JSON.parse(check.context),
    note: check.note,
    limitsVersion: {
      id: limits.id,
      version: limits.version,
      publishedAt: limits.publishedAt?.toISOString() ?? null,
    },
    airframeHours: check.airframeHours === null ? null : Number(check.airframeHours),
    signedBy: {
      id: signer.id,
      name: signer.name,
      badgeNumber: signer.badgeNumber,
      licenceNumber: signer.licenceNumber,
      active: Boolean(signer.active),
    },
    signedAt: check.signedAt.toISOString(),
    contentHash: check.contentHash,
    signedContent: check.signedContent ? JSON.parse(check.signedContent) : null,
    integrity: { ok: problem === null, problem },
    correctsCheckId: check.correctsCheckId,
    correctedBy: corrections.map((c) => ({ id: c.id, signedAt: c.signedAt.toISOString() })),
    readings: readings.map((r) => {
      const cp = checkpoints.get(r.checkpointCode);
      return {
        ...readingView(r, cp?.label ?? r.checkpointCode, photos),
        seq: r.seq,
        ata: cp?.ata ?? null,
        reference: cp?.reference ?? null,
      };
    }),
    servicing: servicing.map(servicingView),
    hold: hold
      ? {
          id: hold.id,
          reason: hold.reason,
          openedAt: hold.openedAt.toISOString(),
          releasedAt: hold.releasedAt?.toISOString() ?? null,
        }
      : null,
    countersigns: countersigns.map((c) => ({
      decision: c.decision,
      reason: c.reason,
      signedBy: c.name,
      licenceNumber: c.licence_number,
      signedAt: new Date(c.signed_at).toISOString(),
      contentHash: c.content_hash,
    })),
    auditEvent: event ? { id: Number(event.id), at: event.at.toISOString(), hash: event.hash } : null,
  };
}

type TrendRows = Awaited<ReturnType<typeof checksWithReadings>>;
type TrendCheck = TrendRows['checks'][number];
type TrendSystemDefinition = AircraftTypeDefinition['systems'][number];

const hoursOf = (c: TrendCheck) => (c.airframeHours === null ? null : Number(c.airframeHours));

/**
 * Each top-up over the hours recorded as flown since the one before it (for the first, since the window opened):
 * fluid put in replaces what was used since the system was last filled.
 */
function ratesPerFlightHour(
  added: { at: string; checkId: string; litres: number }[],
  flights: FlightHoursEntry[],
) {
  let from = -Infinity;
  return added.flatMap((e) => {
    const to = new Date(e.at).getTime();
    const hours = flights
      .filter((f) => new Date(f.at).getTime() > from && new Date(f.at).getTime() <= to)
      .reduce((total, f) => total + f.flightHours, 0);
    from = to;
    return hours > 0 ? [{ at: e.at, checkId: e.checkId, litresPerFh: e.litres / hours }] : [];
  });
}

interface TrendContext {
  definition: AircraftTypeDefinition;
  rows: TrendRows;
  checkById: Map<string, TrendCheck>;
  /** Hours flown as recorded at after-flight checks and pilots' closes of flights, in the window. */
  flights: FlightHoursEntry[];
  now: Date;
  days: number;
}

function levelsOf(system: TrendSystemDefinition, ctx: TrendContext) {
  const levelCodes = new Set(
    ctx.definition.checkpoints
      .filter((cp) => cp.system === system.code && cp.kind === 'level')
      .map((cp) => cp.code),
  );
  levelCodes.add(system.reservoirCheckpoint);
  return ctx.rows.readings
    .filter((r) => levelCodes.has(r.checkpointCode) && r.value !== null && r.unit !== null)
    .map((r) => {
      const c = ctx.checkById.get(r.checkId)!;
      const context = JSON.parse(c.context) as { attitude?: string };
      return {
        at: c.signedAt.toISOString(),
        checkId: c.id,
        airframeHours: hoursOf(c),
        levelL: convert(r.value!, r.unit!, 'L'),
        attitude: context.attitude ?? null,
      };
    })
    .sort((a, b) => a.at.localeCompare(b.at));
}

/** Fluid added to a system, each litre once (see `countedOnce`): top-ups, and older checks' "fluid added" readings. */
function fluidAddedTo(system: TrendSystemDefinition, ctx: TrendContext) {
  const entries = ctx.rows.servicing
    .filter((e) => e.system === system.code)
    .map((e) => ({
      checkId: e.checkId,
      system: e.system,
      source: 'servicing' as const,
      litres: e.quantityL,
    }));
  const readings = ctx.rows.readings
    .filter(
      (r) => r.checkpointCode === `${system.code}${fluidAddedSuffix}` && r.value !== null && r.value > 0,
    )
    .map((r) => ({
      checkId: r.checkId,
      system: system.code,
      source: 'reading' as const,
      litres: convert(r.value!, r.unit ?? 'L', 'L'),
    }));
  return countedOnce([...entries, ...readings])
    .map((e) => {
      const check = ctx.checkById.get(e.checkId)!;
      return {
        at: check.signedAt.toISOString(),
        checkId: e.checkId,
        litres: e.litres,
        airframeHours: hoursOf(check),
      };
    })
    .sort((a, b) => a.at.localeCompare(b.at));
}

function systemTrend(system: TrendSystemDefinition, ctx: TrendContext): TrendSystem {
  const { flights, days } = ctx;
  const levels = levelsOf(system, ctx);
  const added = fluidAddedTo(system, ctx);
  const events: (ServicingEvent & { checkId: string })[] = added.map((e) => ({
    at: e.at,
    system: system.code,
    litres: e.litres,
    checkId: e.checkId,
  }));
  const ratePerFh = ratesPerFlightHour(added, flights);
  const windowSummary = consumptionOverWindow({
    system: system.code,
    events,
    flights,
    windowEnd: ctx.now,
    windowDays: days,
    alertLPerFh: ctx.definition.consumptionAlertLPerFh,
  });
  const alerts: TrendSystem['alerts'] = [];
  if (windowSummary.alert) {
    alerts.push({
      kind: windowSummary.alert.kind,
      message: windowSummary.alert.message,
      checkIds: [...new Set(added.map((e) => e.checkId))],
    });
  }
  const levelChecks: (LevelCheck & { checkId: string })[] = levels.map((l) => ({
    at: l.at,
    system: system.code,
    levelL: l.levelL,
    checkId: l.checkId,
    ...(l.attitude ? { attitude: l.attitude as LevelCheck['attitude'] } : {}),
  }));
  for (const drop of unexplainedLevelDrops({ system: system.code, checks: levelChecks, events, flights })) {
    const from = drop.from as LevelCheck & { checkId: string };
    const to = drop.to as LevelCheck & { checkId: string };
    alerts.push({
      kind: 'unexplained_level_drop',
      message: drop.message,
      checkIds: [from.checkId, to.checkId],
    });
  }
  const { litresAdded, flightHours, litresPerFlightHour } = windowSummary;
  return {
    system: system.code,
    label: system.label,
    levels,
    servicing: added,
    ratePerFh,
    window: { days, litresAdded, flightHours, litresPerFlightHour },
    alerts,
  };
}

/**
 * Levels and fluid added for each hydraulic system of one airframe. Flight hours come from the usage entries
 * (after-flight checks and pilots' closes of flights), not from the hours a check was stamped with, which only
 * move when someone records a flight.
 */
export async function trends(airframeId: number, days: number, now = new Date()): Promise<Trends> {
  const airframe = await airframeById(airframeId);
  if (!airframe) throw notFound(refusal('airframes.airframeGone'));
  const limits = await currentLimits(airframe.typeId);
  if (!limits)
    throw new AppError(
      409,
      'no_limits',
      refusal('airframes.noLimits', { fleetNumber: airframe.fleetNumber }),
    );
  const since = new Date(now.getTime() - days * 86_400_000);
  const [rows, flights] = await Promise.all([
    checksWithReadings(airframeId, since, now),
    flightHoursBetween(airframeId, since, now),
  ]);
  const ctx: TrendContext = {
    definition: limits.definition,
    rows,
    checkById: new Map(rows.checks.map((c) => [c.id, c])),
    flights,
    now,
    days,
  };
  return {
    airframe: { id: airframe.id, fleetNumber: airframe.fleetNumber, typeCode: limits.definition.code },
    thresholdLPerFh: limits.definition.consumptionAlertLPerFh,
    days,
    systems: limits.definition.systems.map((system) => systemTrend(system, ctx)),
  };
}

export async function verifyTrail(sequelize: Sequelize): Promise<TrailReport> {
  const result = await verifyRecords(sequelize);
  return { ...result, checkedAt: new Date().toISOString() };
}

export async function recentAuditEvents(limit: number) {
  const events = await newestAuditEvents(limit);
  const names = await staffNames(events.map((e) => e.actorId));
  return events.map((e) => ({
    id: Number(e.id),
    at: e.at.toISOString(),
    actor: e.actorId === null ? null : (names.get(e.actorId) ?? null),
    action: e.action,
    entity: e.entity,
    entityId: e.entityId,
    hash: e.hash,
  }));
}
