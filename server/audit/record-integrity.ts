import type { Sequelize } from 'sequelize';
import { AuditEvent, Check, LimitsVersion, Reading, ServicingEntry } from '../db/models';
import { canonicalJson, sha256 } from '../security/hashing';
import { verifyAuditTrail, type TrailVerification } from './audit-trail';
import { signedRecordProblem } from './signed-records';

interface SignedReading {
  code: string;
  entry: unknown;
  verdict: string;
  bandId: string;
}

interface SignedCheck {
  readings: SignedReading[];
  kind: string;
  context: unknown;
  note: string | null;
  signedAt: string;
  airframeHours: number | null;
  correctsCheckId: string | null;
  limitsVersion: number;
  servicing?: { code: string; fluidSpec: string; batch: string; levelBefore: unknown; quantityL: number }[];
}

/** The check row's own columns against what was signed: the first that differs, or null. */
async function changedCheckField(check: Check, signed: SignedCheck): Promise<string | null> {
  const limits = await LimitsVersion.findByPk(check.limitsVersionId, { attributes: ['version'] });
  const hours = check.airframeHours === null ? null : Number(check.airframeHours);
  const fields: [string, boolean][] = [
    ['kind', signed.kind === check.kind],
    ['note', (signed.note ?? null) === (check.note ?? null)],
    ['context', canonicalJson(signed.context) === canonicalJson(JSON.parse(check.context))],
    ['signing time', signed.signedAt === check.signedAt.toISOString()],
    ['airframe hours', (signed.airframeHours ?? null) === hours],
    ['corrected check', (signed.correctsCheckId ?? null) === (check.correctsCheckId ?? null)],
    ['limits version', limits?.version === signed.limitsVersion],
  ];
  const changed = fields.find(([, same]) => !same);
  if (changed) return changed[0];
  const servicing = await ServicingEntry.findAll({ where: { checkId: check.id }, order: [['id', 'ASC']] });
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
  const check = await Check.findByPk(checkId);
  if (!check) return `check ${checkId} is missing`;
  if (!check.signedContent) return `check ${checkId} has no signed content`;
  if (sha256(check.signedContent) !== check.contentHash)
    return `check ${checkId}: the signed content does not match its signature hash`;
  const signed = JSON.parse(check.signedContent) as SignedCheck;
  const changed = await changedCheckField(check, signed);
  if (changed === 'kind') return `check ${checkId}: its kind was changed after signing`;
  if (changed) return `check ${checkId}: its ${changed} was changed after signing`;
  const rows = await Reading.findAll({ where: { checkId }, order: [['seq', 'ASC']] });
  if (rows.length !== signed.readings.length)
    return `check ${checkId}: readings were added or removed after signing`;
  for (const [i, row] of rows.entries()) {
    const s = signed.readings[i]!;
    const entry = JSON.parse(row.entry) as { value?: number; answer?: boolean };
    const value = entry.value ?? (entry.answer === undefined ? null : entry.answer ? 1 : 0);
    if (
      row.checkpointCode !== s.code ||
      canonicalJson(entry) !== canonicalJson(s.entry) ||
      row.verdict !== s.verdict ||
      row.bandId !== s.bandId ||
      (value !== null && row.value !== value)
    ) {
      return `check ${checkId}: reading "${row.checkpointCode}" was changed after signing`;
    }
  }
  const worst = rows.some((r) => r.verdict === 'out_of_limits')
    ? 'out_of_limits'
    : rows.some((r) => r.verdict === 'service')
      ? 'service'
      : 'in_limits';
  if (worst !== check.verdict) return `check ${checkId}: its verdict was changed after signing`;
  return null;
}

/** The chain, and for every signed check in it, that the stored record still is what was signed. */
export function verifyRecords(sequelize: Sequelize): Promise<TrailVerification> {
  return verifyAuditTrail(sequelize, async (event: AuditEvent) => {
    if (event.action !== 'check.signed') return signedRecordProblem(event);
    const payload = JSON.parse(event.payload) as { contentHash?: string };
    const check = await Check.findByPk(event.entityId);
    if (!check) return `check ${event.entityId} was removed`;
    if (payload.contentHash !== check.contentHash)
      return `check ${event.entityId}: its signature hash was replaced`;
    return checkRecordProblem(event.entityId);
  });
}
