import { describe, expect, it } from 'vitest';
import type { ValidityWindow } from '../schemas/limits';
import {
  canCountersign,
  deriveAirframeStatus,
  type AirframeState,
  type Hold,
  type SignedCheck,
} from './status';

// Invented windows in the demo's spirit (RX-4): pre-flight until local 23:59 and at most 14 h. Madeira is UTC+0 in January.
const validity: Partial<Record<SignedCheck['kind'], ValidityWindow>> = {
  pre_flight: { untilLocalTime: '23:59', hours: 14 },
};
const timeZone = 'Atlantic/Madeira';

const check = (
  id: string,
  signedAt: string,
  verdict: SignedCheck['verdict'] = 'in_limits',
  signedBy = 'M1',
): SignedCheck => ({
  id,
  kind: 'pre_flight',
  signedAt,
  signedBy,
  verdict,
});
const hold = (
  id: string,
  checkId: string,
  openedAt: string,
  countersigns: Hold['countersigns'] = [],
  raisedBy = 'M1',
): Hold => ({
  id,
  checkId,
  openedAt,
  reason: `finding on ${checkId}`,
  raisedBy,
  countersigns,
});

interface Scenario {
  name: string;
  now: string;
  checks: SignedCheck[];
  holds?: Hold[];
  state: AirframeState;
}

const failed = check('c1', '2026-01-15T07:00:00Z', 'out_of_limits');
const recheck = check('c2', '2026-01-15T08:00:00Z');
const release = (by: string, at = '2026-01-15T08:30:00Z') => ({ by, at, decision: 'release' as const });

const scenarios: Scenario[] = [
  {
    name: 'a pre-flight signed 07:00 one millisecond before its 14 h edge is released',
    now: '2026-01-15T20:59:59.999Z',
    checks: [check('c1', '2026-01-15T07:00:00Z')],
    state: 'released',
  },
  {
    name: 'the same pre-flight at the edge instant itself is due (valid up to, not including, the edge)',
    now: '2026-01-15T21:00:00.000Z',
    checks: [check('c1', '2026-01-15T07:00:00Z')],
    state: 'due',
  },
  {
    name: 'a pre-flight signed 12:00 is due at local 23:59 before its 14 h run out',
    now: '2026-01-15T23:59:00.000Z',
    checks: [check('c1', '2026-01-15T12:00:00Z')],
    state: 'due',
  },
  {
    name: 'a re-check that passes does not by itself close the hold',
    now: '2026-01-15T09:00:00Z',
    checks: [failed, recheck],
    holds: [hold('h1', 'c1', failed.signedAt as string)],
    state: 'hold',
  },
  {
    name: 'a re-check that passes and a release countersigned by another person release the airframe',
    now: '2026-01-15T09:00:00Z',
    checks: [failed, recheck],
    holds: [hold('h1', 'c1', failed.signedAt as string, [release('L1')])],
    state: 'released',
  },
  {
    name: 'a release countersigned by the person who signed the held check does not count',
    now: '2026-01-15T09:00:00Z',
    checks: [failed, recheck],
    holds: [hold('h1', 'c1', failed.signedAt as string, [release('M1')])],
    state: 'hold',
  },
  {
    name: 'a release dated after now does not count yet',
    now: '2026-01-15T08:15:00Z',
    checks: [failed, recheck],
    holds: [hold('h1', 'c1', failed.signedAt as string, [release('L1', '2026-01-15T08:30:00Z')])],
    state: 'hold',
  },
  {
    name: 'a "keep" after a release leaves the hold open',
    now: '2026-01-15T09:00:00Z',
    checks: [failed, recheck],
    holds: [
      hold('h1', 'c1', failed.signedAt as string, [
        release('L1'),
        { by: 'L2', at: '2026-01-15T08:45:00Z', decision: 'keep' },
      ]),
    ],
    state: 'hold',
  },
  {
    name: 'a hold opened after a release puts the airframe on hold again',
    now: '2026-01-15T11:00:00Z',
    checks: [failed, recheck, check('c3', '2026-01-15T10:00:00Z', 'out_of_limits')],
    holds: [
      hold('h1', 'c1', failed.signedAt as string, [release('L1')]),
      hold('h2', 'c3', '2026-01-15T10:00:00Z'),
    ],
    state: 'hold',
  },
  {
    name: 'an out-of-limits check with no hold recorded against it still holds the airframe',
    now: '2026-01-15T09:00:00Z',
    checks: [failed],
    state: 'hold',
  },
];

describe('airframe state scenarios', () => {
  it.each(scenarios)('when $name, then the state is $state', ({ now, checks, holds, state }) => {
    expect(deriveAirframeStatus({ now, timeZone, validity, checks, holds: holds ?? [] }).state).toBe(state);
  });

  it('when the person who signed the held check asks to countersign, then it is refused with a reason; another lead may', () => {
    const refused = canCountersign({ raisedBy: 'M1' }, 'M1');
    expect(refused.allowed).toBe(false);
    expect(refused.reason).toMatch(/another shift lead/);
    expect(canCountersign({ raisedBy: 'M1' }, 'L1')).toEqual({ allowed: true });
  });
});
