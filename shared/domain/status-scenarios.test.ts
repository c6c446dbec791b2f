import { describe, expect, it } from 'vitest';
import type { CheckKind, ValidityWindow, Verdict } from '../schemas/limits';
import type { Authorisation } from './authorisation';
import {
  deriveAirframeStatus,
  releaseScope,
  type AirframeState,
  type AirframeStatusInput,
  type Authority,
  type Certificate,
  type Defect,
  type Hold,
  type SignedCheck,
  type UnserviceableCause,
} from './status';
import { inWords } from '../i18n/phrase';

// A table of scenarios for the one serviceability rule. The rules it applies, and where they come from:
// - every finding counts until the records show it cleared; "released" means a certificate of release to service
//   signed by authorised certifying staff: EASA Part-145 145.A.30 and 145.A.50 (from memory); record content
//   14 CFR 43.9 and 43.11 (from memory);
// - deferral limits by MEL category (A as remarked, B 3, C 10, D 120 calendar days, not counting the day of
//   discovery), valid up to the limit and not past it: EASA CS-MMEL / FAA MMEL policy letters (from memory);
// - independent inspection after disturbing, for example, flight controls: EASA Part-145 AMC on error capturing
//   (from memory).
// The windows, people and times are invented. Madeira is UTC+0 in January.

const validity: Partial<Record<CheckKind, ValidityWindow>> = {
  pre_flight: { untilLocalTime: '23:59', hours: 14 },
};
const timeZone = 'Atlantic/Madeira';

const b1: Authorisation = { category: 'B1', typeCodes: ['RX-4'], scope: ['all'], expiresOn: '2026-12-31' };
const otherType: Authorisation = { ...b1, typeCodes: ['RL-2'] };
const expired: Authorisation = { ...b1, expiresOn: '2026-01-10' };
const hydraulicsOnly: Authorisation = { ...b1, scope: ['29'] };

const reading = (code: string, verdict: Verdict) => ({ code, label: code, verdict, ata: '12' });
const allIn = [reading('sys1.level', 'in_limits'), reading('sys2.level', 'in_limits')];

const check = (
  id: string,
  kind: CheckKind,
  signedAt: string,
  readings = allIn,
  signedBy = 'M1',
): SignedCheck => ({
  id,
  kind,
  signedAt,
  signedBy,
  verdict: readings.some((r) => r.verdict === 'out_of_limits')
    ? 'out_of_limits'
    : readings.some((r) => r.verdict === 'service')
      ? 'service'
      : 'in_limits',
  readings,
});

const sys2 = (verdict: Verdict) => [reading('sys1.level', 'in_limits'), reading('sys2.level', verdict)];
const preFlight = check('pf', 'pre_flight', '2026-01-15T07:00:00Z');

const hold = (
  checkId: string,
  openedAt: string,
  countersigns: Hold['countersigns'] = [],
  extra: Partial<Hold> = {},
): Hold => ({
  id: `h-${checkId}`,
  checkId,
  openedAt,
  reason: `finding on ${checkId}`,
  raisedBy: 'M1',
  chapters: ['12'],
  correctiveActionsBy: ['M2'],
  countersigns,
  ...extra,
});
const release = (by: string, at: string, authorisation: Authority, recheckBy = 'M3') => ({
  by,
  at,
  decision: 'release' as const,
  recheckBy,
  authorisation,
});

const defect = (entries: Defect['entries'], extra: Partial<Defect> = {}): Defect => ({
  id: 'd1',
  number: 1,
  raisedAt: '2026-01-15T08:00:00Z',
  raisedBy: 'M1',
  description: 'Chafed hose at the sys 2 pump',
  chapter: '29',
  entries,
  ...extra,
});
const certificate = (at: string, authorisation: Authority = b1): Certificate => ({
  at,
  by: 'C1',
  authorisation,
  chapters: [],
});

interface Scenario {
  name: string;
  now: string;
  input: Partial<AirframeStatusInput>;
  state: AirframeState;
  causes?: UnserviceableCause[];
}

const failed = check('af', 'after_flight', '2026-01-15T09:00:00Z', sys2('service'));
const oolGroundRun = check('gr', 'ground_run', '2026-01-15T09:00:00Z', sys2('out_of_limits'));
const recheck = check('rc', 'ground_run', '2026-01-15T10:00:00Z', allIn, 'M3');

/** The category B deferral with a valid pre-flight of that day, after this many flights in all. */
const deferredBOn = (day: string, flights: number) => ({
  checks: [laterPreFlight(day)],
  defects: [deferredB],
  usage: { hours: 100, flights },
});

