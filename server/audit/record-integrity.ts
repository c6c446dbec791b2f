import type { Sequelize } from 'sequelize';
import {
  checkById,
  limitsVersionNumber,
  readingsOf,
  servicingOf,
  type StoredCheck,
  type StoredEvent,
} from './audit.repository';
import { canonicalJson } from '../security/hashing';
import { verifyAuditTrail, type TrailVerification } from './audit-trail';
import { recordProblem, signedEventProblem } from './record-check';
import { signedRecordProblem } from './signed-records';

interface SignedCheck {
  kind: string;
  context: unknown;
  note: string | null;
  signedAt: string;
  airframeHours: number | null;
  /** Stamped since flights were recorded; absent on older checks, whose column is null. */
  airframeFlights?: number | null;
  correctsCheckId: string | null;
  limitsVersion: number;
  servicing?: { code: string; fluidSpec: string; batch: string; levelBefore: unknown; quantityL: number }[];
}

/** The check row's own columns against what was signed: the first that differs, or null. */
async function changedCheckField(check: StoredCheck, signed: SignedCheck): Promise<string | null> {
  const limitsVersion = await limitsVersionNumber(check.limitsVersionId);
  const hours = check.airframeHours === null ? null : Number(check.airframeHours);
  const fields: [string, boolean][] = [
    ['kind', signed.kind === check.kind],
    ['note', (signed.note ?? null) === (check.note ?? null)],
    ['context', canonicalJson(signed.context) === canonicalJson(JSON.parse(check.context))],
    ['signing time', signed.signedAt === check.signedAt.toISOString()],
    ['airframe hours', (signed.airframeHours ?? null) === hours],
    ['airframe flights', (signed.airframeFlights ?? null) === (check.airframeFlights ?? null)],
    ['corrected check', (signed.correctsCheckId ?? null) === (check.correctsCheckId ?? null)],
    ['limits version', limitsVersion === signed.limitsVersion],
  ];
  const changed = fields.find(([, same]) => !same);
  if (changed) return changed[0];
  const servicing = await servicingOf(check.id);
  const signedServicing = signed.servicing ?? [];
  if (servicing.length !== signedServicing.length) return 'fluid added';
  const same = servicing.every((row, i) => {
    const s = signedServicing[i]!;
    return (
      row.checkpointCode === s.code &&
      row.fluidSpec === s.fluidSpec &&
      row.batch === s.batch &&
      row.quantityL === s.quantityL &&
      canonicalJson(JSON.parse(row.levelBefore)) === canonicalJson(s.levelBefore)
    );
  });
  return same ? null : 'fluid added';
}

/** Why a signed check no longer matches what was signed, or null when it does. */
export async function checkRecordProblem(checkId: string): Promise<string | null> {
  const [check, readings] = await Promise.all([checkById(checkId), readingsOf(checkId)]);
  const problem = recordProblem(checkId, check, readings);
  if (problem || !check) return problem;
  // The readings and verdict hold; the check's own columns must too.
  const changed = await changedCheckField(check, JSON.parse(check.signedContent!) as SignedCheck);
  return changed ? `check ${checkId}: its ${changed} was changed after signing` : null;
}

/** The chain, and for every signed check in it, that the stored record still is what was signed. */
export function verifyRecords(sequelize: Sequelize): Promise<TrailVerification> {
  return verifyAuditTrail(sequelize, async (event: StoredEvent) => {
    if (event.action !== 'check.signed') return signedRecordProblem(event);
    const [check, readings] = await Promise.all([checkById(event.entityId), readingsOf(event.entityId)]);
    return signedEventProblem(event, check) ?? recordProblem(event.entityId, check, readings);
  });
}
