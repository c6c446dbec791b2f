import { readFileSync, readdirSync } from 'node:fs';
import { join } from 'node:path';
import i18next from 'i18next';
import ts from 'typescript';
import { describe, expect, it } from 'vitest';
import { correctiveActionSchema } from '../schemas/holds';
import { limitBandSchema } from '../schemas/limits';
import { recordExportSchema } from '../schemas/records';
import { calendarDateSchema, createToolSchema } from '../schemas/tools';
import { english } from './english';
import { languages } from './languages';
import { validationWords } from './validation';

// The schemas (and the helpers they are built with: freeText, calendarDateSchema…) read as TypeScript, so a message
// is found wherever zod takes one: a check's argument (`.min(1, '…')`, `.int('…')`, `.refine(ok, '…')`), a
// `message:` or `error:` option, a helper's `minMessage`/`maxMessage`, or a table of messages.
const schemasDir = join(import.meta.dirname, '..', 'schemas');
const schemaSources = readdirSync(schemasDir)
  .filter((name) => name.endsWith('.ts') && !name.endsWith('.test.ts'))
  .map((name) =>
    ts.createSourceFile(name, readFileSync(join(schemasDir, name), 'utf8'), ts.ScriptTarget.Latest, true),
  );

// Calls whose text arguments are values to work with, not messages.
const valueCalls = new Set([
  // String methods inside the helpers (free-text.ts normalises and names a code point; lists are split and joined).
  'split',
  'join',
  'normalize',
  'padStart',
  // A default value (limits.ts: a type's time zone, 'UTC').
  'default',
  // oneSecret('countersign') names the act; the key it makes, words:validation.secret.<act>, is checked below.
  'oneSecret',
]);
const messageOption = (name: string) => name === 'message' || name === 'error' || /Messages?$/.test(name);

type Text = ts.StringLiteral | ts.NoSubstitutionTemplateLiteral | ts.TemplateExpression;
const isText = (node: ts.Node): node is Text =>
  ts.isStringLiteral(node) || ts.isNoSubstitutionTemplateLiteral(node) || ts.isTemplateExpression(node);
const nameOf = (node: ts.Node) => (ts.isIdentifier(node) || ts.isStringLiteral(node) ? node.text : undefined);

/** The texts an expression gives: itself, either branch of a condition, either side of `??`, `||` or `&&`. */
function textsOf(node: ts.Expression): Text[] {
  if (isText(node)) return [node];
  if (ts.isParenthesizedExpression(node) || ts.isAsExpression(node) || ts.isSatisfiesExpression(node))
    return textsOf(node.expression);
  if (ts.isConditionalExpression(node)) return [...textsOf(node.whenTrue), ...textsOf(node.whenFalse)];
  if (
    ts.isBinaryExpression(node) &&
    [
      ts.SyntaxKind.QuestionQuestionToken,
      ts.SyntaxKind.BarBarToken,
      ts.SyntaxKind.AmpersandAmpersandToken,
      ts.SyntaxKind.PlusToken,
    ].includes(node.operatorToken.kind)
  )
    return [...textsOf(node.left), ...textsOf(node.right)];
  if (ts.isObjectLiteralExpression(node))
    return node.properties.flatMap((p) => (ts.isPropertyAssignment(p) ? textsOf(p.initializer) : []));
  return [];
}

/** Every text that stands where zod (or a helper) takes a message, with the file it is in. */
function messageTexts(): { file: string; node: Text }[] {
  const found: { file: string; node: Text }[] = [];
  for (const source of schemaSources) {
    const visit = (node: ts.Node) => {
      if (ts.isCallExpression(node)) {
        const callee = ts.isPropertyAccessExpression(node.expression)
          ? node.expression.name.text
          : nameOf(node.expression);
        if (!callee || !valueCalls.has(callee))
          for (const argument of node.arguments)
            if (!ts.isObjectLiteralExpression(argument))
              found.push(...textsOf(argument).map((text) => ({ file: source.fileName, node: text })));
      }
      if (ts.isPropertyAssignment(node) && messageOption(nameOf(node.name) ?? ''))
        found.push(...textsOf(node.initializer).map((text) => ({ file: source.fileName, node: text })));
      if (ts.isVariableDeclaration(node) && node.initializer && messageOption(nameOf(node.name) ?? ''))
        found.push(...textsOf(node.initializer).map((text) => ({ file: source.fileName, node: text })));
      ts.forEachChild(node, visit);
    };
    visit(source);
  }
  return found;
}

