import type { AirframeState } from '../../../shared/schemas/api';
import type { DueItem } from '../../../shared/domain/status';

export interface AcceptanceRefusal {
  code:
    | 'airframe_on_hold'
    | 'preflight_missing'
    | 'preflight_expired'
    | 'preflight_not_in_limits'
    | 'check_in_progress';
  message: string;
}

/** Why a pilot cannot accept the airframe now, in words that say what has to happen first; null when they can. */
export function acceptanceRefusal(
  fleetNumber: string,
  state: AirframeState,
  reasons: readonly string[],
  due: readonly DueItem[],
): AcceptanceRefusal | null {
  const why = reasons.join('; ');
  switch (state) {
    case 'released':
      return null;
    case 'hold':
      return {
        code: 'airframe_on_hold',
        message: `${fleetNumber} is on hold (${why}). It cannot be accepted until a shift lead releases it.`,
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
      if (!preFlight || preFlight.expired) {
        return {
          code: preFlight && preFlight.at ? 'preflight_expired' : 'preflight_missing',
          message: `The pre-flight of ${fleetNumber} is no longer valid (${why}). A new pre-flight is needed before it can be accepted.`,
        };
      }
      return {
        code: 'preflight_not_in_limits',
        message: `The latest pre-flight of ${fleetNumber} was not wholly in limits (${why}). It needs servicing and a new pre-flight before it can be accepted.`,
      };
    }
  }
}
