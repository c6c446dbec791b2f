import {
  attitudeSchema,
  leakStateSchema,
  systemPressureSchema,
  type AircraftTypeDefinition,
  type BandCondition,
  type CheckKind,
  type Checkpoint,
  type Evaluation,
  type LevelPosition,
  type LimitBand,
  type Reading,
} from '../schemas/limits';
import { evaluatePrecharge } from './accumulator';
import { evaluateLeakRate, maxLeakRate } from './leak-rate';
import {
  applicableBands,
  conditionMatches,
  contains,
  intersects,
  isEmpty,
  worstBand,
  type Interval,
} from './bands';
import { assertValueEntry, canonicalValue, checkContext, InvalidReadingError } from './reading-input';
import { dimensionOf } from './units';
import { phrase, type Phrase, type PhraseValue } from '../i18n/phrase';

export { InvalidReadingError, type InvalidReadingCode } from './reading-input';

function checkEntryShape(checkpoint: Checkpoint, reading: Reading): void {
  if (checkpoint.kind === 'leak_rate') {
    if (!('dropsPerMinute' in reading)) {
      throw new InvalidReadingError('wrong_entry', checkpoint, phrase('wantsLeakRate'));
    }
    return;
  }
  if ('dropsPerMinute' in reading) {
    throw new InvalidReadingError('wrong_entry', checkpoint, phrase('leakRateOnlyForLeaks'));
  }
  if (checkpoint.kind === 'yes_no') {
    if (!('answer' in reading)) {
      throw new InvalidReadingError('wrong_entry', checkpoint, phrase('wantsAnswer'));
    }
    return;
  }
  if ('answer' in reading) {
    throw new InvalidReadingError('wrong_entry', checkpoint, phrase('wantsValueNotAnswer'));
  }
  if ('position' in reading) {
    if (checkpoint.kind !== 'level') {
      throw new InvalidReadingError('wrong_entry', checkpoint, phrase('positionOnlyForGlass'));
    }
    if (checkpoint.marks === undefined) {
      throw new InvalidReadingError('wrong_entry', checkpoint, phrase('glassWithoutMarks'));
    }
    return;
  }
  assertValueEntry(checkpoint, reading);
}

/** The values a position against the marks can stand for, clipped to the glass. */
export function positionInterval(checkpoint: Checkpoint, position: LevelPosition): Interval {
  const marks = checkpoint.marks;
  if (marks === undefined) {
    throw new InvalidReadingError('wrong_entry', checkpoint, phrase('glassWithoutMarks'));
  }
  const at = (value: number): Interval => ({
    lower: { value, closed: true },
    upper: { value, closed: true },
  });
  const open = (from: number, to: number): Interval => ({
    lower: { value: from, closed: false },
    upper: { value: to, closed: false },
  });
  const { min, max } = checkpoint.range;
  switch (position) {
    case 'below_minimum':
      return { lower: { value: min, closed: true }, upper: { value: marks.minimum, closed: false } };
    case 'at_minimum':
      return at(marks.minimum);
    case 'between_minimum_normal':
      return open(marks.minimum, marks.normal);
    case 'at_normal':
      return at(marks.normal);
    case 'between_normal_maximum':
      return open(marks.normal, marks.maximum);
    case 'at_maximum':
      return at(marks.maximum);
    case 'above_maximum':
      return { lower: { value: marks.maximum, closed: false }, upper: { value: max, closed: true } };
  }
}

function evaluatePosition(checkpoint: Checkpoint, position: LevelPosition, bands: LimitBand[]): Evaluation {
  const interval = positionInterval(checkpoint, position);
  if (isEmpty(interval)) {
    throw new InvalidReadingError(
      'out_of_range',
      checkpoint,
      phrase('glassCannotShow', { position: { position } }),
    );
  }
  // A position stands for a span of levels; judge it by the worst level it could be, never the best.
  const band = worstBand(bands.filter((candidate) => intersects(candidate, interval)));
  if (band === undefined) {
    throw new InvalidReadingError('no_band', checkpoint, phrase('noBandForLevel'));
  }
  return { verdict: band.verdict, band, message: band.message, action: band.action };
}

/**
 * Judges one reading. The value is converted to the checkpoint's canonical unit and compared unrounded with the
 * edges as declared (open or closed). Input that cannot be judged throws InvalidReadingError.
 */
