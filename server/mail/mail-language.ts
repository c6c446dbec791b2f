import type { Language } from '@shared/i18n/languages';
import { translatorFor } from '@server/i18n/translator';
import type { Translate } from '@shared/i18n/translate';

/**
 * The one place that decides the language of an e-mail. Today every e-mail goes to maintenance control's
 * addresses (MAINTENANCE_CONTROL_EMAILS), so it is the operator's language (OPERATOR_LANGUAGE, default English).
 * When people carry a preferred language (people.preferred_language, migration 0013) and an e-mail goes to a
 * person, pass that person's language as `recipient`: it wins over the operator's.
 */
export function mailLanguage(operator: Language, recipient?: Language | null): Language {
  return recipient ?? operator;
}

/** The language an e-mail is written in and the words to write it with. */
export interface MailWords {
  language: Language;
  t: Translate;
}

export const mailWords = (operator: Language, recipient?: Language | null): MailWords => {
  const language = mailLanguage(operator, recipient);
  return { language, t: translatorFor(language) };
};
