import { describe, expect, it } from 'vitest';
import { decimalText, hoursText, typedDecimal } from './typed-number';

describe('a figure typed into a form', () => {
  it('when it is typed with a decimal comma or point, then both read the same in either language', () => {
    for (const language of ['en', 'de']) {
      expect(typedDecimal('1234,5', language)).toBe(1234.5);
      expect(typedDecimal('1234.5', language)).toBe(1234.5);
      expect(typedDecimal(' 4 211,4 ', language)).toBe(4211.4);
      expect(typedDecimal('-40', language)).toBe(-40);
      expect(typedDecimal('0,75', language)).toBe(0.75);
      expect(typedDecimal('', language)).toBeUndefined();
      expect(typedDecimal('12a', language)).toBeNaN();
      expect(typedDecimal('1.234,5', language)).toBeNaN();
    }
  });

  it("when three digits follow the screen language's thousands mark, then it is not read at all, never as a figure a thousand times off", () => {
    expect(typedDecimal('4.211', 'de')).toBeNaN();
    expect(typedDecimal('4,211', 'de')).toBe(4.211);
    expect(typedDecimal('4,211', 'en')).toBeNaN();
    expect(typedDecimal('4.211', 'en')).toBe(4.211);
  });

  it('when hours are put back into a form, then they are written so the form reads them back the same', () => {
    for (const language of ['en', 'de']) {
      for (const value of [4211.4, 12, 0.1, 1234.5, 100000.9]) {
        expect(typedDecimal(hoursText(value, language), language)).toBe(value);
      }
    }
    expect(hoursText(4211.4, 'de')).toBe('4211,4');
  });

  it('when a figure from a type definition is put back into a form, then every digit comes back and it reads back the same', () => {
    for (const language of ['en', 'de']) {
      for (const value of [0.125, 3.5, -40, 207, 1e-7, 12345.678]) {
        expect(typedDecimal(decimalText(value, language), language)).toBe(value);
      }
      expect(decimalText(undefined, language)).toBe('');
      expect(decimalText(Number.NaN, language)).toBe('');
    }
    expect(decimalText(0.125, 'de')).toBe('0,125');
    expect(decimalText(12345.678, 'en')).toBe('12345.678');
  });
});
