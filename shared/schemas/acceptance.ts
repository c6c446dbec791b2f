import { z } from 'zod';
import { pinSchema } from './auth';
import { signingRequest } from './signing';
import type { CheckKind, Verdict } from './limits';
import type { ReadingAgainstLimits } from './checks';
import type { AirframeSummary } from './airframes';
import type { AirframeRef, SignerRef } from './refs';
import type { UsageFigures } from './usage';
import type { Phrase } from '../i18n/phrase';

export const acceptAirframeSchema = z.object({ pin: pinSchema, ...signingRequest }).strict();
export type AcceptAirframeInput = z.infer<typeof acceptAirframeSchema>;

export interface FluidAddedItem {
  at: string;
  checkId: string;
  code: string;
  system: string | null;
  litres: number;
  fluidSpec: string | null;
  batch: string | null;
  /** servicing: a top-up recorded at a level checkpoint; reading: a "fluid added" checkpoint of a check. */
  source: 'servicing' | 'reading';
}

export interface AcceptanceViewCheck {
  kind: CheckKind;
  id: string;
  verdict: Verdict;
  signedAt: string;
  signedBy: SignerRef;
  limitsVersion: { id: number; typeCode: string; version: number };
  /** Whether this check still counts (within its validity window) right now. */
  valid: boolean;
  validUntil: string | null;
  validity: Phrase;
  readings: ReadingAgainstLimits[];
}

export interface AcceptanceRecord {
  id: number;
  airframeId: number;
  acceptedBy: SignerRef & { badgeNumber: string };
  acceptedAt: string;
  checkIds: string[];
  contentHash: string;
}

/** The pilot's view: the board's judgement of the airframe (the same derivation), with the checks behind it. */
export interface AcceptanceView extends Pick<
  AirframeSummary,
  'state' | 'causes' | 'stateReasons' | 'defects' | 'release' | 'openHolds'
> {
  airframe: AirframeRef & { serial: string; type: { code: string; name: string }; hours: number };
  latestChecks: AcceptanceViewCheck[];
  /** Fluid added in the 7 days before now, newest first. */
  fluidAdded: FluidAddedItem[];
  lastAcceptance: { by: string; at: string } | null;
  /** The airframe's hours, flights and landings as last recorded, which the pilot's close of a flight starts from. */
  lastUsage: UsageFigures;
  canAccept: boolean;
  /** Why it cannot be accepted now; null when it can. */
  refusal: Phrase | null;
  caution: string;
}
