import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  checkpointSchema,
  type Checkpoint,
  type CheckpointInput,
  type LimitBand,
  type Reading,
  type Verdict,
} from '../schemas/limits';
import { demoTypes } from '../demo/demo-types';
import { contains } from './bands';
import { evaluateReading, findBandProblems, validateCheckpoint } from './limits';
import { convert } from './units';
import { phraseWords } from '../i18n/phrase';
import { band, readingRefusal } from '@tests/setup/domain-fixtures';

const checkpoint = (input: CheckpointInput): Checkpoint => checkpointSchema.parse(input);

const bar = (value: number, context: Reading['context'] = { systemPressure: 'on' }): Reading => ({
  value,
  unit: 'bar',
  context,
});
const litres = (value: number, context: Reading['context']): Reading => ({ value, unit: 'L', context });
const onWheels = { attitude: 'on_wheels' } as const;
const onJacks = { attitude: 'on_jacks_gear_retracted' } as const;

const refusal = readingRefusal;

// The gauge ranges (0 to 300 bar, 0 to 15 L, 0 to 10 L) are test fixtures, not facts of the trade.
// Hydraulic system pressure of a medium twin helicopter: maximum 210, nominal 175, minimum 110 bar; the
// low-pressure caution comes on below 110 bar, not at 110 (common practice, no source).
const systemPressure = checkpoint({
  code: 'trade.sys.pressure',
  label: 'System pressure',
  instruction: 'Read system pressure.',
  kind: 'pressure',
  unit: 'bar',
  range: { min: 0, max: 300 },
  takenWith: { systemPressure: 'on' },
  ata: '29',
  reference: 'test',
  bands: [
    band('low_pressure_caution', [0, true], [110, false], 'out_of_limits'),
    band('in_limits', [110, true], [210, true], 'in_limits'),
    band('above_maximum', [210, false], [300, true], 'out_of_limits'),
  ],
});

// An electrically driven auxiliary pump holds 110 to 140 bar (common practice, no source).
const auxiliaryPump = checkpoint({
  code: 'trade.aux.pressure',
  label: 'Auxiliary pump pressure',
  instruction: 'Read pressure with the auxiliary pump on.',
  kind: 'pressure',
  unit: 'bar',
  range: { min: 0, max: 300 },
  ata: '29',
  reference: 'test',
  bands: [
    band('low', [0, true], [110, false], 'out_of_limits'),
    band('in_limits', [110, true], [140, true], 'in_limits'),
    band('high', [140, false], [300, true], 'out_of_limits'),
  ],
});

// Main (left) reservoir: normal 9.5 L, maximum 12 L; the 12 L mark applies only with gear retracted on jacks;
// strictly below 4 L a level switch isolates everything downstream (common practice, no source).
const mainReservoir = checkpoint({
  code: 'trade.left.level',
  label: 'Left reservoir level',
  instruction: 'Read the left reservoir sight glass.',
  kind: 'level',
  unit: 'L',
  range: { min: 0, max: 15 },
  requires: ['attitude'],
  ata: '12',
  reference: 'test',
  bands: [
    band('isolated', [0, true], [4, false], 'out_of_limits'),
    band('up_to_normal', [4, true], [9.5, true], 'in_limits'),
    band('overfilled_on_wheels', [9.5, false], [15, true], 'service', { attitude: 'on_wheels' }),
    band('up_to_maintenance', [9.5, false], [12, true], 'in_limits', { attitude: 'on_jacks_gear_retracted' }),
    band('overfilled_on_jacks', [12, false], [15, true], 'service', { attitude: 'on_jacks_gear_retracted' }),
  ],
});

// Second (right) reservoir: normal 5 L, maximum 7.5 L; at or below 2 L its level switch isolates the tail rotor
// servo (common practice, no source).
const secondReservoir = checkpoint({
  code: 'trade.right.level',
  label: 'Right reservoir level',
  instruction: 'Read the right reservoir sight glass.',
  kind: 'level',
  unit: 'L',
  range: { min: 0, max: 10 },
  ata: '12',
  reference: 'test',
  bands: [
    band('tail_rotor_isolated', [0, true], [2, true], 'out_of_limits'),
    band('in_limits', [2, false], [7.5, true], 'in_limits'),
    band('overfilled', [7.5, false], [10, true], 'service'),
  ],
});

// Common practice, no source: the caution comes on below 110 bar, not at 110.

