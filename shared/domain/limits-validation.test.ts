import { describe, expect, it } from 'vitest';
import type { AircraftTypeDefinition, Checkpoint, Reading } from '../schemas/limits';
import { demoTypes } from '../demo/demo-types';
import { band, plainGlass, readingRefusal } from '@tests/setup/domain-fixtures';
import {
  evaluateReading,
  findBandProblems,
  positionInterval,
  validateCheckpoint,
  validateTypeDefinition,
  type CheckpointProblem,
} from './limits';
import { phraseWords } from '../i18n/phrase';
import i18next from 'i18next';

// Invented fixtures for the engineering desk's checks of a limits definition: not facts of the trade.

const glass: Checkpoint = {
  ...plainGlass,
  marks: { minimum: 3, normal: 5, maximum: 8, isolation: 1 },
  bands: [
    band('low', [0, true], [3, false], 'out_of_limits'),
    band('ok', [3, true], [8, true]),
    band('high', [8, false], [10, true], 'service'),
  ],
};
const gauge: Checkpoint = {
  ...glass,
  code: 'sys1.pressure',
  kind: 'pressure',
  unit: 'bar',
  marks: undefined,
  bands: [band('all', [0, true], [10, true])],
};
const question: Checkpoint = {
  ...glass,
  code: 'leaks.none',
  kind: 'yes_no',
  unit: null,
  range: { min: 0, max: 1 },
  marks: undefined,
  bands: [band('no', [0, true], [0, true], 'out_of_limits'), band('yes', [1, true], [1, true])],
};
const accumulator: Checkpoint = {
  ...gauge,
  code: 'acc.precharge',
  range: { min: 0, max: 200 },
  precharge: { referencePressure: 90, referenceTempC: 20, tolerance: 5 },
  takenWith: { systemPressure: 'relieved' },
  bands: [],
};

const problemsOf = (c: Checkpoint) =>
  validateCheckpoint(c).map((p) => [p.kind, phraseWords(p.reason), p.bands]);
/** The problems with their reasons in English words, as the desk reads them. */
const worded = (problems: CheckpointProblem[]) =>
  problems.map(({ reason, ...p }) => ({ ...p, message: phraseWords(reason) }));

const refusal = readingRefusal;

describe('a checkpoint that is sound', () => {
  it.each([glass, gauge, question, accumulator])('when $code is checked, then there is no problem', (c) => {
    expect(validateCheckpoint(c)).toEqual([]);
  });
});

describe('structural problems of a checkpoint, each with its own message', () => {
  it('when the range is empty, then it is a bad range naming both ends', () => {
    expect(
      problemsOf({ ...gauge, range: { min: 5, max: 5 }, bands: [band('x', [5, true], [5, true])] }),
    ).toEqual([['bad_range', 'The range 5 to 5 is empty.', undefined]]);
  });

  it('when a yes/no checkpoint has a unit or another range, then each is reported', () => {
    expect(problemsOf({ ...question, unit: 'L' })).toEqual([
      ['bad_unit', 'A yes/no checkpoint has no unit.', undefined],
    ]);
    const rangeProblem = ['bad_range', 'A yes/no checkpoint has the range 0 (no) to 1 (yes).', undefined];
    expect(problemsOf({ ...question, range: { min: 0, max: 2 } })).toContainEqual(rangeProblem);
    expect(problemsOf({ ...question, range: { min: -1, max: 1 } })).toContainEqual(rangeProblem);
  });

  it('when a value checkpoint has no unit or one of another dimension, then the unit is reported', () => {
    expect(problemsOf({ ...gauge, unit: 'L' })).toEqual([
      ['bad_unit', "A pressure checkpoint needs a pressure unit, not 'L'.", undefined],
    ]);
    expect(problemsOf({ ...glass, unit: null })).toEqual([
      ['bad_unit', 'A level checkpoint needs a volume unit.', undefined],
    ]);
    expect(problemsOf({ ...gauge, unit: 'psi' })).toEqual([]);
  });

  it('when marks sit on a gauge that is not a glass, then they are reported', () => {
    expect(problemsOf({ ...gauge, marks: { minimum: 3, normal: 5, maximum: 8 } })).toEqual([
      ['bad_marks', 'Only a level checkpoint has sight-glass marks.', undefined],
    ]);
  });

  it.each([[{ minimum: 6, normal: 5, maximum: 8 }], [{ minimum: 3, normal: 9, maximum: 8 }]])(
    'when the marks are out of order (%o), then the order is reported',
    (marks) => {
      expect(problemsOf({ ...glass, marks })).toEqual([
        ['bad_marks', 'Marks must run minimum <= normal <= maximum.', undefined],
      ]);
    },
  );

  it('when marks are equal, then they are still in order', () => {
    expect(problemsOf({ ...glass, marks: { minimum: 5, normal: 5, maximum: 5 } })).toEqual([]);
  });

  it.each([[{ minimum: -1, normal: 5, maximum: 8 }], [{ minimum: 3, normal: 5, maximum: 11 }]])(
    'when a mark lies outside the glass (%o), then it is reported',
    (marks) => {
      expect(problemsOf({ ...glass, marks })).toEqual([
        ['bad_marks', 'Every mark must lie within the range of the glass.', undefined],
      ]);
    },
  );
});

