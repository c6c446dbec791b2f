import { Op, type CreationAttributes, type Transaction } from 'sequelize';
import { limitsById } from '@server/db/limits-store';
import {
  AircraftType,
  Airframe,
  Check,
  Defect,
  DefectEntry,
  Hold,
  HoldCorrectiveAction,
  HoldCountersign,
  MailDelivery,
  Reading,
  Staff,
} from '@server/db/models';

// The rows the hold service reasons about, named for what they are to it.
export type HoldRow = Hold;
export type HeldCheckRow = Check;
export type CorrectiveActionRow = HoldCorrectiveAction;
export type InspectionRow = DefectEntry;
export type PersonRow = Staff;

export async function openHoldRows() {
  return Hold.findAll({ where: { releasedAt: { [Op.is]: null } }, order: [['openedAt', 'ASC']] });
}

export async function findHold(id: number, transaction?: Transaction) {
  return Hold.findByPk(id, transaction ? { transaction, lock: transaction.LOCK.UPDATE } : {});
}

export async function airframeWithType(airframeId: number) {
  const airframe = await Airframe.findByPk(airframeId);
  const type = airframe ? await AircraftType.findByPk(airframe.typeId) : null;
  return { airframe, type };
}

export async function correctiveActionsOf(holdIds: number[], transaction?: Transaction) {
  if (holdIds.length === 0) return [];
  return HoldCorrectiveAction.findAll({
    where: { holdId: { [Op.in]: holdIds } },
    order: [
      ['recordedAt', 'ASC'],
      ['id', 'ASC'],
    ],
    transaction,
  });
}

export async function countersignsOf(holdIds: number[]) {
  if (holdIds.length === 0) return [];
  return HoldCountersign.findAll({
    where: { holdId: { [Op.in]: holdIds } },
    order: [
      ['signedAt', 'ASC'],
      ['id', 'ASC'],
    ],
  });
}

/**
 * The newest passing re-check of a held check: signed later on the same airframe, wholly in limits, and either
 * of the same kind or recorded as the correction of the held check.
 */
export async function passingRecheck(
  held: Pick<Check, 'id' | 'airframeId' | 'kind' | 'signedAt'>,
  transaction?: Transaction,
) {
  return Check.findOne({
    where: {
      airframeId: held.airframeId,
      verdict: 'in_limits',
      signedAt: { [Op.gt]: held.signedAt },
      [Op.or]: [{ kind: held.kind }, { correctsCheckId: held.id }],
    },
    order: [['signedAt', 'DESC']],
    transaction,
  });
}

export async function people(ids: number[]) {
  if (ids.length === 0) return new Map<number, Staff>();
  const rows = await Staff.findAll({ where: { id: { [Op.in]: [...new Set(ids)] } } });
  return new Map(rows.map((s) => [s.id, s]));
}

/** The held check's readings out of limits, with each checkpoint's ATA chapter and inspection requirement. */
export async function heldFindings(held: Pick<Check, 'id' | 'limitsVersionId'>) {
  const [readings, limits] = await Promise.all([
    Reading.findAll({
      where: { checkId: held.id, verdict: 'out_of_limits' },
      attributes: ['checkpointCode'],
    }),
    limitsById(held.limitsVersionId),
  ]);
  const byCode = new Map((limits?.definition.checkpoints ?? []).map((c) => [c.code, c]));
  return readings.map((r) => ({
    code: r.checkpointCode,
    ata: byCode.get(r.checkpointCode)?.ata ?? null,
    independentInspection: byCode.get(r.checkpointCode)?.independentInspection === true,
  }));
}

/** The tech-log defect of a hold's finding, and its independent inspections. */
export async function defectOfHold(holdId: number, transaction?: Transaction) {
  const defect = await Defect.findOne({ where: { holdId }, ...(transaction ? { transaction } : {}) });
  const inspections = defect
    ? await DefectEntry.findAll({
        where: { defectId: defect.id, kind: 'inspection' },
        order: [['signedAt', 'ASC']],
        ...(transaction ? { transaction } : {}),
      })
    : [];
  return { defect, inspections };
}

export const checkById = (id: string) => Check.findByPk(id);

export const createCorrectiveAction = (
  row: CreationAttributes<HoldCorrectiveAction>,
  transaction: Transaction,
) => HoldCorrectiveAction.create(row, { transaction });

/** Stores a countersign; a release also marks the hold released, by the same person at the same instant. */
export async function storeCountersign(
  hold: Hold,
  row: CreationAttributes<HoldCountersign>,
  transaction: Transaction,
) {
  const countersign = await HoldCountersign.create(row, { transaction });
  if (row.decision === 'release') {
    await hold.update({ releasedAt: row.signedAt, releasedBy: row.signedBy }, { transaction });
  }
  return countersign;
}

/** The countersign signed under a screen's signing id, if any. */
export const countersignSignedAs = (requestId: string) => HoldCountersign.findOne({ where: { requestId } });

export const holdsOpenedSince = (since: Date) =>
  Hold.findAll({ where: { openedAt: { [Op.gt]: since } }, order: [['id', 'ASC']] });

/** Which of these mail topics were already sent or tried. */
export const deliveredTopics = async (topicKeys: string[]) =>
  new Set(
    (
      await MailDelivery.findAll({ where: { topicKey: { [Op.in]: topicKeys } }, attributes: ['topicKey'] })
    ).map((d) => d.topicKey),
  );
