import type { UsageFigures } from '../schemas/usage';
import { formatInstant } from './when';

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

export type UsageProblem =
  | { kind: 'backwards'; field: keyof UsageFigures; message: string }
  | { kind: 'jump'; field: keyof UsageFigures; message: string };

const fields: (keyof UsageFigures)[] = ['hours', 'flights', 'landings'];

const fieldWords: Record<keyof UsageFigures, string> = {
  hours: 'Hours',
  flights: 'Flights',
  landings: 'Landings',
};

/** "1 234.5 h", "412 flights": a thin space between thousands, as the trade writes figures on a log page. */
export function formatFigure(field: keyof UsageFigures, value: number): string {
  const fixed = field === 'hours' ? value.toFixed(1) : String(Math.round(value));
  const [whole = '0', tenths] = fixed.split('.');
  const grouped = whole.replace(/\B(?=(\d{3})+(?!\d))/g, ' ');
  const number = tenths === undefined ? grouped : `${grouped}.${tenths}`;
  if (field === 'hours') return `${number} h`;
  return `${number} ${value === 1 ? field.slice(0, -1) : field}`;
}

const recordedWords = (last: LastUsage) =>
  last.recordedAt === null ? 'set at the desk' : `recorded ${formatInstant(last.recordedAt)}`;

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
    const lastWords = `the last figure is ${formatFigure(field, last[field])}, ${recordedWords(last)}`;
    if (flown[field] < 0) {
      return {
        kind: 'backwards',
        field,
        message: `${fieldWords[field]} cannot go back: ${lastWords}. Read the figure again.`,
      };
    }
    if (flown[field] > limits[field]) {
      return {
        kind: 'jump',
        field,
        message:
          `${fieldWords[field]} jump by ${formatFigure(field, flown[field])}, more than the ` +
          `${formatFigure(field, limits[field])} one entry may add: ${lastWords}. Read the figure again; ` +
          'a longer gap is entered at the desk.',
      };
    }
  }
  return null;
}
