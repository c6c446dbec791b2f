import type { Sequelize } from 'sequelize';
import type { CloseDraftInput, OpenDraft } from '@shared/schemas/checks';
import { draftLifetimeMs } from '@shared/schemas/checks';
import type { CheckKind } from '@shared/schemas/limits';
import { appendAuditEvent } from '@server/audit/audit-trail';
import { conflict, notFound, refusal } from '@server/errors/app-error';
import {
  airframeExists,
  checkById,
  createDraft,
  draftById,
  openDraftRows,
  updateDraft,
} from './checks.repository';
import { inTransaction } from '@server/db/retry';

export async function touchDraft(
  input: { id: string; airframeId: number; kind: CheckKind },
  staffId: number,
  now = new Date(),
) {
  if (await checkById(input.id)) return { id: input.id, created: false, signed: true };
  if (!(await airframeExists(input.airframeId))) throw notFound(refusal('airframes.airframeGone'));
  const existing = await draftById(input.id);
  if (existing) {
    // A check a lead closed stays closed: the tablet can still sign it, but it no longer shows as in progress.
    if (existing.closedAt) return { id: input.id, created: false, signed: false };
    await updateDraft(existing, { touchedAt: now });
    return { id: input.id, created: false, signed: false };
  }
  await createDraft({
    id: input.id,
    airframeId: input.airframeId,
    kind: input.kind,
    startedBy: staffId,
    startedAt: now,
    touchedAt: now,
  });
  return { id: input.id, created: true, signed: false };
}

/** Checks started on a tablet, not signed, not closed and touched within the draft lifetime. */
export async function openDrafts(now = new Date()): Promise<OpenDraft[]> {
  const { drafts, fleet, names } = await openDraftRows(new Date(now.getTime() - draftLifetimeMs));
  return drafts.map((d) => ({
    id: d.id,
    airframe: { id: d.airframeId, fleetNumber: fleet.get(d.airframeId) ?? '' },
    kind: d.kind,
    startedBy: names.get(d.startedBy) ?? 'unknown',
    startedAt: d.startedAt.toISOString(),
    touchedAt: d.touchedAt.toISOString(),
  }));
}

/**
 * A lead closes a check left open on a tablet, with a reason, so it stops holding the airframe "in progress"
 * before its 30 minutes run out. The reason goes into the audit trail.
 */
export async function closeDraft(
  sequelize: Sequelize,
  id: string,
  input: CloseDraftInput,
  by: number,
  now = new Date(),
) {
  return inTransaction(sequelize, async (transaction) => {
    const draft = await draftById(id, transaction);
    if (!draft) throw notFound(refusal('checks.noDraft'));
    if (draft.closedAt) throw conflict('draft_closed', refusal('checks.draftClosed'));
    await updateDraft(draft, { closedAt: now, closedBy: by, closeReason: input.reason }, transaction);
    await appendAuditEvent(sequelize, transaction, {
      actorId: by,
      action: 'check_draft.closed',
      entity: 'check_draft',
      entityId: id,
      payload: { airframeId: draft.airframeId, kind: draft.kind, reason: input.reason },
      at: now,
    });
    return { id, closedAt: now.toISOString(), reason: input.reason };
  });
}