describe('evaluateReading at the trade edges', () => {
  it('when system pressure is exactly 110.0 bar, then it is in limits', () => {
    expect(evaluateReading(systemPressure, bar(110.0)).verdict).toBe('in_limits');
  });

  it('when system pressure is 109.99 bar, then it is out of limits in the low-pressure caution band', () => {
    const result = evaluateReading(systemPressure, bar(109.99));
    expect(result.verdict).toBe('out_of_limits');
    expect(result.band.id).toBe('low_pressure_caution');
  });

  // Common practice, no source: nominal 175 bar, maximum 210 bar.
  it.each([
    [175, 'in_limits'],
    [210, 'in_limits'],
    [210.01, 'out_of_limits'],
  ] as const)('when system pressure is %s bar, then it is %s', (value, verdict) => {
    expect(evaluateReading(systemPressure, bar(value)).verdict).toBe(verdict);
  });

  it('when 110 bar is entered in psi and converts to a hair below 110 bar, then it is not rounded into limits', () => {
    const justBelow = convert(109.9999, 'bar', 'psi');
    const justAbove = convert(110.0001, 'bar', 'psi');
    expect(
      evaluateReading(systemPressure, { value: justBelow, unit: 'psi', context: { systemPressure: 'on' } })
        .verdict,
    ).toBe('out_of_limits');
    expect(
      evaluateReading(systemPressure, { value: justAbove, unit: 'psi', context: { systemPressure: 'on' } })
        .verdict,
    ).toBe('in_limits');
  });

  // Common practice, no source: the auxiliary pump holds 110 to 140 bar.
  it.each([
    [109.99, 'out_of_limits'],
    [110, 'in_limits'],
    [140, 'in_limits'],
    [140.01, 'out_of_limits'],
  ] as const)('when the auxiliary pump shows %s bar, then it is %s', (value, verdict) => {
    expect(evaluateReading(auxiliaryPump, bar(value, {})).verdict).toBe(verdict);
  });

  // Common practice, no source: the 12 L mark applies only with gear retracted on jacks.
});

describe('evaluateReading at the trade edges: reservoir levels', () => {
  it('when the main reservoir shows 12 L with gear retracted on jacks, then it is in limits', () => {
    expect(evaluateReading(mainReservoir, litres(12, onJacks)).verdict).toBe('in_limits');
  });

  it('when the main reservoir shows 12 L on wheels, then it is overfilled', () => {
    const result = evaluateReading(mainReservoir, litres(12, onWheels));
    expect(result.verdict).toBe('service');
    expect(result.band.id).toBe('overfilled_on_wheels');
  });

  it('when the main reservoir shows its 9.5 L normal level on wheels, then it is in limits', () => {
    expect(evaluateReading(mainReservoir, litres(9.5, onWheels)).verdict).toBe('in_limits');
  });

  // Common practice, no source: the level switch isolates strictly below 4 L.
  it('when the main reservoir is just below 4 L, then it has isolated; at 4 L exactly it has not', () => {
    expect(evaluateReading(mainReservoir, litres(3.999, onWheels)).band.id).toBe('isolated');
    expect(evaluateReading(mainReservoir, litres(4, onWheels)).band.id).not.toBe('isolated');
  });

  // Common practice, no source: at or below 2 L the second reservoir's switch has isolated the tail rotor servo.
  it('when the second reservoir shows 2.0 L exactly, then the tail rotor servo has isolated', () => {
    const result = evaluateReading(secondReservoir, litres(2.0, {}));
    expect(result.band.id).toBe('tail_rotor_isolated');
    expect(result.verdict).toBe('out_of_limits');
    expect(evaluateReading(secondReservoir, litres(2.001, {})).band.id).not.toBe('tail_rotor_isolated');
  });

  // Common practice, no source: normal 5 L, maximum 7.5 L.
  it.each([
    [5, 'in_limits'],
    [7.5, 'in_limits'],
    [7.51, 'service'],
  ] as const)('when the second reservoir shows %s L, then it is %s', (value, verdict) => {
    expect(evaluateReading(secondReservoir, litres(value, {})).verdict).toBe(verdict);
  });

  it('when a level is entered in US quarts, then it is judged in litres at full precision', () => {
    const result = evaluateReading(mainReservoir, { value: 4, unit: 'US_qt', context: onWheels });
    // NIST SP 811 (2008), B.9: 1 US liquid quart = 9.463529E-04 m3; exactly 0.946352946 L.
    expect(result.value).toBeCloseTo(4 * 0.946352946, 12);
    expect(result.band.id).toBe('isolated');
  });
});

