import type { CheckContext, CheckKind, Checkpoint, Fluid, ReadingEntry, Verdict } from './limits';

export type AirframeState =
  'unserviceable' | 'in_progress' | 'not_checked' | 'due' | 'checks_in_limits' | 'released';

export type UnserviceableCause = 'service_needed' | 'on_hold' | 'open_defect' | 'deferral_expired';

/** "Released" only with a certificate of release to service in force (EASA Part-145 145.A.50, from memory). */
export const airframeStateLabels: Record<AirframeState, string> = {
  unserviceable: 'Unserviceable',
  in_progress: 'In progress',
  not_checked: 'Not checked',
  due: 'Check due',
  checks_in_limits: 'Checks in limits',
  released: 'Released',
};

export const causeLabels: Record<UnserviceableCause, string> = {
  service_needed: 'Service needed',
  on_hold: 'On hold',
  open_defect: 'Open defect',
  deferral_expired: 'Deferral expired',
};

/**
 * The state names the API gave before unserviceable causes and certificates of release were recorded, kept as
 * `formerState` for clients written against them: an unserviceable airframe was "hold" (or "due" when it only
 * needed service), and "released" meant only that the checks were in limits.
 */
export type FormerAirframeState = 'released' | 'due' | 'in_progress' | 'hold' | 'not_checked';

export function formerState(
  state: AirframeState,
  causes: readonly UnserviceableCause[],
): FormerAirframeState {
  switch (state) {
    case 'unserviceable':
      return causes.every((c) => c === 'service_needed') ? 'due' : 'hold';
    case 'checks_in_limits':
    case 'released':
      return 'released';
    default:
      return state;
  }
}

export interface ApiError {
  code: string;
  message: string;
  issues?: { path: string; message: string }[];
  [key: string]: unknown;
}

export interface AirframeSummary {
  id: number;
  fleetNumber: string;
  serial: string;
  type: { id: number; code: string; name: string };
  base: { code: string; name: string };
  hours: number;
  flights: number;
  state: AirframeState;
  /** The same state in the names the API used before: see `formerState`. Deprecated. */
  formerState: FormerAirframeState;
  /** Why it is unserviceable; empty when it is not. */
  causes: UnserviceableCause[];
  stateReasons: string[];
  /** Defects not rectified: open, deferred (with the deferral's limit) or deferred past their limit. */
  defects: DefectSummary[];
  /** The certificate of release to service in force, if one is. */
  release: { by: string; at: string } | null;
  lastCheck: {
    id: string;
    kind: CheckKind;
    verdict: Verdict;
    signedAt: string;
    signedBy: string;
  } | null;
  nextDue: { kind: CheckKind; at: string } | null;
  openHolds: { id: number; reason: string; openedAt: string }[];
  /** The latest pilot acceptance, when there is one. */
  lastAcceptance?: { by: string; at: string } | null;
}

export interface DefectSummary {
  id: number;
  number: number;
  description: string;
  status: 'open' | 'deferred' | 'deferral_expired';
  /** In words: why it is open, or its deferral's limit. */
  reason: string;
  /** The calendar limit of its deferral, for a countdown. */
  deferredUntil: string | null;
}

export interface CheckCard {
  airframeId: number;
  kind: CheckKind;
  limitsVersion: { id: number; version: number; publishedAt: string | null };
  type: { code: string; name: string };
  requires: ('attitude' | 'systemPressure' | 'ambientTempC')[];
  checkpoints: Checkpoint[];
  /** The fluids approved for the type, so the kiosk can offer them and refuse another base at once. */
  fluids: Fluid[];
}

export interface StoredReading {
  code: string;
  label: string;
  entry: ReadingEntry;
  value: number | null;
  unit: string | null;
  verdict: Verdict;
  bandId: string;
  message: string;
  action: string;
  expected: number | null;
  photos: { id: string; mimeType: string; sizeBytes: number; sha256: string; uploadedAt: string }[];
}

export interface StoredServicing {
  code: string;
  system: string | null;
  quantityL: number;
  entered: { value: number; unit: string };
  fluidSpec: string;
  batch: string;
  levelBefore: ReadingEntry;
  addedAt: string;
}

export interface StoredCheck {
  id: string;
  airframe: { id: number; fleetNumber: string };
  kind: CheckKind;
  limitsVersion: { id: number; typeCode: string; version: number };
  context: CheckContext;
  verdict: Verdict;
  note: string | null;
  airframeHours: number | null;
  signedBy: { id: number; name: string; badgeNumber: string; licenceNumber: string | null };
  signedAt: string;
  contentHash: string;
  correctsCheckId: string | null;
  readings: StoredReading[];
  servicing: StoredServicing[];
  holdOpened: boolean;
}
