import { zoneFormat } from './local-time';

// One way to write an instant for people, everywhere: 24-hour clock, day, month as a word, year, and the zone
// named. Records read in UTC; the kiosk and the board read the base's own clock and name its zone.

const instantParts: Intl.DateTimeFormatOptions = {
  day: 'numeric',
  month: 'short',
  year: 'numeric',
  hour: '2-digit',
  minute: '2-digit',
  timeZoneName: 'short',
};

/**
 * "2 Dec 2026, 14:05 UTC"; in another zone its short name, as people say it: "15 Jul 2026, 23:59 WEST" or
 * "2 Dec 2026, 08:05 GMT-6" where the zone has no common abbreviation.
 */
export function formatInstant(at: Date | string | number, timeZone = 'UTC'): string {
  const date = at instanceof Date ? at : new Date(at);
  const parts = Object.fromEntries(
    zoneFormat(timeZone, instantParts)
      .formatToParts(date)
      .map((p) => [p.type, p.value]),
  );
  const zone = timeZone === 'UTC' ? 'UTC' : (parts.timeZoneName ?? timeZone);
  return `${parts.day} ${parts.month} ${parts.year}, ${parts.hour}:${parts.minute} ${zone}`;
}

const months = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];

/** A calendar date "YYYY-MM-DD" as "1 Dec 2026". */
export function formatDay(day: string): string {
  const [year, month, date] = day.split('-').map(Number);
  return `${date} ${months[(month ?? 1) - 1]} ${year}`;
}