describe('evaluateReading refusals', () => {
  it.each([Number.NaN, Number.POSITIVE_INFINITY, Number.NEGATIVE_INFINITY])(
    'when the value is %s, then it is refused as not a number',
    (value) => {
      const error = refusal(() => evaluateReading(systemPressure, bar(value)));
      expect(error.code).toBe('not_a_number');
      expect(error.message).toContain('trade.sys.pressure');
    },
  );

  it('when a level is negative, then it is refused as a negative level', () => {
    expect(refusal(() => evaluateReading(mainReservoir, litres(-0.1, onWheels))).code).toBe('negative_level');
  });

  it('when a value is beyond what the gauge can show, then it is refused as out of range', () => {
    const error = refusal(() => evaluateReading(systemPressure, bar(300.01)));
    expect(error.code).toBe('out_of_range');
    expect(error.message).toMatch(/gauge/);
  });

  it('when a level lacks the attitude its marks depend on, then it is refused as missing context', () => {
    const error = refusal(() => evaluateReading(mainReservoir, litres(9, {})));
    expect(error.code).toBe('missing_context');
    expect(error.message).toMatch(/on jacks/);
  });

  it('when a pump pressure is read with system pressure relieved, then it is refused as the wrong context', () => {
    expect(
      refusal(() => evaluateReading(systemPressure, bar(150, { systemPressure: 'relieved' }))).code,
    ).toBe('wrong_context');
    expect(refusal(() => evaluateReading(systemPressure, bar(150, {}))).code).toBe('missing_context');
  });

  it.each([
    [
      'a position for a pressure',
      systemPressure,
      { position: 'at_normal', context: { systemPressure: 'on' } },
    ],
    ['an answer for a level', mainReservoir, { answer: true, context: onWheels }],
    ['a position on a glass without marks', mainReservoir, { position: 'at_normal', context: onWheels }],
  ] as const)('when the entry is %s, then it is refused as the wrong entry', (_what, target, reading) => {
    expect(refusal(() => evaluateReading(target, reading as Reading)).code).toBe('wrong_entry');
  });

  it('when a yes/no checkpoint gets a number, then it is refused as the wrong entry', () => {
    const bypass = demoTypes[0]?.checkpoints.find((c) => c.code === 'sys1.filter_bypass');
    if (!bypass) throw new Error('demo filter bypass checkpoint missing');
    expect(refusal(() => evaluateReading(bypass, litres(1, {}))).code).toBe('wrong_entry');
    expect(evaluateReading(bypass, { answer: true, context: {} }).verdict).toBe('out_of_limits');
    expect(evaluateReading(bypass, { answer: false, context: {} }).verdict).toBe('in_limits');
  });

  it('when a level is entered in a pressure unit, then it is refused as the wrong unit', () => {
    expect(
      refusal(() => evaluateReading(mainReservoir, { value: 9, unit: 'psi', context: onWheels })).code,
    ).toBe('wrong_unit');
  });

  it('when no band covers the value, then it is refused and engineering is told, not given a verdict', () => {
    const gappy = checkpoint({
      ...systemPressure,
      bands: [
        band('low', [0, true], [100, false], 'out_of_limits'),
        band('ok', [100, false], [300, true], 'in_limits'),
      ],
    });
    expect(refusal(() => evaluateReading(gappy, bar(100))).code).toBe('no_band');
  });
});

