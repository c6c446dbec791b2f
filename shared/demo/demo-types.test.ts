import { describe, expect, it } from 'vitest';
import { readingRefusal } from '@tests/setup/domain-fixtures';
import type { Checkpoint, Reading } from '../schemas/limits';
import { expectedPrecharge } from '../domain/accumulator';
import { evaluateReading, validateCheckpoint, validateTypeDefinition } from '../domain/limits';
import { demoTypes } from './demo-types';
import { phraseWords } from '../i18n/phrase';

function demoCheckpoint(type: string, code: string): Checkpoint {
  const found = demoTypes.find((t) => t.code === type)?.checkpoints.find((c) => c.code === code);
  if (!found) throw new Error(`demo ${type} ${code} missing`);
  return found;
}

const refusalCode = (run: () => unknown) => readingRefusal(run).code;

const on = { systemPressure: 'on' } as const;
const wheels = { attitude: 'on_wheels' } as const;
const jacks = { attitude: 'on_jacks_gear_retracted' } as const;
const value = (v: number, unit: 'bar' | 'L', context: Reading['context']): Reading => ({
  value: v,
  unit,
  context,
});

describe('demo types as data', () => {
  it.each(demoTypes.map((t) => [t.code, t] as const))(
    'when %s is checked by the engineering desk, then no checkpoint has a gap, overlap or fault',
    (_code, type) => {
      for (const checkpoint of type.checkpoints)
        expect(validateCheckpoint(checkpoint), checkpoint.code).toEqual([]);
    },
  );

  it.each(demoTypes.map((t) => [t.code, t] as const))(
    'when %s lists its cards and systems, then every code names a checkpoint',
    (_code, type) => {
      const codes = new Set(type.checkpoints.map((c) => c.code));
      expect(codes.size).toBe(type.checkpoints.length);
      for (const card of Object.values(type.cards))
        for (const code of card) expect(codes.has(code), code).toBe(true);
      for (const system of type.systems) expect(codes.has(system.reservoirCheckpoint)).toBe(true);
      expect(validateTypeDefinition(type)).toEqual([]);
      expect(Object.keys(type.cards).sort()).toEqual([
        'after_flight',
        'ground_run',
        'pre_flight',
        'servicing',
      ]);
    },
  );

  it('when the RX-4 pre-flight is walked, then all 8 checkpoints are readable with engines off', () => {
    const rx4 = demoTypes.find((t) => t.code === 'RX-4');
    const card = rx4?.cards.pre_flight ?? [];
    expect(card).toHaveLength(8);
    for (const code of card)
      expect(demoCheckpoint('RX-4', code).takenWith?.systemPressure, code).not.toBe('on');
  });

  it('when every number in the demo limits is listed, then none is a figure from the practitioner account used by the tests', () => {
    const numbers = new Set<number>();
    const walk = (node: unknown): void => {
      if (typeof node === 'number') numbers.add(node);
      else if (Array.isArray(node)) node.forEach(walk);
      else if (node !== null && typeof node === 'object') Object.values(node).forEach(walk);
    };
    walk(demoTypes.map((type) => type.checkpoints));
    for (const figure of [210, 175, 110, 9.5, 12, 4, 7.5, 2, 60, 140])
      expect(numbers.has(figure), String(figure)).toBe(false);
  });
});

// The figures below are DESIGN.md's invented demo limits for RX-4 system 1.
describe('validateTypeDefinition', () => {
  it('when a card names a checkpoint the type does not have, then the problem names the card and the code', () => {
    const [rx4] = demoTypes;
    if (!rx4) throw new Error('demo RX-4 missing');
    const broken = {
      ...rx4,
      cards: { ...rx4.cards, ground_run: [...rx4.cards.ground_run, 'sys3.pressure'] },
    };
    expect(validateTypeDefinition(broken)).toEqual([
      expect.objectContaining({ kind: 'unknown_checkpoint', checkpoint: 'sys3.pressure' }),
    ]);
    expect(phraseWords(validateTypeDefinition(broken)[0]!.reason)).toMatch(/ground-run card/);
  });
});

