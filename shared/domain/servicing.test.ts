import { describe, expect, it } from 'vitest';
import i18next from 'i18next';
import { demoTypes } from '../demo/demo-types';
import { checkFluidAllowed, countedOnce, fluidToAdd, levelAfterTopUp, targetMark } from './servicing';
import { convert } from './units';
import { phraseWords } from '../i18n/phrase';

const rx4 = demoTypes.find((t) => t.code === 'RX-4');
const rl2 = demoTypes.find((t) => t.code === 'RL-2');
if (!rx4 || !rl2) throw new Error('demo types missing');
const rx4Sys1 = rx4.checkpoints.find((c) => c.code === 'sys1.level');
const rl2Sys1 = rl2.checkpoints.find((c) => c.code === 'sys1.level');
if (!rx4Sys1 || !rl2Sys1) throw new Error('demo levels missing');

describe('fluidToAdd (demo RX-4 system 1: normal 7.0 L, maintenance 9.0 L)', () => {
  it.each([
    [5.5, 'on_wheels', 1.5],
    [7.0, 'on_wheels', 0],
    [8.2, 'on_wheels', 0],
    [5.5, 'on_jacks_gear_retracted', 3.5],
    [9.0, 'on_jacks_gear_retracted', 0],
    [0, 'on_wheels', 7.0],
  ] as const)('when the level is %s L %s, then %s L is to be added', (currentLevelL, attitude, litres) => {
    expect(fluidToAdd({ checkpoint: rx4Sys1, currentLevelL, attitude })).toBeCloseTo(litres, 12);
  });

  it('when the aircraft is on jacks with gear retracted, then the maintenance mark is the target', () => {
    expect(targetMark(rx4Sys1, 'on_jacks_gear_retracted')).toEqual({ mark: 'maximum', level: 9 });
    expect(targetMark(rx4Sys1, 'on_wheels')).toEqual({ mark: 'normal', level: 7 });
  });

  it('when the glass does not depend on attitude, then the normal mark is the target even on jacks', () => {
    expect(targetMark(rl2Sys1, 'on_jacks_gear_retracted')).toEqual({ mark: 'normal', level: 1.2 });
  });

  it('when the attitude is missing for a glass that depends on it, or the level is not a number, then it throws', () => {
    expect(() => fluidToAdd({ checkpoint: rx4Sys1, currentLevelL: 5 })).toThrow(/how the aircraft stands/);
    expect(() =>
      fluidToAdd({ checkpoint: rx4Sys1, currentLevelL: Number.NaN, attitude: 'on_wheels' }),
    ).toThrow(/litres/);
    expect(() => fluidToAdd({ checkpoint: rx4Sys1, currentLevelL: -1, attitude: 'on_wheels' })).toThrow(
      /litres/,
    );
  });

  it('when the caller wants US quarts, then the litres convert through units.ts', () => {
    const litres = fluidToAdd({ checkpoint: rx4Sys1, currentLevelL: 5.5, attitude: 'on_wheels' });
    expect(convert(litres, 'L', 'US_qt')).toBeCloseTo(1.5 / 0.946352946, 9);
  });
});

describe('levelAfterTopUp', () => {
  it('when 1.5 L goes into 5.5 L, then the glass should show 7.0 L', () => {
    expect(levelAfterTopUp({ currentLevelL: 5.5, addedL: 1.5 })).toBe(7);
  });

  it('when a negative top-up is entered, then it throws', () => {
    expect(() => levelAfterTopUp({ currentLevelL: 5.5, addedL: -0.5 })).toThrow(/litres/);
  });
});

describe('checkFluidAllowed', () => {
  it.each(['MIL-PRF-83282', 'mil-prf-87257', 'MIL PRF 83282'])(
    'when %s is offered for the RX-4, then it is allowed',
    (spec) => {
      expect(checkFluidAllowed(rx4, spec).allowed).toBe(true);
    },
  );

  it('when a mineral-base fluid is offered for the synthetic-hydrocarbon RX-4, then it is refused as a mix of bases with a stronger message', () => {
    const result = checkFluidAllowed(rx4, 'MIL-PRF-5606');
    expect(result).toMatchObject({ allowed: false, reason: 'different_base' });
    if (result.allowed) throw new Error('unreachable');
    expect(result.message).toMatch(/^DO NOT ADD/);
    expect(result.message).toMatch(/mineral/);
    expect(result.message).toMatch(/do not fly/);
  });

  it('when an unknown specification is offered, then it is refused as not approved, naming what is', () => {
    const result = checkFluidAllowed(rx4, 'ACME-7');
    expect(result).toMatchObject({ allowed: false, reason: 'not_approved' });
    if (result.allowed) throw new Error('unreachable');
    expect(result.message).toContain('MIL-PRF-83282, MIL-PRF-87257');
  });

  it('when a German screen checks the fluid, then the refusal reads in German', () => {
    const result = checkFluidAllowed(rx4, 'MIL-PRF-5606');
    if (result.allowed) throw new Error('unreachable');
    expect(phraseWords(result.words, i18next.getFixedT('de'))).toMatch(
      /^MIL-PRF-5606 NICHT EINFÜLLEN: Diese Flüssigkeit ist auf Basis von Mineralöl, und RX-4 verwendet Flüssigkeit auf Basis von synthetischem Kohlenwasserstoff\./,
    );
    const unknown = checkFluidAllowed(rx4, 'ACME-7');
    if (unknown.allowed) throw new Error('unreachable');
    expect(phraseWords(unknown.words, i18next.getFixedT('de'))).toBe(
      'ACME-7 ist für RX-4 nicht zugelassen. Verwenden Sie eine dieser Flüssigkeiten: MIL-PRF-83282, MIL-PRF-87257.',
    );
  });

  it('when a fluid of the same base but not on the list is offered, then it is refused as not approved, not as a mix', () => {
    expect(checkFluidAllowed(rx4, 'MIL-PRF-46170')).toMatchObject({ allowed: false, reason: 'not_approved' });
  });

  it('when a synthetic hydrocarbon is offered for the mineral-base RL-2, then it is refused as a mix of bases', () => {
    expect(checkFluidAllowed(rl2, { spec: 'MIL-PRF-83282', base: 'synthetic_hydrocarbon' })).toMatchObject({
      allowed: false,
      reason: 'different_base',
    });
  });
});

describe('countedOnce: each litre of fluid counted once', () => {
  const entry = (checkId: string, system: string) => ({
    checkId,
    system,
    source: 'servicing' as const,
    litres: 1.5,
  });
  const reading = (checkId: string, system: string) => ({
    checkId,
    system,
    source: 'reading' as const,
    litres: 1.5,
  });

  it('when an older check holds a top-up and a "fluid added" reading of the same system, then only the top-up counts', () => {
    expect(countedOnce([entry('a', 'sys1'), reading('a', 'sys1')])).toEqual([entry('a', 'sys1')]);
    expect(countedOnce([reading('a', 'sys1'), entry('a', 'sys1')])).toEqual([entry('a', 'sys1')]);
  });

  it('when the reading is of another system or another check, or stands alone, then it counts', () => {
    const records = [entry('a', 'sys1'), reading('a', 'sys2'), reading('b', 'sys1')];
    expect(countedOnce(records)).toEqual(records);
  });
});
