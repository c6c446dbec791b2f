import type { ApiErrorCode } from '@shared/schemas/errors';
import type { english } from '@shared/i18n/english';
import { englishTranslate } from '@shared/i18n/translate';
import { phraseWords, type Phrase, type PhraseValue } from '@shared/i18n/phrase';

// A refusal's words are a phrase of the "refusals" catalogue, never an English sentence: the error handler writes
// them in the language of the screen that asked (its Accept-Language, which the screens set to their own language),
// so a German kiosk reads a German refusal. The English words stay on the error for the logs.

type CatalogueKeys<T, Prefix extends string = ''> = {
  [K in keyof T & string]: T[K] extends string
    ? `${Prefix}${K extends `${infer Base}_${'one' | 'other'}` ? Base : K}`
    : CatalogueKeys<T[K], `${Prefix}${K}.`>;
}[keyof T & string];

/** A key of the refusals catalogue ("checks.noCard"); a key missing from the English file fails the build. */
export type RefusalKey = CatalogueKeys<(typeof english)['refusals']>;

/** The words of a refusal: a refusals catalogue key and its values. */
export const refusal = (key: RefusalKey, values?: Record<string, PhraseValue>): Phrase =>
  values ? { key: `refusals:${key}`, values } : { key: `refusals:${key}` };

export class AppError extends Error {
  constructor(
    readonly status: number,
    readonly code: ApiErrorCode,
    /** What the person is told, written in each reader's language. */
    readonly words: Phrase,
    readonly details?: Record<string, unknown>,
    cause?: unknown,
  ) {
    super(phraseWords(words, englishTranslate()), cause === undefined ? undefined : { cause });
    this.name = 'AppError';
  }
}

export const badRequest = (code: ApiErrorCode, words: Phrase, details?: Record<string, unknown>) =>
  new AppError(400, code, words, details);
export const unauthorized = (words = refusal('access.signInFirst'), code: ApiErrorCode = 'not_signed_in') =>
  new AppError(401, code, words);
export const forbidden = (words: Phrase, code: ApiErrorCode = 'forbidden') => new AppError(403, code, words);
export const notFound = (words: Phrase, code: ApiErrorCode = 'not_found') => new AppError(404, code, words);
export const conflict = (code: ApiErrorCode, words: Phrase, details?: Record<string, unknown>) =>
  new AppError(409, code, words, details);
