import i18next from 'i18next';
import LanguageDetector from 'i18next-browser-languagedetector';
import resourcesToBackend from 'i18next-resources-to-backend';
import { initReactI18next } from 'react-i18next';
import { isLanguage, sourceLanguage, type Language } from '@shared/i18n/languages';
import { sharedOptions } from '@shared/i18n/setup';

// The words every first screen needs ship in the main script, in English (the fallback). Every other namespace, and
// every other language, is a chunk of its own (the shared words of checks and records too, see sharedWordsLoaded), fetched with the first screen that uses it (react-i18next waits for
// it) and precached by the service worker like any other chunk, so a tablet offline can still switch.
const firstScreenEnglish = import.meta.glob<Record<string, unknown>>(
  '/shared/i18n/locales/en/{common,app,auth}.json',
  { eager: true, import: 'default' },
);
const eagerEnglish = Object.fromEntries(
  Object.entries(firstScreenEnglish).map(([path, catalogue]) => [/(\w+)\.json$/.exec(path)![1]!, catalogue]),
);
// The server's refusals are written by the server in the screen's language (server/errors/error-handler.ts), so
// the screens never load that namespace.
const onDemand = import.meta.glob<{ default: Record<string, unknown> }>([
  '/shared/i18n/locales/*/*.json',
  '!/shared/i18n/locales/en/{common,app,auth}.json',
  '!/shared/i18n/locales/*/refusals.json',
]);

export const languageStorageKey = 'gaugewalk.language';

// Missing keys are kept where a browser test can read them (window.__gaugewalkMissingKeys) instead of showing up
// as raw keys on a screen nobody looks at in English.
declare global {
  interface Window {
    __gaugewalkMissingKeys?: string[];
  }
}

void i18next
  .use(
    resourcesToBackend((language: string, namespace: string) => {
      const load = onDemand[`/shared/i18n/locales/${language}/${namespace}.json`];
      return load ? load().then((module) => module.default) : Promise.resolve({});
    }),
  )
  .use(LanguageDetector)
  .use(initReactI18next)
  .init({
    ...sharedOptions,
    resources: { en: eagerEnglish },
    partialBundledLanguages: true,
    ns: Object.keys(eagerEnglish),
    returnNull: false,
    saveMissing: true,
    missingKeyHandler: (lngs, namespace, key) => {
      const missing = `${lngs.join(',')}:${namespace}:${key}`;
      (window.__gaugewalkMissingKeys ??= []).push(missing);
    },
    detection: {
      // A TV's board link or a bookmark can name its language (?lang=de); a kiosk keeps the last badge's choice;
      // otherwise the browser's own language.
      order: ['querystring', 'localStorage', 'navigator'],
      lookupQuerystring: 'lang',
      lookupLocalStorage: languageStorageKey,
      caches: ['localStorage'],
    },
  });

i18next.on('languageChanged', (language) => {
  document.documentElement.lang = language;
});

/**
 * The shared words (namespace words: check kinds, units, roles, ATA chapters) that shared/domain and shared/schemas
 * read whenever a label is read, and the schemas' own messages (words:validation), which every form shows through
 * fieldError. The kiosk's first screen reads none of them, so they load with the code of every lazily loaded screen
 * (the desk's sign-in form among them): the router waits for both, and so does any other lazily loaded part that
 * reads them.
 */
export const sharedWordsLoaded = () => i18next.loadNamespaces('words');

export function currentLanguage(): Language {
  const language = i18next.resolvedLanguage;
  return isLanguage(language) ? language : sourceLanguage;
}

export { i18next };
