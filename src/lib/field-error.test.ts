import i18next from 'i18next';
import { describe, expect, it } from 'vitest';
import { countersignSchema } from '@shared/schemas/holds';
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
    expect(refused).toBe('common:validation.holdStays');
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
    expect(fieldError('common:validation.noSuchKey')).toBe('common:validation.noSuchKey');
    expect(fieldError(undefined)).toBeUndefined();
  });
});