export function evaluateReading(checkpoint: Checkpoint, reading: Reading): Evaluation {
  if (checkpoint.precharge !== undefined) return evaluatePrecharge(checkpoint, reading);
  checkEntryShape(checkpoint, reading);
  checkContext(checkpoint, reading.context);
  if ('dropsPerMinute' in reading) return evaluateLeakRate(checkpoint, reading, reading.context);
  const bands = applicableBands(checkpoint.bands, reading.context);
  if ('position' in reading) return evaluatePosition(checkpoint, reading.position, bands);
  const value =
    'answer' in reading ? (reading.answer ? 1 : 0) : canonicalValue(checkpoint, reading.value, reading.unit);
  // Overlapping bands are a data fault that validateCheckpoint reports; until fixed, the worse one wins.
  const band = worstBand(bands.filter((candidate) => contains(candidate, value)));
  if (band === undefined) {
    throw new InvalidReadingError('no_band', checkpoint, phrase('noBandForValue'));
  }
  return { verdict: band.verdict, band, message: band.message, action: band.action, value };
}

export type CheckpointProblemKind =
  | 'gap'
  | 'overlap'
  | 'empty_band'
  | 'duplicate_band_id'
  | 'bad_range'
  | 'bad_unit'
  | 'bad_marks'
  | 'bad_precharge'
  | 'bad_leak_state'
  | 'unknown_checkpoint'
  | 'duplicate_checkpoint';

export interface CheckpointProblem {
  checkpoint: string;
  kind: CheckpointProblemKind;
  /** What is wrong, for the engineering desk: written in each reader's language (engineeringTypes:problems.*). */
  reason: Phrase;
  /** Band ids involved. */
  bands?: string[];
  /** The configuration in which the problem shows. */
  context?: BandCondition;
  from?: number;
  to?: number;
}

// The problems' words live in the engineeringTypes catalogue, which the types screens load: the desk reads them in
// its own language, and the server writes its refusal to publish from the same phrases.
const problem = (key: string, values?: Record<string, PhraseValue>): Phrase =>
  phrase(`engineeringTypes:problems.${key}`, values);

/** A name as written in the definition (a band id, a checkpoint code), in the language's quotes. */
const quoted = (name: PhraseValue): PhraseValue => ({ phrase: problem('quoted', { name }) });

/** Several values as one comma-separated list. */
function listed(items: PhraseValue[]): PhraseValue {
  const [first, ...rest] = items;
  if (first === undefined) return '';
  return rest.length === 0 ? first : { phrase: problem('list', { first, rest: listed(rest) }) };
}

/** A number as the definition gives it, with as many decimals as it has: "0.25" in English, "0,25" in German. */
function exactly(value: number): PhraseValue {
  const written = String(value);
  const plain = /^-?\d+(?:\.(\d+))?$/.exec(written);
  return plain ? { decimal: value, places: plain[1]?.length ?? 0 } : written;
}

/** Every configuration the bands distinguish, limited to those in which a reading is accepted at all. */
function distinctContexts(checkpoint: Checkpoint): BandCondition[] {
  const usesAttitude = checkpoint.bands.some((band) => band.when?.attitude !== undefined);
  const usesPressure = checkpoint.bands.some((band) => band.when?.systemPressure !== undefined);
  const usesLeakState = checkpoint.bands.some((band) => band.when?.leakState !== undefined);
  const attitudes = usesAttitude ? attitudeSchema.options : [undefined];
  const pressures = usesPressure ? systemPressureSchema.options : [undefined];
  const leakStates = usesLeakState ? leakStateSchema.options : [undefined];
  const contexts: BandCondition[] = [];
  const combinations = attitudes.flatMap((attitude) =>
    pressures.flatMap((systemPressure) =>
      leakStates.map((leakState) => ({ attitude, systemPressure, leakState })),
    ),
  );
  for (const { attitude, systemPressure, leakState } of combinations) {
    const context: BandCondition = {};
    if (attitude !== undefined) context.attitude = attitude;
    if (systemPressure !== undefined) context.systemPressure = systemPressure;
    if (leakState !== undefined) context.leakState = leakState;
    const accepted =
      (checkpoint.takenWith?.attitude === undefined ||
        attitude === undefined ||
        attitude === checkpoint.takenWith.attitude) &&
      (checkpoint.takenWith?.systemPressure === undefined ||
        systemPressure === undefined ||
        systemPressure === checkpoint.takenWith.systemPressure);
    if (accepted) contexts.push(context);
  }
  return contexts;
}

/** The configuration a gap or an overlap shows in: "on wheels, system pressure on", or "in every configuration". */
function describeContext(context: BandCondition): PhraseValue {
  const parts: Phrase[] = [];
  if (context.attitude)
    parts.push(problem(context.attitude === 'on_wheels' ? 'where.onWheels' : 'where.onJacks'));
  if (context.systemPressure)
    parts.push(problem(context.systemPressure === 'on' ? 'where.pressureOn' : 'where.pressureRelieved'));
  if (context.leakState)
    parts.push(problem(context.leakState === 'static' ? 'where.staticLeak' : 'where.dynamicLeak'));
  if (parts.length === 0) return { phrase: problem('where.everywhere') };
  return listed(parts.map((part) => ({ phrase: part })));
}

