import type { Sequelize, Transaction } from 'sequelize';
import type {
  CertifyInput,
  DeferDefectInput,
  DefectView,
  DefectWorkInput,
  InspectionInput,
  RaiseDefectInput,
} from '@shared/schemas/defects';
import { deferralLimit } from '@shared/domain/deferral';
import { defectState } from '@shared/domain/status';
import { statusDefect } from '@server/db/airworthiness-records';
import { authorityFor } from '@server/security/authority';
import {
  appendDefectEntry,
  appendInspection,
  defectViews,
  entriesOf,
  lockDefect,
  type EntryFields,
} from '@server/db/defect-records';
import { badRequest, conflict, forbidden, notFound, refusal } from '@server/errors/app-error';
import {
  signContent,
  signerOf,
  verifySigner,
  type Secret,
  type Signature,
  type SigningAct,
  type SigningContext,
} from '@server/security/signing';
import {
  airframeForTechLog,
  correctiveActionsBy,
  createDefect,
  defectsOfAirframe,
  findDefect,
  holdStillOpen,
  type DefectEntryRow,
  type DefectRow,
} from './defects.repository';
import { inTransaction } from '@server/db/retry';

async function techLogAirframe(airframeId: number) {
  const found = await airframeForTechLog(airframeId);
  if (!found) throw notFound(refusal('airframes.airframeGone'), 'airframe_unknown');
  return found;
}

export async function airframeDefects(airframeId: number): Promise<DefectView[]> {
  await techLogAirframe(airframeId);
  return defectViews(await defectsOfAirframe(airframeId));
}

export async function defectDetail(id: number): Promise<DefectView> {
  const defect = await findDefect(id);
  if (!defect) throw notFound(refusal('defects.notFound', { defect: id }));
  return (await defectViews([defect]))[0]!;
}

/** A defect raised by a person (a pilot, a lead or a mechanic), signed like any tech-log entry. */
export async function raiseDefect(
  sequelize: Sequelize,
  airframeId: number,
  input: RaiseDefectInput,
  ctx: SigningContext,
  now = new Date(),
) {
  const { airframe } = await techLogAirframe(airframeId);
  const signature = await verifySigner(input, ctx, 'raiseDefect', now);
  const fields = {
    airframeId: airframe.id,
    description: input.description,
    chapter: input.chapter ?? null,
    source: 'raised' as const,
    checkId: null,
    needsIndependentInspection: input.needsIndependentInspection ?? false,
  };
  const defect = await inTransaction(sequelize, async (transaction) => {
    const { row } = await signContent(signature, {
      content: {
        ...fields,
        fleetNumber: airframe.fleetNumber,
        raisedBy: signerOf(signature.row),
        signedWith: signature.which,
        raisedAt: signature.at.toISOString(),
      },
      store: (sealed) =>
        createDefect(
          { ...fields, holdId: null, raisedBy: signature.row.id, raisedAt: signature.at, ...sealed },
          transaction,
        ),
      trail: { sequelize, transaction },
      event: (created, sealed) => ({
        action: 'defect.raised',
        entity: 'defect',
        entityId: String(created.id),
        payload: { contentHash: sealed.contentHash, checkId: null, holdId: null },
      }),
    });
    return row;
  });
  return (await defectViews([defect], now))[0]!;
}

interface LockedDefect {
  sequelize: Sequelize;
  defect: DefectRow;
  state: ReturnType<typeof defectState>;
  entries: DefectEntryRow[];
  techLog: Awaited<ReturnType<typeof techLogAirframe>>;
  transaction: Transaction;
}

/** The defect, its airframe and its standing now, read inside the transaction that adds to it. */
async function defectUnderLock(
  sequelize: Sequelize,
  id: number,
  now: Date,
  work: (locked: LockedDefect) => Promise<void>,
) {
  await inTransaction(sequelize, async (transaction) => {
    const defect = await lockDefect(id, transaction);
    if (!defect) throw notFound(refusal('defects.notFound', { defect: id }));
    const techLog = await techLogAirframe(defect.airframeId);
    const entries = await entriesOf([defect.id], transaction);
    const ofOpenHold = defect.holdId !== null && (await holdStillOpen(defect.holdId, transaction));
    const state = defectState(statusDefect(defect, entries), {
      now,
      typeCode: techLog.typeCode,
      usage: techLog.usage,
      timeZone: techLog.timeZone,
      holdOpen: () => ofOpenHold,
    });
    await work({ sequelize, defect, state, entries, techLog, transaction });
  });
}

/** A defect that is a hold's finding is worked on the hold: the refusal says what to do there instead. */
const notOnHold = (defect: DefectRow, act: 'ofHoldRecordWork' | 'ofHoldCertify' | 'ofHoldDefer') => {
  if (defect.holdId !== null) {
    throw conflict('defect_of_hold', refusal(`defects.${act}`, { defect: defect.id, hold: defect.holdId }));
  }
};

const stillOpen = (defect: DefectRow, state: { status: string }) => {
  if (state.status === 'rectified')
    throw conflict('defect_rectified', refusal('defects.alreadyRectified', { defect: defect.id }));
};

/**
 * A signed act on one defect: the secret verified first (so a wrong one counts towards the lockout), then the work
 * done on the locked defect, and the defect as it now stands returned.
 */
