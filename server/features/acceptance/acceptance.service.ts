import type { Sequelize, Transaction } from 'sequelize';
import type { AirframeSummary } from '@shared/schemas/airframes';
import type { StoredCheck } from '@shared/schemas/checks';
import type { AirframeStatus } from '@shared/domain/status';
import type { CheckKind } from '@shared/schemas/limits';
import { limitsCaution } from '@shared/schemas/limits';
import {
  type AcceptanceRecord,
  type AcceptanceView,
  type AcceptanceViewCheck,
} from '@shared/schemas/acceptance';
import { readingsAgainstLimits } from '@server/db/reading-limits';
import { fluidAdded } from '@server/db/fluid-records';
import { lastUsage } from '@server/db/usage-records';
import type { LockoutPolicy } from '@server/security/credentials';
import { signContent, verifySigner, type Signature } from '@server/security/signing';
import { conflict, notFound, refusal } from '@server/errors/app-error';
import { acceptanceRefusal } from './acceptance-rules';
import {
  acceptanceSignedAs,
  checkHashes,
  createAcceptance,
  holdsAndNewerChecks,
  lockAuditHead,
  techLogMark,
} from './acceptance.repository';
import { inTransaction } from '@server/db/retry';
import { signingIdReused, signOnce } from '@server/security/sign-once';
import { phrase } from '@shared/i18n/phrase';
import { englishTranslate, type Translate } from '@shared/i18n/translate';

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

type StatusDetail = NonNullable<Awaited<ReturnType<AirframeStatusOf>>>;

const kindOrder: CheckKind[] = ['pre_flight', 'ground_run', 'after_flight', 'servicing'];
const weekMs = 7 * 24 * 3_600_000;

async function statusOrNotFound(deps: AcceptanceDeps, airframeId: number, now: Date) {
  const detail = await deps.statusOf(airframeId, now);
  if (!detail) throw notFound(refusal('airframes.airframeGone'));
  return detail;
}

/** The latest check of each kind that is still valid now: what an acceptance rests on. */
function validLatest(detail: StatusDetail) {
  return detail.latest.filter((check) => detail.status.due.some((d) => d.kind === check.kind && !d.expired));
}

export async function acceptanceView(
  sequelize: Sequelize,
  deps: AcceptanceDeps,
  airframeId: number,
  now = new Date(),
  t: Translate = englishTranslate(),
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
        validity: due?.reason ?? phrase('noValidityWindow'),
        readings: await readingsAgainstLimits(check, t),
      };
    }),
  );
  const refused = refusalOf(detail);
  const usage = await lastUsage(airframeId);
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
    lastUsage: {
      hours: usage?.hours ?? summary.hours,
      flights: usage?.flights ?? summary.flights,
      landings: usage?.landings ?? 0,
    },
    canAccept: refused === null,
    refusal: refused?.phrase ?? null,
    caution: limitsCaution,
  };
}

const refusalOf = ({ summary, status }: StatusDetail) =>
  acceptanceRefusal(summary.fleetNumber, status.state, status.reasons, status.due, status.causes);

/**
 * Refuses when a check, a hold decision or a tech-log entry for this airframe landed after its state was derived.
 * Called under the audit head lock, so nothing can commit between this look and the acceptance.
 */
async function refuseIfChanged(
  sequelize: Sequelize,
  detail: StatusDetail,
  techLogBefore: string,
  transaction: Transaction,
) {
  const airframeId = detail.summary.id;
  const newestUsed = Math.max(0, ...detail.latest.map((c) => new Date(c.signed_at).getTime()));
  const changed = await holdsAndNewerChecks(sequelize, airframeId, new Date(newestUsed), transaction);
  const holdsUsed = detail.summary.openHolds
    .map((h) => h.id)
    .sort((a, b) => a - b)
    .join(',');
  const techLogNow = await techLogMark(sequelize, airframeId, transaction);
  if (changed.holds !== holdsUsed || changed.newer > 0 || techLogNow !== techLogBefore) {
    throw conflict(
      'state_changed',
      refusal('acceptance.changedWhileSigning', { fleetNumber: detail.summary.fleetNumber }),
    );
  }
}

