import { useMemo } from 'react';
import { useTranslation } from 'react-i18next';
import type { TFunction } from 'i18next';
import type {
  CheckContext,
  CheckKind,
  LeakState,
  LevelPosition,
  ReadingEntry,
  Unit,
  Verdict,
} from '@shared/schemas/limits';
import type { ToolKind } from '@shared/schemas/tools';
import {
  describeContext,
  describeEntry,
  describeReading,
  leakRateWords,
  localNumber,
  positionLabel,
  unitWords,
  valueWords,
} from '@shared/domain/words';
import {
  checkKindInSentence,
  checkKindLabel,
  toolKindInSentence,
  toolKindLabel,
} from '@shared/schemas/plain';
import { typedInLanguage } from '@/lib/typed-number';

// The shared words (shared/domain/words.ts, shared/schemas/plain.ts) in the screen's language, gathered for the
// check screens; the same words the desk, the e-mails and the exports use.
function checkWords(language: string) {
  return {
    language,
    number: (value: number, decimals: number) => localNumber(value, decimals),
    value: (amount: number, unit: Unit, decimals?: number) => valueWords(amount, unit, decimals),
    // Each takes only what the screens pass, so a stray argument (a list index) never lands on a translate slot.
    unit: (unit: Unit) => unitWords(unit),
    typed: (typed: string) => typedInLanguage(language, typed),
    kind: (kind: CheckKind) => checkKindLabel(kind),
    kindCheck: (kind: CheckKind) => checkKindInSentence(kind),
    position: (position: LevelPosition) => positionLabel(position),
    toolKind: (kind: ToolKind) => toolKindLabel(kind),
    toolKindInSentence: (kind: ToolKind) => toolKindInSentence(kind),
    leakRate: (dropsPerMinute: number, leakState?: LeakState) => leakRateWords(dropsPerMinute, leakState),
    entry: (entry: ReadingEntry | undefined) => describeEntry(entry),
    reading: (entry: ReadingEntry, verdict: Verdict) => describeReading(entry, verdict),
    context: (context: CheckContext) => describeContext(context),
  };
}

export type CheckWords = ReturnType<typeof checkWords>;

/** The check screens' translator and their words, in the language on screen (suspends until both are loaded). */
export function useCheckWords(): { t: TFunction<'checks'>; words: CheckWords } {
  const { t, i18n } = useTranslation('checks');
  const language = i18n.resolvedLanguage ?? i18n.language;
  const words = useMemo(() => checkWords(language), [language]);
  return { t, words };
}