describe('marks, isolation and pre-charge problems of a checkpoint', () => {
  it('when marks sit exactly on the ends of the glass, then they are inside it', () => {
    expect(problemsOf({ ...glass, marks: { minimum: 0, normal: 5, maximum: 10 } })).toEqual([]);
  });

  it.each([4, -0.5])(
    'when the isolation level is %s (above the minimum mark or below the glass), then it is reported',
    (isolation) => {
      expect(problemsOf({ ...glass, marks: { ...glass.marks!, isolation } })).toEqual([
        [
          'bad_marks',
          'The isolation level must lie between the bottom of the glass and the minimum mark.',
          undefined,
        ],
      ]);
    },
  );

  it('when the isolation level is on the minimum mark or the bottom of the glass, then it is accepted', () => {
    expect(problemsOf({ ...glass, marks: { ...glass.marks!, isolation: 3 } })).toEqual([]);
    expect(problemsOf({ ...glass, marks: { ...glass.marks!, isolation: 0 } })).toEqual([]);
  });

  it('when a pre-charge is on a level, has fixed bands, a tolerance as large as itself, or is read with pressure on, then each is reported', () => {
    expect(problemsOf({ ...accumulator, kind: 'level', unit: 'L' })).toContainEqual([
      'bad_precharge',
      'A pre-charge is a pressure checkpoint.',
      undefined,
    ]);
    expect(problemsOf({ ...accumulator, bands: [band('fixed', [0, true], [200, true])] })).toEqual([
      ['bad_precharge', 'A pre-charge checkpoint derives its bands; remove the fixed ones.', ['fixed']],
    ]);
    expect(
      problemsOf({ ...accumulator, precharge: { referencePressure: 90, referenceTempC: 20, tolerance: 90 } }),
    ).toEqual([['bad_precharge', 'The tolerance must be smaller than the reference pre-charge.', undefined]]);
    expect(
      problemsOf({
        ...accumulator,
        precharge: { referencePressure: 90, referenceTempC: 20, tolerance: 89.9 },
      }),
    ).toEqual([]);
    expect(problemsOf({ ...accumulator, takenWith: { systemPressure: 'on' } })).toEqual([
      ['bad_precharge', 'A pre-charge is read with system pressure relieved, never on.', undefined],
    ]);
    expect(problemsOf({ ...accumulator, takenWith: undefined })).toEqual([]);
  });

  it('when a band id is used twice, then the second use is reported with that id', () => {
    const twice = { ...gauge, bands: [band('a', [0, true], [5, false]), band('a', [5, true], [10, true])] };
    expect(problemsOf(twice)).toEqual([['duplicate_band_id', "Band id 'a' is used twice.", ['a']]]);
  });
});