/** Exactly what an acceptance covers: the state, the checks it rests on, deferrals, release and the pilot. */
function acceptanceContent(
  { summary, status }: StatusDetail,
  checks: { id: string; kind: CheckKind; contentHash: string }[],
  signature: Signature,
) {
  const pilot = signature.row;
  return {
    airframe: { id: summary.id, fleetNumber: summary.fleetNumber },
    state: status.state,
    checks: checks.map((c) => ({ id: c.id, kind: c.kind, contentHash: c.contentHash })),
    deferredDefects: status.defects.map((d) => ({ number: d.number, limit: d.reason })),
    release: status.release ? { by: status.release.by, at: status.release.at.toISOString() } : null,
    pilot: { badge: pilot.badgeNumber, name: pilot.name, licence: pilot.licenceNumber },
    acceptedAt: signature.at.toISOString(),
  };
}

export async function acceptAirframe(
  sequelize: Sequelize,
  deps: AcceptanceDeps,
  airframeId: number,
  input: { pin: string; requestId?: string | undefined },
  ctx: { pilot: Express.User; lockout: LockoutPolicy; now?: Date },
): Promise<AcceptanceRecord> {
  // The pilot's own PIN typed again is the signature of the acceptance.
  const signature = await verifySigner(
    { pin: input.pin },
    { signer: ctx.pilot, channel: 'kiosk', lockout: ctx.lockout },
    'accept',
    ctx.now,
  );
  return signOnce(
    input.requestId,
    async (requestId) => {
      const earlier = await acceptanceSignedAs(requestId);
      if (!earlier) return null;
      if (earlier.airframeId !== airframeId || earlier.acceptedBy !== signature.row.id)
        throw signingIdReused();
      return acceptanceRecord(earlier, signature);
    },
    () => signAcceptance(sequelize, deps, airframeId, input.requestId ?? null, signature),
  );
}

/** What the pilot is answered with, the first time and on any resend of the same signing. */
const acceptanceRecord = (
  row: { id: number; airframeId: number; acceptedAt: Date; checkIds: string; contentHash: string },
  { row: pilot }: Signature,
): AcceptanceRecord => ({
  id: row.id,
  airframeId: row.airframeId,
  acceptedBy: {
    id: pilot.id,
    name: pilot.name,
    badgeNumber: pilot.badgeNumber,
    licenceNumber: pilot.licenceNumber,
  },
  acceptedAt: row.acceptedAt.toISOString(),
  checkIds: JSON.parse(row.checkIds) as string[],
  contentHash: row.contentHash,
});

/** The acceptance itself, once the pilot is known and no earlier try of this signing was stored. */
async function signAcceptance(
  sequelize: Sequelize,
  deps: AcceptanceDeps,
  airframeId: number,
  requestId: string | null,
  signature: Signature,
): Promise<AcceptanceRecord> {
  const { row: pilot, at: acceptedAt } = signature;
  const techLogBefore = await techLogMark(sequelize, airframeId);
  const detail = await statusOrNotFound(deps, airframeId, acceptedAt);
  const refused = refusalOf(detail);
  if (refused) throw conflict(refused.code, refused.phrase);
  const checks = (await checkHashes(validLatest(detail).map((c) => c.id))).sort(
    (a, b) => kindOrder.indexOf(a.kind) - kindOrder.indexOf(b.kind),
  );
  const checkIds = checks.map((c) => c.id);
  const { row, sealed } = await inTransaction(sequelize, async (transaction) => {
    await lockAuditHead(sequelize, transaction);
    await refuseIfChanged(sequelize, detail, techLogBefore, transaction);
    return signContent(signature, {
      content: acceptanceContent(detail, checks, signature),
      store: (sealedContent) =>
        createAcceptance(
          {
            airframeId,
            acceptedBy: pilot.id,
            acceptedAt,
            checkIds: JSON.stringify(checkIds),
            requestId,
            ...sealedContent,
          },
          transaction,
        ),
      trail: { sequelize, transaction },
      event: (row, sealedContent) => ({
        action: 'airframe.accepted',
        entity: 'acceptance',
        entityId: String(row.id),
        payload: { airframeId, checkIds, contentHash: sealedContent.contentHash },
      }),
    });
  });
  return acceptanceRecord(
    {
      id: row.id,
      airframeId,
      acceptedAt,
      checkIds: JSON.stringify(checkIds),
      contentHash: sealed.contentHash,
    },
    signature,
  );
}
