import { readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { createInstance, type ResourceLanguage, type TFunction } from 'i18next';
import { english, namespaces } from '@shared/i18n/english';
import {
  fromAcceptLanguage,
  languages,
  sourceLanguage,
  toLanguage,
  type Language,
} from '@shared/i18n/languages';

// The server writes e-mails, PDFs and CSV headers in a person's language from the same catalogues as the screens.
// Every shipped language is read once at start; a missing file is an error at start, not a raw key in an e-mail.
const localesDir = join(dirname(fileURLToPath(import.meta.url)), '..', '..', 'shared', 'i18n', 'locales');

function readCatalogue(language: Language): ResourceLanguage {
  if (language === sourceLanguage) return english;
  return Object.fromEntries(
    namespaces.map((namespace) => [
      namespace,
      JSON.parse(readFileSync(join(localesDir, language, `${namespace}.json`), 'utf8')) as ResourceLanguage,
    ]),
  );
}

const instance = createInstance();
void instance.init({
  resources: Object.fromEntries(languages.map((language) => [language, readCatalogue(language)])),
  supportedLngs: [...languages],
  nonExplicitSupportedLngs: true,
  load: 'languageOnly',
  fallbackLng: sourceLanguage,
  ns: namespaces,
  defaultNS: 'common',
  interpolation: { escapeValue: false },
  initAsync: false,
});

export type Translate = TFunction;

export function translatorFor(language: Language | undefined): TFunction {
  return instance.getFixedT(language ?? sourceLanguage);
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
