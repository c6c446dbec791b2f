import fc from 'fast-check';
import { unit as mathUnit } from 'mathjs';
import { describe, expect, it } from 'vitest';
import { pressureUnits, temperatureUnits, volumeUnits, type Unit } from '../schemas/limits';
import { convert } from './units';
import { valueWords } from './words';

const relativelyClose = (actual: number, expected: number, tolerance: number) =>
  Math.abs(actual - expected) <= tolerance * Math.max(Math.abs(expected), Number.MIN_VALUE);

describe('convert against NIST SP 811', () => {
  // NIST SP 811 (2008), appendix B.9, "pressure": 1 bar = 1.0E+05 Pa exactly.
  it('when 1 bar is converted to kPa and MPa, then it is exactly 100 kPa and 0.1 MPa', () => {
    expect(convert(1, 'bar', 'kPa')).toBe(100);
    expect(convert(1, 'bar', 'MPa')).toBeCloseTo(0.1, 15);
  });

  // NIST SP 811 (2008), appendix B.9, "pressure": 1 psi = 6.894757E+03 Pa (factor given to 7 digits).
  it('when 1 psi is converted to kPa, then it is 6.894757 kPa to the 7 digits NIST gives', () => {
    expect(convert(1, 'psi', 'kPa')).toBeCloseTo(6.894757, 6);
  });

  // NIST SP 811 (2008), appendix B.8/B.9: the psi follows from the exact pound (0.45359237 kg), standard
  // gravity (9.80665 m/s2) and inch (0.0254 m).
  it('when 1 psi is converted to bar, then it equals the exact definition 0.45359237 * 9.80665 / 0.0254^2 Pa', () => {
    expect(convert(1, 'psi', 'bar') * 1e5).toBeCloseTo((0.45359237 * 9.80665) / 0.0254 ** 2, 9);
  });

  // NIST SP 811 (2008), appendix B.9, "volume": 1 US gallon = 3.785412E-03 m3, exactly 3.785411784 L.
  it('when 1 US gallon is converted to litres, then it is exactly 3.785411784 L', () => {
    expect(convert(1, 'US_gal', 'L')).toBe(3.785411784);
  });

  // NIST SP 811 (2008), appendix B.9, "volume": 1 US liquid quart = 9.463529E-04 m3.
  it('when 1 US quart is converted to litres, then it is 0.9463529 L to the digits NIST gives', () => {
    expect(convert(1, 'US_qt', 'L')).toBeCloseTo(0.9463529, 7);
    expect(convert(4, 'US_qt', 'US_gal')).toBe(1);
  });

  // NIST SP 811 (2008), appendix B.9, "volume": 1 gallon (UK) = 4.54609E-03 m3.
  it('when 1 UK gallon is converted to litres, then it is exactly 4.54609 L', () => {
    expect(convert(1, 'UK_gal', 'L')).toBe(4.54609);
    expect(convert(4.54609, 'L', 'UK_gal')).toBe(1);
  });

  // NIST SP 811 (2008), appendix B.9, "temperature": t/°C = (t/°F - 32)/1.8; T/K = t/°C + 273.15.
  it.each([
    [32, 0],
    [212, 100],
    [-40, -40],
    [70, (70 - 32) / 1.8],
  ])('when %s F is converted to C, then it is (t - 32) / 1.8 = %s', (fahrenheit, celsius) => {
    expect(convert(fahrenheit, 'F', 'C')).toBeCloseTo(celsius, 12);
  });

  it('when 0 C is converted to kelvin and back, then it is 273.15 K and 0 C', () => {
    expect(convert(0, 'C', 'K')).toBe(273.15);
    expect(convert(273.15, 'K', 'C')).toBe(0);
    expect(convert(0, 'K', 'F')).toBeCloseTo(-459.67, 10);
  });
});

// mathjs (npm) unit().to(): an independent general-purpose reference. Its names: 'qt' is the US liquid quart,
// 'gal' the US liquid gallon, 'degC'/'degF' temperatures. It has no imperial gallon (checked against NIST above).
const mathjsName: Partial<Record<Unit, string>> = {
  bar: 'bar',
  psi: 'psi',
  kPa: 'kPa',
  MPa: 'MPa',
  L: 'L',
  US_qt: 'qt',
  US_gal: 'gal',
  C: 'degC',
  F: 'degF',
  K: 'K',
};

function pairs(units: readonly Unit[]): [Unit, Unit][] {
  return units.flatMap((from) => units.filter((to) => to !== from).map((to): [Unit, Unit] => [from, to]));
}

describe('convert against mathjs', () => {
  const known = (units: readonly Unit[]) => units.filter((u) => mathjsName[u] !== undefined);
  const allPairs = [
    ...pairs(known(pressureUnits)),
    ...pairs(known(volumeUnits)),
    ...pairs(known(temperatureUnits)),
  ];

  it.each(allPairs)('when %s is converted to %s, then it agrees with mathjs to 1e-9 relative', (from, to) => {
    for (const value of [1, 12.5, 160, 2999.9, -17.3]) {
      const expected = mathUnit(value, mathjsName[from] ?? '').toNumber(mathjsName[to] ?? '');
      expect(relativelyClose(convert(value, from, to), expected, 1e-9), `${value} ${from} -> ${to}`).toBe(
        true,
      );
    }
  });
});

describe('convert refusals', () => {
  it('when the units measure different things, then the error names both units', () => {
    expect(() => convert(1, 'bar', 'L')).toThrow(/'bar'.*'L'/);
  });

  it('when a unit is unknown, then the error names both units', () => {
    expect(() => convert(1, 'inHg', 'bar')).toThrow(/'inHg'.*'bar'/);
    expect(() => convert(1, 'L', 'pint')).toThrow(/'L'.*'pint'/);
  });
});

describe('convert round trips', () => {
  const all = [...pressureUnits, ...volumeUnits, ...temperatureUnits] as Unit[];
  const sameDimension = [
    ...pairs([...pressureUnits]),
    ...pairs([...volumeUnits]),
    ...pairs([...temperatureUnits]),
  ];

  // Readings from 1e-6 to 1e6 in size, either sign; subnormal numbers are no reading anyone takes.
  const reading = fc.oneof(
    fc.double({ min: 1e-6, max: 1e6, noNaN: true }),
    fc.double({ min: -1e6, max: -1e-6, noNaN: true }),
    fc.constant(0),
  );

  it('when any value goes to another unit and back, then it returns within 1e-12 relative', () => {
    fc.assert(
      fc.property(fc.constantFrom(...sameDimension), reading, ([from, to], value) => {
        const back = convert(convert(value, from, to), to, from);
        // Temperatures shift by an offset, so near zero the error is measured against the offset's size.
        const scale = Math.max(
          Math.abs(value),
          (temperatureUnits as readonly string[]).includes(from) ? 500 : 0,
        );
        return Math.abs(back - value) <= 1e-12 * scale;
      }),
    );
  });

  it('when a value is converted to its own unit, then it is returned unchanged', () => {
    fc.assert(
      fc.property(fc.constantFrom(...all), fc.double({ noNaN: true }), (u, value) =>
        Object.is(convert(value, u, u), value),
      ),
    );
  });
});

describe('valueWords', () => {
  it('when 99.97 bar is shown with one decimal, then the screen reads 100.0 bar (display only)', () => {
    expect(valueWords(99.97, 'bar')).toBe('100.0 bar');
    expect(valueWords(1.5, 'US_qt')).toBe('1.50 US qt');
  });
});
