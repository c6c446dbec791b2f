import type { Sequelize } from 'sequelize';
import { AuditEvent, Check, Reading } from '../db/models';
import { verifyAuditTrail, type TrailVerification } from './audit-trail';
import { recordProblem, signedEventProblem } from './record-check';
import { signedRecordProblem } from './signed-records';

const readingsOf = (checkId: string) => Reading.findAll({ where: { checkId }, order: [['seq', 'ASC']] });

/** Why a signed check no longer matches what was signed, or null when it does. */
export async function checkRecordProblem(checkId: string): Promise<string | null> {
  const [check, readings] = await Promise.all([Check.findByPk(checkId), readingsOf(checkId)]);
  return recordProblem(checkId, check, readings);
}

/** The chain, and for every signed check in it, that the stored record still is what was signed. */
export function verifyRecords(sequelize: Sequelize): Promise<TrailVerification> {
  return verifyAuditTrail(sequelize, async (event: AuditEvent) => {
    if (event.action !== 'check.signed') return signedRecordProblem(event);
    const [check, readings] = await Promise.all([Check.findByPk(event.entityId), readingsOf(event.entityId)]);
    return signedEventProblem(event, check) ?? recordProblem(event.entityId, check, readings);
  });
}