const signedDefectAct =
  <Input extends Secret>(
    act: SigningAct,
    work: (locked: LockedDefect, input: Input, signature: Signature) => Promise<void>,
  ) =>
  async (sequelize: Sequelize, id: number, input: Input, ctx: SigningContext, now = new Date()) => {
    const signature = await verifySigner(input, ctx, act, now);
    await defectUnderLock(sequelize, id, signature.at, (locked) => work(locked, input, signature));
    return defectDetail(id);
  };

export const recordWork = signedDefectAct<DefectWorkInput>('recordWork', async (locked, input, signature) => {
  const { sequelize, defect, state, transaction } = locked;
  notOnHold(defect, 'ofHoldRecordWork');
  stillOpen(defect, state);
  await appendDefectEntry(
    sequelize,
    transaction,
    defect,
    { kind: 'work', text: input.action, independentInspection: input.independentInspection ?? false },
    signature,
  );
});

/**
 * A second person's inspection of work that disturbed, for example, flight controls (EASA Part-145 AMC on error
 * capturing, from memory): never by someone who did the work.
 */
export const recordInspection = signedDefectAct<InspectionInput>(
  'signInspection',
  async ({ sequelize, defect, state, entries, transaction }, input, signature) => {
    stillOpen(defect, state);
    const doers = defect.holdId
      ? await correctiveActionsBy(defect.holdId)
      : entries.filter((e) => e.kind === 'work').map((e) => e.signedBy);
    if (doers.length === 0)
      throw conflict('no_work', refusal('defects.inspectAfterWork', { defect: defect.id }));
    await appendInspection(sequelize, transaction, defect, doers, input.statement, signature);
  },
);

/** Refuses to certify work its certifier did, or work that needs an independent inspection it has not had. */
function refuseUncertifiable(defect: DefectRow, entries: DefectEntryRow[], signerId: number) {
  const work = entries.filter((e) => e.kind === 'work');
  if (work.length === 0)
    throw conflict('no_work', refusal('defects.certifyAfterWork', { defect: defect.id }));
  if (work.some((e) => e.signedBy === signerId)) {
    throw forbidden(refusal('defects.ownWork'), 'self_certification');
  }
  const lastWork = Math.max(...work.map((e) => e.signedAt.getTime()));
  const needsInspection = defect.needsIndependentInspection || work.some((e) => e.independentInspection);
  const doers = new Set(work.map((e) => e.signedBy));
  if (
    needsInspection &&
    !entries.some(
      (e) => e.kind === 'inspection' && !doers.has(e.signedBy) && e.signedAt.getTime() >= lastWork,
    )
  ) {
    throw conflict('inspection_missing', refusal('defects.inspectionMissing', { defect: defect.id }));
  }
}

/** Certifies the rectification: the certificate of release to service for that work (145.A.50, from memory). */
export const certifyRectification = signedDefectAct<CertifyInput>(
  'certify',
  async ({ sequelize, defect, state, entries, techLog, transaction }, _input, signature) => {
    notOnHold(defect, 'ofHoldCertify');
    stillOpen(defect, state);
    refuseUncertifiable(defect, entries, signature.row.id);
    const authorisation = await authorityFor(
      signature.row.id,
      { typeCode: techLog.typeCode, chapters: [defect.chapter] },
      signature.at,
      refusal('signing.acts.certifyRectification'),
    );
    await appendDefectEntry(
      sequelize,
      transaction,
      defect,
      {
        kind: 'certification',
        text: 'Rectification certified: certificate of release to service for this work.',
        authorisation,
      },
      signature,
    );
  },
);

/** Defers the defect under an MEL item or the operator's procedure, within its category's interval. */
export async function deferDefect(
  sequelize: Sequelize,
  id: number,
  input: DeferDefectInput,
  ctx: SigningContext,
  now = new Date(),
) {
  const defect = await findDefect(id);
  if (!defect) throw notFound(refusal('defects.notFound', { defect: id }));
  notOnHold(defect, 'ofHoldDefer');
  const signature = await verifySigner(input, ctx, 'defer', now);
  const { row: signer, at } = signature;
  await defectUnderLock(sequelize, id, at, async ({ defect: locked, state, techLog, transaction }) => {
    stillOpen(locked, state);
    const limit = deferralLimit(
      {
        category: input.category,
        untilDay: input.untilDay ?? null,
        hours: input.hours ?? null,
        flights: input.flights ?? null,
      },
      locked.raisedAt,
      at,
      techLog.usage,
      techLog.timeZone,
    );
    if (!limit.ok)
      throw badRequest('invalid_deferral', limit.reason, {
        field: limit.field,
      });
    const authorisation = await authorityFor(
      signer.id,
      { typeCode: techLog.typeCode, chapters: [locked.chapter] },
      at,
      refusal('signing.acts.deferDefect'),
    );
    const fields: EntryFields = {
      kind: 'deferral',
      text: input.repeatInspection ?? '',
      authorisation,
      category: input.category,
      reference: input.reference,
      limitAt: limit.limit.at ? new Date(limit.limit.at) : null,
      limitHours: limit.limit.hours ?? null,
      limitFlights: limit.limit.flights ?? null,
    };
    await appendDefectEntry(sequelize, transaction, locked, fields, signature);
  });
  return defectDetail(id);
}