describe('demo RX-4 system 1 evaluates as the design says', () => {
  const pressure = demoCheckpoint('RX-4', 'sys1.pressure');
  const level = demoCheckpoint('RX-4', 'sys1.level');
  const backup = demoCheckpoint('RX-4', 'backup.pressure');

  it.each([
    [99.999, 'out_of_limits'],
    [100, 'in_limits'],
    [160, 'in_limits'],
    [195, 'in_limits'],
    [195.001, 'out_of_limits'],
  ] as const)(
    'when system 1 pressure is %s bar, then it is %s (caution strictly below 100)',
    (v, verdict) => {
      expect(evaluateReading(pressure, value(v, 'bar', on)).verdict).toBe(verdict);
    },
  );

  it('when system 1 pressure is read with pressure relieved, then it is refused', () => {
    expect(
      refusalCode(() => evaluateReading(pressure, value(150, 'bar', { systemPressure: 'relieved' }))),
    ).toBe('wrong_context');
  });

  it.each([
    [99.999, 'out_of_limits'],
    [100, 'in_limits'],
    [130, 'in_limits'],
    [130.001, 'out_of_limits'],
  ] as const)('when the backup pump shows %s bar, then it is %s', (v, verdict) => {
    expect(evaluateReading(backup, value(v, 'bar', on)).verdict).toBe(verdict);
  });

  it.each([
    [2.999, wheels, 'isolated'],
    [3.0, wheels, 'below_minimum'],
    [5.4999, wheels, 'below_minimum'],
    [5.5, wheels, 'in_limits_wheels'],
    [7.0, wheels, 'in_limits_wheels'],
    [7.0001, wheels, 'overfilled_wheels'],
    [9.0, wheels, 'overfilled_wheels'],
    [9.0, jacks, 'in_limits_jacks'],
    [9.0001, jacks, 'overfilled_jacks'],
  ] as const)('when the system 1 level is %s L (%o), then it falls in band %s', (v, context, bandId) => {
    expect(evaluateReading(level, value(v, 'L', context)).band.id).toBe(bandId);
  });

  it('when the level is 5.5 L at the minimum mark, then it is in limits; 9.0 L on wheels is overfilled', () => {
    expect(evaluateReading(level, value(5.5, 'L', wheels)).verdict).toBe('in_limits');
    expect(evaluateReading(level, value(9.0, 'L', wheels)).verdict).toBe('service');
    expect(evaluateReading(level, value(9.0, 'L', jacks)).verdict).toBe('in_limits');
  });
});

describe('demo RX-4 brake accumulator (45 bar at 20 C, plus or minus 5 bar)', () => {
  const brake = demoCheckpoint('RX-4', 'brake.precharge');
  const relieved = (ambientTempC: number) => ({ systemPressure: 'relieved', ambientTempC }) as const;

  it.each([
    [45, 'in_limits'],
    [40, 'in_limits'],
    [50, 'in_limits'],
    [39.999, 'service'],
    [50.001, 'service'],
  ] as const)('when it shows %s bar at 20 C, then it is %s', (v, verdict) => {
    expect(evaluateReading(brake, value(v, 'bar', relieved(20))).verdict).toBe(verdict);
  });

  it('when it is 0 C, then the expected pre-charge is lower by the gas law and a reading low for 20 C is in limits', () => {
    const atZero = evaluateReading(brake, value(39.5, 'bar', relieved(0)));
    expect(atZero.expected).toBeCloseTo(45 - (46.01325 * 20) / 293.15, 10);
    expect(atZero.expected).toBeLessThan(45);
    expect(atZero.verdict).toBe('in_limits');
    expect(evaluateReading(brake, value(39.5, 'bar', relieved(20))).verdict).toBe('service');
    expect(expectedPrecharge({ referencePressure: 45, referenceTemp: 20, ambientTemp: 0, unit: 'bar' })).toBe(
      atZero.expected,
    );
  });

  it('when it is read with system pressure on, then it is refused', () => {
    expect(
      refusalCode(() => evaluateReading(brake, value(45, 'bar', { systemPressure: 'on', ambientTempC: 20 }))),
    ).toBe('pressure_on');
  });
});

describe('demo RL-2', () => {
  it.each([
    [0.8999, 'out_of_limits'],
    [0.9, 'in_limits'],
    [1.5, 'in_limits'],
    [1.5001, 'service'],
  ] as const)(
    'when its single reservoir shows %s L, then it is %s without needing the attitude',
    (v, verdict) => {
      expect(evaluateReading(demoCheckpoint('RL-2', 'sys1.level'), value(v, 'L', {})).verdict).toBe(verdict);
    },
  );

  it.each([
    [49.999, 'out_of_limits'],
    [50, 'in_limits'],
    [85, 'in_limits'],
  ] as const)('when its system pressure is %s bar, then it is %s', (v, verdict) => {
    expect(evaluateReading(demoCheckpoint('RL-2', 'sys1.pressure'), value(v, 'bar', on)).verdict).toBe(
      verdict,
    );
  });
});
