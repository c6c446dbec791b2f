import type { Checkpoint, CheckContext, Evaluation, ReadingEntry } from '@shared/schemas/limits';
import { judgeReading, type ReadingJudgement } from '@shared/domain/judge';
import i18next from 'i18next';
import { phraseWords } from '@shared/i18n/phrase';

export type Judgement =
  { kind: 'empty' } | { kind: 'verdict'; evaluation: Evaluation } | { kind: 'invalid'; message: string };

/**
 * The words of a judgement for the screen, in its language: a refusal is its reason alone, without the
 * checkpoint's name (shown already in large type).
 */
export function forScreen(judgement: ReadingJudgement): Judgement {
  if (judgement.kind !== 'invalid') return judgement;
  return { kind: 'invalid', message: phraseWords(judgement.error.reason) };
}

/** The instant preview, from the same engine the server signs with. Invalid input gets its message, never a verdict. */
export function judge(
  checkpoint: Checkpoint,
  entry: ReadingEntry | undefined,
  context: CheckContext,
): Judgement {
  try {
    return forScreen(judgeReading(checkpoint, entry, context));
  } catch (error) {
    return {
      kind: 'invalid',
      message: error instanceof Error ? error.message : i18next.t('judge.cannotJudge', { ns: 'checks' }),
    };
  }
}