const validationKey = /^words:validation\.[\w.]+$/;

/** A text's words: a string as it is; a template's parts, with `${…}` where a value goes. */
const wordsOf = (node: Text) =>
  ts.isTemplateExpression(node)
    ? node.head.text + node.templateSpans.map((span) => '${…}' + span.literal.text).join('')
    : node.text;

/** Whether a message text is a key: a key as it is, or a key built from a prefix (`words:validation.secret.${act}`). */
const isKey = (node: Text) =>
  ts.isTemplateExpression(node)
    ? validationKey.test(node.head.text.replace(/\.$/, ''))
    : validationKey.test(node.text);

/** Every key of the validation words a schema names, with the values given where it is named. */
function namedKeys(): Map<string, Set<string>> {
  const keys = new Map<string, Set<string>>();
  const name = (key: string, values: string[]) => {
    const given = keys.get(key) ?? new Set<string>();
    values.forEach((value) => given.add(value));
    keys.set(key, given);
  };
  for (const source of schemaSources) {
    const visit = (node: ts.Node) => {
      if (
        (ts.isStringLiteral(node) || ts.isNoSubstitutionTemplateLiteral(node)) &&
        validationKey.test(node.text)
      ) {
        const parent = node.parent;
        // withValues('words:validation.missing', { field }): the values it names.
        if (
          ts.isCallExpression(parent) &&
          nameOf(parent.expression) === 'withValues' &&
          parent.arguments[0] === node
        ) {
          const values = parent.arguments[1];
          name(
            node.text,
            values && ts.isObjectLiteralExpression(values)
              ? values.properties.flatMap((p) => (p.name ? [nameOf(p.name) ?? ''] : []))
              : [],
          );
        } else if (ts.isPropertyAssignment(parent) && nameOf(parent.name) === 'maxMessage') {
          // freeText fills a maxMessage's {{max}} with the field's maximum length (free-text.ts).
          name(node.text, ['max']);
        } else name(node.text, []);
      }
      if (ts.isCallExpression(node) && nameOf(node.expression) === 'oneSecret') {
        // oneSecret(act) names the act's own key (signing.ts); its default act is 'sign'. It always names notBoth.
        const act = node.arguments[0];
        name(`words:validation.secret.${act && ts.isStringLiteral(act) ? act.text : 'sign'}`, []);
      }
      ts.forEachChild(node, visit);
    };
    visit(source);
  }
  return keys;
}

/** Every leaf of the English validation words, as "words:validation.a.b" -> text. */
function englishValidationWords(tree: unknown = english.words.validation, prefix = 'words:validation') {
  const out = new Map<string, string>();
  for (const [key, value] of Object.entries(tree as Record<string, unknown>)) {
    if (value && typeof value === 'object')
      for (const [k, v] of englishValidationWords(value, `${prefix}.${key}`)) out.set(k, v);
    else out.set(`${prefix}.${key}`, String(value));
  }
  return out;
}

// Values validationWords fills in for every message (shared/i18n/validation.ts, standingValues).
const standingValues = ['languages'];