/** The ground run held for its finding, its passing re-check, and one release countersign of the hold. */
const releasedGroundRun = (...countersign: Parameters<typeof release>) => ({
  checks: [preFlight, oolGroundRun, recheck],
  holds: [hold('gr', '2026-01-15T09:00:00Z', [release(...countersign)])],
});

const scenarios: Scenario[] = [
  // A finding from each kind of check.
  ...(['pre_flight', 'ground_run', 'after_flight', 'servicing'] as const).map((kind): Scenario => ({
    name: `a ${kind.replace('_', '-')} check finds System 2 below its minimum (service) after a good pre-flight`,
    now: '2026-01-15T12:00:00Z',
    input: { checks: [preFlight, check('x', kind, '2026-01-15T09:00:00Z', sys2('service'))] },
    state: 'unserviceable',
    causes: ['service_needed'],
  })),
  ...(['pre_flight', 'ground_run', 'after_flight', 'servicing'] as const).map((kind): Scenario => ({
    name: `a ${kind.replace('_', '-')} check finds a reading out of limits, with no hold recorded`,
    now: '2026-01-15T12:00:00Z',
    input: { checks: [preFlight, check('x', kind, '2026-01-15T09:00:00Z', sys2('out_of_limits'))] },
    state: 'unserviceable',
    causes: ['on_hold'],
  })),
  {
    name: 'a good pre-flight and nothing else, with no certificate of release',
    now: '2026-01-15T12:00:00Z',
    input: { checks: [preFlight] },
    state: 'checks_in_limits',
  },
  {
    name: 'a good pre-flight and a certificate of release signed after it by an authorised engineer',
    now: '2026-01-15T12:00:00Z',
    input: { checks: [preFlight], certificates: [certificate('2026-01-15T07:30:00Z')] },
    state: 'released',
  },
  {
    name: 'a certificate of release signed under an authorisation for another type',
    now: '2026-01-15T12:00:00Z',
    input: { checks: [preFlight], certificates: [certificate('2026-01-15T07:30:00Z', otherType)] },
    state: 'checks_in_limits',
  },
  // SERVICE findings: cleared by a later reading of the same checkpoint in limits, and only by that.
  {
    name: 'a SERVICE finding cleared by a later servicing check with the same checkpoint in limits',
    now: '2026-01-15T12:00:00Z',
    input: { checks: [preFlight, failed, check('sv', 'servicing', '2026-01-15T10:00:00Z', allIn)] },
    state: 'checks_in_limits',
  },
  {
    name: 'a SERVICE finding followed by a check in limits on other checkpoints only',
    now: '2026-01-15T12:00:00Z',
    input: {
      checks: [
        preFlight,
        failed,
        check('sv', 'servicing', '2026-01-15T10:00:00Z', [reading('sys1.level', 'in_limits')]),
      ],
    },
    state: 'unserviceable',
    causes: ['service_needed'],
  },
  {
    name: 'a SERVICE finding whose re-check found the same checkpoint needing service again',
    now: '2026-01-15T12:00:00Z',
    input: { checks: [preFlight, failed, check('sv', 'servicing', '2026-01-15T10:00:00Z', sys2('service'))] },
    state: 'unserviceable',
    causes: ['service_needed'],
  },
  {
    name: 'a SERVICE finding cleared, then a certificate of release signed before the finding',
    now: '2026-01-15T12:00:00Z',
    input: {
      checks: [preFlight, failed, check('sv', 'servicing', '2026-01-15T10:00:00Z', allIn)],
      certificates: [certificate('2026-01-15T08:00:00Z')],
    },
    state: 'checks_in_limits',
  },
  // OUT OF LIMITS findings: cleared only by a countersigned release that counts.
  {
    name: 'a hold released by an authorised engineer after a passing re-check',
    now: '2026-01-15T12:00:00Z',
    input: releasedGroundRun('C1', '2026-01-15T11:00:00Z', b1),
    state: 'released',
  },
  {
    name: 'a hold "released" by a lead who holds no authorisation',
    now: '2026-01-15T12:00:00Z',
    input: releasedGroundRun('L1', '2026-01-15T11:00:00Z', null),
    state: 'unserviceable',
    causes: ['on_hold'],
  },
  {
    name: 'a hold "released" by a lead authorised for another type',
    now: '2026-01-15T12:00:00Z',
    input: releasedGroundRun('L1', '2026-01-15T11:00:00Z', otherType),
    state: 'unserviceable',
    causes: ['on_hold'],
  },
  {
    name: 'a hold "released" by a lead whose authorisation has expired',
    now: '2026-01-15T12:00:00Z',
    input: releasedGroundRun('L1', '2026-01-15T11:00:00Z', expired),
    state: 'unserviceable',
    causes: ['on_hold'],
  },
  {
    name: 'a hold "released" by a lead authorised for ATA 29 only, for a chapter 12 finding',
    now: '2026-01-15T12:00:00Z',
    input: releasedGroundRun('L1', '2026-01-15T11:00:00Z', hydraulicsOnly),
    state: 'unserviceable',
    causes: ['on_hold'],
  },
  {
    name: 'a hold "released" by the engineer who signed the re-check it rests on',
    now: '2026-01-15T12:00:00Z',
    input: releasedGroundRun('M3', '2026-01-15T11:00:00Z', b1, 'M3'),
    state: 'unserviceable',
    causes: ['on_hold'],
  },
  {
    name: 'a hold whose corrective action needs an independent inspection, released without one',
    now: '2026-01-15T12:00:00Z',
    input: {
      checks: [preFlight, oolGroundRun, recheck],
      holds: [
        hold('gr', '2026-01-15T09:00:00Z', [release('C1', '2026-01-15T11:00:00Z', b1)], {
          needsIndependentInspection: true,
        }),
      ],
    },
    state: 'unserviceable',
    causes: ['on_hold'],
  },
  {
    name: 'the same hold with the independent inspection signed by a second person before the release',
    now: '2026-01-15T12:00:00Z',
    input: {
      checks: [preFlight, oolGroundRun, recheck],
      holds: [
        hold('gr', '2026-01-15T09:00:00Z', [release('C1', '2026-01-15T11:00:00Z', b1)], {
          needsIndependentInspection: true,
          inspections: [{ by: 'I1', at: '2026-01-15T10:30:00Z' }],
        }),
      ],
    },
    state: 'released',
  },
  {
    name: 'a release legacy-signed before authorisations were recorded',
    now: '2026-01-15T12:00:00Z',
    input: releasedGroundRun('L1', '2026-01-15T11:00:00Z', 'legacy'),
    state: 'released',
  },
  // Defects.
  {
    name: 'a defect raised and neither rectified nor deferred',
    now: '2026-01-15T12:00:00Z',
    input: { checks: [preFlight], defects: [defect([])] },
    state: 'unserviceable',
    causes: ['open_defect'],
  },
  {
    name: 'a defect rectified and certified by a second, authorised person',
    now: '2026-01-15T12:00:00Z',
    input: {
      checks: [preFlight],
      defects: [
        defect([
          { kind: 'work', at: '2026-01-15T09:00:00Z', by: 'M2' },
          { kind: 'certification', at: '2026-01-15T10:00:00Z', by: 'C1', authorisation: b1 },
        ]),
      ],
    },
    state: 'released',
  },
  {
    name: 'a defect rectified with the independent inspection still missing',
    now: '2026-01-15T12:00:00Z',
    input: {
      checks: [preFlight],
      defects: [
        defect([
          { kind: 'work', at: '2026-01-15T09:00:00Z', by: 'M2', independentInspection: true },
          { kind: 'certification', at: '2026-01-15T10:00:00Z', by: 'C1', authorisation: b1 },
        ]),
      ],
    },
    state: 'unserviceable',
    causes: ['open_defect'],
  },
  {
    name: 'a defect whose only inspection was signed by the person who did the work',
    now: '2026-01-15T12:00:00Z',
    input: {
      checks: [preFlight],
      defects: [
        defect([
          { kind: 'work', at: '2026-01-15T09:00:00Z', by: 'M2', independentInspection: true },
          { kind: 'inspection', at: '2026-01-15T09:30:00Z', by: 'M2' },
          { kind: 'certification', at: '2026-01-15T10:00:00Z', by: 'C1', authorisation: b1 },
        ]),
      ],
    },
    state: 'unserviceable',
    causes: ['open_defect'],
  },
  {
    name: 'a defect deferred by an unauthorised lead',
    now: '2026-01-15T12:00:00Z',
    input: {
      checks: [preFlight],
      defects: [
        defect([
          {
            kind: 'deferral',
            at: '2026-01-15T09:00:00Z',
            by: 'L1',
            authorisation: otherType,
            limit: { at: '2026-01-18T23:59:59.999Z' },
          },
        ]),
      ],
    },
    state: 'unserviceable',
    causes: ['open_defect'],
  },
];

