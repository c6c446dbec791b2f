import type { Sequelize, Transaction } from 'sequelize';
import type { StoredCheck } from '@shared/schemas/checks';
import type { CorrectiveActionInput, CountersignInput } from '@shared/schemas/holds';
import { limitsCaution } from '@shared/schemas/limits';
import type { HoldDetail, HoldQueueItem, ReleaseReadiness } from '@shared/schemas/holds';
import type { PersonRef } from '@shared/schemas/refs';
import { canCountersign } from '@shared/domain/status';
import { readingsAgainstLimits } from '@server/db/reading-limits';
import { englishTranslate, type Translate } from '@shared/i18n/translate';
import { appendAuditEvent } from '@server/audit/audit-trail';
import {
  signContent,
  signerOf,
  verifySigner,
  type Signature,
  type SigningContext,
} from '@server/security/signing';
import { releaseStatement } from '@shared/schemas/releases';
import type { InspectionInput } from '@shared/schemas/defects';
import { authorityFor } from '@server/security/authority';
import { appendInspection } from '@server/db/defect-records';
import { AppError, conflict, forbidden, notFound, refusal } from '@server/errors/app-error';
import { instantValue, phrase, phraseWords, type Phrase } from '@shared/i18n/phrase';
import {
  airframeWithType,
  checkById,
  correctiveActionsOf,
  countersignSignedAs,
  countersignsOf,
  createCorrectiveAction,
  defectOfHold,
  findHold,
  heldFindings,
  openHoldRows,
  passingRecheck,
  people,
  storeCountersign,
  type CorrectiveActionRow,
  type HeldCheckRow,
  type HoldRow,
  type InspectionRow,
  type PersonRow,
} from './holds.repository';
import { inTransaction } from '@server/db/retry';
import { signingIdReused, signOnce } from '@server/security/sign-once';

export type LoadCheck = (id: string) => Promise<StoredCheck>;

const person = (staff: PersonRow | undefined, id: number): PersonRef => ({
  id,
  name: staff?.name ?? 'unknown',
});

async function heldCheck(hold: HoldRow) {
  const check = await checkById(hold.checkId);
  if (!check) throw new AppError(500, 'record_incomplete', refusal('holds.checkMissing', { hold: hold.id }));
  return check;
}

interface ReadinessFacts {
  held: HeldCheckRow;
  actions: readonly CorrectiveActionRow[];
  recheck: HeldCheckRow | null;
  findings: Awaited<ReturnType<typeof heldFindings>>;
  inspections: readonly InspectionRow[];
  defectNumber: number | null;
  names: Map<number, PersonRow>;
}

/**
 * The readiness with what is still missing as phrases of the holds catalogue: the hold's page gets them in its
 * reader's language, a refused release in the asker's.
 */
type Readiness = Omit<ReleaseReadiness, 'missing'> & { missing: Phrase[] };

function readiness(f: ReadinessFacts): Readiness {
  const missing: Phrase[] = [];
  if (f.actions.length === 0) missing.push(phrase('holds:readiness.missingAction'));
  if (!f.recheck) {
    missing.push(
      phrase('holds:readiness.missingRecheck', { kind: { checkKind: f.held.kind, inSentence: true } }),
    );
  }
  const needed =
    f.actions.some((a) => a.independentInspection) || f.findings.some((x) => x.independentInspection);
  const doers = new Set(f.actions.map((a) => a.recordedBy));
  const lastAction = Math.max(0, ...f.actions.map((a) => a.recordedAt.getTime()));
  const inspectors = f.inspections.filter(
    (i) => !doers.has(i.signedBy) && i.signedAt.getTime() >= lastAction,
  );
  if (needed && inspectors.length === 0) {
    missing.push(phrase('holds:readiness.missingInspection'));
  }
  return {
    hasCorrectiveAction: f.actions.length > 0,
    independentInspection: {
      needed,
      by: inspectors.map((i) => f.names.get(i.signedBy)?.name ?? 'unknown'),
    },
    chapters: [...new Set(f.findings.map((x) => x.ata))],
    defectNumber: f.defectNumber,
    recheck: f.recheck
      ? {
          id: f.recheck.id,
          kind: f.recheck.kind,
          signedAt: f.recheck.signedAt.toISOString(),
          signedBy: f.names.get(f.recheck.signedBy)?.name ?? 'unknown',
        }
      : null,
    missing,
  };
}

