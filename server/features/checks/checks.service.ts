import type { Sequelize } from 'sequelize';
import type { SubmitCheck } from '@shared/schemas/checks';
import type { StoredCheck } from '@shared/schemas/checks';
import type { Checkpoint, Evaluation, Verdict } from '@shared/schemas/limits';
import { evaluateReading, InvalidReadingError } from '@shared/domain/limits';
import { Op } from 'sequelize';
import { Check, Photo } from '@server/db/models';
import { checkFluidAllowed } from '@shared/domain/servicing';
import { convert } from '@shared/domain/units';
import { loadCheckRows, readingView, servicingView, type CheckRows } from '@server/db/check-records';
import {
  PHOTO_TAKEN_SQLSTATE,
  signingTargets,
  storeSignedCheck,
  type SignedCheckRows,
} from './checks.repository';
import { isDuplicateKey } from '@server/db/unique-violation';
import { verifyCredential, type LockoutPolicy, type StaffRow } from '@server/security/credentials';
import { canonicalJson, sha256 } from '@server/security/hashing';
import { badRequest, conflict, forbidden, notFound } from '@server/errors/app-error';
import { checkKindLabels } from '@shared/schemas/plain';

const severity: Record<Verdict, number> = { in_limits: 0, service: 1, out_of_limits: 2 };
/**
 * The tech-log defects a signed check raises: one for its findings out of limits (tied to the hold), and one for
 * its defect note. Each carries its own signed content, hashed, so the record check can prove it unchanged.
 */
function checkDefects(f: {
  airframeId: number;
  checkId: string;
  holdReason: string;
  outOfLimits: (Checkpoint | undefined)[];
  note: string | null;
  signer: { id: number; badge: string; name: string };
  at: Date;
}): SignedCheckRows['defects'] {
  const made: SignedCheckRows['defects'] = [];
  const add = (
    source: 'finding' | 'check_note',
    description: string,
    chapter: string | null,
    inspect: boolean,
  ) => {
    const content = {
      airframeId: f.airframeId,
      description,
      chapter,
      source,
      checkId: f.checkId,
      needsIndependentInspection: inspect,
      raisedBy: { badge: f.signer.badge, name: f.signer.name },
      raisedAt: f.at.toISOString(),
    };
    const signedContent = canonicalJson(content);
    made.push({
      ofHold: source === 'finding',
      row: {
        airframeId: f.airframeId,
        description,
        chapter,
        source,
        checkId: f.checkId,
        needsIndependentInspection: inspect,
        raisedBy: f.signer.id,
        raisedAt: f.at,
        contentHash: sha256(signedContent),
        signedContent,
      },
    });
  };
  if (f.outOfLimits.length > 0) {
    add(
      'finding',
      f.holdReason,
      f.outOfLimits.find((c) => c?.ata)?.ata ?? null,
      f.outOfLimits.some((c) => c?.independentInspection === true),
    );
  }
  if (f.note && f.note.trim()) add('check_note', f.note.trim(), null, false);
  return made;
}

export const worstVerdict = (verdicts: Verdict[]): Verdict =>
  verdicts.reduce<Verdict>((worst, v) => (severity[v] > severity[worst] ? v : worst), 'in_limits');

