import { liveLabels, say, type Translate } from '../i18n/translate';
import type { CheckKind, Verdict } from './limits';
import type { DefectSummary } from './defects';
import type { Phrase } from '../i18n/phrase';

export type AirframeState =
  'unserviceable' | 'in_progress' | 'not_checked' | 'due' | 'checks_in_limits' | 'released';

export type UnserviceableCause = 'service_needed' | 'on_hold' | 'open_defect' | 'deferral_expired';

/** "Released" only with a certificate of release to service in force (EASA Part-145 145.A.50, from memory). */
const stateKeys = {
  unserviceable: 'words:state.unserviceable',
  in_progress: 'words:state.inProgress',
  not_checked: 'words:state.notChecked',
  due: 'words:state.due',
  checks_in_limits: 'words:state.checksInLimits',
  released: 'words:state.released',
} as const satisfies Record<AirframeState, string>;
const causeKeys = {
  service_needed: 'words:cause.serviceNeeded',
  on_hold: 'words:cause.onHold',
  open_defect: 'words:cause.openDefect',
  deferral_expired: 'words:cause.deferralExpired',
} as const satisfies Record<UnserviceableCause, string>;

// Both read in the screen's language when read (shared/i18n/translate.ts liveLabels); English on the server.
export const airframeStateLabels: Readonly<Record<AirframeState, string>> = liveLabels(stateKeys);
export const causeLabels: Readonly<Record<UnserviceableCause, string>> = liveLabels(causeKeys);

/** A state or cause in the language `t` writes (the server's e-mails and PDFs). */
export const airframeStateLabel = (state: AirframeState, t: Translate) => say(t, stateKeys[state]);
export const causeLabel = (cause: UnserviceableCause, t: Translate) => say(t, causeKeys[cause]);

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

export interface AirframeSummary {
  id: number;
  fleetNumber: string;
  /** The registration mark, e.g. "QX-TNA"; null until engineering records one. */
  registration: string | null;
  serial: string;
  type: { id: number; code: string; name: string };
  /** timeZone: the base's clock (IANA name), which the kiosk and board show times in. */
  base: { id: number; code: string; name: string; timeZone: string };
  hours: number;
  flights: number;
  state: AirframeState;
  /** The same state in the names the API used before: see `formerState`. Deprecated. */
  formerState: FormerAirframeState;
  /** Why it is unserviceable; empty when it is not. */
  causes: UnserviceableCause[];
  /** Why it stands as it does, as phrases each screen writes in its own language. */
  stateReasons: Phrase[];
  /** Defects not rectified: open, deferred (with the deferral's limit) or deferred past their limit. */
  defects: DefectSummary[];
  /** Findings not cleared, in words: a reading needing service, or out of limits (held or not yet). */
  findings: FindingSummary[];
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
  /** Fluid alerts in words (a level that fell with nothing flown): alerts to look into, not findings. */
  fluidAlerts: FluidAlert[];
}

export interface FluidAlert {
  /** The system's words, e.g. "System 1". */
  system: string;
  message: Phrase;
}

export interface FindingSummary {
  /** The checkpoint's words, e.g. "System 2 reservoir level". */
  label: string;
  verdict: 'service' | 'out_of_limits';
  kind: CheckKind;
  signedAt: string;
  /** Whether a hold was recorded against it (its hold line says the rest). */
  held: boolean;
  /** The finding and the check it came from. */
  phrase: Phrase;
}
