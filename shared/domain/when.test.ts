import { describe, expect, it } from 'vitest';
import { formatDay, formatInstant } from './when';

// One date style for people: 24-hour clock, day, month as a word, year, and the zone named (invented instants).
describe('formatDay', () => {
  it.each([
    ['2026-01-05', '5 Jan 2026'],
    ['2026-02-28', '28 Feb 2026'],
    ['2026-03-01', '1 Mar 2026'],
    ['2026-04-30', '30 Apr 2026'],
    ['2026-05-15', '15 May 2026'],
    ['2026-06-30', '30 Jun 2026'],
    ['2026-07-04', '4 Jul 2026'],
    ['2026-08-31', '31 Aug 2026'],
    ['2026-09-09', '9 Sep 2026'],
    ['2026-10-10', '10 Oct 2026'],
    ['2026-11-11', '11 Nov 2026'],
    ['2026-12-31', '31 Dec 2026'],
  ])('when the day is %s, then it reads %s', (day, words) => {
    expect(formatDay(day)).toBe(words);
  });
});

describe('formatInstant', () => {
  it('when no zone is given, then it is UTC, on a 24-hour clock, and says so', () => {
    expect(formatInstant('2026-12-02T14:05:59.999Z')).toBe('2 Dec 2026, 14:05 UTC');
    expect(formatInstant(new Date('2026-12-02T00:00:00Z'))).toBe('2 Dec 2026, 00:00 UTC');
  });

  it('when a zone is given, then the local clock is shown and the zone named (Madeira is UTC+1 in July)', () => {
    expect(formatInstant('2026-07-15T22:59:00Z', 'Atlantic/Madeira')).toBe('15 Jul 2026, 23:59 WEST');
    expect(formatInstant('2026-12-15T22:59:00Z', 'Atlantic/Madeira')).toBe('15 Dec 2026, 22:59 WET');
  });

  it('when the zone has no common short name, then its offset names it', () => {
    expect(formatInstant('2026-12-15T22:59:00Z', 'Asia/Kolkata')).toBe('16 Dec 2026, 04:29 GMT+5:30');
  });
});
