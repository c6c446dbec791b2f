import { readFileSync, readdirSync } from 'node:fs';
import { join } from 'node:path';
import i18next from 'i18next';
import { describe, expect, it } from 'vitest';
import { languages } from './languages';
import { validationWords } from './validation';

const schemasDir = join(import.meta.dirname, '..', 'schemas');
const schemaSources = readdirSync(schemasDir)
  .filter((name) => name.endsWith('.ts') && !name.endsWith('.test.ts'))
  .map((name) => ({ name, text: readFileSync(join(schemasDir, name), 'utf8') }));

describe("the schemas' own messages", () => {
  it('when a schema gives a message option, then it is a catalogue key, not English words', () => {
    const words: string[] = [];
    // Not yet: free-text.ts names the field and the offending code point, values a form's resolver does not pass on.
    for (const { name, text } of schemaSources.filter((source) => source.name !== 'free-text.ts')) {
      for (const m of text.matchAll(/\bmessage: '([^']*)'/g))
        if (!/^\w+:[\w.]+$/.test(m[1]!)) words.push(`${name}: ${m[1]!}`);
      for (const m of text.matchAll(/\bmessage: `([^`]*)`/g))
        if (!m[1]!.startsWith('common:validation.')) words.push(`${name}: ${m[1]!}`);
    }
    expect(words).toEqual([]);
  });

  it('when a schema names a key of the common validation words, then every language has it', () => {
    const used = new Set<string>();
    for (const { text } of schemaSources) {
      for (const m of text.matchAll(/'(common:validation\.[\w.]+)'/g)) used.add(m[1]!);
      // oneSecret(act) names the act's own key (shared/schemas/signing.ts); its default act is 'sign'.
      if (/\boneSecret\(\)/.test(text)) used.add('common:validation.secret.sign');
      for (const m of text.matchAll(/\boneSecret\('(\w+)'\)/g)) used.add(`common:validation.secret.${m[1]!}`);
    }
    expect(used.size).toBeGreaterThan(15);
    for (const language of languages) {
      const missing = [...used].filter((key) => !i18next.exists(key, { lng: language, fallbackLng: false }));
      expect({ language, missing }).toEqual({ language, missing: [] });
    }
  });

  it('when a message is written for a reader, then the language of the translate function counts', () => {
    expect(validationWords('common:validation.secret.countersign', i18next.getFixedT('de'))).toBe(
      'Geben Sie Ihre PIN (Kiosk) oder Ihr Passwort (Büro) erneut ein, um gegenzuzeichnen.',
    );
    expect(validationWords('common:validation.dayFormat', i18next.getFixedT('en'))).toBe(
      'Give the day as YYYY-MM-DD.',
    );
  });
});
