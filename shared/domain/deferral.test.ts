import { describe, expect, it } from 'vitest';
import i18next from 'i18next';
import { deferralLimit, deferralState, type LimitOutcome } from './deferral';
import { phraseWords } from '../i18n/phrase';

// MEL rectification intervals as commonly published (from memory; EASA CS-MMEL, FAA MMEL policy letters):
// B 3, C 10, D 120 consecutive calendar days, not counting the day of discovery; A as the item's remarks say.
// The discovery instant and the zone are invented (UTC+0 in January, UTC+1 in July).
const zone = 'Atlantic/Madeira';
const found = new Date('2026-01-15T09:00:00Z');
const usage = { hours: 1200.5, flights: 300 };
const reasonIn = (outcome: LimitOutcome, language: string) =>
  outcome.ok ? null : phraseWords(outcome.reason, i18next.getFixedT(language));

describe('deferralLimit', () => {
  it.each([
    ['B', '2026-01-18T23:59:59.999Z'],
    ['C', '2026-01-25T23:59:59.999Z'],
    ['D', '2026-05-15T22:59:59.999Z'],
  ] as const)(
    'when a defect found on 15 January is deferred under category %s, then it holds until %s',
    (category, until) => {
      const outcome = deferralLimit({ category }, found, found, usage, zone);
      expect(outcome.ok && new Date(outcome.limit.at!).toISOString()).toBe(until);
    },
  );

  it('when a shorter last day is asked for, then that day ends the deferral', () => {
    const outcome = deferralLimit({ category: 'C', untilDay: '2026-01-20' }, found, found, usage, zone);
    expect(outcome.ok && new Date(outcome.limit.at!).toISOString()).toBe('2026-01-20T23:59:59.999Z');
  });

  it('when the last day asked for is in the past, then it is refused naming the field', () => {
    const outcome = deferralLimit({ category: 'C', untilDay: '2026-01-14' }, found, found, usage, zone);
    expect(outcome).toMatchObject({ ok: false, field: 'untilDay' });
    expect(reasonIn(outcome, 'en')).toBe(
      "The deferral limit 14 Jan 2026 is in the past. Give today's date or later.",
    );
    expect(reasonIn(outcome, 'de')).toBe(
      'Die Frist der Zurückstellung, 14. Jan. 2026, liegt in der Vergangenheit. Geben Sie das heutige Datum oder ein späteres an.',
    );
  });

  it('when the last day asked for is beyond the category, then it is refused with the category last day', () => {
    const outcome = deferralLimit({ category: 'B', untilDay: '2026-01-19' }, found, found, usage, zone);
    expect(outcome).toMatchObject({ ok: false, field: 'untilDay' });
    expect(reasonIn(outcome, 'en')).toBe(
      'Category B allows 3 calendar days after the day of discovery: the last day is 18 Jan 2026.',
    );
  });

  it("when a category's interval has already run out, then it can no longer be deferred under it", () => {
    const outcome = deferralLimit({ category: 'B' }, found, new Date('2026-01-19T10:00:00Z'), usage, zone);
    expect(outcome.ok).toBe(false);
    // On the base's clock, as the limit is set, whoever reads it.
    expect(reasonIn(outcome, 'en')).toMatch(
      /^Category B's interval for this defect ran out at 18 Jan 2026, 23:59 /,
    );
  });

  it('when category A gives no limit, then it is refused; with flight hours, the limit is the airframe hours plus those', () => {
    expect(deferralLimit({ category: 'A' }, found, found, usage, zone).ok).toBe(false);
    const outcome = deferralLimit({ category: 'A', hours: 10, flights: 4 }, found, found, usage, zone);
    expect(outcome).toEqual({ ok: true, limit: { at: null, hours: 1210.5, flights: 304 } });
  });
});

describe('deferralState', () => {
  const limit = { at: '2026-01-18T23:59:59.999Z', hours: 1210.5, flights: 304 };
  it.each([
    ['at the calendar limit instant', '2026-01-18T23:59:59.999Z', usage, false],
    ['one millisecond after it', '2026-01-19T00:00:00.000Z', usage, true],
    ['at the hours limit', '2026-01-16T00:00:00Z', { hours: 1210.5, flights: 300 }, false],
    ['one tenth of an hour past it', '2026-01-16T00:00:00Z', { hours: 1210.6, flights: 300 }, true],
    ['at the flight limit', '2026-01-16T00:00:00Z', { hours: 1201, flights: 304 }, false],
    ['one flight past it', '2026-01-16T00:00:00Z', { hours: 1201, flights: 305 }, true],
  ])('when it is %s, then expired is %s', (_what, now, at, expired) => {
    expect(deferralState(limit, new Date(now), at).expired).toBe(expired);
  });
});
