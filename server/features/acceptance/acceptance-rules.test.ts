import { describe, expect, it } from 'vitest';
import { acceptanceRefusal } from './acceptance-rules';

const due = (expired: boolean, at: Date | null = new Date('2026-01-15T21:00:00Z')) => [
  { kind: 'pre_flight' as const, at, expired, reason: 'r' },
];

describe('acceptanceRefusal', () => {
  it('when the airframe is released, then there is no refusal', () => {
    expect(acceptanceRefusal('T-01', 'released', [], due(false))).toBeNull();
  });

  it.each([
    ['on hold', 'hold', due(false), 'airframe_on_hold', /on hold .*shift lead releases/],
    ['never checked', 'not_checked', [], 'preflight_missing', /no pre-flight/],
    ['with an expired pre-flight', 'due', due(true), 'preflight_expired', /no longer valid/],
    [
      'with a pre-flight that needed service',
      'due',
      due(false),
      'preflight_not_in_limits',
      /not wholly in limits/,
    ],
    ['with a check in progress', 'in_progress', due(false), 'check_in_progress', /in progress/],
  ] as const)(
    'when the airframe is %s, then acceptance is refused with %s',
    (_what, state, items, code, message) => {
      const refusal = acceptanceRefusal('T-03', state, ['because'], items);
      expect(refusal?.code).toBe(code);
      expect(refusal?.message).toMatch(message);
      expect(refusal?.message).toContain('T-03');
    },
  );
});
