import { describe, expect, it } from 'vitest';
import i18next from 'i18next';
import { readingRefusal } from '@tests/setup/domain-fixtures';
import { checkpointSchema, type Reading } from '../schemas/limits';
import { evaluatePrecharge, expectedPrecharge } from './accumulator';
import { evaluateReading } from './limits';

// NIST SP 811 (2008), B.9: t/C = (t/F - 32)/1.8; written out so the reference check does not lean on convert().
const fToC = (fahrenheit: number) => (fahrenheit - 32) / 1.8;

const refusalCode = (run: () => unknown) => readingRefusal(run).code;

describe('expectedPrecharge', () => {
  // FAA-H-8083-30 (Aviation Maintenance Technician Handbook, General), ch. 3 "Gas Laws", worked example:
  // 750 psig at 70 F heated to 140 F gives about 851 psig (851.06 with 459.67 and 14.696).
  it('when 750 psig at 70 F is warmed to 140 F, then about 851 psig is expected', () => {
    const expected = expectedPrecharge({
      referencePressure: 750,
      referenceTemp: fToC(70),
      ambientTemp: fToC(140),
      unit: 'psi',
    });
    expect(Math.abs(expected - 851.06)).toBeLessThanOrEqual(0.5);
  });

  // Accumulator maker's worked example (industrial hydraulics): 90 bar pre-charge at 40 C is about 84 bar at
  // 20 C (84.19 with absolute pressures).
  it('when 90 bar at 40 C cools to 20 C, then 84.19 bar is expected', () => {
    expect(
      expectedPrecharge({ referencePressure: 90, referenceTemp: 40, ambientTemp: 20, unit: 'bar' }),
    ).toBeCloseTo(84.19, 2);
  });

  it('when the same correction is made in kPa instead of bar, then it gives the same pressure', () => {
    const inKpa = expectedPrecharge({
      referencePressure: 9000,
      referenceTemp: 40,
      ambientTemp: 20,
      unit: 'kPa',
    });
    const inBar = expectedPrecharge({
      referencePressure: 90,
      referenceTemp: 40,
      ambientTemp: 20,
      unit: 'bar',
    });
    expect(inKpa / 100).toBeCloseTo(inBar, 10);
  });

  // The gas law is on absolute pressure: a gauge-pressure ratio would give 90 * 293.15 / 313.15 = 84.25 bar instead.
  it('when the correction is made, then it is not the naive gauge-pressure ratio', () => {
    const expected = expectedPrecharge({
      referencePressure: 90,
      referenceTemp: 40,
      ambientTemp: 20,
      unit: 'bar',
    });
    expect(Math.abs(expected - (90 * 293.15) / 313.15)).toBeGreaterThan(0.05);
  });

  it('when the unit is not a pressure or a temperature is below absolute zero, then it throws', () => {
    expect(() =>
      expectedPrecharge({ referencePressure: 45, referenceTemp: 20, ambientTemp: 0, unit: 'L' as never }),
    ).toThrow(/'L'/);
    expect(() =>
      expectedPrecharge({ referencePressure: 45, referenceTemp: 20, ambientTemp: -300, unit: 'bar' }),
    ).toThrow(/absolute zero/);
  });
});

// A brake accumulator of 1 L holds about 60 bar (common practice, no source). The 20 C reference and the 5 bar
// tolerance are test fixtures.
const brakeAccumulator = checkpointSchema.parse({
  code: 'trade.brake.precharge',
  label: 'Brake accumulator pre-charge',
  instruction: 'Relieve system pressure. Read the accumulator gauge.',
  kind: 'pressure',
  unit: 'bar',
  range: { min: 0, max: 100 },
  precharge: { referencePressure: 60, referenceTempC: 20, tolerance: 5 },
  requires: ['systemPressure', 'ambientTempC'],
  bands: [],
  ata: '32',
  reference: 'test',
});

const reading = (value: number, context: Reading['context']): Reading => ({ value, unit: 'bar', context });

