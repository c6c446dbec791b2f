import { describe, expect, it } from 'vitest';
import type { ValidityWindow } from '../schemas/limits';
import {
  canCountersign,
  checkValidUntil,
  deriveAirframeStatus,
  isHoldOpen,
  type AirframeStatusInput,
  type Hold,
  type SignedCheck,
} from './status';
import { inWords } from '../i18n/phrase';

// Invented windows in the demo's spirit; Atlantic/Madeira is UTC+0 in January and UTC+1 in July.
const validity: Partial<Record<SignedCheck['kind'], ValidityWindow>> = {
  pre_flight: { untilLocalTime: '23:59', hours: 14 },
  ground_run: { flights: 1 },
  after_flight: { hours: 12 },
};
const timeZone = 'Atlantic/Madeira';

const preFlight = (
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
  readings: [{ code: 'sys1.level', verdict }],
});

// Authorised for the type, all chapters (EASA Part-145 145.A.30, from memory); invented dates.
const b1 = { category: 'B1' as const, typeCodes: ['RX-4'], scope: ['all'], expiresOn: '2026-12-31' };

const status = (now: string, rest: Partial<AirframeStatusInput>) =>
  deriveAirframeStatus({ now, timeZone, typeCode: 'RX-4', validity, checks: [], ...rest });

describe('checkValidUntil', () => {
  it.each([
    [
      'an early winter signing, the 14 h limit comes first',
      '2026-01-15T07:00:00Z',
      '2026-01-15T21:00:00.000Z',
    ],
    [
      'a midday winter signing, the end of the local day comes first',
      '2026-01-15T12:00:00Z',
      '2026-01-15T23:59:00.000Z',
    ],
    ['a midday summer signing, local 23:59 is 22:59 UTC', '2026-07-15T12:00:00Z', '2026-07-15T22:59:00.000Z'],
    [
      'a signing after local 23:59, the next local 23:59 (capped by 14 h)',
      '2026-01-15T23:59:30Z',
      '2026-01-16T13:59:30.000Z',
    ],
  ])('when the pre-flight has %s, then it is valid until %s', (_what, signedAt, until) => {
    expect(checkValidUntil(signedAt, { untilLocalTime: '23:59', hours: 14 }, timeZone)?.toISOString()).toBe(
      until,
    );
  });

  it('when a window has only a flight count, then it has no time limit', () => {
    expect(checkValidUntil('2026-01-15T07:00:00Z', { flights: 1 }, timeZone)).toBeNull();
  });
});

const signedAt = '2026-01-15T12:00:00Z';

describe('deriveAirframeStatus', () => {
  it.each([
    // now, state: the pre-flight is valid up to, not including, its expiry instant (23:59 local)
    ['2026-01-15T12:00:00.000Z', 'checks_in_limits'],
    ['2026-01-15T23:58:59.999Z', 'checks_in_limits'],
    ['2026-01-15T23:59:00.000Z', 'due'],
    ['2026-01-16T06:00:00.000Z', 'due'],
  ])('when it is %s after a pre-flight signed at noon, then the airframe is %s', (now, state) => {
    const result = status(now, { checks: [preFlight('c1', signedAt)] });
    expect(result.state).toBe(state);
    if (state !== 'due') expect(result.validUntil?.toISOString()).toBe('2026-01-15T23:59:00.000Z');
  });

  it('when nothing was ever signed, then the airframe is not checked', () => {
    expect(status('2026-01-15T08:00:00Z', {}).state).toBe('not_checked');
  });

  it('when a check is in progress, then the airframe is in progress even with a valid pre-flight', () => {
    const result = status('2026-01-15T13:00:00Z', {
      checks: [preFlight('c1', signedAt)],
      inProgress: [{ id: 'c2', kind: 'ground_run', startedAt: '2026-01-15T12:30:00Z', startedBy: 'M2' }],
    });
    expect(result.state).toBe('in_progress');
  });

  it('when the latest pre-flight needed servicing, then the airframe is unserviceable for service', () => {
    const result = status('2026-01-15T13:00:00Z', { checks: [preFlight('c1', signedAt, 'service')] });
    expect(result.state).toBe('unserviceable');
    expect(result.causes).toEqual(['service_needed']);
  });

  it('when a hold is opened after a release, then the airframe goes on hold', () => {
    const hold: Hold = {
      id: 'h1',
      openedAt: '2026-01-15T15:00:00Z',
      reason: 'leak at brake unit',
      raisedBy: 'M2',
    };
    const checks = [preFlight('c1', signedAt)];
    expect(status('2026-01-15T14:59:59Z', { checks, holds: [hold] }).state).toBe('checks_in_limits');
    const held = status('2026-01-15T15:00:00Z', { checks, holds: [hold] });
    expect(held.state).toBe('unserviceable');
    expect(held.causes).toEqual(['on_hold']);
    expect(held.openHolds).toEqual(['h1']);
    expect(inWords(held.reasons)).toEqual(['On hold: leak at brake unit']);
  });

  it('when an out-of-limits check was signed with no hold recorded, then the airframe is on hold anyway', () => {
    expect(
      status('2026-01-15T13:00:00Z', { checks: [preFlight('c1', signedAt, 'out_of_limits')] }).state,
    ).toBe('unserviceable');
  });
});