// Category B found on 15 January: 3 calendar days after the day of discovery, so valid to the end of 18 January.
const deferredB = defect([
  {
    kind: 'deferral',
    at: '2026-01-15T09:00:00Z',
    by: 'C1',
    authorisation: b1,
    limit: { at: '2026-01-18T23:59:59.999Z', flights: 212 },
  },
]);
const laterPreFlight = (day: string) => check('pf2', 'pre_flight', `${day}T07:00:00Z`);

scenarios.push(
  {
    name: 'a category B deferral at the very instant of its limit',
    now: '2026-01-18T23:59:59.999Z',
    // A 24 h pre-flight window here, so the local end of day does not end the pre-flight first.
    input: {
      validity: { pre_flight: { hours: 24 } },
      checks: [laterPreFlight('2026-01-18')],
      defects: [deferredB],
      usage: { hours: 100, flights: 200 },
    },
    state: 'checks_in_limits',
  },
  {
    name: 'the same deferral one millisecond past its limit',
    now: '2026-01-19T00:00:00.000Z',
    input: deferredBOn('2026-01-19', 200),
    state: 'unserviceable',
    causes: ['deferral_expired'],
  },
  {
    name: 'the same deferral at its flight limit (flight 212 flown)',
    now: '2026-01-16T12:00:00Z',
    input: deferredBOn('2026-01-16', 212),
    state: 'checks_in_limits',
  },
  {
    name: 'the same deferral past its limit in flights (flight 213 flown)',
    now: '2026-01-16T12:00:00Z',
    input: deferredBOn('2026-01-16', 213),
    state: 'unserviceable',
    causes: ['deferral_expired'],
  },
  {
    name: 'a deferred defect with a certificate of release signed after the deferral',
    now: '2026-01-16T12:00:00Z',
    input: {
      ...deferredBOn('2026-01-16', 205),
      certificates: [certificate('2026-01-15T09:30:00Z')],
    },
    state: 'released',
  },
  {
    name: 'a finding signed after the certificate of release, even once cleared',
    now: '2026-01-15T12:00:00Z',
    input: {
      checks: [preFlight, failed, check('sv', 'servicing', '2026-01-15T10:00:00Z', allIn)],
      certificates: [certificate('2026-01-15T07:30:00Z')],
    },
    state: 'checks_in_limits',
  },
  {
    name: 'a check in progress on an airframe whose checks are in limits',
    now: '2026-01-15T12:00:00Z',
    input: {
      checks: [preFlight],
      inProgress: [{ id: 'd', kind: 'ground_run', startedAt: '2026-01-15T11:50:00Z', startedBy: 'M2' }],
    },
    state: 'in_progress',
  },
  {
    name: 'an open finding on an airframe with a check in progress (the finding wins)',
    now: '2026-01-15T12:00:00Z',
    input: {
      checks: [preFlight, failed],
      inProgress: [{ id: 'd', kind: 'servicing', startedAt: '2026-01-15T11:50:00Z', startedBy: 'M2' }],
    },
    state: 'unserviceable',
    causes: ['service_needed'],
  },
  {
    name: 'a pre-flight past its 14 h edge, nothing open',
    now: '2026-01-15T21:00:00Z',
    input: { checks: [preFlight] },
    state: 'due',
  },
  {
    name: 'nothing ever signed',
    now: '2026-01-15T21:00:00Z',
    input: {},
    state: 'not_checked',
  },
);

