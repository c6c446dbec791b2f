import i18next from 'i18next';
import LanguageDetector from 'i18next-browser-languagedetector';
import resourcesToBackend from 'i18next-resources-to-backend';
import { initReactI18next } from 'react-i18next';
import { english, namespaces } from '@shared/i18n/english';
import { isLanguage, languages, sourceLanguage, type Language } from '@shared/i18n/languages';

// English ships in the main script (it is also the fallback); every other language is a chunk of its own, fetched
// when chosen and precached by the service worker like any other chunk, so a tablet offline can still switch.
const otherCatalogues = import.meta.glob<{ default: Record<string, unknown> }>(
  '/shared/i18n/locales/*/*.json',
);

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
      const load = otherCatalogues[`/shared/i18n/locales/${language}/${namespace}.json`];
      return load ? load().then((module) => module.default) : Promise.resolve({});
    }),
  )
  .use(LanguageDetector)
  .use(initReactI18next)
  .init({
    resources: { en: english },
    partialBundledLanguages: true,
    supportedLngs: [...languages],
    nonExplicitSupportedLngs: true,
    load: 'languageOnly',
    fallbackLng: sourceLanguage,
    ns: namespaces,
    defaultNS: 'common',
    interpolation: { escapeValue: false },
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

export function currentLanguage(): Language {
  const language = i18next.resolvedLanguage;
  return isLanguage(language) ? language : sourceLanguage;
}

export { i18next };
