import type { Checkpoint, CheckContext, ContextKey, Reading, ReadingEntry, Unit } from '../schemas/limits';
import { convert, formatValue } from './units';

export type InvalidReadingCode =
  | 'not_a_number'
  | 'negative_level'
  | 'not_whole_number'
  | 'out_of_range'
  | 'missing_context'
  | 'wrong_context'
  | 'pressure_on'
  | 'wrong_entry'
  | 'wrong_unit'
  | 'no_band'
  | 'bad_checkpoint';

/** Input that cannot be judged. It is never turned into a verdict; the message tells the mechanic what to do. */
export class InvalidReadingError extends Error {
  readonly code: InvalidReadingCode;
  readonly checkpointCode: string;

  constructor(code: InvalidReadingCode, checkpoint: Pick<Checkpoint, 'code' | 'label'>, message: string) {
    super(`${checkpoint.label} (${checkpoint.code}): ${message}`);
    this.name = 'InvalidReadingError';
    this.code = code;
    this.checkpointCode = checkpoint.code;
  }
}

const contextKeyWords: Record<ContextKey, string> = {
  attitude: 'how the aircraft stands (on wheels, or on jacks with gear retracted)',
  systemPressure: 'whether system pressure is on or relieved',
  ambientTempC: 'the ambient temperature',
};

/** Keys a reading must carry: those the checkpoint asks for, plus any a band condition or takenWith depends on. */
export function requiredContextKeys(checkpoint: Checkpoint): ContextKey[] {
  const keys = new Set<ContextKey>(checkpoint.requires);
  const conditions = [checkpoint.takenWith, ...checkpoint.bands.map((band) => band.when)];
  for (const condition of conditions) {
    if (condition?.attitude !== undefined) keys.add('attitude');
    if (condition?.systemPressure !== undefined) keys.add('systemPressure');
  }
  return [...keys];
}

export function checkContext(checkpoint: Checkpoint, context: CheckContext): void {
  for (const key of requiredContextKeys(checkpoint)) {
    if (context[key] === undefined) {
      throw new InvalidReadingError(
        'missing_context',
        checkpoint,
        `Record ${contextKeyWords[key]} before this reading can be judged.`,
      );
    }
  }
  if (context.ambientTempC !== undefined && !Number.isFinite(context.ambientTempC)) {
    throw new InvalidReadingError(
      'not_a_number',
      checkpoint,
      'The ambient temperature is not a number. Enter it again.',
    );
  }
  const wanted = checkpoint.takenWith;
  if (wanted?.systemPressure !== undefined && context.systemPressure !== wanted.systemPressure) {
    throw new InvalidReadingError(
      'wrong_context',
      checkpoint,
      `Take this reading with system pressure ${wanted.systemPressure}; a reading with system pressure ${String(context.systemPressure)} is not valid.`,
    );
  }
  if (wanted?.attitude !== undefined && context.attitude !== wanted.attitude) {
    throw new InvalidReadingError(
      'wrong_context',
      checkpoint,
      `Take this reading with the aircraft ${wanted.attitude.replaceAll('_', ' ')}; it was recorded ${String(context.attitude).replaceAll('_', ' ')}.`,
    );
  }
}

/**
 * The number a value entry stands for, in the checkpoint's canonical unit, after every physical check.
 * Only for entries of shape {value, unit}; yes/no answers and positions are read elsewhere.
 */
export function canonicalValue(checkpoint: Checkpoint, value: number, unit: Unit): number {
  if (checkpoint.unit === null) {
    throw new InvalidReadingError(
      'wrong_entry',
      checkpoint,
      'This checkpoint takes a yes or no answer, not a number.',
    );
  }
  if (!Number.isFinite(value)) {
    throw new InvalidReadingError(
      'not_a_number',
      checkpoint,
      'The value is not a number. Read the gauge again and enter it.',
    );
  }
  let converted: number;
  try {
    converted = convert(value, unit, checkpoint.unit);
  } catch {
    throw new InvalidReadingError(
      'wrong_unit',
      checkpoint,
      `A value in '${unit}' cannot be a reading in '${checkpoint.unit}'. Pick the unit on the gauge.`,
    );
  }
  if (checkpoint.kind === 'level' && converted < 0) {
    throw new InvalidReadingError(
      'negative_level',
      checkpoint,
      'A level cannot be below empty. Read the sight glass again.',
    );
  }
  const { min, max } = checkpoint.range;
  if (converted < min || converted > max) {
    throw new InvalidReadingError(
      'out_of_range',
      checkpoint,
      `${formatValue(value, unit)} is outside what this gauge can show (${formatValue(min, checkpoint.unit)} to ${formatValue(max, checkpoint.unit)}). Read it again; if the gauge really shows this, report the gauge as faulty.`,
    );
  }
  return converted;
}

export function assertValueEntry(
  checkpoint: Checkpoint,
  reading: Reading,
): asserts reading is Reading & { value: number; unit: Unit } {
  if (!('value' in reading)) {
    const what =
      'answer' in reading
        ? 'a yes or no answer'
        : 'dropsPerMinute' in reading
          ? 'a leak rate'
          : 'a position against the marks';
    throw new InvalidReadingError(
      'wrong_entry',
      checkpoint,
      `This checkpoint takes a value from the gauge, not ${what}.`,
    );
  }
}

/** The number a reading row stores beside its entry: the value, 1/0 for yes/no, the drops per minute; none for a position. */
export function storedValue(entry: ReadingEntry): number | null {
  if ('value' in entry) return entry.value;
  if ('answer' in entry) return entry.answer ? 1 : 0;
  if ('dropsPerMinute' in entry) return entry.dropsPerMinute;
  return null;
}