interface Sample {
  value: number;
  from: number;
  to: number;
}

/** Points at which band membership can change, and one point inside every stretch between them. */
function samplePoints(checkpoint: Checkpoint): Sample[] {
  const { min, max } = checkpoint.range;
  if (checkpoint.kind === 'yes_no') return [0, 1].map((value) => ({ value, from: value, to: value }));
  // A leak is counted in whole drops: a stretch between two whole numbers is no gap.
  if (checkpoint.kind === 'leak_rate' && Number.isInteger(max) && max <= maxLeakRate)
    return Array.from({ length: max + 1 }, (_, value) => ({ value, from: value, to: value }));
  const edges = checkpoint.bands.flatMap((band) => [band.lower?.value, band.upper?.value]);
  const inside = edges.filter((value): value is number => value !== undefined && value > min && value < max);
  const points = [...new Set([min, ...inside, max])].sort((a, b) => a - b);
  const samples: Sample[] = [];
  points.forEach((point, index) => {
    samples.push({ value: point, from: point, to: point });
    const next = points[index + 1];
    if (next !== undefined) samples.push({ value: point + (next - point) / 2, from: point, to: next });
  });
  return samples;
}

/** Gaps and overlaps within the checkpoint's range, for each configuration the bands distinguish. */
export function findBandProblems(checkpoint: Checkpoint): CheckpointProblem[] {
  if (checkpoint.precharge !== undefined) return [];
  const problems: CheckpointProblem[] = [];
  for (const band of checkpoint.bands) {
    if (isEmpty(band)) {
      problems.push({
        checkpoint: checkpoint.code,
        kind: 'empty_band',
        bands: [band.id],
        reason: problem('emptyBand', { band: band.id }),
      });
    }
  }
  const unit = checkpoint.unit;
  const show = (value: number): PhraseValue =>
    unit !== null
      ? { phrase: problem('amount', { value: { decimal: value, places: 3 }, unit: { unitName: unit } }) }
      : checkpoint.kind === 'leak_rate'
        ? {
            phrase: problem('amount', { value: exactly(value), unit: { phrase: phrase('words:leak.unit') } }),
          }
        : exactly(value);
  for (const context of distinctContexts(checkpoint)) {
    const bands = checkpoint.bands.filter((band) => conditionMatches(band.when, context));
    let open: Omit<CheckpointProblem, 'reason'> | undefined;
    const found: Omit<CheckpointProblem, 'reason'>[] = [];
    for (const sample of samplePoints(checkpoint)) {
      const matching = bands.filter((band) => contains(band, sample.value)).map((band) => band.id);
      const kind = matching.length === 0 ? 'gap' : matching.length > 1 ? 'overlap' : undefined;
      const continues =
        open !== undefined && kind === open.kind && matching.join() === (open.bands ?? []).join();
      if (continues && open !== undefined) {
        open.to = sample.to;
        continue;
      }
      if (open !== undefined) found.push(open);
      open =
        kind === undefined
          ? undefined
          : {
              checkpoint: checkpoint.code,
              kind,
              bands: matching,
              context,
              from: sample.from,
              to: sample.to,
            };
    }
    if (open !== undefined) found.push(open);
    for (const stretch of found) {
      const span = { from: show(stretch.from ?? 0), to: show(stretch.to ?? 0) };
      const where = describeContext(stretch.context ?? {});
      problems.push({
        ...stretch,
        reason:
          stretch.kind === 'gap'
            ? problem('gap', { ...span, where })
            : problem('overlap', { bands: listed((stretch.bands ?? []).map(quoted)), ...span, where }),
      });
    }
  }
  return problems;
}

const dimensionForKind = {
  level: 'volume',
  quantity: 'volume',
  pressure: 'pressure',
  temperature: 'temperature',
} as const;

/** The card of each kind, as the problems name it: "the pre-flight card". */
const cardKeys: Record<CheckKind, string> = {
  pre_flight: 'card.preFlight',
  ground_run: 'card.groundRun',
  after_flight: 'card.afterFlight',
  servicing: 'card.servicing',
};

