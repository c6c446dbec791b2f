import type { Sequelize } from 'sequelize';
import type { SubmitCheck } from '@shared/schemas/checks';
import type { StoredCheck } from '@shared/schemas/checks';
import { judgeSubmission, type SubmissionProblem } from '@shared/domain/judge';
import { evaluateReading, InvalidReadingError } from '@shared/domain/limits';
import { checkFluidAllowed } from '@shared/domain/servicing';
import { convert } from '@shared/domain/units';
import { localDay } from '@shared/domain/local-time';
import { toolsUsed, type ToolsUsed } from './check-tools';
import { loadCheckRows, readingView, servicingView, type CheckRows } from '@server/db/check-records';
import { isDuplicateKey } from '@server/db/unique-violation';
import { lastUsage, USAGE_MOVED_SQLSTATE } from '@server/db/usage-records';
import { usageFlown, usageProblem, type UsageStepLimits } from '@shared/domain/usage';
import type { LockoutPolicy, StaffRow } from '@server/security/credentials';
import { canonicalJson, sha256 } from '@server/security/hashing';
import { signContent, verifySigner } from '@server/security/signing';
import { AppError, badRequest, conflict, forbidden, notFound, refusal } from '@server/errors/app-error';
import {
  PHOTO_TAKEN_SQLSTATE,
  checkById,
  photosByIds,
  signingTargets,
  storeSignedCheck,
  type StoredPhoto,
} from './checks.repository';
import {
  checkContent,
  checkDefects,
  checkEvents,
  checkRows,
  holdOf,
  type CheckTarget,
  type JudgedCheck,
  type PhotoClaim,
  type RecordedUsage,
  type TopUp,
} from './check-record';

interface SubmitContext {
  signer: Express.User;
  /** The most one entry of flight hours, flights and landings may add (server configuration). */
  usageLimits: UsageStepLimits;
  /** The signer's row as read for this request, if it was. */
  signerRow?: StaffRow;
  kioskId: number | null;
  lockout: LockoutPolicy;
  now?: Date;
}

/** The hash of what the tablet sent, PIN left out: the same check sent twice hashes the same. */
const submissionHashOf = (input: SubmitCheck) => {
  const { pin: _pin, ...rest } = input;
  return sha256(canonicalJson(rest));
};

/**
 * Signs a check the kiosk sends: the same check sent again answers with the stored one. Each step refuses what it
 * cannot accept before anything is written; the rows, the hold, the defects and the audit events are written
 * together.
 */
export async function submitCheck(sequelize: Sequelize, input: SubmitCheck, ctx: SubmitContext) {
  const submissionHash = submissionHashOf(input);
  const { existing, airframe, limits } = await signingTargets(sequelize, input.id, input.airframeId);
  if (existing) return replay(existing, submissionHash, ctx.signer.id);
  const signature = await verifyMechanic(input, ctx);
  const target = currentCard(input, airframe, limits);
  const judged = judgeReadings(input, target);
  await refuseUnknownCorrection(input, target);
  const tools = await toolsUsed(input, target, signature.at);
  const servicing = topUps(input, target, tools, localDay(signature.at, target.limits.definition.timeZone));
  const usage = await recordedUsage(input, target, ctx.usageLimits);
  const { claims, photos } = await claimablePhotos(input, ctx.signer.id);
  const check: JudgedCheck = {
    input,
    target,
    ...judged,
    servicing,
    usage,
    photos: claims,
    tools,
    signature,
  };
  const stored = await storeCheck(sequelize, check, { submissionHash, kioskId: ctx.kioskId });
  if (!stored.created) return stored;
  return { created: true, check: answer(check, stored.rows, photos) };
}

/** The PIN typed again at signing is the signature: a deliberate act by the badge holder, a mechanic. */
async function verifyMechanic(input: SubmitCheck, ctx: SubmitContext) {
  if (!ctx.signer.roles.includes('mechanic')) throw forbidden(refusal('checks.onlyMechanicSigns'));
  return verifySigner(
    { pin: input.pin },
    { signer: ctx.signer, channel: 'kiosk', lockout: ctx.lockout, known: ctx.signerRow },
    'sign',
    ctx.now,
  );
}

