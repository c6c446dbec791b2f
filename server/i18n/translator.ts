import { readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import i18next, { type ResourceLanguage, type TFunction } from 'i18next';
import { english } from '@shared/i18n/english';
import {
  fromAcceptLanguage,
  languages,
  sourceLanguage,
  toLanguage,
  type Language,
} from '@shared/i18n/languages';
import { namespaces, sharedOptions } from '@shared/i18n/setup';

// The server writes e-mails, PDFs and CSV headers in a person's language from the same catalogues as the screens.
// Every shipped language is read once at start; a missing file is an error at start, not a raw key in an e-mail.
// It initialises the process's global i18next, in English: the shared words a server path calls without a translate
// function of its own (shared/i18n/translate.ts) read in English, as records and logs are kept.
const localesDir = join(dirname(fileURLToPath(import.meta.url)), '..', '..', 'shared', 'i18n', 'locales');

/** One language's catalogue, every namespace, read from its JSON files. */
export function readCatalogue(language: Language): ResourceLanguage {
  if (language === sourceLanguage) return english;
  return Object.fromEntries(
    namespaces.map((namespace) => [
      namespace,
      JSON.parse(readFileSync(join(localesDir, language, `${namespace}.json`), 'utf8')) as ResourceLanguage,
    ]),
  );
}

if (!i18next.isInitialized) {
  void i18next.init({
    ...sharedOptions,
    resources: Object.fromEntries(languages.map((language) => [language, readCatalogue(language)])),
    lng: sourceLanguage,
    ns: [...namespaces],
    initAsync: false,
  });
}

export type Translate = TFunction;

export function translatorFor(language: Language | undefined): TFunction {
  return i18next.getFixedT(language ?? sourceLanguage);
}

// A request's language: an explicit ?lang=, then the signed-in person's preferred language, then Accept-Language.
export function languageOf(request: {
  query?: unknown;
  headers: { 'accept-language'?: string | undefined };
  preferred?: string | null;
}): Language {
  const query = request.query as { lang?: unknown } | undefined;
  const fromQuery = typeof query?.lang === 'string' ? toLanguage(query.lang) : undefined;
  return (
    fromQuery ??
    toLanguage(request.preferred) ??
    fromAcceptLanguage(request.headers['accept-language']) ??
    sourceLanguage
  );
}