/** The unit and range each kind of checkpoint must have, and who may name a leak state. */
function kindProblems(checkpoint: Checkpoint): CheckpointProblem[] {
  const problems: CheckpointProblem[] = [];
  const add = (kind: CheckpointProblemKind, reason: Phrase, bands?: string[]) =>
    problems.push({ checkpoint: checkpoint.code, kind, reason, ...(bands ? { bands } : {}) });
  const { kind, unit, range } = checkpoint;
  const leakBands = checkpoint.bands.filter((band) => band.when?.leakState !== undefined);
  if (kind === 'yes_no') {
    if (unit !== null) add('bad_unit', problem('yesNoUnit'));
    if (range.min !== 0 || range.max !== 1) add('bad_range', problem('yesNoRange'));
  } else if (kind === 'leak_rate') {
    if (unit !== null) add('bad_unit', problem('leakRateUnit'));
    if (range.min !== 0 || !Number.isInteger(range.max) || range.max < 1 || range.max > maxLeakRate)
      add(
        'bad_range',
        problem('leakRateRange', { unit: { phrase: phrase('words:leak.unit') }, max: maxLeakRate }),
      );
    if (checkpoint.takenWith?.leakState !== undefined)
      add('bad_leak_state', problem('leakStateNotCondition'));
  } else if (unit === null || dimensionOf(unit) !== dimensionForKind[kind]) {
    // Each kind names the dimension its unit must have: "a pressure checkpoint needs a pressure unit".
    add(
      'bad_unit',
      unit === null
        ? problem(`unitMissing.${kind}`)
        : problem(`unitFor.${kind}`, { unit: quoted({ unitName: unit }) }),
    );
  }
  if (kind !== 'leak_rate' && (leakBands.length > 0 || checkpoint.takenWith?.leakState !== undefined))
    add(
      'bad_leak_state',
      problem('leakStateOnlyLeakRate'),
      leakBands.map((band) => band.id),
    );
  return problems;
}

function structuralProblems(checkpoint: Checkpoint): CheckpointProblem[] {
  const problems: CheckpointProblem[] = [];
  const add = (kind: CheckpointProblemKind, reason: Phrase, bands?: string[]) =>
    problems.push({ checkpoint: checkpoint.code, kind, reason, ...(bands ? { bands } : {}) });
  const { min, max } = checkpoint.range;
  if (!(min < max)) add('bad_range', problem('emptyRange', { min: exactly(min), max: exactly(max) }));
  problems.push(...kindProblems(checkpoint));
  const marks = checkpoint.marks;
  if (marks !== undefined) {
    if (checkpoint.kind !== 'level') add('bad_marks', problem('marksOnlyLevel'));
    if (!(marks.minimum <= marks.normal && marks.normal <= marks.maximum))
      add('bad_marks', problem('marksOrder'));
    if (marks.minimum < min || marks.maximum > max) add('bad_marks', problem('marksInRange'));
    if (marks.isolation !== undefined && (marks.isolation > marks.minimum || marks.isolation < min)) {
      add('bad_marks', problem('isolationMark'));
    }
  }
  const precharge = checkpoint.precharge;
  if (precharge !== undefined) {
    if (checkpoint.kind !== 'pressure') add('bad_precharge', problem('prechargePressure'));
    if (checkpoint.bands.length > 0)
      add(
        'bad_precharge',
        problem('prechargeBands'),
        checkpoint.bands.map((band) => band.id),
      );
    if (precharge.tolerance >= precharge.referencePressure)
      add('bad_precharge', problem('prechargeTolerance'));
    if (checkpoint.takenWith?.systemPressure === 'on') add('bad_precharge', problem('prechargeRelieved'));
  }
  const seen = new Set<string>();
  for (const band of checkpoint.bands) {
    if (seen.has(band.id)) add('duplicate_band_id', problem('duplicateBand', { band: band.id }), [band.id]);
    seen.add(band.id);
  }
  return problems;
}

/** Everything the engineering desk must fix before publishing this checkpoint; empty when it is sound. */
export function validateCheckpoint(checkpoint: Checkpoint): CheckpointProblem[] {
  return [...structuralProblems(checkpoint), ...findBandProblems(checkpoint)];
}

/** Every checkpoint's problems, plus card entries and systems that name no checkpoint of the type. */
export function validateTypeDefinition(type: AircraftTypeDefinition): CheckpointProblem[] {
  const problems = type.checkpoints.flatMap(validateCheckpoint);
  const codes = new Set<string>();
  for (const checkpoint of type.checkpoints) {
    if (codes.has(checkpoint.code)) {
      problems.push({
        checkpoint: checkpoint.code,
        kind: 'duplicate_checkpoint',
        reason: problem('duplicateCheckpoint', { checkpoint: checkpoint.code, type: type.code }),
      });
    }
    codes.add(checkpoint.code);
  }
  const references = [
    ...(Object.entries(type.cards) as [CheckKind, string[] | undefined][]).flatMap(([kind, card]) =>
      (card ?? []).map((code) => ({ code, where: problem(cardKeys[kind]) })),
    ),
    ...type.systems.map((system) => ({
      code: system.reservoirCheckpoint,
      where: problem('system', { system: system.code }),
    })),
  ];
  for (const { code, where } of references) {
    if (!codes.has(code)) {
      problems.push({
        checkpoint: code,
        kind: 'unknown_checkpoint',
        reason: problem('unknownCheckpoint', { where: { phrase: where }, type: type.code, checkpoint: code }),
      });
    }
  }
  return problems;
}