describe('evaluateReading with a position against the marks (demo RX-4 system 1: min 5.5, normal 7.0, max 9.0 L)', () => {
  const sys1 = demoTypes.find((t) => t.code === 'RX-4')?.checkpoints.find((c) => c.code === 'sys1.level');
  if (!sys1) throw new Error('demo RX-4 sys1.level missing');
  const at = (position: string, context: Reading['context']) =>
    evaluateReading(sys1, { position, context } as Reading);

  it.each([
    ['at_minimum', onWheels, 'in_limits'],
    ['between_minimum_normal', onWheels, 'in_limits'],
    ['at_normal', onWheels, 'in_limits'],
    ['between_normal_maximum', onWheels, 'service'],
    ['at_maximum', onWheels, 'service'],
    ['at_maximum', onJacks, 'in_limits'],
    ['between_normal_maximum', onJacks, 'in_limits'],
    ['above_maximum', onJacks, 'service'],
  ] as const)('when the level is %s (%o), then it is %s', (position, context, verdict) => {
    expect(at(position, context).verdict).toBe(verdict);
  });

  it('when the level is below minimum, then the worst level it could be decides: isolated, out of limits', () => {
    const result = at('below_minimum', onWheels);
    expect(result.verdict).toBe('out_of_limits');
    expect(result.band.id).toBe('isolated');
    expect(result.value).toBeUndefined();
  });

  it('when a glass has its minimum mark at the bottom, then "below minimum" is refused as impossible', () => {
    const flush = checkpoint({ ...sys1, marks: { minimum: 0, normal: 7, maximum: 9 } });
    expect(refusal(() => evaluateReading(flush, { position: 'below_minimum', context: onWheels })).code).toBe(
      'out_of_range',
    );
  });
});

const pressure = (bands: LimitBand[]) => checkpoint({ ...auxiliaryPump, bands });

describe('findBandProblems', () => {
  it('when two bands both leave out the value at their shared edge, then a gap at exactly that value is reported', () => {
    const problems = findBandProblems(
      pressure([
        band('low', [0, true], [100, false], 'out_of_limits'),
        band('ok', [100, false], [300, true], 'in_limits'),
      ]),
    );
    expect(problems).toHaveLength(1);
    expect(problems[0]).toMatchObject({ kind: 'gap', from: 100, to: 100 });
  });

  it('when two bands both claim their shared edge, then an overlap naming both bands is reported', () => {
    const problems = findBandProblems(
      pressure([
        band('low', [0, true], [100, true], 'out_of_limits'),
        band('ok', [100, true], [300, true], 'in_limits'),
      ]),
    );
    expect(problems).toEqual([
      expect.objectContaining({ kind: 'overlap', bands: ['low', 'ok'], from: 100, to: 100 }),
    ]);
    expect(phraseWords(problems[0]!.reason)).toMatch(/'low', 'ok'/);
  });

  it('when a band is open at both ends between two neighbouring numbers, then it is reported as holding no value', () => {
    const edge = 100.5;
    // IEEE 754 binary64 has 52 fraction bits, so in [2^6, 2^7) neighbouring doubles are 2^(6-52) apart.
    const next = edge + Number.EPSILON * 64;
    const between = edge + (next - edge) / 2;
    expect(between === edge || between === next).toBe(true);
    const problems = findBandProblems(
      pressure([
        band('low', [0, true], [edge, true], 'out_of_limits'),
        band('sliver', [edge, false], [next, false], 'service'),
        band('ok', [next, true], [300, true], 'in_limits'),
      ]),
    );
    expect(problems).toEqual([expect.objectContaining({ kind: 'empty_band', bands: ['sliver'] })]);
    const halfOpen = findBandProblems(
      pressure([
        band('low', [0, true], [edge, false], 'out_of_limits'),
        band('sliver', [edge, true], [next, false], 'service'),
        band('ok', [next, true], [300, true], 'in_limits'),
      ]),
    );
    expect(halfOpen).toEqual([]);
  });
});

describe('findBandProblems across the range, configurations and marks', () => {
  it('when the bands stop short of the top of the range, then the uncovered stretch is a gap', () => {
    const problems = findBandProblems(
      pressure([
        band('low', [0, true], [100, false], 'out_of_limits'),
        band('ok', [100, true], [250, true], 'in_limits'),
      ]),
    );
    expect(problems).toEqual([expect.objectContaining({ kind: 'gap', from: 250, to: 300 })]);
  });

  it('when bands cover the range on wheels but not on jacks, then the gap is reported for the jacks configuration only', () => {
    const level = checkpoint({
      ...mainReservoir,
      bands: mainReservoir.bands.filter((b) => b.id !== 'overfilled_on_jacks'),
    });
    const problems = findBandProblems(level);
    expect(problems).toEqual([
      expect.objectContaining({
        kind: 'gap',
        context: { attitude: 'on_jacks_gear_retracted' },
        from: 12,
        to: 15,
      }),
    ]);
  });

  it('when every trade checkpoint above is checked, then none has a gap or overlap', () => {
    for (const target of [systemPressure, auxiliaryPump, mainReservoir, secondReservoir])
      expect(validateCheckpoint(target)).toEqual([]);
  });

  it('when marks are out of order or the unit does not fit the kind, then validateCheckpoint says so', () => {
    const kinds = validateCheckpoint(
      checkpoint({ ...mainReservoir, unit: 'bar', marks: { minimum: 5, normal: 4, maximum: 12 } }),
    ).map((p) => p.kind);
    expect(kinds).toContain('bad_unit');
    expect(kinds).toContain('bad_marks');
  });
});

