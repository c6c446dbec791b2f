import type { Sequelize } from 'sequelize';
import type { StoredCheck } from '../../../shared/schemas/api';
import type { CorrectiveActionInput, CountersignInput } from '../../../shared/schemas/holds';
import {
  limitsCaution,
  type HoldDetail,
  type HoldQueueItem,
  type PersonRef,
  type ReleaseReadiness,
} from '../../../shared/schemas/lead-api';
import { canCountersign } from '../../../shared/domain/status';
import { checkKindLabels } from '../../../shared/schemas/checks';
import { Check, Hold, HoldCorrectiveAction, HoldCountersign, Staff } from '../../db/models';
import { readingsAgainstLimits } from '../../db/reading-limits';
import { appendAuditEvent } from '../../audit/audit-trail';
import { verifyCredential, type LockoutPolicy } from '../../security/credentials';
import { canonicalJson, contentHash } from '../../security/hashing';
import { AppError, badRequest, conflict, forbidden, notFound } from '../../errors/app-error';
import {
  airframeWithType,
  correctiveActionsOf,
  countersignsOf,
  findHold,
  openHoldRows,
  passingRecheck,
  people,
} from './holds.repository';

export type LoadCheck = (id: string) => Promise<StoredCheck>;

const person = (staff: Staff | undefined, id: number): PersonRef => ({ id, name: staff?.name ?? 'unknown' });

async function heldCheck(hold: Hold) {
  const check = await Check.findByPk(hold.checkId);
  if (!check) throw new AppError(500, 'record_incomplete', `Hold ${hold.id} refers to a missing check.`);
  return check;
}

function readiness(
  held: Check,
  actionCount: number,
  recheck: Check | null,
  names: Map<number, Staff>,
): ReleaseReadiness {
  const missing: string[] = [];
  if (actionCount === 0) missing.push('Record the corrective action: what was done about the finding.');
  if (!recheck) {
    missing.push(
      `Sign a passing re-check: a new ${checkKindLabels[held.kind].toLowerCase()} check on this airframe, ` +
        'wholly in limits, after the held one (or a check recorded as its correction).',
    );
  }
  return {
    hasCorrectiveAction: actionCount > 0,
    recheck: recheck
      ? {
          id: recheck.id,
          kind: recheck.kind,
          signedAt: recheck.signedAt.toISOString(),
          signedBy: names.get(recheck.signedBy)?.name ?? 'unknown',
        }
      : null,
    missing,
  };
}

export async function holdQueue(loadCheck: LoadCheck): Promise<HoldQueueItem[]> {
  const holds = await openHoldRows();
  const ids = holds.map((h) => h.id);
  const [actions, countersigns] = await Promise.all([correctiveActionsOf(ids), countersignsOf(ids)]);
  const names = await people(countersigns.map((c) => c.signedBy));
  return Promise.all(
    holds.map(async (hold): Promise<HoldQueueItem> => {
      const [check, { type }, held] = await Promise.all([
        loadCheck(hold.checkId),
        airframeWithType(hold.airframeId),
        heldCheck(hold),
      ]);
      const last = countersigns.filter((c) => c.holdId === hold.id).at(-1);
      const readings = await readingsAgainstLimits(check);
      return {
        id: hold.id,
        airframe: { ...check.airframe, typeCode: type?.code ?? check.limitsVersion.typeCode },
        reason: hold.reason,
        openedAt: hold.openedAt.toISOString(),
        check: {
          id: check.id,
          kind: check.kind,
          verdict: check.verdict,
          signedAt: check.signedAt,
          signedBy: { id: check.signedBy.id, name: check.signedBy.name },
          note: check.note,
        },
        findings: readings.filter((r) => r.verdict !== 'in_limits'),
        correctiveActionCount: actions.filter((a) => a.holdId === hold.id).length,
        lastCountersign: last
          ? {
              decision: last.decision,
              by: names.get(last.signedBy)?.name ?? 'unknown',
              at: last.signedAt.toISOString(),
              reason: last.reason,
            }
          : null,
        recheckPassed: (await passingRecheck(held)) !== null,
      };
    }),
  );
}

export async function holdDetail(id: number, loadCheck: LoadCheck): Promise<HoldDetail> {
  const hold = await findHold(id);
  if (!hold) throw notFound(`No hold with id ${id}.`);
  const held = await heldCheck(hold);
  const [check, { type }, actions, countersigns, recheck] = await Promise.all([
    loadCheck(hold.checkId),
    airframeWithType(hold.airframeId),
    correctiveActionsOf([hold.id]),
    countersignsOf([hold.id]),
    passingRecheck(held),
  ]);
  const names = await people([
    held.signedBy,
    ...actions.map((a) => a.recordedBy),
    ...countersigns.map((c) => c.signedBy),
    ...(recheck ? [recheck.signedBy] : []),
    ...(hold.releasedBy ? [hold.releasedBy] : []),
  ]);
  return {
    id: hold.id,
    airframe: { ...check.airframe, typeCode: type?.code ?? check.limitsVersion.typeCode },
    reason: hold.reason,
    openedAt: hold.openedAt.toISOString(),
    state: hold.releasedAt ? 'released' : 'open',
    releasedAt: hold.releasedAt?.toISOString() ?? null,
    releasedBy: hold.releasedBy ? person(names.get(hold.releasedBy), hold.releasedBy) : null,
    raisedBy: person(names.get(held.signedBy), held.signedBy),
    check,
    readings: await readingsAgainstLimits(check),
    correctiveActions: actions.map((a) => ({
      id: a.id,
      text: a.text,
      recordedBy: person(names.get(a.recordedBy), a.recordedBy),
      recordedAt: a.recordedAt.toISOString(),
    })),
    countersigns: countersigns.map((c) => ({
      id: c.id,
      decision: c.decision,
      reason: c.reason,
      recheckCheckId: c.recheckCheckId,
      signedBy: person(names.get(c.signedBy), c.signedBy),
      signedAt: c.signedAt.toISOString(),
      signedWith: c.signedWith,
      contentHash: c.contentHash,
    })),
    releaseReadiness: readiness(held, actions.length, recheck, names),
    caution: limitsCaution,
  };
}