describe('gaps and overlaps, described in words', () => {
  it('when the desk reads German, then values, units, bands and configuration are written the German way', () => {
    const c: Checkpoint = {
      ...glass,
      bands: [
        band('a', [0, true], [6.5, true], 'in_limits', { attitude: 'on_wheels' }),
        band('b', [4, true], [10, true], 'in_limits', { attitude: 'on_wheels' }),
        band('jacks', [0, true], [9, true], 'in_limits', { attitude: 'on_jacks_gear_retracted' }),
      ],
    };
    expect(findBandProblems(c).map((p) => phraseWords(p.reason, i18next.getFixedT('de')))).toEqual([
      'Die Grenzwertbänder „a“, „b“ überschneiden sich von 4,000 L bis 6,500 L (auf den Rädern).',
      'Kein Grenzwertband deckt 9,000 L bis 10,000 L ab (aufgebockt mit eingefahrenem Fahrwerk).',
    ]);
  });

  it('when a gap shows only with system pressure on, then its message names the values and that configuration', () => {
    const c: Checkpoint = {
      ...gauge,
      bands: [
        band('relieved', [0, true], [10, true], 'in_limits', { systemPressure: 'relieved' }),
        band('on_low', [0, true], [4, true], 'in_limits', { systemPressure: 'on' }),
      ],
    };
    expect(worded(findBandProblems(c))).toEqual([
      {
        checkpoint: 'sys1.pressure',
        kind: 'gap',
        bands: [],
        context: { systemPressure: 'on' },
        from: 4,
        to: 10,
        message: 'No band covers 4.000 bar to 10.000 bar (system pressure on).',
      },
    ]);
  });

  it('when an overlap shows in every configuration, then its message names the bands and says so', () => {
    const c: Checkpoint = {
      ...gauge,
      bands: [band('a', [0, true], [6, true]), band('b', [4, true], [10, true])],
    };
    expect(worded(findBandProblems(c))).toEqual([
      {
        checkpoint: 'sys1.pressure',
        kind: 'overlap',
        bands: ['a', 'b'],
        context: {},
        from: 4,
        to: 6,
        message: "Bands 'a', 'b' overlap from 4.000 bar to 6.000 bar (in every configuration).",
      },
    ]);
  });

  it('when a gap shows only on wheels, then the attitude is written in words', () => {
    const c: Checkpoint = {
      ...glass,
      bands: [
        band('jacks', [0, true], [10, true], 'in_limits', { attitude: 'on_jacks_gear_retracted' }),
        band('wheels', [0, true], [9, true], 'in_limits', { attitude: 'on_wheels' }),
      ],
    };
    expect(findBandProblems(c).map((p) => phraseWords(p.reason))).toEqual([
      'No band covers 9.000 L to 10.000 L (on wheels).',
    ]);
  });
});