interface Cut {
  value: number;
  /** The cut value belongs to the band below it. */
  toLower: boolean;
}

/** Contiguous bands over [min, max] split at the cuts; band i lies between cut i-1 and cut i. */
function contiguousBands(min: number, max: number, cuts: Cut[], verdicts: Verdict[]): LimitBand[] {
  return Array.from({ length: cuts.length + 1 }, (_, i) => {
    const below = cuts[i - 1];
    const above = cuts[i];
    return band(
      `b${i}`,
      below ? [below.value, !below.toLower] : [min, true],
      above ? [above.value, above.toLower] : [max, true],
      verdicts[i % verdicts.length] ?? 'in_limits',
    );
  });
}

/** Which band a value belongs to, counted from the cuts alone. */
function expectedIndex(value: number, cuts: Cut[]): number {
  return cuts.filter((cut) => value > cut.value || (value === cut.value && !cut.toLower)).length;
}

const bandSet = fc
  .record({
    // Limits are written to three decimals at most; a band between two neighbouring doubles is covered by its own test.
    cutValues: fc
      .uniqueArray(fc.integer({ min: 1, max: 999_999 }), { minLength: 0, maxLength: 8 })
      .map((thousandths) => thousandths.map((n) => n / 1000)),
    toLower: fc.array(fc.boolean(), { minLength: 8, maxLength: 8 }),
    verdicts: fc.array(fc.constantFrom<Verdict>('in_limits', 'service', 'out_of_limits'), {
      minLength: 1,
      maxLength: 9,
    }),
    shuffleSeed: fc.nat(),
  })
  .map(({ cutValues, toLower, verdicts, shuffleSeed }) => {
    const cuts = [...cutValues]
      .sort((a, b) => a - b)
      .map((value, i) => ({ value, toLower: toLower[i] ?? true }));
    const bands = contiguousBands(0, 1000, cuts, verdicts);
    // The order bands are listed in must not matter.
    const shuffled = bands
      .map((b, i) => ({ b, key: (i * 7919 + shuffleSeed) % 104729 }))
      .sort((x, y) => x.key - y.key)
      .map(({ b }) => b);
    return { cuts, bands: shuffled };
  });

const propertyCheckpoint = (bands: LimitBand[]) =>
  checkpoint({ ...auxiliaryPump, range: { min: 0, max: 1000 }, bands });

describe('band matching properties', () => {
  it('when bands are contiguous, then exactly one band holds every valid value and no problem is reported', () => {
    fc.assert(
      fc.property(bandSet, fc.double({ min: 0, max: 1000, noNaN: true }), ({ cuts, bands }, value) => {
        const target = propertyCheckpoint(bands);
        expect(bands.filter((b) => contains(b, value))).toHaveLength(1);
        expect(findBandProblems(target)).toEqual([]);
        expect(evaluateReading(target, bar(value, {})).band.id).toBe(`b${expectedIndex(value, cuts)}`);
      }),
    );
  });

  it('when a value sits exactly on an edge, then it belongs to the side whose edge is closed', () => {
    fc.assert(
      fc.property(bandSet, ({ cuts, bands }) => {
        const target = propertyCheckpoint(bands);
        cuts.forEach((cut, i) => {
          expect(evaluateReading(target, bar(cut.value, {})).band.id).toBe(
            cut.toLower ? `b${i}` : `b${i + 1}`,
          );
        });
      }),
    );
  });

  it('when one band is removed from a contiguous set, then findBandProblems reports a gap', () => {
    fc.assert(
      fc.property(
        bandSet.filter(({ bands }) => bands.length > 1),
        fc.nat(),
        ({ bands }, pick) => {
          const removed = bands[pick % bands.length]!;
          const remaining = bands.filter((band) => band !== removed);
          expect(findBandProblems(propertyCheckpoint(remaining)).some((p) => p.kind === 'gap')).toBe(true);
        },
      ),
    );
  });
});