describe('deriveAirframeStatus: release, and a window that ran out', () => {
  describe('a failed pre-flight, a passing re-check and the release', () => {
    const checks = [
      preFlight('c1', '2026-01-15T06:00:00Z', 'out_of_limits'),
      preFlight('c2', '2026-01-15T07:00:00Z', 'in_limits', 'M1'),
    ];
    const hold = (countersigns: Hold['countersigns']): Hold => ({
      id: 'h1',
      checkId: 'c1',
      openedAt: '2026-01-15T06:00:00Z',
      reason: 'sys1 level below isolation',
      raisedBy: 'M1',
      countersigns,
    });

    it('when the re-check passes but nobody has countersigned, then the hold stays', () => {
      expect(status('2026-01-15T08:00:00Z', { checks, holds: [hold([])] }).state).toBe('unserviceable');
    });

    it('when the signer of the check "releases" it himself, then the hold stays', () => {
      const selfRelease = hold([
        { by: 'M1', at: '2026-01-15T07:30:00Z', decision: 'release', authorisation: b1 },
      ]);
      expect(isHoldOpen(selfRelease, '2026-01-15T08:00:00Z', 'RX-4')).toBe(true);
      expect(status('2026-01-15T08:00:00Z', { checks, holds: [selfRelease] }).state).toBe('unserviceable');
    });

    it('when another, authorised person countersigns the release, then that release is a certificate in force', () => {
      const released = hold([
        { by: 'L2', at: '2026-01-15T07:30:00Z', decision: 'release', authorisation: b1 },
      ]);
      expect(status('2026-01-15T07:29:59Z', { checks, holds: [released] }).state).toBe('unserviceable');
      const after = status('2026-01-15T08:00:00Z', { checks, holds: [released] });
      expect(after.state).toBe('released');
      expect(after.release).toEqual({ by: 'L2', at: new Date('2026-01-15T07:30:00Z') });
    });

    it('when a later countersign keeps the hold after a release, then the hold is open again', () => {
      const kept = hold([
        { by: 'L2', at: '2026-01-15T07:30:00Z', decision: 'release', authorisation: b1 },
        { by: 'L3', at: '2026-01-15T07:40:00Z', decision: 'keep' },
      ]);
      expect(isHoldOpen(kept, '2026-01-15T08:00:00Z', 'RX-4')).toBe(true);
    });

    it('when the hold is released and the only pre-flight is the held one, then the pre-flight still counts as signed', () => {
      const released = hold([
        { by: 'L2', at: '2026-01-15T06:30:00Z', decision: 'release', authorisation: b1 },
      ]);
      expect(status('2026-01-15T06:45:00Z', { checks: checks.slice(0, 1), holds: [released] }).state).toBe(
        'released',
      );
    });
  });

  it('when a ground run has been followed by its one flight, then it shows as expired in the due list', () => {
    const groundRun: SignedCheck = {
      id: 'g1',
      kind: 'ground_run',
      signedAt,
      signedBy: 'M1',
      verdict: 'in_limits',
      readings: [],
      flightsSince: 1,
    };
    const result = status('2026-01-15T13:00:00Z', { checks: [preFlight('c1', signedAt), groundRun] });
    expect(result.state).toBe('checks_in_limits');
    expect(result.due.find((d) => d.kind === 'ground_run')).toMatchObject({ at: null, expired: true });
    expect(result.due.find((d) => d.kind === 'pre_flight')).toMatchObject({ expired: false });
  });
});

describe('canCountersign', () => {
  it('when the person who signed the check tries to countersign its hold, then it is refused', () => {
    const decision = canCountersign({ raisedBy: 'M1' }, 'M1');
    expect(decision.allowed).toBe(false);
    expect(decision.reason).toMatch(/another shift lead/);
  });

  it('when someone else countersigns, then it is allowed', () => {
    expect(canCountersign({ raisedBy: 'M1' }, 'L2')).toEqual({ allowed: true });
  });
});