describe('airframe state scenarios', () => {
  it.each(scenarios)('when $name, then the airframe is $state', ({ now, input, state, causes }) => {
    const result = deriveAirframeStatus({ now, timeZone, typeCode: 'RX-4', validity, checks: [], ...input });
    expect(result.state).toBe(state);
    expect(result.causes).toEqual(causes ?? []);
  });

  it('when a SERVICE finding is open, then the reason names the checkpoint and the check in words, with no code or ISO time', () => {
    const result = deriveAirframeStatus({
      now: '2026-01-15T12:00:00Z',
      timeZone,
      typeCode: 'RX-4',
      validity,
      checks: [
        preFlight,
        check('af', 'after_flight', '2026-01-15T09:00:00Z', [
          { code: 'sys2.level', label: 'System 2 reservoir level', verdict: 'service', ata: '12' },
        ]),
      ],
    });
    expect(inWords(result.reasons)).toEqual([
      'System 2 reservoir level needs service (found on the after-flight check of 15 Jan 2026, 09:00 UTC)',
    ]);
  });

  it('when a hold release does not count, then the reason says why', () => {
    const result = deriveAirframeStatus({
      now: '2026-01-15T12:00:00Z',
      timeZone,
      typeCode: 'RX-4',
      validity,
      checks: [preFlight, oolGroundRun, recheck],
      holds: [hold('gr', '2026-01-15T09:00:00Z', [release('L1', '2026-01-15T11:00:00Z', expired)])],
    });
    expect(inWords(result.reasons)).toEqual([
      'On hold: finding on gr (a release was signed but does not count: the authorisation expired on 10 Jan 2026)',
    ]);
  });

  it('when a deferral counts down, then its state carries the limit in words and the instant for a countdown', () => {
    const result = deriveAirframeStatus({
      now: '2026-01-16T12:00:00Z',
      timeZone,
      typeCode: 'RX-4',
      validity,
      checks: [laterPreFlight('2026-01-16')],
      defects: [deferredB],
      usage: { hours: 100, flights: 205 },
    });
    expect(result.defects).toHaveLength(1);
    expect(inWords(result.defects[0])).toMatchObject({
      status: 'deferred',
      reason: 'deferred until 18 Jan 2026, 23:59 UTC or until flight 212',
    });
    expect(result.defects[0]?.deferral?.limit.at).toBe('2026-01-18T23:59:59.999Z');
  });
});

