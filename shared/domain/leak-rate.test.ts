import { describe, expect, it } from 'vitest';
import { checkpointSchema, type Checkpoint, type CheckpointInput, type Reading } from '../schemas/limits';
import { evaluateReading, validateCheckpoint } from './limits';
import { leakReadingWords } from './leak-rate';
import { formatLeakRate } from './units';
import { band, readingRefusal } from '@tests/setup/domain-fixtures';
import { phraseWords } from '../i18n/phrase';
import i18next from 'i18next';

const checkpoint = (input: CheckpointInput): Checkpoint => checkpointSchema.parse(input);

// A static seep is allowed more than a dynamic leak: up to 5 drops/min static and up to 2 dynamic in limits, up to
// 10 and 5 to be watched, beyond that out of limits. Invented test figures (common practice, no source); real
// leak limits come from the approved maintenance data of the aircraft.
const bands = [
  band('static_in_limits', [0, true], [5, true], 'in_limits', { leakState: 'static' }),
  band('static_watch', [5, false], [10, true], 'service', { leakState: 'static' }),
  band('static_out', [10, false], [60, true], 'out_of_limits', { leakState: 'static' }),
  band('dynamic_in_limits', [0, true], [2, true], 'in_limits', { leakState: 'dynamic' }),
  band('dynamic_watch', [2, false], [5, true], 'service', { leakState: 'dynamic' }),
  band('dynamic_out', [5, false], [60, true], 'out_of_limits', { leakState: 'dynamic' }),
];

const leak = checkpoint({
  code: 'sys1.leaks',
  label: 'System 1 leaks',
  instruction: 'Count the drops at the pump for one minute.',
  kind: 'leak_rate',
  unit: null,
  range: { min: 0, max: 60 },
  ata: '29',
  reference: 'test',
  bands,
});

const count = (dropsPerMinute: number, leakState?: 'static' | 'dynamic'): Reading => ({
  dropsPerMinute,
  ...(leakState ? { leakState } : {}),
  context: {},
});

describe('a leak judged by its rate', () => {
  it('when the same rate is static or dynamic, then each is judged against its own bands', () => {
    expect(evaluateReading(leak, count(4, 'static')).band.id).toBe('static_in_limits');
    expect(evaluateReading(leak, count(4, 'dynamic')).band.id).toBe('dynamic_watch');
    expect(evaluateReading(leak, count(8, 'static')).verdict).toBe('service');
    expect(evaluateReading(leak, count(8, 'dynamic')).verdict).toBe('out_of_limits');
  });

  it('when the rate sits on a band edge, then the closed edge holds it and the next whole drop crosses', () => {
    expect(evaluateReading(leak, count(5, 'static')).verdict).toBe('in_limits');
    expect(evaluateReading(leak, count(6, 'static')).verdict).toBe('service');
    expect(evaluateReading(leak, count(2, 'dynamic')).verdict).toBe('in_limits');
    expect(evaluateReading(leak, count(3, 'dynamic')).verdict).toBe('service');
    expect(evaluateReading(leak, count(10, 'static')).verdict).toBe('service');
    expect(evaluateReading(leak, count(11, 'static')).verdict).toBe('out_of_limits');
    expect(evaluateReading(leak, count(60, 'dynamic')).verdict).toBe('out_of_limits');
  });

  it('when "No leak" is tapped (0, no state), then it is in limits and stored as 0 drops per minute', () => {
    const none = evaluateReading(leak, count(0));
    expect(none.verdict).toBe('in_limits');
    expect(none.value).toBe(0);
    expect(leakReadingWords({ dropsPerMinute: 0 }, none.verdict)).toBe('No leak — satisfactory');
  });

  it('when "No leak" meets bands that differ by state, then the worse of the two judges it', () => {
    const strict = checkpoint({
      ...leak,
      bands: [
        band('static_any', [0, true], [60, true], 'in_limits', { leakState: 'static' }),
        band('dynamic_none', [0, true], [0, true], 'service', { leakState: 'dynamic' }),
        band('dynamic_some', [0, false], [60, true], 'out_of_limits', { leakState: 'dynamic' }),
      ],
    });
    expect(evaluateReading(strict, count(0)).band.id).toBe('dynamic_none');
  });
});

