import { zoneFormat } from './local-time';
import { sourceLanguage, type Language } from '../i18n/languages';

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
 * "2 Dec 2026, 08:05 GMT-6" where the zone has no common abbreviation. In another language the day and month read
 * as that language writes them ("2. Dez. 2026, 14:05 UTC"); the clock stays 24-hour everywhere.
 */
export function formatInstant(
  at: Date | string | number,
  timeZone = 'UTC',
  language: Language = sourceLanguage,
): string {
  const date = at instanceof Date ? at : new Date(at);
  const parts = Object.fromEntries(
    zoneFormat(timeZone, instantParts)
      .formatToParts(date)
      .map((p) => [p.type, p.value]),
  );
  if (language !== sourceLanguage)
    return localInstant(date, timeZone, language, `${parts.hour}:${parts.minute}`);
  const zone = timeZone === 'UTC' ? 'UTC' : (parts.timeZoneName ?? timeZone);
  return `${parts.day} ${parts.month} ${parts.year}, ${parts.hour}:${parts.minute} ${zone}`;
}

// One Intl format per language, zone and purpose: building one costs far more than using it.
const localFormats = new Map<string, Intl.DateTimeFormat>();
function localFormat(language: Language, timeZone: string, options: Intl.DateTimeFormatOptions) {
  const key = `${language}|${timeZone}|${JSON.stringify(options)}`;
  let format = localFormats.get(key);
  if (!format) {
    format = new Intl.DateTimeFormat(language, { timeZone, ...options });
    localFormats.set(key, format);
  }
  return format;
}

const dayParts: Intl.DateTimeFormatOptions = { day: 'numeric', month: 'short', year: 'numeric' };

function localInstant(date: Date, timeZone: string, language: Language, clock: string): string {
  const day = localFormat(language, timeZone, dayParts).format(date);
  const zoneName = localFormat(language, timeZone, { timeZoneName: 'short' })
    .formatToParts(date)
    .find((p) => p.type === 'timeZoneName')?.value;
  const zone = timeZone === 'UTC' ? 'UTC' : (zoneName ?? timeZone);
  return `${day}, ${clock} ${zone}`;
}

const months = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];

/** A calendar date "YYYY-MM-DD" as "1 Dec 2026" ("1. Dez. 2026" in German). */
export function formatDay(day: string, language: Language = sourceLanguage): string {
  const [year, month, date] = day.split('-').map(Number);
  if (language !== sourceLanguage) {
    return localFormat(language, 'UTC', dayParts).format(Date.UTC(year ?? 1970, (month ?? 1) - 1, date ?? 1));
  }
  return `${date} ${months[(month ?? 1) - 1]} ${year}`;
}
