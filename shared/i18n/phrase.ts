import type { CheckKind, LevelPosition, Unit } from '../schemas/limits';
import type { Role } from '../schemas/auth';
import { checkKindInSentence, checkKindLabel, roleLabel } from '../schemas/plain';
import { ataChapterWords } from '../domain/ata';
import { formatDay, formatInstant } from '../domain/when';
import {
  languageOfTranslate,
  localNumber,
  positionLabel,
  systemWords,
  unitWords,
  valueWords as quantityWords,
} from '../domain/words';
import { ambientTranslate, say, type Translate } from './translate';

// A sentence the server composes for people to read (why an airframe is unserviceable, what a deferral's limit
// is) goes out as a phrase: a catalogue key and its values, never words. Each reader writes it in its own
// language: a screen in the screen's, an e-mail or a PDF in its reader's. The board's snapshot is made once for
// every screen, so it cannot carry one language's words.

/** A value inside a phrase: as it is, or something each language writes its own way. */
export type PhraseValue =
  | string
  | number
  /** A date and time, written in UTC as records are, or on a base's clock when its zone is given. */
  | { instant: string; timeZone?: string }
  /** A day ("2026-12-04"). */
  | { day: string }
  /** A number with fixed decimals: "1234.5" in English, "1.234,5" in German. */
  | { decimal: number; places: number }
  /** A figure with its unit, to the unit's display decimals: "2900 psi", "1,50 l". */
  | { quantity: number; unit: Unit }
  /** A unit on its own, as the language writes it: "L" in English, "l" in German. */
  | { unitName: Unit }
  /** A sight glass position against its marks: "Between minimum and normal". */
  | { position: LevelPosition }
  /** A kind of check, as a heading ("Pre-flight") or inside a sentence ("pre-flight"). */
  | { checkKind: CheckKind; inSentence?: boolean }
  /** Roles, as people name them, joined by "or": "Shift lead or Engineering". */
  | { roles: Role[] }
  /** A hydraulic system by its code ("sys1" is "System 1"). */
  | { system: string }
  /** ATA chapters (null: unclassified work). */
  | { chapters: (string | null)[] }
  /** Another phrase, or several joined. */
  | { phrase: Phrase }
  | { phrases: Phrase[]; joiner: 'or' | 'semicolon' };

export interface Phrase {
  /**
   * A key of the "words" catalogue's "phrase" part, without the prefix: "phrase.noPreFlight" is "noPreFlight"; or a
   * key with its namespace ("refusals:checks.noCard"), as the server's refusals are.
   */
  key: string;
  values?: Record<string, PhraseValue>;
}

/** A phrase of the words catalogue: `phrase('untilFlight', { flight: 212 })`. */
export const phrase = (key: string, values?: Record<string, PhraseValue>): Phrase =>
  values ? { key, values } : { key };

/** A phrase in the language `t` writes (the screen's by default). */
export function phraseWords(p: Phrase, t: Translate = ambientTranslate()): string {
  const values: Record<string, string | number> = {};
  for (const [name, value] of Object.entries(p.values ?? {})) values[name] = phraseValueWords(value, t);
  return say(t, p.key.includes(':') ? p.key : `words:phrase.${p.key}`, values);
}

/** One phrase value as the language `t` writes it. */
export function phraseValueWords(value: PhraseValue, t: Translate = ambientTranslate()): string | number {
  if (typeof value === 'string' || typeof value === 'number') return value;
  const language = languageOfTranslate(t);
  if ('instant' in value) return formatInstant(value.instant, value.timeZone ?? 'UTC', language);
  if ('day' in value) return formatDay(value.day, language);
  if ('decimal' in value) return localNumber(value.decimal, value.places, t);
  if ('quantity' in value) return quantityWords(value.quantity, value.unit, undefined, t);
  if ('unitName' in value) return unitWords(value.unitName, t);
  if ('position' in value) return positionLabel(value.position, t);
  if ('checkKind' in value)
    return value.inSentence ? checkKindInSentence(value.checkKind, t) : checkKindLabel(value.checkKind, t);
  if ('roles' in value) return value.roles.map((role) => roleLabel(role, t)).join(say(t, 'words:phrase.or'));
  if ('system' in value) return systemWords(value.system, [], t);
  if ('chapters' in value) return value.chapters.map((chapter) => ataChapterWords(chapter, t)).join(', ');
  if ('phrase' in value) return phraseWords(value.phrase, t);
  const parts = value.phrases.map((part) => phraseWords(part, t));
  return value.joiner === 'or' ? parts.join(say(t, 'words:phrase.or')) : parts.join('; ');
}

/** Several phrases read as one ("until … or until …"; "…; …"), or the one itself when there is one. */
export const joined = (parts: Phrase[], joiner: 'or' | 'semicolon'): Phrase =>
  parts.length === 1 ? parts[0]! : phrase('oneOf', { parts: { phrases: parts, joiner } });

/** The instant as a phrase value. */
export const instantValue = (at: Date | string | number): PhraseValue => ({
  instant: new Date(at).toISOString(),
});

const isPhrase = (value: unknown): value is Phrase =>
  typeof value === 'object' &&
  value !== null &&
  typeof (value as Phrase).key === 'string' &&
  Object.keys(value).every((name) => name === 'key' || name === 'values');

/** A copy with every phrase inside written out in the language `t` writes: what a reader of the value would see. */
export function inWords<T>(value: T, t: Translate = ambientTranslate()): unknown {
  if (isPhrase(value)) return phraseWords(value, t);
  if (Array.isArray(value)) return value.map((item: unknown) => inWords(item, t));
  if (typeof value === 'object' && value !== null && !(value instanceof Date))
    return Object.fromEntries(Object.entries(value).map(([name, item]) => [name, inWords(item, t)]));
  return value;
}
