import { Op, QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import type { AirframeSummary } from '@shared/schemas/airframes';
import type { StoredCheck } from '@shared/schemas/checks';
import type { AirframeStatus } from '@shared/domain/status';
import type { CheckKind } from '@shared/schemas/limits';
import { limitsCaution } from '@shared/schemas/limits';
import { type AcceptanceRecord, type AcceptanceView, type AcceptanceViewCheck } from '@shared/schemas/acceptance';
import { Acceptance, Check } from '@server/db/models';
import { readingsAgainstLimits } from '@server/db/reading-limits';
import { fluidAdded } from '@server/db/fluid-records';
import { appendAuditEvent } from '@server/audit/audit-trail';
import { verifyCredential, type LockoutPolicy } from '@server/security/credentials';
import { canonicalJson, contentHash } from '@server/security/hashing';
import { conflict, notFound } from '@server/errors/app-error';
import { acceptanceRefusal } from './acceptance-rules';

/** The board's own derivation for one airframe, handed in by the app so both always agree. */
export type AirframeStatusOf = (
  airframeId: number,
  now: Date,
) => Promise<
  | {
      summary: AirframeSummary;
      status: AirframeStatus;
      latest: { id: string; kind: CheckKind; signed_at: Date }[];
    }
  | undefined
>;

export interface AcceptanceDeps {
  statusOf: AirframeStatusOf;
  loadCheck: (id: string) => Promise<StoredCheck>;
}

const kindOrder: CheckKind[] = ['pre_flight', 'ground_run', 'after_flight', 'servicing'];
const weekMs = 7 * 24 * 3_600_000;

async function statusOrNotFound(deps: AcceptanceDeps, airframeId: number, now: Date) {
  const detail = await deps.statusOf(airframeId, now);
  if (!detail) throw notFound(`No airframe with id ${airframeId}.`);
  return detail;
}

/** The latest check of each kind that is still valid now: what an acceptance rests on. */
function validLatest(detail: Awaited<ReturnType<AirframeStatusOf>> & object) {
  return detail.latest.filter((check) => detail.status.due.some((d) => d.kind === check.kind && !d.expired));
}

export async function acceptanceView(
  sequelize: Sequelize,
  deps: AcceptanceDeps,
  airframeId: number,
  now = new Date(),
): Promise<AcceptanceView> {
  const detail = await statusOrNotFound(deps, airframeId, now);
  const { summary, status } = detail;
  const latest = [...detail.latest].sort((a, b) => kindOrder.indexOf(a.kind) - kindOrder.indexOf(b.kind));
  const latestChecks = await Promise.all(
    latest.map(async (row): Promise<AcceptanceViewCheck> => {
      const check = await deps.loadCheck(row.id);
      const due = status.due.find((d) => d.kind === row.kind);
      return {
        kind: check.kind,
        id: check.id,
        verdict: check.verdict,
        signedAt: check.signedAt,
        signedBy: {
          id: check.signedBy.id,
          name: check.signedBy.name,
          licenceNumber: check.signedBy.licenceNumber,
        },
        limitsVersion: check.limitsVersion,
        valid: due ? !due.expired : false,
        validUntil: due?.at?.toISOString() ?? null,
        validity: due?.reason ?? 'no validity window for this kind of check',
        readings: await readingsAgainstLimits(check),
      };
    }),
  );
  const refusal = acceptanceRefusal(
    summary.fleetNumber,
    status.state,
    status.reasons,
    status.due,
    status.causes,
  );
  return {
    airframe: {
      id: summary.id,
      fleetNumber: summary.fleetNumber,
      serial: summary.serial,
      type: { code: summary.type.code, name: summary.type.name },
      hours: summary.hours,
    },
    state: status.state,
    causes: status.causes,
    stateReasons: status.reasons,
    defects: summary.defects,
    release: summary.release,
    latestChecks,
    fluidAdded: (await fluidAdded(sequelize, [airframeId], new Date(now.getTime() - weekMs), now)).map(
      ({ airframeId: _airframeId, ...item }) => item,
    ),
    openHolds: summary.openHolds,
    lastAcceptance: summary.lastAcceptance ?? null,
    canAccept: refusal === null,
    refusal: refusal?.message ?? null,
    caution: limitsCaution,
  };
}

/** The newest defect, defect entry and release of the airframe: any change to them changes this mark. */
async function techLogMark(sequelize: Sequelize, airframeId: number, transaction?: Transaction) {
  const [row] = await sequelize.query<{ mark: string }>(
    `SELECT CONCAT_WS('/',
        (SELECT MAX(id) FROM defects WHERE airframe_id = :airframeId),
        (SELECT MAX(e.id) FROM defect_entries e JOIN defects d ON d.id = e.defect_id WHERE d.airframe_id = :airframeId),
        (SELECT MAX(id) FROM airframe_releases WHERE airframe_id = :airframeId)) AS mark`,
    { replacements: { airframeId }, type: QueryTypes.SELECT, ...(transaction ? { transaction } : {}) },
  );
  return row?.mark ?? '';
}

export async function acceptAirframe(
  sequelize: Sequelize,
  deps: AcceptanceDeps,
  airframeId: number,
  pin: string,
  ctx: { pilot: Express.User; lockout: LockoutPolicy; now?: Date },
): Promise<AcceptanceRecord> {
  // The pilot's own PIN typed again is the signature of the acceptance.
  const pilot = await verifyCredential(ctx.pilot.badgeNumber, pin, 'pin', ctx.lockout, { signing: true });
  const acceptedAt = new Date(Math.floor((ctx.now ?? new Date()).getTime()));
  const techLogBefore = await techLogMark(sequelize, airframeId);
  const detail = await statusOrNotFound(deps, airframeId, acceptedAt);
  const refusal = acceptanceRefusal(
    detail.summary.fleetNumber,
    detail.status.state,
    detail.status.reasons,
    detail.status.due,
    detail.status.causes,
  );
  if (refusal) throw conflict(refusal.code, refusal.message);

  const restingOn = validLatest(detail);
  const checks = await Check.findAll({
    where: { id: { [Op.in]: restingOn.map((c) => c.id) } },
    attributes: ['id', 'kind', 'contentHash', 'signedAt'],
  });
  const checkIds = checks
    .sort((a, b) => kindOrder.indexOf(a.kind) - kindOrder.indexOf(b.kind))
    .map((c) => c.id);
  const signedContent = {
    airframe: { id: detail.summary.id, fleetNumber: detail.summary.fleetNumber },
    state: detail.status.state,
    checks: checks.map((c) => ({ id: c.id, kind: c.kind, contentHash: c.contentHash })),
    deferredDefects: detail.status.defects.map((d) => ({ number: d.number, limit: d.reason })),
    release: detail.status.release
      ? { by: detail.status.release.by, at: detail.status.release.at.toISOString() }
      : null,
    pilot: { badge: pilot.badgeNumber, name: pilot.name, licence: pilot.licenceNumber },
    acceptedAt: acceptedAt.toISOString(),
  };
  const hash = contentHash(signedContent);
  const acceptance = await sequelize.transaction(async (transaction) => {
    // Every signed check and hold decision locks the audit trail's head before it commits. Holding that lock
    // first, this transaction's reads see everything committed before it and nothing can commit in between: if a
    // check or a hold decision for this airframe landed after the state above was derived, refuse and show it.
    await sequelize.query('SELECT hash FROM audit_head WHERE id = 1 FOR UPDATE', {
      type: QueryTypes.SELECT,
      transaction,
    });
    const newestUsed = Math.max(0, ...detail.latest.map((c) => new Date(c.signed_at).getTime()));
    const [changed] = await sequelize.query<{ holds: string | null; newer: number }>(
      `SELECT (SELECT GROUP_CONCAT(id ORDER BY id) FROM holds
                WHERE airframe_id = :airframeId AND released_at IS NULL) AS holds,
              (SELECT COUNT(*) FROM checks WHERE airframe_id = :airframeId AND signed_at > :newestUsed) AS newer`,
      {
        replacements: { airframeId, newestUsed: new Date(newestUsed) },
        type: QueryTypes.SELECT,
        transaction,
      },
    );
    const holdsUsed = detail.summary.openHolds
      .map((h) => h.id)
      .sort((a, b) => a - b)
      .join(',');
    const techLogNow = await techLogMark(sequelize, airframeId, transaction);
    if (
      (changed?.holds ?? '') !== holdsUsed ||
      Number(changed?.newer ?? 0) > 0 ||
      techLogNow !== techLogBefore
    ) {
      throw conflict(
        'state_changed',
        `${detail.summary.fleetNumber} changed while you were signing (a new check, a hold decision or a tech-log entry). ` +
          'Look at it again before you accept it.',
      );
    }
    const row = await Acceptance.create(
      {
        airframeId,
        acceptedBy: pilot.id,
        acceptedAt,
        checkIds: JSON.stringify(checkIds),
        contentHash: hash,
        signedContent: canonicalJson(signedContent),
      },
      { transaction },
    );
    await appendAuditEvent(sequelize, transaction, {
      actorId: pilot.id,
      action: 'airframe.accepted',
      entity: 'acceptance',
      entityId: String(row.id),
      payload: { airframeId, checkIds, contentHash: hash },
      at: acceptedAt,
    });
    return row;
  });
  return {
    id: acceptance.id,
    airframeId,
    acceptedBy: {
      id: pilot.id,
      name: pilot.name,
      badgeNumber: pilot.badgeNumber,
      licenceNumber: pilot.licenceNumber,
    },
    acceptedAt: acceptedAt.toISOString(),
    checkIds,
    contentHash: hash,
  };
}
