import { formatDay, formatInstant } from '@shared/domain/when';
import { ambientLanguage, ambientTranslate, say } from '@shared/i18n/translate';
import type { Language } from '@shared/i18n/languages';
import { hangarTimeZone } from './api-client';

// How screens write times for people, in one place and in one style: 24-hour clock, day, month as a word, year,
// and the zone named ("2 Dec 2026, 14:05 UTC"). The desk and the records write UTC; the kiosk and the board write
// the base's own clock, and name it ("2 Dec 2026, 14:05 WET"). Durations ("due in 3 h 20 min") are not instants.
// Each takes the language, the screen's by default: German reads "2. Dez. 2026, 14:05 UTC".

type Instant = string | number | Date;

/** An instant as the records write it, "2 Dec 2026, 14:05 UTC"; `none` when there is none. */
export const recordTime = (
  at: Instant | null | undefined,
  none = '—',
  language: Language = ambientLanguage(),
) => (at === null || at === undefined ? none : formatInstant(new Date(at), 'UTC', language));

/**
 * An instant on the base's clock, "2 Dec 2026, 14:05 WET": for the kiosk and the board. Without a zone, the
 * hangar's clock the server named at sign-in (UTC until it has).
 */
export const localTime = (
  at: Instant,
  timeZone: string = hangarTimeZone(),
  language: Language = ambientLanguage(),
) => formatInstant(new Date(at), timeZone, language);

/** A calendar day, "1 Dec 2026". */
export const calendarDay = (day: string, language: Language = ambientLanguage()) => formatDay(day, language);

/**
 * Time left until an instant, in the largest two units that matter, in the screen's language: "2 d 5 h",
 * "3 h 20 min", "12 min"; German "2 Tg. 5 h". The catalogue joins each figure to its unit by a no-break space: on an
 * upright board "7 d 1" and "h" on two lines read as nonsense.
 */
export function timeLeft(iso: string, now: number): { text: string; past: boolean } {
  const minutes = Math.floor((new Date(iso).getTime() - now) / 60_000);
  const past = minutes < 0;
  const total = Math.abs(minutes);
  const days = Math.floor(total / 1440);
  const hours = Math.floor((total % 1440) / 60);
  const mins = total % 60;
  const t = ambientTranslate();
  const text =
    days > 0
      ? say(t, 'common:timeLeft.daysHours', { days, hours })
      : hours > 0
        ? say(t, 'common:timeLeft.hoursMinutes', { hours, minutes: String(mins).padStart(2, '0') })
        : say(t, 'common:timeLeft.minutes', { minutes: mins });
  return { text, past };
}
