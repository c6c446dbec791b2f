import { sourceLanguage, type Language } from '@shared/i18n/languages';
import { say, type Translate } from '@shared/i18n/translate';
import { translatorFor } from '@server/i18n/translator';

/**
 * The language a printed record or an export is written in, and the words to write it with: the route asks
 * languageOf(req) (?lang=, then Accept-Language). Only the printed words change; what was signed is printed as
 * signed (names, notes, statements, the type's own labels and limits).
 */
export interface PrintWords {
  language: Language;
  t: Translate;
  /** One key of the pdf namespace with its values. */
  pdf: (key: string, values?: Record<string, unknown>) => string;
}

export function printWords(language: Language): PrintWords {
  const t = translatorFor(language);
  return { language, t, pdf: (key, values) => say(t, `pdf:${key}`, values) };
}

export const englishPrint = (): PrintWords => printWords(sourceLanguage);

/**
 * A label inside a sentence: English writes it in lower case ("the pre-flight check", "7.00 L, in limits");
 * German keeps its nouns capitalised.
 */
export const inSentence = (label: string, words: PrintWords) =>
  words.language === sourceLanguage ? label.toLowerCase() : label;
