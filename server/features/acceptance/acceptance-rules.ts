import type { AirframeState, UnserviceableCause } from '@shared/schemas/airframes';
import type { DueItem } from '@shared/domain/status';

export interface AcceptanceRefusal {
  code:
    | 'airframe_on_hold'
    | 'airframe_unserviceable'
    | 'preflight_missing'
    | 'preflight_expired'
    | 'check_in_progress';
  message: string;
}

const causeWords: Record<UnserviceableCause, string> = {
  service_needed: 'a reading needs service and no later check found it in limits',
  on_hold: 'it is on hold until its release is countersigned',
  open_defect: 'a defect is open, neither rectified nor deferred',
  deferral_expired: 'a deferred defect is past its limit',
};

/**
 * Why a pilot cannot accept the airframe now, in words that say what has to happen first; null when they can: the
 * checks are in limits (with or without a certificate of release to service in force) and nothing is open.
 */
export function acceptanceRefusal(
  fleetNumber: string,
  state: AirframeState,
  reasons: readonly string[],
  due: readonly DueItem[],
  causes: readonly UnserviceableCause[] = [],
): AcceptanceRefusal | null {
  const why = reasons.join('; ');
  switch (state) {
    case 'released':
    case 'checks_in_limits':
      return null;
    case 'unserviceable':
      return {
        // The code the API gave for a hold before unserviceable causes were named.
        code: causes.includes('on_hold') ? 'airframe_on_hold' : 'airframe_unserviceable',
        message:
          `${fleetNumber} is unserviceable: ${causes.map((c) => causeWords[c]).join('; ')}. ${why}. ` +
          'It cannot be accepted until the records show each item cleared.',
      };
    case 'in_progress':
      return {
        code: 'check_in_progress',
        message: `A check is in progress on ${fleetNumber}. Accept it once the mechanic has signed the check.`,
      };
    case 'not_checked':
      return {
        code: 'preflight_missing',
        message: `${fleetNumber} has no pre-flight check signed. A mechanic signs the pre-flight before it can be accepted.`,
      };
    case 'due': {
      const preFlight = due.find((d) => d.kind === 'pre_flight');
      return {
        code: preFlight && preFlight.at ? 'preflight_expired' : 'preflight_missing',
        message: `The pre-flight of ${fleetNumber} is no longer valid (${why}). A new pre-flight is needed before it can be accepted.`,
      };
    }
  }
}
