import type { StoredServicing, SubmitCheck } from '@shared/schemas/checks';
import type { Checkpoint, Verdict } from '@shared/schemas/limits';
import type { SignedTool } from '@shared/schemas/tools';
import type { JudgedReading } from '@shared/domain/judge';
import { storedValue } from '@shared/domain/reading-input';
import type { LoadedLimits } from '@server/db/limits-store';
import { canonicalJson } from '@server/security/hashing';
import { sealContent, signerOf, type SealedContent, type Signature } from '@server/security/signing';
import type { UsageFigures } from '@shared/schemas/usage';
import type { SignedCheckRows, SigningAirframe } from './checks.repository';
import type { ToolsUsed } from './check-tools';

// What a signed check writes, built from what was judged: pure, so the rows and the signed content they must match
// are made in one place.

export interface CheckTarget {
  airframe: SigningAirframe;
  limits: LoadedLimits;
  /** The card's checkpoints, in the card's order. */
  card: Checkpoint[];
}

/** Fluid added during the check, as signed: the stored top-up before it has its time. */
export type TopUp = Omit<StoredServicing, 'addedAt'>;

export interface PhotoClaim {
  id: string;
  code: string;
  sha256: string;
}

/** The figures an after-flight check records, what they add, and the airframe's figures they were judged against. */
export interface RecordedUsage {
  figures: UsageFigures;
  flown: UsageFigures;
  last: UsageFigures;
}

/** Everything a signed check is made of, once judged. */
export interface JudgedCheck {
  input: SubmitCheck;
  target: CheckTarget;
  readings: JudgedReading[];
  verdict: Verdict;
  servicing: TopUp[];
  photos: PhotoClaim[];
  usage: RecordedUsage | null;
  /** The tools the readings and top-ups were taken with, as the register stood at signing. */
  tools: ToolsUsed;
  signature: Signature;
}

/** The hours and flights a check is stamped with: those it records, or else the airframe's as they stood. */
export function stampOf(c: Pick<JudgedCheck, 'usage' | 'target'>) {
  return c.usage
    ? { hours: c.usage.figures.hours, flights: c.usage.figures.flights }
    : { hours: Number(c.target.airframe.hours), flights: Number(c.target.airframe.flights ?? 0) };
}

/** Exactly what a signature covers; the stored hash can be recomputed from the rows at any time. */
export function checkContent(c: JudgedCheck) {
  const { input, target, signature } = c;
  return {
    id: input.id,
    fleetNumber: target.airframe.fleetNumber,
    // The mark as it stood at signing, so a later re-registration does not rewrite the record.
    registration: target.airframe.registration ?? null,
    kind: input.kind,
    typeCode: target.limits.definition.code,
    limitsVersion: target.limits.version,
    context: input.context,
    readings: c.readings.map((r) => ({
      code: r.code,
      entry: r.entry,
      verdict: r.evaluation.verdict,
      bandId: r.evaluation.band.id,
      ...(c.tools.readings.has(r.code) ? { tool: c.tools.readings.get(r.code) } : {}),
    })),
    servicing: c.servicing,
    photos: c.photos,
    signer: signerOf(signature.row),
    signedAt: signature.at.toISOString(),
    airframeHours: stampOf(c).hours,
    airframeFlights: stampOf(c).flights,
    ...(c.usage ? { usage: c.usage.figures } : {}),
    note: input.note ?? null,
    correctsCheckId: input.correctsCheckId ?? null,
  };
}

/** The check, reading and top-up rows, each as the read-back builds its view from. */
export function checkRows(
  c: JudgedCheck,
  sealed: SealedContent,
  extra: { submissionHash: string; kioskId: number | null },
) {
  const { input, target, signature } = c;
  const check = {
    id: input.id,
    airframeId: target.airframe.id,
    kind: input.kind,
    limitsVersionId: target.limits.id,
    context: canonicalJson(input.context),
    verdict: c.verdict,
    note: input.note ?? null,
    airframeHours: stampOf(c).hours,
    airframeFlights: stampOf(c).flights,
    signedBy: signature.row.id,
    signedAt: signature.at,
    ...sealed,
    submissionHash: extra.submissionHash,
    correctsCheckId: input.correctsCheckId ?? null,
    kioskDeviceId: extra.kioskId,
    createdAt: new Date(),
  };
  const readings = c.readings.map(({ code, entry, evaluation }, seq) => ({
    checkId: input.id,
    seq,
    checkpointCode: code,
    entry: canonicalJson(entry),
    value: storedValue(entry),
    unit: 'value' in entry ? entry.unit : null,
    verdict: evaluation.verdict,
    bandId: evaluation.band.id,
    message: evaluation.message,
    action: evaluation.action,
    expected: evaluation.expected ?? null,
    ...toolColumns(c.tools.readings.get(code) ?? null, c.tools),
  }));
  const servicing = c.servicing.map((entry) => ({
    checkId: input.id,
    airframeId: target.airframe.id,
    checkpointCode: entry.code,
    system: entry.system,
    quantityL: entry.quantityL,
    enteredValue: entry.entered.value,
    enteredUnit: entry.entered.unit,
    fluidSpec: entry.fluidSpec,
    batch: entry.batch,
    canOpenedOn: entry.canOpenedOn,
    levelBefore: canonicalJson(entry.levelBefore),
    ...toolColumns(entry.tool, c.tools),
    addedAt: signature.at,
  }));
  const usage = c.usage && {
    last: c.usage.last,
    row: {
      airframeId: target.airframe.id,
      source: 'after_flight_check' as const,
      checkId: input.id,
      ...c.usage.figures,
      hoursFlown: c.usage.flown.hours,
      flightsFlown: c.usage.flown.flights,
      landingsMade: c.usage.flown.landings,
      recordedBy: signature.row.id,
      recordedAt: signature.at,
      signedWith: null,
      contentHash: null,
      signedContent: null,
    },
  };
  return { check, readings, servicing, usage };
}

