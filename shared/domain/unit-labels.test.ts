import { describe, expect, it } from 'vitest';
import { canonicalUnit, convert, dimensionOf } from './units';
import { valueWords } from './words';

describe('units on screens and in refusals', () => {
  it.each([
    ['bar', 'bar', '1.5 bar'],
    ['psi', 'psi', '2 psi'],
    ['kPa', 'kPa', '2 kPa'],
    ['MPa', 'MPa', '1.50 MPa'],
    ['L', 'L', '1.50 L'],
    ['US_qt', 'US qt', '1.50 US qt'],
    ['US_gal', 'US gal', '1.50 US gal'],
    ['UK_gal', 'UK gal', '1.50 UK gal'],
    ['C', '°C', '1.5 °C'],
    ['F', '°F', '1.5 °F'],
    ['K', 'K', '1.5 K'],
  ] as const)(
    'when 1.5 %s is shown, then it reads with the label %s and its usual decimals',
    (unit, _label, text) => {
      expect(valueWords(1.5, unit)).toBe(text);
    },
  );

  it('when the decimals are given, then they win', () => {
    expect(valueWords(4, 'bar', 3)).toBe('4.000 bar');
  });

  it('when each dimension is asked for its canonical unit, then it is bar, litres and degrees Celsius', () => {
    expect(canonicalUnit).toEqual({ pressure: 'bar', volume: 'L', temperature: 'C' });
  });

  it('when a unit is named, then its dimension is known, and an unknown name has none', () => {
    expect(['bar', 'psi', 'L', 'US_qt', 'C', 'F', 'K', 'inHg'].map(dimensionOf)).toEqual([
      'pressure',
      'pressure',
      'volume',
      'volume',
      'temperature',
      'temperature',
      'temperature',
      undefined,
    ]);
  });
});

describe('conversion refusals and exact temperatures', () => {
  it('when a unit is unknown on either side or both, then the message names exactly the unknown ones', () => {
    expect(() => convert(1, 'inHg', 'bar')).toThrow(
      "Cannot convert from 'inHg' to 'bar': unknown unit 'inHg'.",
    );
    expect(() => convert(1, 'bar', 'inHg')).toThrow(
      "Cannot convert from 'bar' to 'inHg': unknown unit 'inHg'.",
    );
    expect(() => convert(1, 'pint', 'inHg')).toThrow(
      "Cannot convert from 'pint' to 'inHg': unknown unit 'pint' and 'inHg'.",
    );
  });

  it('when the units measure different things, then both dimensions are named', () => {
    expect(() => convert(1, 'bar', 'L')).toThrow("Cannot convert from 'bar' (pressure) to 'L' (volume).");
    expect(() => convert(1, 'C', 'psi')).toThrow(
      "Cannot convert from 'C' (temperature) to 'psi' (pressure).",
    );
  });

  // NIST SP 811 (2008), B.9: t/C = (t/F - 32)/1.8, computed directly. Through kelvin, 70 F would come out as
  // 21.111111111111086 C (binary64 rounding of the detour), which is what the direct path avoids.
  it('when Celsius and Fahrenheit are converted, then the direct formula is used, without a detour through kelvin', () => {
    expect(convert(70, 'F', 'C')).toBe((70 - 32) / 1.8);
    expect(convert(70, 'F', 'C')).not.toBe(21.111111111111086);
    expect(convert(0, 'F', 'C')).toBe(-160 / 9);
    expect(convert(100, 'C', 'F')).toBe(212);
    expect(convert(-40, 'F', 'C')).toBe(-40);
  });

  it('when kelvin is on one side, then the conversion goes through kelvin', () => {
    expect(convert(0, 'K', 'C')).toBe(-273.15);
    expect(convert(273.15, 'K', 'F')).toBeCloseTo(32, 12);
    expect(convert(32, 'F', 'K')).toBeCloseTo(273.15, 12);
  });
});
