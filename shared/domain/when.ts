import { zoneFormat } from './local-time';

// One way to write an instant for people: 24-hour clock, day, month as a word, year, and the zone named.
// Records read in UTC; the kiosk and board may pass the base's zone, which is then named.

const instantParts: Intl.DateTimeFormatOptions = {
  day: 'numeric',
  month: 'short',
  year: 'numeric',
  hour: '2-digit',
  minute: '2-digit',
};

/** "2 Dec 2026, 14:05 UTC" (or the zone's name, for example "Atlantic/Madeira"). */
export function formatInstant(at: Date | string, timeZone = 'UTC'): string {
  const date = at instanceof Date ? at : new Date(at);
  const parts = Object.fromEntries(
    zoneFormat(timeZone, instantParts)
      .formatToParts(date)
      .map((p) => [p.type, p.value]),
  );
  return `${parts.day} ${parts.month} ${parts.year}, ${parts.hour}:${parts.minute} ${timeZone}`;
}

const months = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];

/** A calendar date "YYYY-MM-DD" as "1 Dec 2026". */
export function formatDay(day: string): string {
  const [year, month, date] = day.split('-').map(Number);
  return `${date} ${months[(month ?? 1) - 1]} ${year}`;
}
