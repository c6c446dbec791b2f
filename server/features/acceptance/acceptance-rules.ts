import type { AirframeState, UnserviceableCause } from '@shared/schemas/airframes';
import type { DueItem } from '@shared/domain/status';
import { phrase, type Phrase, type PhraseValue } from '@shared/i18n/phrase';

export interface AcceptanceRefusal {
  code:
    | 'airframe_on_hold'
    | 'airframe_unserviceable'
    | 'preflight_missing'
    | 'preflight_expired'
    | 'check_in_progress';
  /** What the pilot reads, in the screen's language, and the refused acceptance's 409 in the asker's. */
  phrase: Phrase;
}

const causePhrases: Record<UnserviceableCause, string> = {
  service_needed: 'causeServiceNeeded',
  on_hold: 'causeOnHold',
  open_defect: 'causeOpenDefect',
  deferral_expired: 'causeDeferralExpired',
};

/**
 * Why a pilot cannot accept the airframe now, in words that say what has to happen first; null when they can: the
 * checks are in limits (with or without a certificate of release to service in force) and nothing is open.
 */
export function acceptanceRefusal(
  fleetNumber: string,
  state: AirframeState,
  reasons: readonly Phrase[],
  due: readonly DueItem[],
  causes: readonly UnserviceableCause[] = [],
): AcceptanceRefusal | null {
  const why: PhraseValue = { phrases: [...reasons], joiner: 'semicolon' };
  const refusal = (code: AcceptanceRefusal['code'], said: Phrase): AcceptanceRefusal => ({
    code,
    phrase: said,
  });
  switch (state) {
    case 'released':
    case 'checks_in_limits':
      return null;
    case 'unserviceable':
      // The code the API gave for a hold before unserviceable causes were named.
      return refusal(
        causes.includes('on_hold') ? 'airframe_on_hold' : 'airframe_unserviceable',
        phrase('refusedUnserviceable', {
          fleet: fleetNumber,
          causes: { phrases: causes.map((c) => phrase(causePhrases[c])), joiner: 'semicolon' },
          why,
        }),
      );
    case 'in_progress':
      return refusal('check_in_progress', phrase('refusedInProgress', { fleet: fleetNumber }));
    case 'not_checked':
      return refusal('preflight_missing', phrase('refusedNoPreFlight', { fleet: fleetNumber }));
    case 'due': {
      const preFlight = due.find((d) => d.kind === 'pre_flight');
      return refusal(
        preFlight && preFlight.at ? 'preflight_expired' : 'preflight_missing',
        phrase('refusedPreFlightExpired', { fleet: fleetNumber, why }),
      );
    }
  }
}