describe('gaps that do not count, and band edges', () => {
  it('when a checkpoint is only taken with pressure relieved, then a gap with pressure on is not a problem', () => {
    const c: Checkpoint = {
      ...gauge,
      takenWith: { systemPressure: 'relieved' },
      bands: [
        band('relieved', [0, true], [10, true], 'in_limits', { systemPressure: 'relieved' }),
        band('on', [0, true], [4, true], 'in_limits', { systemPressure: 'on' }),
      ],
    };
    expect(findBandProblems(c)).toEqual([]);
    expect(
      findBandProblems({ ...c, takenWith: { systemPressure: 'on' } }).map((p) => phraseWords(p.reason)),
    ).toEqual(['No band covers 4.000 bar to 10.000 bar (system pressure on).']);
  });

  it('when a checkpoint is only taken on jacks, then a gap on wheels is not a problem', () => {
    const c: Checkpoint = {
      ...glass,
      takenWith: { attitude: 'on_jacks_gear_retracted' },
      bands: [
        band('jacks', [0, true], [10, true], 'in_limits', { attitude: 'on_jacks_gear_retracted' }),
        band('wheels', [0, true], [9, true], 'in_limits', { attitude: 'on_wheels' }),
      ],
    };
    expect(findBandProblems(c)).toEqual([]);
  });

  it('when a yes/no question has no band for "no", then the gap is at 0 only', () => {
    const c: Checkpoint = { ...question, bands: [band('yes', [1, true], [1, true])] };
    expect(worded(findBandProblems(c))).toEqual([
      expect.objectContaining({
        kind: 'gap',
        from: 0,
        to: 0,
        message: 'No band covers 0 to 0 (in every configuration).',
      }),
    ]);
  });

  it('when a band edge lies outside the range, then only the range is examined', () => {
    const c: Checkpoint = { ...gauge, bands: [band('wide', [-5, true], [15, true])] };
    expect(findBandProblems(c)).toEqual([]);
  });

  it('when two gaps are separated by a covered stretch, then they are two problems', () => {
    const c: Checkpoint = { ...gauge, bands: [band('middle', [3, true], [6, true])] };
    expect(findBandProblems(c).map((p) => [p.from, p.to])).toEqual([
      [0, 3],
      [6, 10],
    ]);
  });

  it('when a band has no edges at all, then it covers the whole range', () => {
    expect(findBandProblems({ ...gauge, bands: [band('all', null, null)] })).toEqual([]);
  });

  it('when a band holds no value, then it is an empty band as well as a gap', () => {
    const c: Checkpoint = {
      ...gauge,
      bands: [
        band('a', [0, true], [5, true]),
        band('none', [5, false], [5, false]),
        band('b', [5, false], [10, true]),
      ],
    };
    expect(worded(validateCheckpoint(c))).toEqual([
      {
        checkpoint: 'sys1.pressure',
        kind: 'empty_band',
        bands: ['none'],
        message: "Band 'none' contains no value.",
      },
    ]);
  });
});

describe('a type definition', () => {
  const [demo] = demoTypes;
  const type = (): AircraftTypeDefinition => structuredClone(demo!) as AircraftTypeDefinition;

  it('when the demo type is checked, then it has no problem', () => {
    expect(validateTypeDefinition(type())).toEqual([]);
  });

  it('when a checkpoint code is used twice, then it is reported once, with the type', () => {
    const t = type();
    t.checkpoints.push(structuredClone(t.checkpoints[0]!));
    expect(worded(validateTypeDefinition(t))).toEqual([
      {
        checkpoint: t.checkpoints[0]!.code,
        kind: 'duplicate_checkpoint',
        message: `Checkpoint code '${t.checkpoints[0]!.code}' is used twice in ${t.code}.`,
      },
    ]);
  });

  it('when a card or a system names a checkpoint the type does not have, then each is reported where it is', () => {
    const t = type();
    const [kind] = Object.keys(t.cards) as (keyof AircraftTypeDefinition['cards'])[];
    t.cards[kind!] = [...t.cards[kind!]!, 'no.such'];
    t.systems[0] = { ...t.systems[0]!, reservoirCheckpoint: 'no.tank' };
    expect(worded(validateTypeDefinition(t))).toEqual([
      {
        checkpoint: 'no.such',
        kind: 'unknown_checkpoint',
        message: `the ${kind!.replaceAll('_', '-')} card of ${t.code} names 'no.such', which is not a checkpoint of the type.`,
      },
      {
        checkpoint: 'no.tank',
        kind: 'unknown_checkpoint',
        message: `system ${t.systems[0]!.code} of ${t.code} names 'no.tank', which is not a checkpoint of the type.`,
      },
    ]);
  });

  it("when a checkpoint of the type has a problem, then it is among the type's problems", () => {
    const t = type();
    t.checkpoints[0] = { ...t.checkpoints[0]!, range: { min: 1, max: 0 } };
    expect(validateTypeDefinition(t)).toContainEqual(
      expect.objectContaining({ checkpoint: t.checkpoints[0]!.code, kind: 'bad_range' }),
    );
  });
});