describe('what a new certificate of release would cover', () => {
  const input = (extra: Partial<AirframeStatusInput>): AirframeStatusInput => ({
    now: '2026-01-15T12:00:00Z',
    timeZone,
    typeCode: 'RX-4',
    validity,
    checks: [],
    ...extra,
  });

  it('when nothing was ever certified, then the scope is every finding and defect, and the re-check signers are named', () => {
    const scope = releaseScope(
      input({
        checks: [preFlight, failed, check('sv', 'servicing', '2026-01-15T10:00:00Z', allIn, 'M9')],
        defects: [defect([])],
      }),
    );
    expect(scope).toEqual({ since: null, chapters: ['12', '29'], recheckSigners: ['M9'] });
  });

  it('when a certificate counts, then only what came after it is in scope', () => {
    const scope = releaseScope(
      input({
        checks: [preFlight, failed, check('sv', 'servicing', '2026-01-15T10:00:00Z', allIn, 'M9')],
        certificates: [certificate('2026-01-15T09:30:00Z')],
        defects: [defect([], { chapter: '32', raisedAt: '2026-01-15T08:00:00Z' })],
      }),
    );
    expect(scope).toEqual({
      since: new Date('2026-01-15T09:30:00Z'),
      chapters: [],
      recheckSigners: ['M9'],
    });
  });

  it('when the only certificate was signed under an expired authorisation, then it does not bound the scope', () => {
    const scope = releaseScope(
      input({ checks: [preFlight, failed], certificates: [certificate('2026-01-15T09:30:00Z', expired)] }),
    );
    expect(scope.since).toBeNull();
    expect(scope.chapters).toEqual(['12']);
  });
});

const at = (now: string, extra: Partial<AirframeStatusInput>) =>
  deriveAirframeStatus({ now, timeZone, typeCode: 'RX-4', validity, checks: [preFlight], ...extra });
const work = (t: string, by = 'M2', independentInspection = false) =>
  ({ kind: 'work', at: t, by, independentInspection }) as const;
const certification = (t: string, by = 'C1') =>
  ({ kind: 'certification', at: t, by, authorisation: b1 }) as const;