interface SubmitContext {
  signer: Express.User;
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

export async function submitCheck(sequelize: Sequelize, input: SubmitCheck, ctx: SubmitContext) {
  const submissionHash = submissionHashOf(input);
  const { existing, airframe, limits } = await signingTargets(sequelize, input.id, input.airframeId);
  if (existing) return replay(existing, submissionHash, ctx.signer.id);

  if (!ctx.signer.roles.includes('mechanic')) throw forbidden('Only a mechanic can sign a check.');
  // The PIN typed again at signing is the signature: a deliberate act by the badge holder.
  const signerRow = await verifyCredential(ctx.signer.badgeNumber, input.pin, 'pin', ctx.lockout, {
    signing: true,
    known: ctx.signerRow,
  });

  if (!airframe || !airframe.active) throw notFound(`No airframe with id ${input.airframeId}.`);
  if (!limits) throw conflict('no_limits', `Airframe ${airframe.fleetNumber} has no published limits.`);
  if (limits.id !== input.limitsVersionId) {
    throw conflict(
      'limits_changed',
      `The limits for ${limits.definition.code} changed to version ${limits.version} while this check was open. ` +
        'Review the readings against the new limits before signing.',
      { currentLimitsVersionId: limits.id },
    );
  }
  const card = limits.definition.cards[input.kind];
  if (!card)
    throw badRequest('no_card', `Type ${limits.definition.code} has no ${checkKindLabels[input.kind]} card.`);
  const checkpoints = new Map(limits.definition.checkpoints.map((c) => [c.code, c]));

  const seen = new Set<string>();
  const evaluations: {
    code: string;
    entry: SubmitCheck['readings'][number]['entry'];
    result: Evaluation;
    value: number | null;
    unit: string | null;
  }[] = [];
  input.readings.forEach((reading, index) => {
    const checkpoint = checkpoints.get(reading.code);
    if (!checkpoint || !card.includes(reading.code)) {
      throw badRequest(
        'unknown_checkpoint',
        `readings.${index}: "${reading.code}" is not on the ${checkKindLabels[input.kind]} card.`,
      );
    }
    if (seen.has(reading.code))
      throw badRequest('duplicate_reading', `readings.${index}: "${checkpoint.label}" is entered twice.`);
    seen.add(reading.code);
    try {
      const result = evaluateReading(checkpoint, { ...reading.entry, context: input.context });
      const value =
        'value' in reading.entry
          ? reading.entry.value
          : 'answer' in reading.entry
            ? reading.entry.answer
              ? 1
              : 0
            : null;
      evaluations.push({
        code: reading.code,
        entry: reading.entry,
        result,
        value,
        unit: 'value' in reading.entry ? reading.entry.unit : null,
      });
    } catch (err) {
      if (err instanceof InvalidReadingError) {
        throw badRequest(err.code, err.message, { path: `readings.${index}` });
      }
      throw err;
    }
  });
  const missing = card.filter((code) => !seen.has(code)).map((code) => checkpoints.get(code)?.label ?? code);
  if (missing.length > 0)
    throw badRequest('readings_missing', `Readings missing: ${missing.join(', ')}.`, { missing });

  if (input.correctsCheckId) {
    const corrected = await Check.findByPk(input.correctsCheckId);
    if (!corrected || corrected.airframeId !== airframe.id) {
      throw badRequest(
        'unknown_corrected_check',
        'The check this one corrects does not exist for this airframe.',
      );
    }
  }

  const servicing = (input.servicing ?? []).map((entry, index) => {
    const checkpoint = checkpoints.get(entry.code);
    if (!checkpoint || checkpoint.kind !== 'level' || !seen.has(entry.code)) {
      throw badRequest(
        'servicing_not_a_level',
        `servicing.${index}: fluid can only be added at a level checkpoint of this check.`,
      );
    }
    const fluid = checkFluidAllowed(limits.definition, entry.fluidSpec);
    if (!fluid.allowed) {
      throw badRequest(
        fluid.reason === 'different_base' ? 'fluid_wrong_base' : 'fluid_not_approved',
        fluid.message,
        {
          path: `servicing.${index}.fluidSpec`,
        },
      );
    }
    try {
      const before = evaluateReading(checkpoint, { ...entry.levelBefore, context: input.context });
      // A level found out of limits is a finding: it is signed as found and holds the airframe. Topping it up
      // inside the same check would let the re-read hide it.
      if (before.verdict === 'out_of_limits') {
        throw badRequest(
          'servicing_hides_finding',
          `${checkpoint.label} was out of limits before the top-up (${before.message}) Sign the level as found; ` +
            'the airframe goes on hold and the top-up is recorded as the corrective action.',
          { path: `servicing.${index}.levelBefore` },
        );
      }
    } catch (err) {
      if (err instanceof InvalidReadingError)
        throw badRequest(err.code, `Level before the top-up: ${err.message}`, {
          path: `servicing.${index}.levelBefore`,
        });
      throw err;
    }
    return {
      code: entry.code,
      system: checkpoint.system ?? null,
      quantityL: convert(entry.quantity.value, entry.quantity.unit, 'L'),
      entered: entry.quantity,
      fluidSpec: fluid.fluid.spec,
      batch: entry.batch,
      levelBefore: entry.levelBefore,
    };
  });

  const photoIds = input.readings.flatMap((r) => (r.photoIds ?? []).map((id) => ({ id, code: r.code })));
  const photos = photoIds.length
    ? await Photo.findAll({ where: { id: { [Op.in]: photoIds.map((p) => p.id) } } })
    : [];
  for (const { id } of photoIds) {
    const photo = photos.find((p) => p.id === id);
    if (!photo || photo.uploadedBy !== ctx.signer.id || photo.checkId !== null) throw photoUnknown();
  }
  const photoHash = new Map(photos.map((p) => [p.id, p.sha256]));

  const verdict = worstVerdict(evaluations.map((e) => e.result.verdict));
  const signedAt = new Date(Math.floor((ctx.now ?? new Date()).getTime()));
  const signedContent = buildSignedContent({
    id: input.id,
    fleetNumber: airframe.fleetNumber,
    kind: input.kind,
    typeCode: limits.definition.code,
    limitsVersion: limits.version,
    context: input.context,
    readings: evaluations.map((e) => ({
      code: e.code,
      entry: e.entry,
      verdict: e.result.verdict,
      bandId: e.result.band.id,
    })),
    servicing,
    photos: photoIds.map((p) => ({ ...p, sha256: photoHash.get(p.id)! })),
    signer: {
      badge: ctx.signer.badgeNumber,
      name: ctx.signer.name,
      licence: signerRow.licenceNumber,
    },
    signedAt,
    airframeHours: Number(airframe.hours),
    note: input.note ?? null,
    correctsCheckId: input.correctsCheckId ?? null,
  });
  const signedJson = canonicalJson(signedContent);
  const signedHash = sha256(signedJson);

  const check = {
    id: input.id,
    airframeId: airframe.id,
    kind: input.kind,
    limitsVersionId: limits.id,
    context: canonicalJson(input.context),
    verdict,
    note: input.note ?? null,
    airframeHours: airframe.hours,
    signedBy: ctx.signer.id,
    signedAt,
    contentHash: signedHash,
    signedContent: signedJson,
    submissionHash,
    correctsCheckId: input.correctsCheckId ?? null,
    kioskDeviceId: ctx.kioskId,
    createdAt: new Date(),
  };
  const readings = evaluations.map((e, seq) => ({
    checkId: input.id,
    seq,
    checkpointCode: e.code,
    entry: canonicalJson(e.entry),
    value: e.value,
    unit: e.unit,
    verdict: e.result.verdict,
    bandId: e.result.band.id,
    message: e.result.message,
    action: e.result.action,
    expected: e.result.expected ?? null,
  }));
  const servicingRows = servicing.map((entry) => ({
    checkId: input.id,
    airframeId: airframe.id,
    checkpointCode: entry.code,
    system: entry.system,
    quantityL: entry.quantityL,
    enteredValue: entry.entered.value,
    enteredUnit: entry.entered.unit,
    fluidSpec: entry.fluidSpec,
    batch: entry.batch,
    levelBefore: canonicalJson(entry.levelBefore),
    addedAt: signedAt,
  }));
  const outOfLimits = evaluations.filter((e) => e.result.verdict === 'out_of_limits');
  const holdReason = outOfLimits
    .map((e) => `${checkpoints.get(e.code)?.label ?? e.code}: ${e.result.message}`)
    .join('; ');
  const defects = checkDefects({
    airframeId: airframe.id,
    checkId: input.id,
    holdReason,
    outOfLimits: outOfLimits.map((e) => checkpoints.get(e.code)),
    note: input.note ?? null,
    signer: { id: ctx.signer.id, badge: ctx.signer.badgeNumber, name: ctx.signer.name },
    at: signedAt,
  });
  let written: Pick<CheckRows, 'hold'>;
  try {
    written = await storeSignedCheck(sequelize, {
      check,
      readings,
      servicing: servicingRows,
      photos: photoIds,
      hold:
        outOfLimits.length > 0
          ? {
              airframeId: airframe.id,
              checkId: input.id,
              reason: holdReason,
              openedAt: signedAt,
              releasedAt: null,
              releasedBy: null,
            }
          : null,
      defects,
      events: (holdId, defectIds) => [
        ...defectIds.map((id, i) => ({
          actorId: ctx.signer.id,
          action: 'defect.raised',
          entity: 'defect',
          entityId: String(id),
          payload: {
            contentHash: defects[i]!.row.contentHash,
            checkId: input.id,
            holdId: defects[i]!.ofHold ? holdId : null,
          },
          at: signedAt,
        })),
        ...(holdId === null
          ? []
          : [
              {
                actorId: ctx.signer.id,
                action: 'hold.opened',
                entity: 'hold',
                entityId: String(holdId),
                payload: { airframe: airframe.fleetNumber, checkId: input.id, reason: holdReason },
                at: signedAt,
              },
            ]),
        {
          actorId: ctx.signer.id,
          action: 'check.signed',
          entity: 'check',
          entityId: input.id,
          payload: { contentHash: signedHash, verdict, limitsVersionId: limits.id },
          at: signedAt,
        },
      ],
    });
  } catch (err) {
    // Two copies of the same check raced each other: the first one won, the second answers as a replay.
    if (isDuplicateKey(err)) {
      const winner = await Check.findByPk(input.id);
      if (winner) return replay(winner, submissionHash, ctx.signer.id);
    }
    if ((err as { sqlState?: string }).sqlState === PHOTO_TAKEN_SQLSTATE) throw photoUnknown();
    throw err;
  }
  // Answered from the rows just committed, exactly as a read-back would build it (a test holds the two equal).
  for (const { id, code } of photoIds) {
    const photo = photos.find((p) => p.id === id)!;
    photo.checkId = input.id;
    photo.checkpointCode = code;
  }
  const attached = photos
    .filter((p) => p.checkId === input.id)
    .sort((a, b) => a.uploadedAt.getTime() - b.uploadedAt.getTime());
  return {
    created: true,
    check: storedCheckView({
      check,
      readings,
      servicing: servicingRows,
      hold: written.hold,
      airframe,
      signer: signerRow,
      limits,
      photos: attached,
    }),
  };
}

const photoUnknown = () =>
  badRequest(
    'photo_unknown',
    'A photo on this check was not uploaded by you from this check. Take it again.',
  );

async function replay(
  existing: Pick<Check, 'id' | 'submissionHash' | 'signedBy'>,
  submissionHash: string,
  signerId: number,
) {
  if (existing.submissionHash !== submissionHash || existing.signedBy !== signerId) {
    throw conflict(
      'check_id_taken',
      'A different check was already recorded with this id. Start a new check.',
    );
  }
  return { created: false, check: await loadStoredCheck(existing.id) };
}

interface SignedContentInput {
  id: string;
  fleetNumber: string;
  kind: string;
  typeCode: string;
  limitsVersion: number;
  context: unknown;
  readings: { code: string; entry: unknown; verdict: Verdict; bandId: string }[];
  servicing: { code: string; quantityL: number; fluidSpec: string; batch: string; levelBefore: unknown }[];
  photos: { id: string; code: string; sha256: string }[];
  signer: { badge: string; name: string; licence: string | null };
  signedAt: Date;
  airframeHours: number;
  note: string | null;
  correctsCheckId: string | null;
}

/** Exactly what a signature covers; the stored hash can be recomputed from the rows at any time. */
export function buildSignedContent(c: SignedContentInput) {
  return { ...c, signedAt: c.signedAt.toISOString() };
}

export async function loadStoredCheck(id: string): Promise<StoredCheck> {
  return storedCheckView(await loadCheckRows(id));
}

/** The kiosk's view of a stored check, from its rows as read back or exactly as they were just written. */
export function storedCheckView(rows: CheckRows): StoredCheck {
  const { check, airframe, signer, readings, limits, hold, servicing, photos } = rows;
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
    signedBy: {
      id: signer.id,
      name: signer.name,
      badgeNumber: signer.badgeNumber,
      licenceNumber: signer.licenceNumber,
    },
    signedAt: check.signedAt.toISOString(),
    contentHash: check.contentHash,
    correctsCheckId: check.correctsCheckId,
    readings: readings.map((r) => readingView(r, labels.get(r.checkpointCode) ?? r.checkpointCode, photos)),
    servicing: servicing.map(servicingView),
    holdOpened: hold !== null,
  };
}