/** The airframe, its type's current limits (the ones the check was opened with) and the check's card. */
function currentCard(
  input: SubmitCheck,
  airframe: Awaited<ReturnType<typeof signingTargets>>['airframe'],
  limits: Awaited<ReturnType<typeof signingTargets>>['limits'],
): CheckTarget {
  if (!airframe || !airframe.active) throw notFound(refusal('airframes.airframeGone'));
  if (!limits)
    throw conflict('no_limits', refusal('airframes.noLimits', { fleetNumber: airframe.fleetNumber }));
  if (limits.id !== input.limitsVersionId) {
    throw conflict(
      'limits_changed',
      refusal('checks.limitsChanged', { type: limits.definition.code, version: limits.version }),
      { currentLimitsVersionId: limits.id },
    );
  }
  const codes = limits.definition.cards[input.kind];
  if (!codes)
    throw badRequest(
      'no_card',
      refusal('airframes.noCard', { type: limits.definition.code, kind: { checkKind: input.kind } }),
    );
  const checkpoints = new Map(limits.definition.checkpoints.map((c) => [c.code, c]));
  return { airframe, limits, card: codes.flatMap((code) => checkpoints.get(code) ?? []) };
}

/** The refusal for the first problem of a submission, worded for the person at the tablet. */
function problemError(problem: SubmissionProblem, input: SubmitCheck): AppError {
  switch (problem.kind) {
    case 'unknown_checkpoint':
      return badRequest(
        'unknown_checkpoint',
        // The code is for the program that sent it (details); the person reads what to do.
        refusal('checks.unknownCheckpoint', { kind: { checkKind: input.kind } }),
        { path: `readings.${problem.index}`, checkpoint: problem.code },
      );
    case 'duplicate_reading':
      return badRequest(
        'duplicate_reading',
        refusal('checks.duplicateReading', { checkpoint: problem.checkpoint.label }),
        { path: `readings.${problem.index}` },
      );
    case 'invalid_reading':
      return badRequest(
        problem.error.code,
        refusal('readings.invalid', {
          checkpoint: problem.error.checkpointLabel,
          reason: { phrase: problem.error.reason },
        }),
        { path: `readings.${problem.index}` },
      );
    case 'readings_missing': {
      const missing = problem.missing.map((c) => c.label);
      const words = refusal('checks.readingsMissing', { missing: missing.join(', ') });
      return badRequest('readings_missing', words, { missing });
    }
  }
}

/** Every reading judged by the same rule the kiosk's review showed; a check with any problem is refused whole. */
function judgeReadings(input: SubmitCheck, target: CheckTarget) {
  const judged = judgeSubmission(target.card, input);
  const [problem] = judged.problems;
  if (problem) throw problemError(problem, input);
  return { readings: judged.readings, verdict: judged.verdict };
}

async function refuseUnknownCorrection(input: SubmitCheck, target: CheckTarget) {
  if (!input.correctsCheckId) return;
  const corrected = await checkById(input.correctsCheckId);
  if (!corrected || corrected.airframeId !== target.airframe.id) {
    throw badRequest('unknown_corrected_check', refusal('checks.unknownCorrectedCheck'));
  }
}

/**
 * Fluid is recorded once, with its top-up: a second top-up of the same level, or a "fluid added" quantity reading
 * beside a top-up of the same system (an older card's checkpoint), would count the same litres twice.
 */
function refuseSecondFluidRecord(input: SubmitCheck, card: CheckTarget['card']) {
  const entries = input.servicing ?? [];
  entries.forEach((entry, index) => {
    const checkpoint = card.find((c) => c.code === entry.code);
    const where = checkpoint?.label ?? { phrase: refusal('checks.thisLevel') };
    if (entries.findIndex((e) => e.code === entry.code) !== index) {
      throw badRequest('servicing_twice', refusal('checks.fluidEnteredTwice', { where }), {
        path: `servicing.${index}`,
      });
    }
    const system = checkpoint?.system;
    const quantityIndex = input.readings.findIndex((r) => {
      const cp = card.find((c) => c.code === r.code);
      return cp?.kind === 'quantity' && system !== undefined && cp.system === system;
    });
    const quantity = input.readings[quantityIndex];
    if (quantity && 'value' in quantity.entry && quantity.entry.value > 0) {
      const label = card.find((c) => c.code === quantity.code)?.label ?? {
        phrase: refusal('checks.theFluidAdded'),
      };
      throw badRequest('servicing_twice', refusal('checks.fluidWithTopUp', { where, label }), {
        path: `readings.${quantityIndex}`,
      });
    }
  });
}

