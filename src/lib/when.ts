import { formatInstant } from '@shared/domain/when';

// How screens write times for people, in one place and always on the 24-hour clock, whatever the browser's
// language. The desk writes instants in full and in UTC, like the records ("2 Dec 2026, 14:05 UTC"); the kiosk and
// the board write the hangar's own clock, short ("14:05" today, "2 Dec 14:05" on another day).

type Instant = string | number | Date;

const formats = new Map<string, Intl.DateTimeFormat>();
function format(options: Intl.DateTimeFormatOptions, timeZone: string | undefined): Intl.DateTimeFormat {
  const key = JSON.stringify([options, timeZone]);
  let found = formats.get(key);
  if (!found) {
    found = new Intl.DateTimeFormat('en-GB', { ...options, ...(timeZone ? { timeZone } : {}) });
    formats.set(key, found);
  }
  return found;
}

/** "14:05", or "14:05:09" with seconds, on this device's clock unless a zone is given. */
export const clockTime = (
  at: Instant,
  { seconds = false, timeZone }: { seconds?: boolean; timeZone?: string } = {},
) =>
  format(
    { hour: '2-digit', minute: '2-digit', ...(seconds ? { second: '2-digit' } : {}), hourCycle: 'h23' },
    timeZone,
  ).format(new Date(at));

const dayOf = (at: Instant, timeZone?: string) =>
  format({ day: 'numeric', month: 'short', year: 'numeric' }, timeZone).format(new Date(at));

/** "14:05" today, "2 Dec 14:05" on another day. */
export function shortWhen(at: Instant, now: Instant = Date.now(), timeZone?: string): string {
  if (dayOf(at, timeZone) === dayOf(now, timeZone)) return clockTime(at, { timeZone });
  return `${format({ day: 'numeric', month: 'short' }, timeZone).format(new Date(at))} ${clockTime(at, { timeZone })}`;
}

/** "Wed 2 Dec, 14:05": a moment of the last few days, said so nobody has to count back. */
export const dayTime = (at: Instant, timeZone?: string) =>
  `${format({ weekday: 'short', day: 'numeric', month: 'short' }, timeZone).format(new Date(at))}, ${clockTime(at, { timeZone })}`;

/** An instant as the records write it, "2 Dec 2026, 14:05 UTC"; `none` when there is none. */
export const recordTime = (at: Instant | null | undefined, none = '—') =>
  at === null || at === undefined ? none : formatInstant(new Date(at));

/** Time left until an instant, in the largest two units that matter: "2 d 5 h", "3 h 20 min", "12 min". */
export function timeLeft(iso: string, now: number): { text: string; past: boolean } {
  const minutes = Math.floor((new Date(iso).getTime() - now) / 60_000);
  const past = minutes < 0;
  const total = Math.abs(minutes);
  const days = Math.floor(total / 1440);
  const hours = Math.floor((total % 1440) / 60);
  const mins = total % 60;
  const text =
    days > 0
      ? `${days} d ${hours} h`
      : hours > 0
        ? `${hours} h ${String(mins).padStart(2, '0')} min`
        : `${mins} min`;
  return { text, past };
}
