import type { Checkpoint, CheckContext, ContextKey, Reading, ReadingEntry, Unit } from '../schemas/limits';
import { convert } from './units';
import { phrase, phraseWords, type Phrase } from '../i18n/phrase';

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

/**
 * Input that cannot be judged. It is never turned into a verdict; its reason (a phrase, so a German kiosk reads it in
 * German) tells the mechanic what to do. The message, for the API and the logs, is the reason in the process's
 * language (English on the server), after the checkpoint's label and code.
 */
export class InvalidReadingError extends Error {
  readonly code: InvalidReadingCode;
  readonly checkpointCode: string;
  /** The checkpoint as its card names it, for the words a person reads. */
  readonly checkpointLabel: string;
  readonly reason: Phrase;

  constructor(code: InvalidReadingCode, checkpoint: Pick<Checkpoint, 'code' | 'label'>, reason: Phrase) {
    super(`${checkpoint.label} (${checkpoint.code}): ${phraseWords(reason)}`);
    this.name = 'InvalidReadingError';
    this.code = code;
    this.checkpointCode = checkpoint.code;
    this.checkpointLabel = checkpoint.label;
    this.reason = reason;
  }
}

const contextKeyPhrases: Record<ContextKey, Phrase> = {
  attitude: phrase('contextAttitude'),
  systemPressure: phrase('contextSystemPressure'),
  ambientTempC: phrase('contextAmbientTemp'),
};
const pressurePhrases = { on: phrase('pressureOn'), relieved: phrase('pressureRelieved') } as const;
const attitudePhrases = {
  on_wheels: phrase('attitudeOnWheels'),
  on_jacks_gear_retracted: phrase('attitudeOnJacks'),
} as const;

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
        phrase('recordContext', { what: { phrase: contextKeyPhrases[key] } }),
      );
    }
  }
  if (context.ambientTempC !== undefined && !Number.isFinite(context.ambientTempC)) {
    throw new InvalidReadingError('not_a_number', checkpoint, phrase('temperatureNotANumber'));
  }
  const wanted = checkpoint.takenWith;
  if (wanted?.systemPressure !== undefined && context.systemPressure !== wanted.systemPressure) {
    throw new InvalidReadingError(
      'wrong_context',
      checkpoint,
      phrase('takeWithPressure', {
        wanted: { phrase: pressurePhrases[wanted.systemPressure] },
        // Recorded: every key takenWith names is required, and checked above.
        taken: { phrase: pressurePhrases[context.systemPressure ?? wanted.systemPressure] },
      }),
    );
  }
  if (wanted?.attitude !== undefined && context.attitude !== wanted.attitude) {
    throw new InvalidReadingError(
      'wrong_context',
      checkpoint,
      phrase('takeWithAttitude', {
        wanted: { phrase: attitudePhrases[wanted.attitude] },
        taken: { phrase: attitudePhrases[context.attitude ?? wanted.attitude] },
      }),
    );
  }
}

/**
 * The number a value entry stands for, in the checkpoint's canonical unit, after every physical check.
 * Only for entries of shape {value, unit}; yes/no answers and positions are read elsewhere.
 */
export function canonicalValue(checkpoint: Checkpoint, value: number, unit: Unit): number {
  if (checkpoint.unit === null) {
    throw new InvalidReadingError('wrong_entry', checkpoint, phrase('wantsAnswerNotNumber'));
  }
  if (!Number.isFinite(value)) {
    throw new InvalidReadingError('not_a_number', checkpoint, phrase('valueNotANumber'));
  }
  let converted: number;
  try {
    converted = convert(value, unit, checkpoint.unit);
  } catch {
    throw new InvalidReadingError(
      'wrong_unit',
      checkpoint,
      phrase('wrongUnit', { unit: { unitName: unit }, wanted: { unitName: checkpoint.unit } }),
    );
  }
  if (checkpoint.kind === 'level' && converted < 0) {
    throw new InvalidReadingError('negative_level', checkpoint, phrase('levelBelowEmpty'));
  }
  const { min, max } = checkpoint.range;
  if (converted < min || converted > max) {
    throw new InvalidReadingError(
      'out_of_range',
      checkpoint,
      phrase('outsideGauge', {
        value: { quantity: value, unit },
        min: { quantity: min, unit: checkpoint.unit },
        max: { quantity: max, unit: checkpoint.unit },
      }),
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
        ? phrase('entryAnswer')
        : 'dropsPerMinute' in reading
          ? phrase('entryLeakRate')
          : phrase('entryPosition');
    throw new InvalidReadingError(
      'wrong_entry',
      checkpoint,
      phrase('wantsGaugeValue', { what: { phrase: what } }),
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
