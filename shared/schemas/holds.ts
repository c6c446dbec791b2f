import { z } from 'zod';
import { freeText } from './free-text';
import { oneSecret, signedSecrets, signingRequest } from './signing';
import type { CheckKind, Verdict } from './limits';
import type { ReadingAgainstLimits, StoredCheck } from './checks';
import type { AirframeRef, PersonRef } from './refs';

export const correctiveActionSchema = z
  .object({
    text: freeText('words:validation.field.correctiveAction', {
      min: 3,
      minMessage: 'words:validation.sayWhatWasDone',
      max: 2000,
      maxMessage: 'words:validation.correctiveActionTooLong',
    }),
    /** The PIN (kiosk) or password (desk) typed again: a corrective action is release evidence, signed like it. */
    ...signedSecrets,
    /** The work disturbed something (for example flight controls) that a second person must inspect. */
    independentInspection: z.boolean().optional(),
  })
  .strict()
  .superRefine(oneSecret('recordCorrectiveAction'));
export type CorrectiveActionInput = z.infer<typeof correctiveActionSchema>;

/** A shift lead's countersign: the PIN on a kiosk or the password at the desk, typed again. */
export const countersignSchema = z
  .object({
    decision: z.enum(['release', 'keep']),
    reason: freeText('words:validation.field.reason', {
      max: 2000,
      maxMessage: 'words:validation.reasonTooLong',
    }).optional(),
    ...signedSecrets,
    ...signingRequest,
  })
  .strict()
  .superRefine(oneSecret('countersign'))
  .superRefine((value, ctx) => {
    if (value.decision === 'keep' && !value.reason) {
      ctx.addIssue({ code: 'custom', path: ['reason'], message: 'words:validation.holdStays' });
    }
  });
export type CountersignInput = z.infer<typeof countersignSchema>;

export interface HoldQueueItem {
  id: number;
  airframe: AirframeRef & { typeCode: string };
  reason: string;
  openedAt: string;
  check: {
    id: string;
    kind: CheckKind;
    verdict: Verdict;
    signedAt: string;
    signedBy: PersonRef;
    note: string | null;
  };
  /** The readings of the held check that were not in limits. */
  findings: ReadingAgainstLimits[];
  correctiveActionCount: number;
  lastCountersign: { decision: 'release' | 'keep'; by: string; at: string; reason: string | null } | null;
  /** True when a newer passing check of the same kind (or one correcting the held check) is signed. */
  recheckPassed: boolean;
}

export interface CorrectiveActionRecord {
  id: number;
  text: string;
  recordedBy: PersonRef;
  recordedAt: string;
}

export interface CountersignRecord {
  id: number;
  decision: 'release' | 'keep';
  reason: string | null;
  recheckCheckId: string | null;
  signedBy: PersonRef;
  signedAt: string;
  signedWith: 'pin' | 'password';
  contentHash: string;
}

export interface ReleaseReadiness {
  hasCorrectiveAction: boolean;
  /** Whether a second person's inspection is needed before the release, and who gave it. */
  independentInspection: { needed: boolean; by: string[] };
  /** The ATA chapters the release must be authorised for. */
  chapters: (string | null)[];
  /** The tech-log number of the hold's defect. */
  defectNumber: number | null;
  recheck: { id: string; kind: CheckKind; signedAt: string; signedBy: string } | null;
  /** Plain sentences naming what is still missing before a release; empty when it can be released. */
  missing: string[];
}

export interface HoldDetail {
  id: number;
  airframe: AirframeRef & { typeCode: string };
  reason: string;
  openedAt: string;
  state: 'open' | 'released';
  releasedAt: string | null;
  releasedBy: PersonRef | null;
  /** Who signed the held check; that person cannot countersign. */
  raisedBy: PersonRef;
  check: StoredCheck;
  readings: ReadingAgainstLimits[];
  correctiveActions: CorrectiveActionRecord[];
  countersigns: CountersignRecord[];
  releaseReadiness: ReleaseReadiness;
  caution: string;
}
