import { Op, type Sequelize } from 'sequelize';
import type { CloseDraftInput, OpenDraft } from '@shared/schemas/checks';
import { draftLifetimeMs } from '@shared/schemas/checks';
import { appendAuditEvent } from '@server/audit/audit-trail';
import { Airframe, Check, CheckDraft, Staff } from '@server/db/models';
import { conflict, notFound } from '@server/errors/app-error';

export async function touchDraft(
  input: { id: string; airframeId: number; kind: CheckDraft['kind'] },
  staffId: number,
  now = new Date(),
) {
  if (await Check.findByPk(input.id)) return { id: input.id, created: false, signed: true };
  const airframe = await Airframe.findByPk(input.airframeId);
  if (!airframe) throw notFound(`No airframe with id ${input.airframeId}.`);
  const existing = await CheckDraft.findByPk(input.id);
  if (existing) {
    // A check a lead closed stays closed: the tablet can still sign it, but it no longer shows as in progress.
    if (existing.closedAt) return { id: input.id, created: false, signed: false };
    await existing.update({ touchedAt: now });
    return { id: input.id, created: false, signed: false };
  }
  await CheckDraft.create({
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
  const drafts = await CheckDraft.findAll({
    where: { closedAt: { [Op.is]: null }, touchedAt: { [Op.gt]: new Date(now.getTime() - draftLifetimeMs) } },
    order: [['startedAt', 'ASC']],
  });
  const [airframes, people] = await Promise.all([
    Airframe.findAll({
      where: { id: { [Op.in]: drafts.map((d) => d.airframeId) } },
      attributes: ['id', 'fleetNumber'],
    }),
    Staff.findAll({ where: { id: { [Op.in]: drafts.map((d) => d.startedBy) } }, attributes: ['id', 'name'] }),
  ]);
  const fleet = new Map(airframes.map((a) => [a.id, a.fleetNumber]));
  const names = new Map(people.map((p) => [p.id, p.name]));
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
  return sequelize.transaction(async (transaction) => {
    const draft = await CheckDraft.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE });
    if (!draft) throw notFound('No check in progress with that id: it was signed, or never started.');
    if (draft.closedAt) throw conflict('draft_closed', 'That check was already closed.');
    await draft.update({ closedAt: now, closedBy: by, closeReason: input.reason }, { transaction });
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