/** The register's id of a tool (for finding its readings) beside the tool as signed (what the record says). */
const toolColumns = (tool: SignedTool | null, tools: ToolsUsed) => ({
  toolId: tool ? (tools.idOf.get(tool.number) ?? null) : null,
  tool: tool ? canonicalJson(tool) : null,
});

/** The hold a check with findings out of limits opens, and the reason it gives. */
export function holdOf(c: JudgedCheck) {
  const findings = c.readings.filter((r) => r.evaluation.verdict === 'out_of_limits');
  if (findings.length === 0) return null;
  return {
    findings: findings.map((r) => r.checkpoint),
    row: {
      airframeId: c.target.airframe.id,
      checkId: c.input.id,
      reason: findings.map((r) => `${r.checkpoint.label}: ${r.evaluation.message}`).join('; '),
      openedAt: c.signature.at,
      releasedAt: null,
      releasedBy: null,
    },
  };
}

/**
 * The tech-log defects a signed check raises: one for its findings out of limits (tied to the hold), and one for
 * its defect note. Each carries its own signed content, hashed, so the record check can prove it unchanged.
 */
export function checkDefects(c: JudgedCheck, hold: ReturnType<typeof holdOf>): SignedCheckRows['defects'] {
  const { signature } = c;
  const raise = (
    source: 'finding' | 'check_note',
    description: string,
    chapter: string | null,
    inspect: boolean,
  ) => {
    const fields = {
      airframeId: c.target.airframe.id,
      description,
      chapter,
      source,
      checkId: c.input.id,
      needsIndependentInspection: inspect,
    };
    const sealed = sealContent({
      ...fields,
      raisedBy: { badge: signature.row.badgeNumber, name: signature.row.name },
      raisedAt: signature.at.toISOString(),
    });
    return {
      ofHold: source === 'finding',
      row: { ...fields, raisedBy: signature.row.id, raisedAt: signature.at, ...sealed },
    };
  };
  const note = c.input.note?.trim();
  return [
    ...(hold
      ? [
          raise(
            'finding',
            hold.row.reason,
            hold.findings.find((f) => f.ata)?.ata ?? null,
            hold.findings.some((f) => f.independentInspection === true),
          ),
        ]
      : []),
    ...(note ? [raise('check_note', note, null, false)] : []),
  ];
}

/** The audit events of a signed check: its defects, its hold, then the signature itself. */
export function checkEvents(
  c: JudgedCheck,
  sealed: SealedContent,
  defects: SignedCheckRows['defects'],
  hold: ReturnType<typeof holdOf>,
): SignedCheckRows['events'] {
  const actorId = c.signature.row.id;
  const at = c.signature.at;
  const checkId = c.input.id;
  return (holdId, defectIds, usageId) => [
    ...defectIds.map((id, i) => ({
      actorId,
      action: 'defect.raised',
      entity: 'defect',
      entityId: String(id),
      payload: {
        contentHash: defects[i]!.row.contentHash,
        checkId,
        holdId: defects[i]!.ofHold ? holdId : null,
      },
      at,
    })),
    ...(holdId === null || !hold
      ? []
      : [
          {
            actorId,
            action: 'hold.opened',
            entity: 'hold',
            entityId: String(holdId),
            payload: { airframe: c.target.airframe.fleetNumber, checkId, reason: hold.row.reason },
            at,
          },
        ]),
    ...(usageId === null || !c.usage
      ? []
      : [
          {
            actorId,
            action: 'usage.recorded',
            entity: 'airframe_usage',
            entityId: String(usageId),
            payload: {
              airframe: c.target.airframe.fleetNumber,
              source: 'after_flight_check',
              checkId,
              figures: c.usage.figures,
              flown: c.usage.flown,
            },
            at,
          },
        ]),
    {
      actorId,
      action: 'check.signed',
      entity: 'check',
      entityId: checkId,
      payload: { contentHash: sealed.contentHash, verdict: c.verdict, limitsVersionId: c.target.limits.id },
      at,
    },
  ];
}
