import i18next from 'i18next';
import { describe, expect, it } from 'vitest';
import { rememberSession } from './api-client';
import { calendarDay, localTime, recordTime, timeLeft } from './when';

// One date style for every screen: 24-hour, day, month as a word, year, zone named. Fixed zones, so the tests
// read the same on any machine (invented instants).
describe('the screens write times one way', () => {
  it('When the desk writes an instant, then it reads as the records do, in UTC, or says there is none', () => {
    expect(recordTime('2026-12-02T14:05:00Z')).toBe('2 Dec 2026, 14:05 UTC');
    expect(recordTime(Date.UTC(2026, 11, 2, 9, 7))).toBe('2 Dec 2026, 09:07 UTC');
    expect(recordTime('2026-12-02T02:05:59.999Z')).toBe('2 Dec 2026, 02:05 UTC');
    expect(recordTime(null)).toBe('—');
    expect(recordTime(undefined, 'never')).toBe('never');
  });

  it('When the kiosk writes an instant for a base, then it is that base clock, with the zone named', () => {
    // Madeira keeps UTC in winter and UTC+1 in summer; Tokyo is UTC+9 and crosses midnight here.
    expect(localTime('2026-12-02T14:05:00Z', 'Atlantic/Madeira')).toBe('2 Dec 2026, 14:05 WET');
    expect(localTime('2026-07-02T14:05:00Z', 'Atlantic/Madeira')).toBe('2 Jul 2026, 15:05 WEST');
    expect(localTime('2026-12-02T23:30:00Z', 'Asia/Tokyo')).toBe('3 Dec 2026, 08:30 GMT+9');
    expect(localTime('2026-12-02T14:05:00Z', 'UTC')).toBe('2 Dec 2026, 14:05 UTC');
  });

  it('When no zone is given, then the kiosk uses the hangar clock the server named, and UTC before it has', () => {
    const session = { user: null, channel: null, kiosk: null, csrfToken: 't', idleSeconds: 90 };
    rememberSession({ ...session, timeZone: 'UTC' });
    expect(localTime('2026-12-02T14:05:00Z')).toBe('2 Dec 2026, 14:05 UTC');
    rememberSession({ ...session, timeZone: 'America/Chicago' });
    expect(localTime('2026-12-02T14:05:00Z')).toBe('2 Dec 2026, 08:05 GMT-6');
    rememberSession({ ...session, timeZone: 'UTC' });
  });

  it('When a calendar day is written, then the month is a word', () => {
    expect(calendarDay('2026-12-01')).toBe('1 Dec 2026');
    expect(calendarDay('2027-01-09')).toBe('9 Jan 2027');
  });

  it('When time is left or past, then the two largest units are written', () => {
    const now = Date.parse('2026-12-02T12:00:00Z');
    expect(timeLeft('2026-12-04T17:30:00Z', now)).toEqual({ text: '2\u00a0d 5\u00a0h', past: false });
    expect(timeLeft('2026-12-02T15:20:00Z', now)).toEqual({ text: '3\u00a0h 20\u00a0min', past: false });
    expect(timeLeft('2026-12-02T15:05:00Z', now)).toEqual({ text: '3\u00a0h 05\u00a0min', past: false });
    expect(timeLeft('2026-12-02T12:12:00Z', now)).toEqual({ text: '12\u00a0min', past: false });
    expect(timeLeft('2026-12-02T11:48:00Z', now)).toEqual({ text: '12\u00a0min', past: true });
  });

  it('When the screen reads German, then days are written as German writes them', async () => {
    const now = Date.parse('2026-12-02T12:00:00Z');
    await i18next.changeLanguage('de');
    try {
      expect(timeLeft('2026-12-04T17:30:00Z', now).text).toBe('2\u00a0Tg. 5\u00a0h');
      expect(timeLeft('2026-12-02T15:05:00Z', now).text).toBe('3\u00a0h 05\u00a0min');
    } finally {
      await i18next.changeLanguage('en');
    }
  });
});
