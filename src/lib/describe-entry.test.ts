import { describe, expect, it } from 'vitest';
import { describeEntry, describeReading } from './describe-entry';

describe('a reading is described one way on the kiosk and at the desk', () => {
  it('When a value, a level position or an answer was entered, then it reads in words, in the unit entered', () => {
    expect(describeEntry({ value: 3000, unit: 'psi' })).toMatch(/^3,?000 psi$/);
    expect(describeEntry({ position: 'between_minimum_normal' })).toBe('Between minimum and normal');
    expect(describeEntry({ position: 'at_normal' })).toBe('At normal');
    expect(describeEntry({ answer: true })).toBe('Yes');
    expect(describeEntry({ answer: false })).toBe('No');
  });

  it('When a leak was counted, then it reads in drops per minute with static or dynamic; none reads "No leak"', () => {
    expect(describeEntry({ dropsPerMinute: 0 })).toBe('No leak');
    expect(describeEntry({ dropsPerMinute: 3, leakState: 'dynamic' })).toBe('3 drops/min, dynamic');
    expect(describeEntry({ dropsPerMinute: 0, leakState: 'static' })).toBe('0 drops/min, static');
  });

  it("When a judged leak is shown, then it says what it means in the trade's words", () => {
    expect(describeReading({ dropsPerMinute: 0 }, 'in_limits')).toBe('No leak — satisfactory');
    expect(describeReading({ dropsPerMinute: 3, leakState: 'dynamic' }, 'in_limits')).toBe(
      '3 drops/min, dynamic — within limits',
    );
    expect(describeReading({ answer: false }, 'in_limits')).toBe('No');
  });

  it('When nothing was entered yet, then it says so', () => {
    expect(describeEntry(undefined)).toBe('Not read yet');
  });
});
