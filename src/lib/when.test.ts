import { describe, expect, it } from 'vitest';
import { clockTime, dayTime, recordTime, shortWhen, timeLeft } from './when';

// Fixed zones, so the tests read the same on any machine.
describe('the screens write times one way', () => {
  it('When a time is written on the clock, then it is 24-hour whatever the browser language', () => {
    expect(clockTime('2026-12-02T14:05:09Z', { timeZone: 'UTC' })).toBe('14:05');
    expect(clockTime('2026-12-02T02:05:09Z', { timeZone: 'UTC' })).toBe('02:05');
    expect(clockTime('2026-12-02T14:05:09Z', { seconds: true, timeZone: 'UTC' })).toBe('14:05:09');
    expect(clockTime('2026-07-02T14:05:00Z', { timeZone: 'Europe/Lisbon' })).toBe('15:05');
  });

  it('When the time is today, then only the clock is written; on another day the day comes first', () => {
    const now = '2026-12-02T20:00:00Z';
    expect(shortWhen('2026-12-02T14:05:00Z', now, 'UTC')).toBe('14:05');
    expect(shortWhen('2026-12-01T14:05:00Z', now, 'UTC')).toBe('1 Dec 14:05');
    expect(shortWhen('2025-12-02T14:05:00Z', now, 'UTC')).toBe('2 Dec 14:05');
    // Midnight in the hangar's zone decides what "today" is, not UTC.
    expect(shortWhen('2026-12-02T23:30:00Z', '2026-12-03T08:00:00Z', 'Asia/Tokyo')).toBe('08:30');
  });

  it('When a moment of the last days is written, then it names the weekday and the date', () => {
    expect(dayTime('2026-12-02T14:05:00Z', 'UTC')).toBe('Wed 2 Dec, 14:05');
  });

  it('When the desk writes an instant, then it reads as the records do, in UTC, or says there is none', () => {
    expect(recordTime('2026-12-02T14:05:00Z')).toBe('2 Dec 2026, 14:05 UTC');
    expect(recordTime(Date.UTC(2026, 11, 2, 9, 7))).toBe('2 Dec 2026, 09:07 UTC');
    expect(recordTime(null)).toBe('—');
    expect(recordTime(undefined, 'never')).toBe('never');
  });

  it('When time is left or past, then the two largest units are written', () => {
    const now = Date.parse('2026-12-02T12:00:00Z');
    expect(timeLeft('2026-12-04T17:30:00Z', now)).toEqual({ text: '2 d 5 h', past: false });
    expect(timeLeft('2026-12-02T15:20:00Z', now)).toEqual({ text: '3 h 20 min', past: false });
    expect(timeLeft('2026-12-02T15:05:00Z', now)).toEqual({ text: '3 h 05 min', past: false });
    expect(timeLeft('2026-12-02T12:12:00Z', now)).toEqual({ text: '12 min', past: false });
    expect(timeLeft('2026-12-02T11:48:00Z', now)).toEqual({ text: '12 min', past: true });
  });
});
