import { validationWords } from '@shared/i18n/validation';

/**
 * A form's zod message as the person reads it: a schema's own message is a catalogue key ("words:validation.…",
 * with any values it names after it, shared/i18n/validation.ts) and reads in the screen's language; zod's own words
 * (a wrong type) stay as zod writes them. Takes what react-hook-form's `formState.errors.<field>.message` or a zod
 * issue's `message` holds. The words namespace is loaded by then: every screen with a form is a lazily loaded route,
 * which the router holds until the shared words are in (src/app/router.tsx, sharedWordsLoaded).
 */
export function fieldError(message: string): string;
export function fieldError(message: string | undefined): string | undefined;
export function fieldError(message: string | undefined): string | undefined {
  return message === undefined ? undefined : validationWords(message);
}