describe('evaluatePrecharge', () => {
  // Common practice, no source: about 60 bar.
  it('when the brake accumulator shows 60 bar at its reference temperature with pressure relieved, then it is in limits at 60 bar expected', () => {
    const result = evaluatePrecharge(
      brakeAccumulator,
      reading(60, { systemPressure: 'relieved', ambientTempC: 20 }),
    );
    expect(result.verdict).toBe('in_limits');
    expect(result.expected).toBe(60);
  });

  // NAVEDTRA 14018 / 14315 (US Navy aviation hydraulics training manuals): a pre-charge is read with system
  // pressure relieved; a reading taken with system pressure on is not a valid pre-charge reading.
  it('when a pre-charge is read with system pressure on, then it is refused, never judged', () => {
    expect(
      refusalCode(() =>
        evaluatePrecharge(brakeAccumulator, reading(60, { systemPressure: 'on', ambientTempC: 20 })),
      ),
    ).toBe('pressure_on');
    expect(
      refusalCode(() =>
        evaluateReading(brakeAccumulator, reading(60, { systemPressure: 'on', ambientTempC: 20 })),
      ),
    ).toBe('pressure_on');
  });

  it('when the ambient temperature or the pressure state is missing, then it is refused as missing context', () => {
    expect(
      refusalCode(() => evaluateReading(brakeAccumulator, reading(60, { systemPressure: 'relieved' }))),
    ).toBe('missing_context');
    expect(refusalCode(() => evaluateReading(brakeAccumulator, reading(60, { ambientTempC: 20 })))).toBe(
      'missing_context',
    );
  });

  it('when the reading is a yes/no answer, then it is refused as the wrong entry', () => {
    expect(
      refusalCode(() =>
        evaluateReading(brakeAccumulator, {
          answer: true,
          context: { systemPressure: 'relieved', ambientTempC: 20 },
        }),
      ),
    ).toBe('wrong_entry');
  });

  it('when the morning is cold, then the limits move down with the gas law and the message names the corrected value', () => {
    const context = { systemPressure: 'relieved', ambientTempC: 0 } as const;
    const expected = expectedPrecharge({
      referencePressure: 60,
      referenceTemp: 20,
      ambientTemp: 0,
      unit: 'bar',
    });
    const atLowEdge = evaluateReading(brakeAccumulator, reading(expected - 5, context));
    expect(atLowEdge.verdict).toBe('in_limits');
    expect(atLowEdge.expected).toBe(expected);
    const justBelow = evaluateReading(brakeAccumulator, reading(expected - 5 - 1e-9, context));
    expect(justBelow.verdict).toBe('service');
    expect(justBelow.action).toMatch(/recharge nitrogen to 55\.8 bar/);
    const high = evaluateReading(brakeAccumulator, reading(expected + 5.01, context));
    expect(high.action).toMatch(/bleed nitrogen/);
  });
});

describe("a pre-charge in the kiosk's language", () => {
  it('when a German kiosk judges a low pre-charge, then the message and the action read in German, with a German decimal comma', async () => {
    const context = { systemPressure: 'relieved', ambientTempC: 0 } as const;
    // The kiosk's engine writes in its screen's language (the process's i18next); the server's stays English.
    await i18next.changeLanguage('de');
    try {
      const low = evaluateReading(brakeAccumulator, reading(40, context));
      expect(low.message).toBe('Vorfülldruck zu niedrig: bei dieser Temperatur werden 55,8 bar erwartet.');
      expect(low.action).toBe(
        'Bei abgelassenem Systemdruck Stickstoff auf 55,8 bar nachfüllen, dann erneut ablesen.',
      );
    } finally {
      await i18next.changeLanguage('en');
    }
    expect(evaluateReading(brakeAccumulator, reading(40, context)).message).toBe(
      'Pre-charge low: expected 55.8 bar at this temperature.',
    );
  });
});
