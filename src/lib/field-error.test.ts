import i18next from 'i18next';
import { describe, expect, it } from 'vitest';
import { zodResolver } from '@hookform/resolvers/zod';
import { kioskRenameSchema } from '@shared/schemas/kiosks';
import { countersignSchema, correctiveActionSchema } from '@shared/schemas/holds';
import { staffEditSchema } from '@shared/schemas/staff';
import { fieldError } from './field-error';

// A form shows what zod gave for a field (react-hook-form's errors.<field>.message, or a safeParse issue): the
// schemas' own messages are catalogue keys and read in the screen's language.
const keep = { decision: 'keep', password: 'north-pad-lead' } as const;
const firstMessage = (result: { success: boolean; error?: { issues: { message: string }[] } }) =>
  result.error?.issues[0]?.message;

describe('a form shows a schema refusal in the screen language', () => {
  it('when a lead keeps a hold without a reason, then the refusal reads in English, and in German on a German screen', async () => {
    const refused = firstMessage(countersignSchema.safeParse(keep));
    expect(refused).toBe('words:validation.holdStays');
    expect(fieldError(refused)).toBe('Say why the hold stays.');
    await i18next.changeLanguage('de');
    try {
      expect(fieldError(refused)).toBe('Geben Sie an, warum die Sperre bleibt.');
    } finally {
      await i18next.changeLanguage('en');
    }
  });

  it('when a message names the shipped languages, then every one is named, in both languages', async () => {
    const input = { name: 'Remy Faure', licenceNumber: '', roles: ['mechanic'], preferredLanguage: 'fr' };
    const refused = firstMessage(staffEditSchema.safeParse(input));
    expect(fieldError(refused)).toBe('Choose one of the languages Gaugewalk ships: English, Deutsch.');
    await i18next.changeLanguage('de');
    try {
      expect(fieldError(refused)).toBe(
        'Wählen Sie eine der Sprachen, die Gaugewalk mitliefert: English, Deutsch.',
      );
    } finally {
      await i18next.changeLanguage('en');
    }
  });

  it('when zod refuses in its own words, or nothing is wrong, then the form shows them as they are', () => {
    const wrongType = firstMessage(countersignSchema.safeParse({ ...keep, reason: 7 }));
    expect(wrongType).toMatch(/expected string/);
    expect(fieldError(wrongType)).toBe(wrongType);
    expect(fieldError('words:validation.noSuchKey')).toBe('words:validation.noSuchKey');
    expect(fieldError(undefined)).toBeUndefined();
  });

  it('when a form resolver keeps only the message, then a figure and a field name in it still read in German', async () => {
    // react-hook-form's zodResolver gives a field { message, type } and drops the rest of the zod issue.
    const resolve = async (schema: Parameters<typeof zodResolver>[0], values: Record<string, unknown>) => {
      const result = await zodResolver(schema)(values, undefined, {
        fields: {},
        shouldUseNativeValidation: false,
      });
      return result.errors as Record<string, { message?: string }>;
    };
    const tooLong = await resolve(correctiveActionSchema, { text: 'x'.repeat(2001), pin: '4821' });
    const hidden = await resolve(kioskRenameSchema, { name: 'Stand \u202E2' });
    expect(fieldError(tooLong.text?.message)).toBe('A corrective action is at most 2000 characters.');
    await i18next.changeLanguage('de');
    try {
      expect(fieldError(tooLong.text?.message)).toBe('Eine Abhilfemaßnahme hat höchstens 2000 Zeichen.');
      expect(fieldError(hidden.name?.message)).toBe(
        'Der Name des Tablets enthält ein Steuerzeichen für die Textrichtung (U+202E), das verbergen kann, was dort steht.',
      );
    } finally {
      await i18next.changeLanguage('en');
    }
  });
});
