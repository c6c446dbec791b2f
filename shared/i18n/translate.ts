import i18next, { createInstance, type TFunction } from 'i18next';
import { english, namespaces } from './english';
import { isLanguage, sourceLanguage, type Language } from './languages';

// Shared words (shared/domain/words.ts, shared/schemas/plain.ts, the dates in shared/domain/when.ts) take an
// optional translate function. The server always passes translatorFor(language); a screen passes nothing and gets
// the global i18next, which src/i18n/i18n.ts initialises in the screen's language. Where nobody initialised it (a
// unit test, a server script), the words read in English from the same catalogue.
const englishOnly = createInstance();
void englishOnly.init({
  resources: { [sourceLanguage]: english },
  lng: sourceLanguage,
  ns: namespaces,
  defaultNS: 'common',
  interpolation: { escapeValue: false },
  initAsync: false,
});
const englishT = englishOnly.getFixedT(sourceLanguage);

/**
 * What a shared helper needs of a translate function: a key ("words:checkKind.preFlight") and its values in, text
 * out. Both the server's translatorFor(language) and the screens' i18next.t fit; the keys these helpers use are
 * checked against the English catalogue by shared/i18n/catalogue.test.ts instead of by the compiler.
 */
export type Translate = TFunction | ((key: string, options?: Record<string, unknown>) => string);

/** Calls any Translate with a key and values. */
export const say = (t: Translate, key: string, options?: Record<string, unknown>): string =>
  String((t as (key: string, options?: Record<string, unknown>) => unknown)(key, options));

/** English, whatever the screen reads: for the few places that keep English on purpose. */
export const englishTranslate = (): Translate => englishT;

/**
 * Labels for codes that read in the screen's language each time they are read: `labels.pre_flight` is
 * "Pre-flight" on an English screen and "Vorflug" on a German one, and English on the server, which passes its own
 * translate function to the helpers that take one. The object keeps its keys, so Object.keys and indexing work.
 */
export function liveLabels<Code extends string>(keys: Record<Code, string>): Readonly<Record<Code, string>> {
  const labels = {} as Record<Code, string>;
  for (const code of Object.keys(keys) as Code[]) {
    Object.defineProperty(labels, code, {
      enumerable: true,
      get: () => say(ambientTranslate(), keys[code]),
    });
  }
  return labels;
}

/** The translate function a shared helper uses when its caller gave none: the screen's language, else English. */
export const ambientTranslate = (): Translate => (i18next.isInitialized ? i18next.t : englishT);

/** The language the ambient translate function writes: the screen's, else English. */
export function ambientLanguage(): Language {
  const language = i18next.isInitialized ? i18next.resolvedLanguage : undefined;
  return isLanguage(language) ? language : sourceLanguage;
}
