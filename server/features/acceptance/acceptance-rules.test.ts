import { describe, expect, it } from 'vitest';
import { acceptanceRefusal } from './acceptance-rules';
import { phrase, phraseWords } from '@shared/i18n/phrase';
import { englishTranslate } from '@shared/i18n/translate';

const due = (expired: boolean, at: Date | null = new Date('2026-01-15T21:00:00Z')) => [
  { kind: 'pre_flight' as const, at, expired, reason: phrase('noPreFlight') },
];

describe('acceptanceRefusal', () => {
  it.each(['released', 'checks_in_limits'] as const)(
    'when the airframe is %s, then there is no refusal',
    (state) => {
      expect(acceptanceRefusal('T-01', state, [], due(false))).toBeNull();
    },
  );

  it.each([
    ['on hold', 'unserviceable', due(false), ['on_hold'], 'airframe_on_hold', /unserviceable: it is on hold/],
    [
      'in need of service',
      'unserviceable',
      due(false),
      ['service_needed'],
      'airframe_unserviceable',
      /unserviceable: a reading needs service/,
    ],
    [
      'with an open defect',
      'unserviceable',
      due(false),
      ['open_defect'],
      'airframe_unserviceable',
      /a defect is open, neither rectified nor deferred/,
    ],
    [
      'past a deferral limit',
      'unserviceable',
      due(false),
      ['deferral_expired'],
      'airframe_unserviceable',
      /a deferred defect is past its limit/,
    ],
    ['never checked', 'not_checked', [], [], 'preflight_missing', /no pre-flight/],
    ['with an expired pre-flight', 'due', due(true), [], 'preflight_expired', /no longer valid/],
    ['with a check in progress', 'in_progress', due(false), [], 'check_in_progress', /in progress/],
  ] as const)(
    'when the airframe is %s, then acceptance is refused with %s',
    (_what, state, items, causes, code, message) => {
      const refusal = acceptanceRefusal('T-03', state, [phrase('noRelease')], items, causes);
      expect(refusal?.code).toBe(code);
      const words = phraseWords(refusal!.phrase, englishTranslate());
      expect(words).toMatch(message);
      expect(words).toContain('T-03');
    },
  );
});
