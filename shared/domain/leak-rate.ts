import {
  leakStateSchema,
  type CheckContext,
  type Checkpoint,
  type Evaluation,
  type LeakState,
  type Verdict,
} from '../schemas/limits';
import { applicableBands, contains, worstBand } from './bands';
import { InvalidReadingError } from './reading-input';
import { formatLeakRate } from './units';
import { phrase } from '../i18n/phrase';

/** The most drops per minute a leak-rate checkpoint's range may reach: beyond this a person no longer counts drops. */
export const maxLeakRate = 600;

/** A leak-rate entry: drops per minute, and static or dynamic (not needed for "no leak"). */
export interface LeakEntry {
  dropsPerMinute: number;
  leakState?: LeakState | undefined;
}

/** The count itself, after every check a person's count must pass: a whole number of drops from none upwards. */
/** A count as it was typed, in the reader's way of writing numbers: "2.5" in English, "2,5" in German. */
const asTyped = (value: number) => ({
  decimal: value,
  places: Math.min(6, (/\.(\d+)/.exec(String(value))?.[1] ?? '').length),
});

export function leakRate(checkpoint: Checkpoint, entry: LeakEntry): number {
  const drops = entry.dropsPerMinute;
  if (!Number.isFinite(drops)) {
    throw new InvalidReadingError('not_a_number', checkpoint, phrase('leakNotANumber'));
  }
  if (drops < 0) {
    throw new InvalidReadingError('out_of_range', checkpoint, phrase('leakBelowNone'));
  }
  if (!Number.isInteger(drops)) {
    throw new InvalidReadingError(
      'not_whole_number',
      checkpoint,
      phrase('leakNotWhole', { drops: asTyped(drops) }),
    );
  }
  if (drops > checkpoint.range.max) {
    throw new InvalidReadingError(
      'out_of_range',
      checkpoint,
      phrase('leakTooMany', { drops: asTyped(drops), max: asTyped(checkpoint.range.max) }),
    );
  }
  if (drops > 0 && entry.leakState === undefined) {
    throw new InvalidReadingError('wrong_entry', checkpoint, phrase('leakStateMissing'));
  }
  return drops;
}

/**
 * Judges a leak rate against the bands for its state. "No leak" carries no state, so it is judged against the
 * bands of every state and gets the worst of them (in practice both say none is satisfactory).
 */
export function evaluateLeakRate(
  checkpoint: Checkpoint,
  entry: LeakEntry,
  context: CheckContext,
): Evaluation {
  const value = leakRate(checkpoint, entry);
  const states = entry.leakState === undefined ? leakStateSchema.options : [entry.leakState];
  const bands = [
    ...new Set(states.flatMap((leakState) => applicableBands(checkpoint.bands, { ...context, leakState }))),
  ];
  const band = worstBand(bands.filter((candidate) => contains(candidate, value)));
  if (band === undefined) {
    throw new InvalidReadingError('no_band', checkpoint, phrase('noBandForLeak'));
  }
  return { verdict: band.verdict, band, message: band.message, action: band.action, value };
}

const leakVerdictWords: Record<Verdict, string> = {
  in_limits: 'within limits',
  service: 'needs attention',
  out_of_limits: 'out of limits',
};

/** A judged leak in the trade's words: "No leak — satisfactory", "3 drops/min, dynamic — within limits". */
export function leakReadingWords(entry: LeakEntry, verdict: Verdict): string {
  if (entry.dropsPerMinute === 0 && verdict === 'in_limits') return 'No leak — satisfactory';
  return `${formatLeakRate(entry.dropsPerMinute, entry.leakState)} — ${leakVerdictWords[verdict]}`;
}