/** The open holds; their limits in words in the language of `t` (the reader's; English by default). */
export async function holdQueue(
  loadCheck: LoadCheck,
  t: Translate = englishTranslate(),
): Promise<HoldQueueItem[]> {
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
      const readings = await readingsAgainstLimits(check, t);
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

export async function holdDetail(
  id: number,
  loadCheck: LoadCheck,
  t: Translate = englishTranslate(),
): Promise<HoldDetail> {
  const hold = await findHold(id);
  if (!hold) throw notFound(refusal('holds.notFound'));
  const held = await heldCheck(hold);
  const [check, { airframe, type }, actions, countersigns, recheck, findings, { defect, inspections }] =
    await Promise.all([
      loadCheck(hold.checkId),
      airframeWithType(hold.airframeId),
      correctiveActionsOf([hold.id]),
      countersignsOf([hold.id]),
      passingRecheck(held),
      heldFindings(held),
      defectOfHold(hold.id),
    ]);
  const names = await people([
    ...inspections.map((i) => i.signedBy),
    held.signedBy,
    ...actions.map((a) => a.recordedBy),
    ...countersigns.map((c) => c.signedBy),
    ...(recheck ? [recheck.signedBy] : []),
    ...(hold.releasedBy ? [hold.releasedBy] : []),
  ]);
  return {
    id: hold.id,
    airframe: {
      ...check.airframe,
      registration: airframe?.registration ?? null,
      typeCode: type?.code ?? check.limitsVersion.typeCode,
    },
    reason: hold.reason,
    openedAt: hold.openedAt.toISOString(),
    state: hold.releasedAt ? 'released' : 'open',
    releasedAt: hold.releasedAt?.toISOString() ?? null,
    releasedBy: hold.releasedBy ? person(names.get(hold.releasedBy), hold.releasedBy) : null,
    raisedBy: person(names.get(held.signedBy), held.signedBy),
    check,
    readings: await readingsAgainstLimits(check, t),
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
    releaseReadiness: inWordsOf(
      readiness({ held, actions, recheck, findings, inspections, defectNumber: defect?.id ?? null, names }),
      t,
    ),
    caution: limitsCaution,
  };
}

/** The readiness with what is missing written in the language of `t`. */
const inWordsOf = ({ missing, ...rest }: Readiness, t: Translate): ReleaseReadiness => ({
  ...rest,
  missing: missing.map((sentence) => phraseWords(sentence, t)),
});

/** Sentences read one after another, as one phrase. */
const oneAfterAnother = (sentences: Phrase[]): Phrase =>
  sentences
    .slice(1)
    .reduce(
      (before, next) => refusal('holds.sentences', { before: { phrase: before }, next: { phrase: next } }),
      sentences[0]!,
    );

const alreadyReleased = (hold: HoldRow) =>
  conflict(
    'hold_already_released',
    refusal('holds.alreadyReleased', { hold: hold.id, at: instantValue(hold.releasedAt!) }),
  );

/** The hold, locked for the caller's transaction, refused when it is missing or already released. */
async function lockedOpenHold(holdId: number, transaction: Transaction) {
  const hold = await findHold(holdId, transaction);
  if (!hold) throw notFound(refusal('holds.notFound'));
  if (hold.releasedAt) throw alreadyReleased(hold);
  return hold;
}

export async function recordCorrectiveAction(
  sequelize: Sequelize,
  holdId: number,
  input: CorrectiveActionInput,
  by: Express.User,
  now = new Date(),
) {
  return inTransaction(sequelize, async (transaction) => {
    await lockedOpenHold(holdId, transaction);
    const action = await createCorrectiveAction(
      {
        holdId,
        text: input.text,
        recordedBy: by.id,
        recordedAt: now,
        independentInspection: input.independentInspection ?? false,
      },
      transaction,
    );
    await appendAuditEvent(sequelize, transaction, {
      actorId: by.id,
      action: 'hold.corrective_action',
      entity: 'hold',
      entityId: String(holdId),
      payload: {
        correctiveActionId: action.id,
        text: input.text,
        independentInspection: input.independentInspection ?? false,
      },
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

export interface CountersignContext extends SigningContext {
  now?: Date;
}

/** A second person's independent inspection of the corrective action, kept on the hold's tech-log defect. */
export async function recordHoldInspection(
  sequelize: Sequelize,
  holdId: number,
  input: InspectionInput,
  ctx: SigningContext,
  now = new Date(),
) {
  const signature = await verifySigner(input, ctx, 'signInspection', now);
  await inTransaction(sequelize, async (transaction) => {
    const hold = await lockedOpenHold(holdId, transaction);
    const actions = await correctiveActionsOf([hold.id], transaction);
    if (actions.length === 0)
      throw conflict('no_work', refusal('holds.inspectAfterAction', { hold: hold.id }));
    const { defect } = await defectOfHold(hold.id, transaction);
    if (!defect)
      throw new AppError(500, 'record_incomplete', refusal('holds.defectMissing', { hold: hold.id }));
    const doers = actions.map((a) => a.recordedBy);
    await appendInspection(sequelize, transaction, defect, doers, input.statement, signature);
  });
}

type Findings = Awaited<ReturnType<typeof heldFindings>>;

/**
 * The release is the certificate of release to service for the corrective action: only certifying staff whose
 * authorisation covers the type and the work may sign it (EASA Part-145 145.A.30 and 145.A.50, from memory).
 */
async function releaseAuthority(hold: HoldRow, findings: Findings, signature: Signature) {
  const { airframe, type } = await airframeWithType(hold.airframeId);
  return authorityFor(
    signature.row.id,
    { typeCode: type?.code ?? '', chapters: [...new Set(findings.map((f) => f.ata))] },
    signature.at,
    airframe
      ? refusal('signing.acts.releaseHold', { fleetNumber: airframe.fleetNumber })
      : refusal('signing.acts.releaseHoldHere'),
  );
}

interface ReleaseFacts {
  hold: HoldRow;
  held: HeldCheckRow;
  actions: readonly CorrectiveActionRow[];
  recheck: HeldCheckRow | null;
  findings: Findings;
  signerId: number;
}

/** Refuses a release the evidence does not support yet, or one its signer may not certify. */
async function refuseUnreadyRelease(f: ReleaseFacts, transaction: Transaction) {
  const { defect, inspections } = await defectOfHold(f.hold.id, transaction);
  const { missing } = readiness({ ...f, inspections, defectNumber: defect?.id ?? null, names: new Map() });
  if (missing.length > 0) {
    throw conflict(
      'release_not_ready',
      refusal('holds.releaseNotReady', { hold: f.hold.id, missing: { phrase: oneAfterAnother(missing) } }),
      // The API's detail stays in English, as it was: the message above is the reader's.
      { missing: missing.map((sentence) => phraseWords(sentence, englishTranslate())) },
    );
  }
  if (f.recheck && f.recheck.signedBy === f.signerId) {
    throw forbidden(refusal('holds.ownRecheck'), 'own_recheck');
  }
  if (f.actions.some((a) => a.recordedBy === f.signerId)) {
    throw forbidden(refusal('holds.ownAction'), 'self_certification');
  }
}

/** Exactly what a countersign covers: the held check, the evidence, the decision and who signed it. */
function countersignContent(
  f: Omit<ReleaseFacts, 'findings' | 'signerId'>,
  input: CountersignInput,
  authorisation: string | null,
  signature: Signature,
) {
  return {
    hold: f.hold.id,
    airframeId: f.hold.airframeId,
    heldCheck: { id: f.held.id, contentHash: f.held.contentHash },
    decision: input.decision,
    reason: input.reason ?? null,
    recheck: f.recheck ? { id: f.recheck.id, contentHash: f.recheck.contentHash } : null,
    correctiveActions: f.actions.map((a) => ({
      id: a.id,
      text: a.text,
      performedBy: a.recordedBy,
      independentInspection: a.independentInspection,
    })),
    statement: input.decision === 'release' ? releaseStatement : null,
    authorisation: authorisation ? JSON.parse(authorisation) : null,
    signer: signerOf(signature.row),
    signedWith: signature.which,
    signedAt: signature.at.toISOString(),
  };
}

export async function countersignHold(
  sequelize: Sequelize,
  holdId: number,
  input: CountersignInput,
  ctx: CountersignContext,
) {
  const found = await findHold(holdId);
  if (!found) throw notFound(refusal('holds.notFound'));
  const held = await heldCheck(found);
  // The shared rule's own reason is English; the refusal says the same in the asker's language.
  if (!canCountersign({ raisedBy: String(held.signedBy) }, String(ctx.signer.id)).allowed) {
    throw forbidden(refusal('holds.ownCheck'), 'own_check');
  }
  const signature = await verifySigner(input, ctx, 'countersign', ctx.now);
  await signOnce(
    input.requestId,
    async (requestId) => {
      const earlier = await countersignSignedAs(requestId);
      if (!earlier) return null;
      const same =
        earlier.holdId === holdId &&
        earlier.signedBy === signature.row.id &&
        earlier.decision === input.decision;
      if (!same) throw signingIdReused();
      return earlier.id;
    },
    async () => {
      await signCountersign(sequelize, found, held, input, signature, ctx.signer.id);
      return holdId;
    },
  );
}

/** The countersign itself, once the signer is known and no earlier try of this signing was stored. */
async function signCountersign(
  sequelize: Sequelize,
  found: HoldRow,
  held: HeldCheckRow,
  input: CountersignInput,
  signature: Signature,
  signerId: number,
) {
  const holdId = found.id;
  const release = input.decision === 'release';
  const findings = await heldFindings(held);
  const authorisation = release ? await releaseAuthority(found, findings, signature) : null;

  await inTransaction(sequelize, async (transaction) => {
    const hold = await lockedOpenHold(holdId, transaction);
    const actions = await correctiveActionsOf([hold.id], transaction);
    const recheck = release ? await passingRecheck(held, transaction) : null;
    if (release) {
      await refuseUnreadyRelease({ hold, held, actions, recheck, findings, signerId }, transaction);
    }
    await signContent(signature, {
      content: countersignContent({ hold, held, actions, recheck }, input, authorisation, signature),
      store: (sealed) =>
        storeCountersign(
          hold,
          {
            holdId: hold.id,
            decision: input.decision,
            reason: input.reason ?? null,
            recheckCheckId: recheck?.id ?? null,
            signedBy: signerId,
            signedAt: signature.at,
            signedWith: signature.which,
            authorisation,
            legacy: false,
            requestId: input.requestId ?? null,
            ...sealed,
          },
          transaction,
        ),
      trail: { sequelize, transaction },
      event: (countersign, sealed) => ({
        action: release ? 'hold.released' : 'hold.kept',
        entity: 'hold',
        entityId: String(hold.id),
        payload: {
          countersignId: countersign.id,
          contentHash: sealed.contentHash,
          recheckCheckId: recheck?.id ?? null,
          reason: input.reason ?? null,
        },
      }),
    });
  });
}
