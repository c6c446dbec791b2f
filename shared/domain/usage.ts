import type { UsageFigures } from '../schemas/usage';
import { instantValue, phrase, phraseValueWords, type Phrase, type PhraseValue } from '../i18n/phrase';
import { ambientTranslate, type Translate } from '../i18n/translate';

// Flight hours, flights and landings only move forward. A new set of figures is refused whole when one goes back or
// jumps further than one entry can plausibly cover (a typing slip: 1 243.5 for 1 234.5), so the consumption per
// flight hour and the validity in flights are never built on a wrong figure.

/** The most one entry may add; the server's configuration sets them (USAGE_MAX_* in server/config.ts). */
export interface UsageStepLimits {
  hours: number;
  flights: number;
  landings: number;
}

/** The airframe's figures as last recorded, and when (null: never recorded from a flight, set at the desk). */
export interface LastUsage extends UsageFigures {
  recordedAt: Date | string | null;
}

/** A day of flying at most, and 50 flights or landings (training circuits): only slips go past. Common practice, no source. */
export const defaultUsageStepLimits: UsageStepLimits = { hours: 24, flights: 50, landings: 50 };

export interface UsageProblem {
  kind: 'backwards' | 'jump';
  field: keyof UsageFigures;
  /** What the person is told: each screen and each answer writes it in its reader's language. */
  reason: Phrase;
}

const fields: (keyof UsageFigures)[] = ['hours', 'flights', 'landings'];

const fieldPhrases: Record<keyof UsageFigures, Phrase> = {
  hours: phrase('usageHours'),
  flights: phrase('usageFlights'),
  landings: phrase('usageLandings'),
};

/** The whole part with a space between thousands, and the tenths: "1 234" and "5". */
function figureParts(field: keyof UsageFigures, value: number) {
  const fixed = field === 'hours' ? value.toFixed(1) : String(Math.round(value));
  const [whole = '0', tenths] = fixed.split('.');
  return { grouped: whole.replace(/\B(?=(\d{3})+(?!\d))/g, ' '), tenths };
}

/**
 * "1 234.5 h", "412 flights": a space between thousands, as the trade writes figures on a log page, in the reader's
 * language ("1 234,5 h", "412 Flüge" on a German screen).
 */
export function formatFigure(
  field: keyof UsageFigures,
  value: number,
  t: Translate = ambientTranslate(),
): string {
  return String(phraseValueWords(figureValue(field, value), t));
}

/**
 * A figure as a phrase value, grouped by thousands as a log page writes it: "1 234.5 h" in English, "1 234,5 h"
 * in German; "412 flights", "412 Flüge".
 */
function figureValue(field: keyof UsageFigures, value: number): PhraseValue {
  const { grouped, tenths } = figureParts(field, value);
  if (field === 'hours') return { phrase: phrase('figureHours', { whole: grouped, tenths: tenths ?? '0' }) };
  const key = field === 'flights' ? 'figureFlights' : 'figureLandings';
  return { phrase: phrase(key, { count: Math.round(value), figure: grouped }) };
}

const recordedValue = (last: LastUsage): PhraseValue => ({
  phrase:
    last.recordedAt === null
      ? phrase('usageSetAtDesk')
      : phrase('usageRecorded', { at: instantValue(last.recordedAt) }),
});

/** Tenths of an hour as whole numbers, so 0.1 + 0.2 never reads as more than 0.3. */
const difference = (field: keyof UsageFigures, next: number, last: number) =>
  field === 'hours' ? Math.round(next * 10 - last * 10) / 10 : next - last;

/** What the new figures add to the last ones. */
export function usageFlown(last: UsageFigures, next: UsageFigures): UsageFigures {
  return {
    hours: difference('hours', next.hours, last.hours),
    flights: difference('flights', next.flights, last.flights),
    landings: difference('landings', next.landings, last.landings),
  };
}

/** The first problem of a new set of figures against the last ones, or null when they can be recorded. */
export function usageProblem(
  last: LastUsage,
  next: UsageFigures,
  limits: UsageStepLimits,
): UsageProblem | null {
  const flown = usageFlown(last, next);
  for (const field of fields) {
    const said = {
      field: { phrase: fieldPhrases[field] },
      last: figureValue(field, last[field]),
      recorded: recordedValue(last),
    };
    if (flown[field] < 0) return { kind: 'backwards', field, reason: phrase('usageBackwards', said) };
    if (flown[field] > limits[field]) {
      return {
        kind: 'jump',
        field,
        reason: phrase('usageJump', {
          ...said,
          flown: figureValue(field, flown[field]),
          limit: figureValue(field, limits[field]),
        }),
      };
    }
  }
  return null;
}