describe('a leak count that cannot be judged', () => {
  it('when the count is negative, fractional, not a number or beyond the range, then it is refused in plain words', () => {
    const negative = readingRefusal(() => evaluateReading(leak, count(-1, 'static')));
    expect(negative.code).toBe('out_of_range');
    expect(negative.message).toContain('cannot be less than none');
    const fraction = readingRefusal(() => evaluateReading(leak, count(2.5, 'dynamic')));
    expect(fraction.code).toBe('not_whole_number');
    expect(fraction.message).toContain('Count whole drops: 2.5 is not a whole number of drops/min.');
    expect(readingRefusal(() => evaluateReading(leak, count(Number.NaN, 'static'))).code).toBe(
      'not_a_number',
    );
    const tooMany = readingRefusal(() => evaluateReading(leak, count(61, 'static')));
    expect(tooMany.code).toBe('out_of_range');
    expect(tooMany.message).toContain('up to 60');
    // Each reader writes the typed figure its own way.
    expect(phraseWords(fraction.reason, i18next.getFixedT('de'))).toContain('2,5 ');
  });

  it('when drops are counted without saying static or dynamic, then the reading is refused until it is said', () => {
    const error = readingRefusal(() => evaluateReading(leak, count(3)));
    expect(error.code).toBe('wrong_entry');
    expect(error.message).toContain('static (system not pressurised) or dynamic');
  });

  it('when a leak checkpoint gets a yes/no answer, or a gauge gets a leak rate, then the entry is refused', () => {
    expect(readingRefusal(() => evaluateReading(leak, { answer: false, context: {} })).code).toBe(
      'wrong_entry',
    );
    const gauge = checkpoint({
      ...leak,
      kind: 'pressure',
      unit: 'bar',
      bands: [band('any', [0, true], [60, true])],
    });
    expect(readingRefusal(() => evaluateReading(gauge, count(0))).message).toContain(
      'only for a leak checkpoint',
    );
  });

  it('when a leak is described, then it reads in words with its unit, never a code', () => {
    expect(formatLeakRate(0)).toBe('No leak');
    expect(formatLeakRate(3, 'dynamic')).toBe('3 drops/min, dynamic');
    expect(leakReadingWords({ dropsPerMinute: 3, leakState: 'dynamic' }, 'in_limits')).toBe(
      '3 drops/min, dynamic — within limits',
    );
    expect(leakReadingWords({ dropsPerMinute: 12, leakState: 'static' }, 'out_of_limits')).toBe(
      '12 drops/min, static — out of limits',
    );
  });
});

describe('a leak-rate checkpoint as engineering defines it', () => {
  it('when bands cover 0 to the range in whole drops for each state, then there is nothing to fix', () => {
    expect(validateCheckpoint(leak)).toEqual([]);
    const wholeSteps = checkpoint({
      ...leak,
      bands: [band('low', [0, true], [2, true]), band('high', [3, true], [60, true], 'out_of_limits')],
    });
    expect(validateCheckpoint(wholeSteps)).toEqual([]);
  });

  it('when a state misses a stretch or two bands overlap, then the gap and overlap are named in drops/min', () => {
    const gappy = checkpoint({
      ...leak,
      bands: bands
        .filter((b) => b.id !== 'dynamic_watch')
        .map((b) => (b.id === 'static_watch' ? { ...b, upper: { value: 12, closed: true } } : b)),
    });
    const messages = validateCheckpoint(gappy).map((p) => phraseWords(p.reason));
    expect(messages).toContain('No band covers 3 drops/min to 5 drops/min (dynamic leak).');
    expect(messages).toContain(
      "Bands 'static_watch', 'static_out' overlap from 11 drops/min to 12 drops/min (static leak).",
    );
  });

  it('when a leak rate has a unit, a range not from 0, or a state on a gauge, then each is a problem', () => {
    const kinds = (input: CheckpointInput) => validateCheckpoint(checkpoint(input)).map((p) => p.kind);
    expect(kinds({ ...leak, unit: 'bar' })).toContain('bad_unit');
    expect(kinds({ ...leak, range: { min: 1, max: 60 } })).toContain('bad_range');
    expect(kinds({ ...leak, range: { min: 0, max: 2.5 } })).toContain('bad_range');
    expect(kinds({ ...leak, takenWith: { leakState: 'static' } })).toContain('bad_leak_state');
    expect(
      kinds({
        ...leak,
        kind: 'pressure',
        unit: 'bar',
        bands: [band('any', [0, true], [60, true], 'in_limits', { leakState: 'static' })],
      }),
    ).toContain('bad_leak_state');
  });
});