describe("the schemas' own messages", () => {
  it('when a schema gives a message (an argument, a message or error option, a helper message), then it is a key of the validation words', () => {
    const found = messageTexts();
    expect(found.length).toBeGreaterThan(80);
    const words = found
      .filter(({ node }) => !isKey(node))
      .map(({ file, node }) => `${file}: ${wordsOf(node)}`);
    expect(words).toEqual([]);
  });

  it('when a schema names a key of the validation words, then every language has it, and no key is left unnamed', () => {
    const named = namedKeys();
    expect(named.size).toBeGreaterThan(80);
    for (const language of languages) {
      const missing = [...named.keys()].filter(
        (key) => !i18next.exists(key, { lng: language, fallbackLng: false }),
      );
      expect({ language, missing }).toEqual({ language, missing: [] });
    }
    const unnamed = [...englishValidationWords().keys()].filter((key) => !named.has(key));
    expect(unnamed).toEqual([]);
  });

  it('when a key has {{placeholders}}, then where a schema names it, it gives a value for each', () => {
    const english = englishValidationWords();
    const unfilled: string[] = [];
    for (const [key, given] of namedKeys()) {
      for (const m of (english.get(key) ?? '').matchAll(/{{\s*(\w+)/g))
        if (!given.has(m[1]!) && !standingValues.includes(m[1]!)) unfilled.push(`${key}: {{${m[1]!}}}`);
    }
    expect(unfilled).toEqual([]);
  });

  it('when a message is written for a reader, then the language of the translate function counts', () => {
    expect(validationWords('words:validation.secret.countersign', i18next.getFixedT('de'))).toBe(
      'Geben Sie Ihre PIN (Kiosk) oder Ihr Passwort (Büro) erneut ein, um gegenzuzeichnen.',
    );
    expect(validationWords('words:validation.dayFormat', i18next.getFixedT('en'))).toBe(
      'Give the day as YYYY-MM-DD.',
    );
  });
});

describe('a message that names a value', () => {
  const messageOf = (result: { error?: { issues: { message: string }[] } }) =>
    result.error!.issues[0]!.message;
  const inBoth = (message: string) => ({
    en: validationWords(message, i18next.getFixedT('en')),
    de: validationWords(message, i18next.getFixedT('de')),
  });

  it('when a text is longer than its field takes, then the maximum is named in either language', () => {
    const refused = messageOf(correctiveActionSchema.safeParse({ text: 'x'.repeat(2001), pin: '4821' }));
    expect(inBoth(refused)).toEqual({
      en: 'A corrective action is at most 2000 characters.',
      de: 'Eine Abhilfemaßnahme hat höchstens 2000 Zeichen.',
    });
  });

  it('when free text holds a text-direction control, then the field and the code point are named in either language', () => {
    const tool = { number: 'PG-014', kind: 'pressure_gauge', serial: 'S1', calibrationDue: '2027-01-01' };
    const refused = messageOf(createToolSchema.safeParse({ ...tool, description: 'Gauge \u202Eraw' }));
    expect(inBoth(refused)).toEqual({
      en: 'The description holds a text-direction control (U+202E), which can hide what it says.',
      de: 'Die Beschreibung enthält ein Steuerzeichen für die Textrichtung (U+202E), das verbergen kann, was dort steht.',
    });
  });

  it('when a helper names its field, then the field reads in either language', () => {
    const band = { id: 'b', lower: null, upper: null, verdict: 'in_limits', message: '', action: 'None.' };
    expect(inBoth(messageOf(limitBandSchema.safeParse(band)))).toEqual({
      en: 'The band message is missing.',
      de: 'Die Meldung des Grenzwertbands fehlt.',
    });
    const day = messageOf(
      calendarDateSchema('words:validation.field.calibrationDue').safeParse('2026-02-30'),
    );
    expect(inBoth(day)).toEqual({
      en: 'The calibration due date: that day does not exist; a date is written YYYY-MM-DD, e.g. 2026-01-15.',
      de: 'Das Fälligkeitsdatum der Kalibrierung: Diesen Tag gibt es nicht; ein Datum wird JJJJ-MM-TT geschrieben, z. B. 2026-01-15.',
    });
    expect(inBoth(messageOf(recordExportSchema.safeParse('photos'))).en).toBe(
      'An export is one of: checks, readings, fluid, holds, releases.',
    );
  });

  it('when what follows a key is not values, then the message is returned as it is', () => {
    expect(validationWords('words:validation.missing{not json', i18next.getFixedT('de'))).toBe(
      'words:validation.missing{not json',
    );
    expect(validationWords('words:validation.missing[1]', i18next.getFixedT('de'))).toBe(
      'words:validation.missing[1]',
    );
  });
});
