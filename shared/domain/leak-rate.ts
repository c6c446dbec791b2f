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
import { formatLeakRate, leakRateUnitWords } from './units';

/** The most drops per minute a leak-rate checkpoint's range may reach: beyond this a person no longer counts drops. */
export const maxLeakRate = 600;

/** A leak-rate entry: drops per minute, and static or dynamic (not needed for "no leak"). */
export interface LeakEntry {
  dropsPerMinute: number;
  leakState?: LeakState | undefined;
}

/** The count itself, after every check a person's count must pass: a whole number of drops from none upwards. */
export function leakRate(checkpoint: Checkpoint, entry: LeakEntry): number {
  const drops = entry.dropsPerMinute;
  if (!Number.isFinite(drops)) {
    throw new InvalidReadingError(
      'not_a_number',
      checkpoint,
      'The leak rate is not a number. Count the drops for one minute and enter them.',
    );
  }
  if (drops < 0) {
    throw new InvalidReadingError(
      'out_of_range',
      checkpoint,
      'A leak rate cannot be less than none. Enter 0 or tap "No leak" if nothing drips.',
    );
  }
  if (!Number.isInteger(drops)) {
    throw new InvalidReadingError(
      'not_whole_number',
      checkpoint,
      `Count whole drops: ${drops} is not a whole number of ${leakRateUnitWords}.`,
    );
  }
  if (drops > checkpoint.range.max) {
    throw new InvalidReadingError(
      'out_of_range',
      checkpoint,
      `${drops} ${leakRateUnitWords} is more than can be counted here (up to ${checkpoint.range.max}). Count again; a running leak is out of limits whatever its rate.`,
    );
  }
  if (drops > 0 && entry.leakState === undefined) {
    throw new InvalidReadingError(
      'wrong_entry',
      checkpoint,
      'Say whether the leak is static (system not pressurised) or dynamic (system pressurised or operating).',
    );
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
    throw new InvalidReadingError(
      'no_band',
      checkpoint,
      'No limit covers this leak rate in this configuration; tell engineering.',
    );
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