/** Fluid added during the check: only at a level of this check, of an approved fluid, never hiding a finding. */
function topUps(input: SubmitCheck, { card, limits }: CheckTarget, tools: ToolsUsed, day: string): TopUp[] {
  refuseSecondFluidRecord(input, card);
  return (input.servicing ?? []).map((entry, index) => {
    const checkpoint = card.find((c) => c.code === entry.code);
    if (!checkpoint || checkpoint.kind !== 'level') {
      throw badRequest('servicing_not_a_level', refusal('checks.notALevel'), { path: `servicing.${index}` });
    }
    const fluid = checkFluidAllowed(limits.definition, entry.fluidSpec);
    if (!fluid.allowed) {
      throw badRequest(
        fluid.reason === 'different_base' ? 'fluid_wrong_base' : 'fluid_not_approved',
        fluid.words,
        { path: `servicing.${index}.fluidSpec` },
      );
    }
    refuseHiddenFinding(checkpoint, entry.levelBefore, input.context, index);
    if (entry.canOpenedOn > day) {
      throw badRequest('can_opened_later', refusal('checks.canOpenedLater', { day: { day } }), {
        path: `servicing.${index}.canOpenedOn`,
      });
    }
    return {
      code: entry.code,
      system: checkpoint.system ?? null,
      quantityL: convert(entry.quantity.value, entry.quantity.unit, 'L'),
      entered: entry.quantity,
      fluidSpec: fluid.fluid.spec,
      batch: entry.batch,
      canOpenedOn: entry.canOpenedOn,
      levelBefore: entry.levelBefore,
      tool: tools.servicing[index] ?? null,
    };
  });
}

/**
 * A level found out of limits is a finding: it is signed as found and holds the airframe. Topping it up inside
 * the same check would let the re-read hide it.
 */
function refuseHiddenFinding(
  checkpoint: CheckTarget['card'][number],
  levelBefore: NonNullable<SubmitCheck['servicing']>[number]['levelBefore'],
  context: SubmitCheck['context'],
  index: number,
) {
  const path = `servicing.${index}.levelBefore`;
  let before;
  try {
    before = evaluateReading(checkpoint, { ...levelBefore, context });
  } catch (err) {
    if (err instanceof InvalidReadingError) {
      const words = refusal('checks.levelBeforeTopUp', {
        checkpoint: err.checkpointLabel,
        reason: { phrase: err.reason },
      });
      throw badRequest(err.code, words, { path });
    }
    throw err;
  }
  if (before.verdict === 'out_of_limits') {
    // The band's message is the type's configured words, as engineering wrote them.
    throw badRequest(
      'servicing_hides_finding',
      refusal('checks.hidesFinding', { checkpoint: checkpoint.label, band: before.message }),
      { path },
    );
  }
}

/**
 * The figures an after-flight check records: refused whole, check and all, when one goes back or jumps further than
 * one entry may, with the last figure in the message so the mechanic can read the meter again.
 */
async function recordedUsage(
  input: SubmitCheck,
  target: CheckTarget,
  limits: UsageStepLimits,
): Promise<RecordedUsage | null> {
  if (!input.usage) return null;
  if (input.kind !== 'after_flight') {
    throw badRequest(
      'usage_not_after_flight',
      refusal('checks.usageNotAfterFlight', { kind: { checkKind: input.kind, inSentence: true } }),
      { path: 'usage' },
    );
  }
  const last = await lastUsage(target.airframe.id);
  if (!last) throw notFound(refusal('airframes.airframeGone'));
  const problem = usageProblem(last, input.usage, limits);
  if (problem) {
    const words = problem.reason;
    throw badRequest(problem.kind === 'backwards' ? 'usage_backwards' : 'usage_jump', words, {
      path: `usage.${problem.field}`,
      last: { hours: last.hours, flights: last.flights, landings: last.landings },
    });
  }
  const figures = { hours: last.hours, flights: last.flights, landings: last.landings };
  return { figures: input.usage, flown: usageFlown(figures, input.usage), last: figures };
}

/**
 * The photos the readings name: each uploaded by the signer and not yet part of another check. A photo already
 * part of this very check means a copy of it (a double tap, or the resend through another instance) was stored
 * after this one looked for it: the store below then meets the stored check and answers as a replay.
 */