describe('edges of the rule that a table row reaches only one way', () => {
  it('when a deferral is signed after the certificate of release, then the certificate no longer covers it', () => {
    const deferredLater = defect([
      {
        kind: 'deferral',
        at: '2026-01-15T10:00:00Z',
        by: 'C1',
        authorisation: b1,
        limit: { at: '2026-01-25T23:59:59.999Z' },
      },
    ]);
    const result = at('2026-01-15T12:00:00Z', {
      defects: [deferredLater],
      certificates: [certificate('2026-01-15T09:00:00Z')],
    });
    expect(result.state).toBe('checks_in_limits');
    expect(result.release).toBeNull();
    expect(inWords(result.reasons)).toContain(
      'No certificate of release to service since the last finding, defect or deferral',
    );
  });

  it('when records are dated after now, then they do not count yet', () => {
    const result = at('2026-01-15T12:00:00Z', {
      defects: [defect([], { raisedAt: '2026-01-15T13:00:00Z' })],
      certificates: [certificate('2026-01-15T12:30:00Z')],
    });
    expect(result.state).toBe('checks_in_limits');
    expect(inWords(result.reasons)).toContain('No certificate of release to service recorded');
    const rectifiedLater = defect([work('2026-01-15T09:00:00Z'), certification('2026-01-15T13:00:00Z')]);
    expect(at('2026-01-15T12:00:00Z', { defects: [rectifiedLater] }).causes).toEqual(['open_defect']);
  });

  it('when a defect is certified with no work recorded before the certification, then it stays open and says why', () => {
    const result = at('2026-01-15T12:00:00Z', {
      defects: [defect([certification('2026-01-15T09:00:00Z'), work('2026-01-15T10:00:00Z')])],
    });
    expect(result.causes).toEqual(['open_defect']);
    expect(inWords(result.defects[0]?.reason)).toBe('certified with no work recorded');
    expect(inWords(result.reasons)).toEqual([
      'Defect 1 open, certified with no work recorded: Chafed hose at the sys 2 pump',
    ]);
  });

  it('when the independent inspection came before the latest work, then it does not cover that work', () => {
    const result = at('2026-01-15T12:00:00Z', {
      defects: [
        defect(
          [
            work('2026-01-15T09:00:00Z'),
            { kind: 'inspection', at: '2026-01-15T09:30:00Z', by: 'I1' },
            work('2026-01-15T10:00:00Z', 'M3'),
            certification('2026-01-15T11:00:00Z'),
          ],
          { needsIndependentInspection: true },
        ),
      ],
    });
    expect(result.causes).toEqual(['open_defect']);
    expect(inWords(result.defects[0]?.reason)).toBe(
      'rectified, but the independent inspection by a second person is missing',
    );
  });
});

describe('edges of the rule: holds, deferrals and checks in progress', () => {
  it("when a hold is open, then its finding's defect is listed but the cause is the hold alone", () => {
    const result = at('2026-01-15T12:00:00Z', {
      checks: [preFlight, oolGroundRun],
      holds: [hold('gr', '2026-01-15T09:00:00Z')],
      defects: [defect([], { id: 'd9', number: 9, holdId: 'h-gr', raisedAt: '2026-01-15T09:00:00Z' })],
    });
    expect(result.causes).toEqual(['on_hold']);
    expect(inWords(result.defects)).toEqual([
      expect.objectContaining({
        number: 9,
        status: 'open',
        reason: 'on hold until its release is countersigned',
      }),
    ]);
    const released = at('2026-01-15T12:00:00Z', {
      checks: [preFlight, oolGroundRun, recheck],
      holds: [hold('gr', '2026-01-15T09:00:00Z', [release('C1', '2026-01-15T11:00:00Z', b1)])],
      defects: [defect([], { id: 'd9', number: 9, holdId: 'h-gr', raisedAt: '2026-01-15T09:00:00Z' })],
    });
    expect(released.state).toBe('released');
    expect(released.defects).toEqual([]);
  });

  it('when a deferral runs out, then the reason names the defect and the limit that passed', () => {
    const result = at('2026-01-19T06:00:00Z', {
      validity: { pre_flight: { hours: 24 } },
      checks: [laterPreFlight('2026-01-19')],
      defects: [deferredB],
      usage: { hours: 100, flights: 200 },
    });
    expect(inWords(result.reasons)).toEqual([
      'Defect 1: deferral ran out: its limit of 18 Jan 2026, 23:59 UTC has passed',
    ]);
  });

  it('when a check is in progress, then the reason says which and since when; with nothing signed, that no pre-flight was', () => {
    expect(
      at('2026-01-15T12:00:00Z', {
        inProgress: [{ id: 'd', kind: 'ground_run', startedAt: '2026-01-15T11:50:00Z', startedBy: 'M2' }],
      }).reasons.map((reason) => inWords(reason)),
    ).toEqual(['Ground run in progress since 15 Jan 2026, 11:50 UTC']);
    const never = deriveAirframeStatus({ now: '2026-01-15T12:00:00Z', timeZone, validity, checks: [] });
    expect(inWords(never.reasons)).toEqual(['no pre-flight signed']);
    expect(inWords(never.due)).toEqual([
      { kind: 'pre_flight', at: null, expired: true, reason: 'no pre-flight signed' },
    ]);
  });
});
