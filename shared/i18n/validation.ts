import i18next from 'i18next';
import { languageNames, languages } from './languages';
import { ambientTranslate, say, type Translate } from './translate';

// The zod schemas in shared/schemas give their own messages as catalogue keys with their namespace
// ("common:validation.dayFormat"), never as English, because two readers write them in their own language: a form on
// a screen (fieldError, src/lib/field-error.ts) and the server's 400 answer, in the asking screen's language
// (server/errors/error-handler.ts). zod's own messages (a wrong type, say) are words, not keys, and stay as zod
// writes them.

const catalogueKey = /^\w+:[\w.]+$/;

/** Values a schema's message may name that no zod issue carries: the languages Gaugewalk ships (staff.ts). */
const standingValues = () => ({ languages: languages.map((language) => languageNames[language]).join(', ') });

/**
 * A zod message in the language `t` writes (the screen's by default): a catalogue key that exists is written out,
 * with the issue's params when the caller has them; any other message is returned as it is.
 */
export function validationWords(
  message: string,
  t: Translate = ambientTranslate(),
  params?: Record<string, unknown>,
): string {
  if (!catalogueKey.test(message) || !i18next.exists(message)) return message;
  return say(t, message, { ...standingValues(), ...params });
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
