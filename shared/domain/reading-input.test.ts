import { describe, expect, it } from 'vitest';
import i18next from 'i18next';
import { phraseWords } from '../i18n/phrase';
import type { Checkpoint, CheckContext, Reading } from '../schemas/limits';
import {
  assertValueEntry,
  canonicalValue,
  checkContext,
  InvalidReadingError,
  requiredContextKeys,
} from './reading-input';
import { plainGlass } from '@tests/setup/domain-fixtures';

// Invented fixtures: a 0 to 10 L glass and a 0 to 300 bar gauge, not facts of the trade.
const glass = plainGlass;
const gauge: Checkpoint = {
  ...glass,
  code: 'sys1.pressure',
  label: 'System 1 pressure',
  kind: 'pressure',
  unit: 'bar',
  range: { min: 0, max: 300 },
};

function refusal(run: () => unknown): {
  name: string;
  code: string;
  message: string;
  checkpointCode: string;
} {
  try {
    run();
  } catch (error) {
    if (!(error instanceof InvalidReadingError)) throw error;
    return {
      name: error.name,
      code: error.code,
      message: error.message,
      checkpointCode: error.checkpointCode,
    };
  }
  throw new Error('expected a refusal');
}

describe('which context a reading must carry', () => {
  it('when nothing asks for context, then none is required', () => {
    expect(requiredContextKeys(glass)).toEqual([]);
  });

  it('when a band depends on the attitude and another on system pressure, then both are required, after those asked for', () => {
    const c: Checkpoint = {
      ...glass,
      requires: ['ambientTempC'],
      bands: [
        {
          id: 'a',
          lower: null,
          upper: null,
          verdict: 'in_limits',
          message: 'a',
          action: 'a',
          when: { attitude: 'on_wheels' },
        },
        {
          id: 'b',
          lower: null,
          upper: null,
          verdict: 'in_limits',
          message: 'b',
          action: 'b',
          when: { systemPressure: 'on' },
        },
      ],
    };
    expect(requiredContextKeys(c)).toEqual(['ambientTempC', 'attitude', 'systemPressure']);
  });

  it('when only takenWith names an attitude, then the attitude is required', () => {
    expect(requiredContextKeys({ ...glass, takenWith: { attitude: 'on_jacks_gear_retracted' } })).toEqual([
      'attitude',
    ]);
  });
});

describe('checking the context, each refusal in words a mechanic can act on', () => {
  const check = (c: Checkpoint, context: CheckContext) => refusal(() => checkContext(c, context));

  it.each([
    ['attitude', 'how the aircraft stands (on wheels, or on jacks with gear retracted)'],
    ['systemPressure', 'whether system pressure is on or relieved'],
    ['ambientTempC', 'the ambient temperature'],
  ] as const)('when %s is asked for and missing, then the mechanic is told to record %s', (key, words) => {
    expect(check({ ...glass, requires: [key] }, {})).toEqual({
      name: 'InvalidReadingError',
      code: 'missing_context',
      message: `System 1 level (sys1.level): Record ${words} before this reading can be judged.`,
      checkpointCode: 'sys1.level',
    });
  });

  it('when the ambient temperature is not a finite number, then it is refused as not a number', () => {
    expect(check(glass, { ambientTempC: Number.NaN })).toMatchObject({
      code: 'not_a_number',
      message: 'System 1 level (sys1.level): The ambient temperature is not a number. Enter it again.',
    });
    expect(() => checkContext(glass, { ambientTempC: -40 })).not.toThrow();
  });

  it('when a reading is taken with system pressure other than the checkpoint wants, then both are named', () => {
    expect(
      check({ ...gauge, takenWith: { systemPressure: 'on' } }, { systemPressure: 'relieved' }),
    ).toMatchObject({
      code: 'wrong_context',
      message:
        'System 1 pressure (sys1.pressure): Take this reading with system pressure on; a reading with system pressure relieved is not valid.',
    });
  });

  it('when a reading is taken on wheels where it must be on jacks, then both attitudes are named in words', () => {
    expect(
      check({ ...glass, takenWith: { attitude: 'on_jacks_gear_retracted' } }, { attitude: 'on_wheels' }),
    ).toMatchObject({
      code: 'wrong_context',
      message:
        'System 1 level (sys1.level): Take this reading with the aircraft on jacks with gear retracted; it was recorded on wheels.',
    });
  });

  it('when a German kiosk judges the same reading, then its reason reads in German, with no English left', () => {
    let refusal: unknown;
    try {
      checkContext(
        { ...glass, takenWith: { attitude: 'on_jacks_gear_retracted' } },
        { attitude: 'on_wheels' },
      );
    } catch (error) {
      refusal = error;
    }
    expect(refusal).toBeInstanceOf(InvalidReadingError);
    expect(phraseWords((refusal as InvalidReadingError).reason, i18next.getFixedT('de'))).toBe(
      'Lesen Sie diesen Wert mit dem Luftfahrzeug aufgebockt mit eingefahrenem Fahrwerk ab; erfasst wurde es auf Rädern.',
    );
  });

  it('when the context is the one the checkpoint wants, then it passes', () => {
    const wanted: CheckContext = { attitude: 'on_wheels', systemPressure: 'on' };
    expect(() => checkContext({ ...gauge, takenWith: wanted }, wanted)).not.toThrow();
  });
});

