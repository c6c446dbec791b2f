import { Op } from 'sequelize';
import type { CreationAttributes, Transaction } from 'sequelize';
import {
  AircraftType,
  Airframe,
  Defect,
  Hold,
  HoldCorrectiveAction,
  type DefectEntry,
} from '@server/db/models';

export type DefectRow = Defect;
export type DefectEntryRow = DefectEntry;
import { currentLimits } from '@server/db/limits-store';

/** An active airframe with what a tech-log signature needs: its type code, zone, hours and flights. */
export async function airframeForTechLog(airframeId: number) {
  const airframe = await Airframe.findByPk(airframeId);
  if (!airframe || !airframe.active) return null;
  const type = await AircraftType.findByPk(airframe.typeId);
  const limits = await currentLimits(airframe.typeId);
  return {
    airframe,
    typeCode: type?.code ?? '',
    timeZone: limits?.definition.timeZone ?? 'UTC',
    usage: { hours: Number(airframe.hours), flights: Number(airframe.flights ?? 0) },
  };
}

export const defectsOfAirframe = (airframeId: number) =>
  Defect.findAll({ where: { airframeId }, order: [['id', 'DESC']] });

/** Defects not yet shown rectified; the state rule decides, this only leaves out what is clearly closed. */
export const recentDefects = (since: Date) =>
  Defect.findAll({ where: { raisedAt: { [Op.gte]: since } }, order: [['id', 'DESC']], limit: 500 });

export const findDefect = (id: number) => Defect.findByPk(id);

export const correctiveActionsBy = async (holdId: number) =>
  (await HoldCorrectiveAction.findAll({ where: { holdId }, attributes: ['recordedBy'] })).map(
    (a) => a.recordedBy,
  );

/** Whether the hold a defect belongs to is still open (not released), read in the caller's transaction. */
export const holdStillOpen = async (holdId: number, transaction: Transaction) =>
  (await Hold.findByPk(holdId, { transaction, attributes: ['releasedAt'] }))?.releasedAt == null;

export const createDefect = (row: CreationAttributes<Defect>, transaction: Transaction) =>
  Defect.create(row, { transaction });
