import i18next from 'i18next';
import { languageNames, languages } from './languages';
import { ambientTranslate, say, type Translate } from './translate';

// The zod schemas in shared/schemas give their own messages as keys of the words catalogue's "validation" part, with
// their namespace ("words:validation.dayFormat"), never as English, because two readers write them in their own
// language: a form on a screen (fieldError, src/lib/field-error.ts) and the server's 400 answer, in the asking
// screen's language (server/errors/error-handler.ts). The words namespace loads with every screen that has a form
// (src/i18n/i18n.ts, sharedWordsLoaded); the common one ships in the kiosk's first screen, whose bytes are budgeted.
// zod's own messages (a wrong type, say) are words, not keys, and stay as zod writes them.
//
// A message that names a value known when the schema is built (a maximum length, the field a helper checks) or when
// the input is checked (the code point free text refuses) carries it after the key, as JSON (withValues): a form's
// resolver (react-hook-form's zodResolver) keeps only an issue's message, so the values travel inside it.

/** A key of the words catalogue's validation part, with its namespace. */
export type ValidationKey = `words:validation.${string}`;

/** A field's name as a message names it ("The note"): a key of the validation part's `field` group. */
export type FieldKey = `words:validation.field.${string}`;

/** What a message's values may be: a figure, words as they are, or a field's key, written out by the reader. */
type MessageValues = Record<string, string | number>;

const keyedMessage = /^(\w+:[\w.]+)(\{.*\})?$/s;
const catalogueKey = /^\w+:[\w.]+$/;

/**
 * A schema's message with values for its {{placeholders}}: `withValues('words:validation.atMostCharacters', { max: 500 })`
 * is the key followed by the values as JSON. A value that is a catalogue key (a field's name) is written out in the
 * reader's language too.
 */
export const withValues = (key: ValidationKey, values: MessageValues): string =>
  `${key}${JSON.stringify(values)}`;

/** Whether a zod message is a schema's own (a catalogue key, with values or not), not zod's words. */
export const isCatalogueMessage = (message: string) => keyedMessage.test(message);

/** The key and values a message holds, or null when it is words (zod's own). */
function keyAndValues(message: string): { key: string; values: MessageValues } | null {
  const match = keyedMessage.exec(message);
  if (!match) return null;
  if (!match[2]) return { key: match[1]!, values: {} };
  try {
    const values: unknown = JSON.parse(match[2]);
    if (typeof values !== 'object' || values === null || Array.isArray(values)) return null;
    return { key: match[1]!, values: values as MessageValues };
  } catch {
    return null;
  }
}

/** Values a schema's message may name that no zod issue carries: the languages Gaugewalk ships (staff.ts). */
const standingValues = () => ({ languages: languages.map((language) => languageNames[language]).join(', ') });

/**
 * A zod message in the language `t` writes (the screen's by default): a catalogue key that exists is written out,
 * with the values the message carries (withValues) and the issue's params when the caller has them; any other
 * message is returned as it is.
 */
export function validationWords(
  message: string,
  t: Translate = ambientTranslate(),
  params?: Record<string, unknown>,
): string {
  const keyed = keyAndValues(message);
  if (!keyed || !i18next.exists(keyed.key)) return message;
  const values = Object.fromEntries(
    Object.entries(keyed.values).map(([name, value]) => [
      name,
      typeof value === 'string' && catalogueKey.test(value) && i18next.exists(value) ? say(t, value) : value,
    ]),
  );
  return say(t, keyed.key, { ...standingValues(), ...values, ...params });
}

/** zod's issues as the API answers them: where each is, and its message in the language `t` writes. */
export const issuesInWords = (
  issues: readonly { path: PropertyKey[]; message: string; params?: Record<string, unknown> }[],
  t: Translate,
) =>
  issues.map((issue) => ({
    path: issue.path.join('.'),
    message: validationWords(issue.message, t, issue.params),
  }));