describe('the shape of an entry, refused with a message a mechanic can act on', () => {
  const entry = (e: object) => ({ ...e, context: {} }) as Reading;

  it('when a yes/no question gets a value, then it asks for a yes or no', () => {
    const error = refusal(() => evaluateReading(question, entry({ value: 1, unit: 'L' })));
    expect([error.code, error.message]).toEqual([
      'wrong_entry',
      expect.stringContaining('This checkpoint takes a yes or no answer.'),
    ]);
  });

  it('when a gauge gets a yes or no, then it asks for the value shown', () => {
    const error = refusal(() => evaluateReading(gauge, entry({ answer: true })));
    expect(error.code).toBe('wrong_entry');
    expect(error.message).toContain(
      'This checkpoint takes a value from the gauge or glass, not a yes or no answer.',
    );
  });

  it('when a gauge gets a position against marks, then it asks for the value shown', () => {
    const error = refusal(() => evaluateReading(gauge, entry({ position: 'at_normal' })));
    expect(error.code).toBe('wrong_entry');
    expect(error.message).toContain(
      'A position against the marks is only for a sight glass. Enter the value the gauge shows.',
    );
  });

  it('when a glass without marks gets a position, then it asks for a quantity', () => {
    const unmarked = { ...glass, marks: undefined };
    const error = refusal(() => evaluateReading(unmarked, entry({ position: 'at_normal' })));
    expect(error.code).toBe('wrong_entry');
    expect(error.message).toContain('This glass has no marks defined. Enter the level as a quantity.');
    expect(refusal(() => positionInterval(unmarked, 'at_normal')).code).toBe('wrong_entry');
  });

  it('when a yes/no question gets an answer, then yes and no are judged by their bands', () => {
    expect(evaluateReading(question, entry({ answer: true })).band.id).toBe('yes');
    expect(evaluateReading(question, entry({ answer: false })).band.id).toBe('no');
  });

  it('when a position is judged against bands that leave it uncovered, then engineering is told', () => {
    const gappy = { ...glass, bands: [band('ok', [3, true], [8, true])] };
    const error = refusal(() => evaluateReading(gappy, entry({ position: 'below_minimum' })));
    expect([error.code, error.message]).toEqual([
      'no_band',
      expect.stringContaining('No limit covers this level in this configuration; tell engineering.'),
    ]);
    const value = refusal(() => evaluateReading(gappy, entry({ value: 1, unit: 'L' })));
    expect(value.message).toContain('No limit covers this value in this configuration; tell engineering.');
  });

  it('when the glass cannot show a position, then the position is named in words', () => {
    const flush = { ...glass, marks: { minimum: 0, normal: 5, maximum: 10 } };
    const error = refusal(() => evaluateReading(flush, entry({ position: 'above_maximum' })));
    expect(error.code).toBe('out_of_range');
    // The position's label, as the kiosk's position buttons write it; never its code.
    expect(error.message).toContain('This glass cannot show "Above maximum". Look at the glass again.');
  });
});

describe('what a position against the marks stands for (marks 3, 5, 8 on a 0 to 10 L glass)', () => {
  const edge = (value: number, closed: boolean) => ({ value, closed });
  it.each([
    ['below_minimum', edge(0, true), edge(3, false)],
    ['at_minimum', edge(3, true), edge(3, true)],
    ['between_minimum_normal', edge(3, false), edge(5, false)],
    ['at_normal', edge(5, true), edge(5, true)],
    ['between_normal_maximum', edge(5, false), edge(8, false)],
    ['at_maximum', edge(8, true), edge(8, true)],
    ['above_maximum', edge(8, false), edge(10, true)],
  ] as const)('when the level is %s, then it is the interval from %o to %o', (position, lower, upper) => {
    expect(positionInterval(glass, position)).toEqual({ lower, upper });
  });
});