async function claimablePhotos(input: SubmitCheck, signerId: number) {
  const wanted = input.readings.flatMap((r) => (r.photoIds ?? []).map((id) => ({ id, code: r.code })));
  const photos = await photosByIds(wanted.map((p) => p.id));
  const claims: PhotoClaim[] = wanted.map(({ id, code }) => {
    const photo = photos.find((p) => p.id === id);
    const ofAnotherCheck = photo?.checkId != null && photo.checkId !== input.id;
    if (!photo || photo.uploadedBy !== signerId || ofAnotherCheck) throw photoUnknown();
    return { id, code, sha256: photo.sha256 };
  });
  return { claims, photos };
}

/** Signs and stores the check with its hold, defects and events; a copy that lost a race answers as a replay. */
async function storeCheck(
  sequelize: Sequelize,
  check: JudgedCheck,
  extra: { submissionHash: string; kioskId: number | null },
) {
  const hold = holdOf(check);
  const defects = checkDefects(check, hold);
  try {
    const { row } = await signContent(check.signature, {
      content: checkContent(check),
      store: async (sealed) => {
        const rows = checkRows(check, sealed, extra);
        const written = await storeSignedCheck(sequelize, {
          ...rows,
          photos: check.photos.map(({ id, code }) => ({ id, code })),
          hold: hold?.row ?? null,
          defects,
          events: checkEvents(check, sealed, defects, hold),
        });
        return { ...rows, hold: written.hold };
      },
      trail: 'chained by store',
    });
    return { created: true as const, rows: row };
  } catch (err) {
    if (isDuplicateKey(err)) {
      const winner = await checkById(check.input.id);
      if (winner) return replay(winner, extra.submissionHash, check.signature.row.id);
    }
    if ((err as { sqlState?: string }).sqlState === PHOTO_TAKEN_SQLSTATE) throw photoUnknown();
    if ((err as { sqlState?: string }).sqlState === USAGE_MOVED_SQLSTATE) {
      throw conflict(
        'usage_moved',
        refusal('checks.usageMoved', { fleetNumber: check.target.airframe.fleetNumber }),
      );
    }
    throw err;
  }
}

/** Answered from the rows just committed, exactly as a read-back would build it (a test holds the two equal). */
function answer(
  check: JudgedCheck,
  rows: Pick<CheckRows, 'check' | 'readings' | 'servicing' | 'hold'>,
  photos: StoredPhoto[],
): StoredCheck {
  const attached = check.photos
    .map(({ id, code }) => ({
      ...photos.find((p) => p.id === id)!,
      checkId: check.input.id,
      checkpointCode: code,
    }))
    .sort((a, b) => a.uploadedAt.getTime() - b.uploadedAt.getTime());
  return storedCheckView({
    ...rows,
    airframe: check.target.airframe,
    signer: check.signature.row,
    limits: check.target.limits,
    photos: attached,
  });
}

const photoUnknown = () => badRequest('photo_unknown', refusal('checks.photoUnknown'));

async function replay(
  existing: { id: string; submissionHash: string | null; signedBy: number },
  submissionHash: string,
  signerId: number,
) {
  if (existing.submissionHash !== submissionHash || existing.signedBy !== signerId) {
    throw conflict('check_id_taken', refusal('checks.checkIdTaken'));
  }
  return { created: false as const, check: await loadStoredCheck(existing.id) };
}

export async function loadStoredCheck(id: string): Promise<StoredCheck> {
  return storedCheckView(await loadCheckRows(id));
}

/** The kiosk's view of a stored check, from its rows as read back or exactly as they were just written. */
export function storedCheckView(rows: CheckRows): StoredCheck {
  const { check, airframe, signer, readings, limits, hold, servicing, photos } = rows;
  const { id, name, badgeNumber, licenceNumber } = signer;
  const labels = new Map(limits.definition.checkpoints.map((c) => [c.code, c.label]));
  return {
    id: check.id,
    airframe: { id: airframe.id, fleetNumber: airframe.fleetNumber },
    kind: check.kind,
    limitsVersion: { id: limits.id, typeCode: limits.definition.code, version: limits.version },
    context: JSON.parse(check.context),
    verdict: check.verdict,
    note: check.note,
    airframeHours: check.airframeHours === null ? null : Number(check.airframeHours),
    airframeFlights: check.airframeFlights ?? null,
    signedBy: { id, name, badgeNumber, licenceNumber },
    signedAt: check.signedAt.toISOString(),
    contentHash: check.contentHash,
    correctsCheckId: check.correctsCheckId,
    readings: readings.map((r) => readingView(r, labels.get(r.checkpointCode) ?? r.checkpointCode, photos)),
    servicing: servicing.map(servicingView),
    holdOpened: hold !== null,
  };
}