describe('the value a reading stands for', () => {
  it('when a value is in another unit of the same kind, then it is converted and kept unrounded', () => {
    // NIST SP 811 (2008), B.9: 1 psi = 6.894757E+03 Pa, 1 bar = 1.0E+05 Pa.
    expect(canonicalValue(gauge, 100, 'psi')).toBeCloseTo(6.894757, 5);
    expect(canonicalValue(glass, 0, 'L')).toBe(0);
    expect(canonicalValue(glass, 10, 'L')).toBe(10);
  });

  it('when a yes/no checkpoint gets a number, then it asks for a yes or no', () => {
    expect(refusal(() => canonicalValue({ ...glass, unit: null }, 1, 'L'))).toMatchObject({
      code: 'wrong_entry',
      message: 'System 1 level (sys1.level): This checkpoint takes a yes or no answer, not a number.',
    });
  });

  it('when the value is not finite, then it is read again', () => {
    expect(refusal(() => canonicalValue(glass, Number.POSITIVE_INFINITY, 'L'))).toMatchObject({
      code: 'not_a_number',
      message: 'System 1 level (sys1.level): The value is not a number. Read the gauge again and enter it.',
    });
  });

  it('when the unit measures something else, then both units are named', () => {
    expect(refusal(() => canonicalValue(glass, 1, 'bar'))).toMatchObject({
      code: 'wrong_unit',
      message:
        "System 1 level (sys1.level): A value in 'bar' cannot be a reading in 'L'. Pick the unit on the gauge.",
    });
    // Units are written as people write them, never as their codes ("C", "US_qt").
    expect(refusal(() => canonicalValue(glass, 1, 'C')).message).toContain("A value in '°C' cannot be");
  });

  it('when a level is below empty, then it is refused as negative; zero is a level', () => {
    expect(refusal(() => canonicalValue(glass, -0.01, 'L'))).toMatchObject({
      code: 'negative_level',
      message: 'System 1 level (sys1.level): A level cannot be below empty. Read the sight glass again.',
    });
    expect(refusal(() => canonicalValue({ ...gauge, range: { min: -1, max: 300 } }, -2, 'bar')).code).toBe(
      'out_of_range',
    );
    expect(canonicalValue({ ...gauge, range: { min: -1, max: 300 } }, -0.5, 'bar')).toBe(-0.5);
  });

  it('when a value lies just past either end of the gauge, then it is out of range with the gauge shown', () => {
    expect(refusal(() => canonicalValue(gauge, 300.01, 'bar'))).toMatchObject({
      code: 'out_of_range',
      message:
        'System 1 pressure (sys1.pressure): 300.0 bar is outside what this gauge can show (0.0 bar to 300.0 bar). Read it again; if the gauge really shows this, report the gauge as faulty.',
    });
    expect(refusal(() => canonicalValue({ ...gauge, range: { min: 10, max: 300 } }, 9.99, 'bar')).code).toBe(
      'out_of_range',
    );
  });
});

describe('an entry that is not a value', () => {
  it.each([
    [{ answer: true }, 'a yes or no answer'],
    [{ position: 'at_normal' }, 'a position against the marks'],
  ])('when %o reaches a value checkpoint, then it is refused naming %s', (entry, what) => {
    const reading = { ...entry, context: {} } as Reading;
    expect(refusal(() => assertValueEntry(gauge, reading))).toMatchObject({
      code: 'wrong_entry',
      message: `System 1 pressure (sys1.pressure): This checkpoint takes a value from the gauge, not ${what}.`,
    });
  });

  it('when a value reaches it, then it passes', () => {
    expect(() => assertValueEntry(gauge, { value: 1, unit: 'bar', context: {} })).not.toThrow();
  });
});
