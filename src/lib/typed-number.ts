import i18next from 'i18next';

/** The mark that groups thousands in a language's numbers: "," in English, "." in German. */
const groupMark = (language: string) =>
  new Intl.NumberFormat(language).formatToParts(12345).find((part) => part.type === 'group')?.value ?? ',';

/**
 * A figure typed into a form, with either "." or "," as its decimal mark: "1234,5" and "1234.5" are both 1234.5, as
 * a German keyboard and an English one type it. A mark followed by exactly three digits that the screen's language
 * uses to group thousands ("4.211" on a German screen, "4,211" on an English one) could be either, so it is not read
 * at all (NaN), and the form asks again: flight hours or a limit read ten times too large must never be saved.
 * Spaces are ignored; anything else that is not a plain number is NaN. Empty is undefined (not given).
 */
export function typedDecimal(
  value: unknown,
  language: string = i18next.resolvedLanguage ?? 'en',
): number | undefined {
  if (typeof value === 'number') return value;
  if (value === undefined || value === null) return undefined;
  const text = String(value).replace(/[\s\u00a0\u202f]/g, '');
  if (text === '') return undefined;
  const match = /^(-?\d+)(?:([.,])(\d+))?$/.exec(text);
  if (!match) return Number.NaN;
  const [, whole, mark, fraction] = match;
  if (mark === undefined) return Number(whole);
  if (fraction!.length === 3 && mark === groupMark(language)) return Number.NaN;
  return Number(`${whole}.${fraction}`);
}

/** Hours with one decimal in the reader's language ("4211.4", "4211,4"), no grouping: as a table shows them and a
 * form takes them back (typedDecimal). */
export const hoursText = (hours: number, language: string = i18next.resolvedLanguage ?? 'en') =>
  new Intl.NumberFormat(language, {
    minimumFractionDigits: 1,
    maximumFractionDigits: 1,
    useGrouping: false,
  }).format(hours);

/** A figure as a form shows it for editing in the reader's language ("0.125", "0,125"), no grouping, every digit
 * kept; empty for none. typedDecimal reads it back. */
export function decimalText(
  value: number | null | undefined,
  language: string = i18next.resolvedLanguage ?? 'en',
): string {
  if (value === null || value === undefined || Number.isNaN(value)) return '';
  return new Intl.NumberFormat(language, { useGrouping: false, maximumFractionDigits: 20 }).format(value);
}

const decimalSigns = new Map<string, string>();

/** The sign a language writes between whole and fraction: "." in English, "," in German. Asked on every keypad
 * render, so each language's is worked out once. */
export function decimalSign(language: string = i18next.resolvedLanguage ?? 'en'): string {
  let sign = decimalSigns.get(language);
  if (sign === undefined) {
    sign =
      new Intl.NumberFormat(language).formatToParts(1.5).find((part) => part.type === 'decimal')?.value ??
      '.';
    decimalSigns.set(language, sign);
  }
  return sign;
}

/** What a keypad has typed so far ("1." included), with the language's decimal sign; the value itself stays a number. */
export const typedInLanguage = (language: string, typed: string): string =>
  typed.replace('.', decimalSign(language));
