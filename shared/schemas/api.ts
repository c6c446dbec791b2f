import type { CheckContext, CheckKind, Checkpoint, Fluid, ReadingEntry, Verdict } from './limits';

export type AirframeState = 'released' | 'due' | 'in_progress' | 'hold' | 'not_checked';

export const airframeStateLabels: Record<AirframeState, string> = {
  released: 'Released',
  due: 'Check due',
  in_progress: 'In progress',
  hold: 'On hold',
  not_checked: 'Not checked',
};

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
  state: AirframeState;
  stateReasons: string[];
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
