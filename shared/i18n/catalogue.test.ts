import { readFileSync, readdirSync } from 'node:fs';
import { join } from 'node:path';
import { ESLint } from 'eslint';
import { describe, expect, it } from 'vitest';
import { english } from './english';
import { namespaces } from './setup';
import { fromAcceptLanguage, languages, sourceLanguage, toLanguage } from './languages';

const localesDir = join(import.meta.dirname, 'locales');

// Every leaf of a catalogue as "a.b.c" -> text.
function leaves(tree: unknown, prefix = ''): Map<string, unknown> {
  const out = new Map<string, unknown>();
  if (tree && typeof tree === 'object') {
    for (const [key, value] of Object.entries(tree)) {
      const path = prefix ? `${prefix}.${key}` : key;
      if (value && typeof value === 'object') for (const [k, v] of leaves(value, path)) out.set(k, v);
      else out.set(path, value);
    }
  }
  return out;
}

// i18next keeps plural forms as key_one, key_other...; languages differ in which forms they need, so parity is
// checked on the base key.
const pluralSuffix = /_(zero|one|two|few|many|other)$/;
const baseKeys = (tree: unknown) =>
  new Set([...leaves(tree).keys()].map((key) => key.replace(pluralSuffix, '')));

describe('message catalogues', () => {
  it('ships a folder for every language and a file for every namespace, and nothing else', () => {
    expect(readdirSync(localesDir).sort()).toEqual([...languages].sort());
    for (const language of languages) {
      const files = readdirSync(join(localesDir, language)).sort();
      expect(files).toEqual(namespaces.map((namespace) => `${namespace}.json`).sort());
    }
  });

  for (const language of languages.filter((l) => l !== sourceLanguage)) {
    it(`${language} has every English key, no key English lacks, and no empty text`, () => {
      for (const namespace of namespaces) {
        const other = JSON.parse(
          readFileSync(join(localesDir, language, `${namespace}.json`), 'utf8'),
        ) as unknown;
        const expected = [...baseKeys(english[namespace])].sort();
        expect({ namespace, keys: [...baseKeys(other)].sort() }).toEqual({ namespace, keys: expected });
        for (const [key, text] of leaves(other)) {
          expect({ namespace, key, ok: typeof text === 'string' && text.trim().length > 0 }).toEqual({
            namespace,
            key,
            ok: true,
          });
        }
      }
    });
  }

  it('keeps the same {{placeholders}} in every language, so no figure drops out of a translation', () => {
    const placeholders = (text: unknown) =>
      [...String(text).matchAll(/{{\s*([\w.]+)/g)].map((m) => m[1]).sort();
    for (const language of languages.filter((l) => l !== sourceLanguage)) {
      for (const namespace of namespaces) {
        const other = leaves(
          JSON.parse(readFileSync(join(localesDir, language, `${namespace}.json`), 'utf8')) as unknown,
        );
        const source = leaves(english[namespace]);
        for (const [key, text] of source) {
          const base = key.replace(pluralSuffix, '');
          const match = other.get(key) ?? other.get(`${base}_other`) ?? other.get(base);
          if (match === undefined) continue; // reported by the parity test
          expect({ namespace, key, vars: placeholders(match) }).toEqual({
            namespace,
            key,
            vars: placeholders(text),
          });
        }
      }
    }
  });
});

// The same rule and options as eslint.config.js, without the type-aware rules (slow, and they need files on disk).
const root = join(import.meta.dirname, '..', '..');

async function literalLinter(typed: boolean) {
  // @ts-expect-error -- eslint.config.js is plain JavaScript with no type declarations.
  const config = (await import('../../eslint.config.js')) as { literalStringRule: unknown };
  const [i18nextPlugin, tsParser] = await Promise.all([
    import('eslint-plugin-i18next'),
    import('@typescript-eslint/parser'),
  ]);
  return new ESLint({
    cwd: root,
    overrideConfigFile: true,
    overrideConfig: [
      {
        files: ['**/*.tsx'],
        // With type information, as lint runs it: the rule lets a string through where its type is a fixed set of
        // codes (channel="kiosk"), so both agree on what counts as a word.
        languageOptions: {
          parser: tsParser.default,
          parserOptions: {
            ecmaFeatures: { jsx: true },
            ...(typed ? { projectService: true, tsconfigRootDir: root } : {}),
          },
        },
        plugins: { i18next: i18nextPlugin.default },
        rules: { 'i18next/no-literal-string': config.literalStringRule as never },
      },
    ],
  });
}

describe('words on screens come from the catalogue', () => {
  it('finds no literal text in any screen of src/ (eslint-plugin-i18next, the rule lint also runs)', async () => {
    const eslint = await literalLinter(true);
    const results = await eslint.lintFiles(['src/**/*.tsx']);
    const literals = results.flatMap((result) =>
      result.messages
        .filter((message) => message.ruleId === 'i18next/no-literal-string' || message.fatal)
        .map((message) => `${result.filePath.replace(/.*\/src\//, 'src/')}:${message.line}`),
    );
    expect(literals).toEqual([]);
  }, 120_000);

  it('the rule itself catches a literal, so an empty result above means something', async () => {
    // Untyped: the probe is not a file of the project.
    const eslint = await literalLinter(false);
    const [result] = await eslint.lintText(
      'export const Probe = () => <button aria-label="Close the dialog">Sign and send</button>;\n',
      { filePath: 'src/components/ui/probe.tsx' },
    );
    const flagged = result?.messages.filter((message) => message.ruleId === 'i18next/no-literal-string');
    expect(flagged?.length).toBe(2);
  }, 60_000);
});

describe('choosing a language', () => {
  it('reads a tag or an Accept-Language header down to a shipped language', () => {
    expect(toLanguage('de-AT')).toBe('de');
    expect(toLanguage('DE_de')).toBe('de');
    expect(toLanguage('pt-BR')).toBeUndefined();
    expect(fromAcceptLanguage('pt-BR,pt;q=0.9,de;q=0.8,en;q=0.5')).toBe('de');
    expect(fromAcceptLanguage('en;q=0.4, de;q=0.9')).toBe('de');
    expect(fromAcceptLanguage('fr;q=1, de;q=0')).toBeUndefined();
    expect(fromAcceptLanguage(undefined)).toBeUndefined();
  });
});
