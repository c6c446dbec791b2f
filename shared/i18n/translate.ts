import i18next, { type TFunction } from 'i18next';
import { isLanguage, sourceLanguage, type Language } from './languages';

// Shared words (shared/domain/words.ts, shared/schemas/plain.ts, the dates in shared/domain/when.ts) take an
// optional translate function. The server passes translatorFor(language) where a person's language counts; without
// one they use the process's i18next: on a screen, src/i18n/i18n.ts sets it up in the screen's language; in Node,
// server/i18n/translator.ts sets it up in English (the unit tests load it too, see vite.config.ts).

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
export const englishTranslate = (): Translate => i18nextReady().getFixedT(sourceLanguage);

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

/** The process's i18next, or a loud error where nothing set it up: a raw key must never reach a person. */
function i18nextReady() {
  if (!i18next.isInitialized)
    throw new Error(
      'i18next is not set up in this process: import src/i18n/i18n.ts (screens) or server/i18n/translator.ts (Node).',
    );
  return i18next;
}

/** The translate function a shared helper uses when its caller gave none: the screen's language (English in Node). */
export const ambientTranslate = (): Translate => i18nextReady().t;

/** The language the ambient translate function writes. */
export function ambientLanguage(): Language {
  const language = i18nextReady().resolvedLanguage;
  return isLanguage(language) ? language : sourceLanguage;
}
