import type { AirframeState, DefectSummary, StoredCheck, StoredReading, UnserviceableCause } from './api';
import type { CheckKind, LevelMarks, LimitBand, Unit, Verdict } from './limits';

/** Shown wherever limits are shown. */
export const limitsCaution =
  'Gaugewalk records and compares. Real limits come from the approved maintenance data of the aircraft, ' +
  'local regulations and licensed engineers.';

export interface PersonRef {
  id: number;
  name: string;
}

export interface AirframeRef {
  id: number;
  fleetNumber: string;
}

/** A stored reading next to the limit it was judged against (from the limits version of its check). */
export interface ReadingAgainstLimits extends StoredReading {
  /** The checkpoint's canonical unit; null for yes/no. */
  canonicalUnit: Unit | null;
  system: string | null;
  /** The band the reading fell in, edges in the canonical unit. */
  band: LimitBand | null;
  /** The band in words, e.g. "at or above 5.5 L and below 7 L". */
  limitText: string | null;
  marks: LevelMarks | null;
  /** Where the limit comes from in the approved maintenance data. */
  reference: string | null;
}

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
  signedBy: { id: number; name: string; licenceNumber: string | null };
  limitsVersion: { id: number; typeCode: string; version: number };
  /** Whether this check still counts (within its validity window) right now. */
  valid: boolean;
  validUntil: string | null;
  validity: string;
  readings: ReadingAgainstLimits[];
}

export interface AcceptanceRecord {
  id: number;
  airframeId: number;
  acceptedBy: { id: number; name: string; badgeNumber: string; licenceNumber: string | null };
  acceptedAt: string;
  checkIds: string[];
  contentHash: string;
}

export interface AcceptanceView {
  airframe: AirframeRef & { serial: string; type: { code: string; name: string }; hours: number };
  state: AirframeState;
  causes: UnserviceableCause[];
  stateReasons: string[];
  /** Defects not rectified: open, deferred with their limit, or past it. */
  defects: DefectSummary[];
  /** The certificate of release to service in force, if one is. */
  release: { by: string; at: string } | null;
  latestChecks: AcceptanceViewCheck[];
  /** Fluid added in the 7 days before now, newest first. */
  fluidAdded: FluidAddedItem[];
  openHolds: { id: number; reason: string; openedAt: string }[];
  lastAcceptance: { by: string; at: string } | null;
  canAccept: boolean;
  /** Why it cannot be accepted now; null when it can. */
  refusal: string | null;
  caution: string;
}

export interface BoardLinkInfo {
  id: number;
  name: string;
  createdAt: string;
  createdBy: string;
  revokedAt: string | null;
  lastSeenAt: string | null;
}

/** Only answered once, on creation: the token itself is not stored. */
export interface BoardLinkCreated extends BoardLinkInfo {
  token: string;
  /** Path to open on the TV, e.g. /board?board=<token>. */
  path: string;
}

export interface HandoverConsumption {
  airframe: AirframeRef;
  system: string;
  windowDays: number;
  litresAdded: number;
  /** null when the flight hours in the window are not known. */
  flightHours: number | null;
  litresPerFlightHour: number | null;
  litresPerDay: number;
  alertLPerFh: number;
  alert: { kind: 'rate_at_or_above_threshold' | 'fluid_without_flying'; message: string } | null;
}

export interface HandoverSummary {
  from: string;
  to: string;
  checks: {
    total: number;
    byKind: { kind: CheckKind; total: number; in_limits: number; service: number; out_of_limits: number }[];
  };
  holdsOpened: { id: number; airframe: AirframeRef; reason: string; openedAt: string; checkId: string }[];
  holdsReleased: { id: number; airframe: AirframeRef; releasedAt: string; releasedBy: string }[];
  holdsStillOpen: number;
  /** Each airframe's state at the end of the window, as the board shows it. */
  states: { airframe: AirframeRef; state: AirframeState; causes: UnserviceableCause[] }[];
  /** Every airframe with a defect not rectified: open, deferred or deferred past its limit. */
  defects: { airframe: AirframeRef; defects: DefectSummary[] }[];
  fluidUsed: {
    bySystem: { system: string; litres: number }[];
    byAirframe: { airframe: AirframeRef; system: string; litres: number }[];
  };
  consumption: HandoverConsumption[];
  consumptionAlerts: string[];
  /** Plain notes on what the summary could not say, e.g. flight hours not recorded. */
  notes: string[];
  caution: string;
}

export interface HandoverSent {
  deliveryId: number;
  status: 'sent' | 'failed';
  to: string[];
  subject: string;
  error: string | null;
}

export interface CaughtMailItem {
  id: number;
  to: string;
  subject: string;
  text: string;
  receivedAt: string;
}