const alreadyReleased = (hold: Hold) =>
  conflict(
    'hold_already_released',
    `Hold ${hold.id} was released at ${hold.releasedAt!.toISOString()}. A new finding opens a new hold.`,
  );

export async function recordCorrectiveAction(
  sequelize: Sequelize,
  holdId: number,
  input: CorrectiveActionInput,
  by: Express.User,
  now = new Date(),
) {
  return sequelize.transaction(async (transaction) => {
    const hold = await findHold(holdId, transaction);
    if (!hold) throw notFound(`No hold with id ${holdId}.`);
    if (hold.releasedAt) throw alreadyReleased(hold);
    const action = await HoldCorrectiveAction.create(
      { holdId, text: input.text, recordedBy: by.id, recordedAt: now },
      { transaction },
    );
    await appendAuditEvent(sequelize, transaction, {
      actorId: by.id,
      action: 'hold.corrective_action',
      entity: 'hold',
      entityId: String(holdId),
      payload: { correctiveActionId: action.id, text: input.text },
      at: now,
    });
    return {
      id: action.id,
      text: action.text,
      recordedBy: { id: by.id, name: by.name },
      recordedAt: action.recordedAt.toISOString(),
    };
  });
}

export interface CountersignContext {
  signer: Express.User;
  channel: 'kiosk' | 'desk' | undefined;
  lockout: LockoutPolicy;
  now?: Date;
}

/** The secret the channel asks for: a kiosk has badge + PIN, the desk has a password. */
function credentialFor(input: CountersignInput, channel: CountersignContext['channel']) {
  if (channel === 'kiosk') {
    if (!input.pin) throw badRequest('pin_required', 'On a kiosk, countersign by typing your PIN again.');
    return { which: 'pin' as const, secret: input.pin };
  }
  if (!input.password)
    throw badRequest('password_required', 'At the desk, countersign by typing your password again.');
  return { which: 'password' as const, secret: input.password };
}

export async function countersignHold(
  sequelize: Sequelize,
  holdId: number,
  input: CountersignInput,
  ctx: CountersignContext,
) {
  const found = await findHold(holdId);
  if (!found) throw notFound(`No hold with id ${holdId}.`);
  const held = await heldCheck(found);
  const allowed = canCountersign({ raisedBy: String(held.signedBy) }, String(ctx.signer.id));
  if (!allowed.allowed) {
    throw forbidden(`Nobody countersigns their own check. ${allowed.reason ?? ''}`.trim(), 'own_check');
  }
  const credential = credentialFor(input, ctx.channel);
  // Verified outside the transaction, so a wrong PIN still counts towards the lockout.
  const signerRow = await verifyCredential(
    ctx.signer.badgeNumber,
    credential.secret,
    credential.which,
    ctx.lockout,
    { signing: true },
  );
  const signedAt = new Date(Math.floor((ctx.now ?? new Date()).getTime()));

  await sequelize.transaction(async (transaction) => {
    const hold = await findHold(holdId, transaction);
    if (!hold) throw notFound(`No hold with id ${holdId}.`);
    if (hold.releasedAt) throw alreadyReleased(hold);
    const actions = await correctiveActionsOf([hold.id], transaction);
    const recheck = input.decision === 'release' ? await passingRecheck(held, transaction) : null;
    if (input.decision === 'release') {
      const { missing } = readiness(held, actions.length, recheck, new Map());
      if (missing.length > 0) {
        throw conflict('release_not_ready', `Hold ${hold.id} cannot be released yet. ${missing.join(' ')}`, {
          missing,
        });
      }
    }
    const signedContent = {
      hold: hold.id,
      airframeId: hold.airframeId,
      heldCheck: { id: held.id, contentHash: held.contentHash },
      decision: input.decision,
      reason: input.reason ?? null,
      recheck: recheck ? { id: recheck.id, contentHash: recheck.contentHash } : null,
      correctiveActions: actions.map((a) => ({ id: a.id, text: a.text })),
      signer: { badge: signerRow.badgeNumber, name: signerRow.name, licence: signerRow.licenceNumber },
      signedWith: credential.which,
      signedAt: signedAt.toISOString(),
    };
    const hash = contentHash(signedContent);
    const countersign = await HoldCountersign.create(
      {
        holdId: hold.id,
        decision: input.decision,
        reason: input.reason ?? null,
        recheckCheckId: recheck?.id ?? null,
        signedBy: ctx.signer.id,
        signedAt,
        signedWith: credential.which,
        contentHash: hash,
        signedContent: canonicalJson(signedContent),
      },
      { transaction },
    );
    if (input.decision === 'release') {
      await hold.update({ releasedAt: signedAt, releasedBy: ctx.signer.id }, { transaction });
    }
    await appendAuditEvent(sequelize, transaction, {
      actorId: ctx.signer.id,
      action: input.decision === 'release' ? 'hold.released' : 'hold.kept',
      entity: 'hold',
      entityId: String(hold.id),
      payload: {
        countersignId: countersign.id,
        contentHash: hash,
        recheckCheckId: recheck?.id ?? null,
        reason: input.reason ?? null,
      },
      at: signedAt,
    });
  });
}
