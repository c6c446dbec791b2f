// Wall-clock times in a named zone, for limits that end at a local clock time or at the end of a local day.

export interface LocalParts {
  year: number;
  month: number;
  day: number;
  hour: number;
  minute: number;
  second: number;
}

// Building an Intl.DateTimeFormat costs far more than using one; the board derives hundreds of airframes per read.
const formats = new WeakMap<Intl.DateTimeFormatOptions, Map<string, Intl.DateTimeFormat>>();

/** A 24-hour en-GB format in the zone, made once for each zone and each (constant) set of options. */
export function zoneFormat(timeZone: string, options: Intl.DateTimeFormatOptions): Intl.DateTimeFormat {
  let byZone = formats.get(options);
  if (!byZone) {
    byZone = new Map();
    formats.set(options, byZone);
  }
  let format = byZone.get(timeZone);
  if (!format) {
    format = new Intl.DateTimeFormat('en-GB', { timeZone, hourCycle: 'h23', ...options });
    byZone.set(timeZone, format);
  }
  return format;
}

const numericParts: Intl.DateTimeFormatOptions = {
  year: 'numeric',
  month: 'numeric',
  day: 'numeric',
  hour: 'numeric',
  minute: 'numeric',
  second: 'numeric',
};

// The last second asked in each zone: a signed check and a board read ask the same second many times, and
// formatToParts is the costly part (every zone's offset is whole seconds, so a second has one set of parts).
const lastSecond = new Map<string, { second: number; parts: LocalParts }>();

export function localParts(date: Date, timeZone: string): LocalParts {
  const second = Math.floor(date.getTime() / 1000);
  const last = lastSecond.get(timeZone);
  if (last?.second === second) return { ...last.parts };
  const parts = partsOf(date, timeZone);
  lastSecond.set(timeZone, { second, parts });
  return { ...parts };
}

function partsOf(date: Date, timeZone: string): LocalParts {
  const format = zoneFormat(timeZone, numericParts);
  const parts = Object.fromEntries(format.formatToParts(date).map((part) => [part.type, Number(part.value)]));
  return {
    year: parts.year ?? 0,
    month: parts.month ?? 0,
    day: parts.day ?? 0,
    hour: parts.hour ?? 0,
    minute: parts.minute ?? 0,
    second: parts.second ?? 0,
  };
}

/** Milliseconds the zone's clock is ahead of UTC at this instant. */
function zoneOffsetMs(date: Date, timeZone: string): number {
  const p = localParts(date, timeZone);
  const wholeSeconds = Math.floor(date.getTime() / 1000) * 1000;
  return Date.UTC(p.year, p.month - 1, p.day, p.hour, p.minute, p.second) - wholeSeconds;
}

export function localToInstant(
  year: number,
  month: number,
  day: number,
  hour: number,
  minute: number,
  timeZone: string,
): Date {
  const asIfUtc = Date.UTC(year, month - 1, day, hour, minute);
  const firstGuess = asIfUtc - zoneOffsetMs(new Date(asIfUtc), timeZone);
  // Re-read the offset at the guess, in case a daylight-saving change lies between the two.
  return new Date(asIfUtc - zoneOffsetMs(new Date(firstGuess), timeZone));
}

/** The first instant after `after` at which the zone's clock shows hh:mm. */
export function nextLocalTime(after: Date, hhmm: string, timeZone: string): Date {
  const [hour = 0, minute = 0] = hhmm.split(':').map(Number);
  const today = localParts(after, timeZone);
  const candidate = localToInstant(today.year, today.month, today.day, hour, minute, timeZone);
  if (candidate.getTime() > after.getTime()) return candidate;
  const tomorrow = new Date(Date.UTC(today.year, today.month - 1, today.day + 1));
  return localToInstant(
    tomorrow.getUTCFullYear(),
    tomorrow.getUTCMonth() + 1,
    tomorrow.getUTCDate(),
    hour,
    minute,
    timeZone,
  );
}

/** The last millisecond of the local calendar day `days` after the day of `at`, in the zone. */
export function endOfLocalDayAfter(at: Date, days: number, timeZone: string): Date {
  const today = localParts(at, timeZone);
  const target = new Date(Date.UTC(today.year, today.month - 1, today.day + days + 1));
  const nextMidnight = localToInstant(
    target.getUTCFullYear(),
    target.getUTCMonth() + 1,
    target.getUTCDate(),
    0,
    0,
    timeZone,
  );
  return new Date(nextMidnight.getTime() - 1);
}

/** The local calendar day of an instant, "YYYY-MM-DD". */
export function localDay(at: Date, timeZone: string): string {
  const p = localParts(at, timeZone);
  return `${p.year}-${String(p.month).padStart(2, '0')}-${String(p.day).padStart(2, '0')}`;
}

/** The last millisecond of a local calendar day "YYYY-MM-DD" in the zone. */
export function endOfLocalDay(day: string, timeZone: string): Date {
  const [y, m, d] = day.split('-').map(Number);
  return endOfLocalDayAfter(localToInstant(y ?? 0, m ?? 1, d ?? 1, 12, 0, timeZone), 0, timeZone);
}
