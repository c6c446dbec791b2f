import type { Checkpoint, CheckContext, Evaluation, ReadingEntry, Verdict } from '../schemas/limits';
import { worstVerdict } from './bands';
import { evaluateReading } from './limits';
import { InvalidReadingError } from './reading-input';

/** One checkpoint's reading as judged: not read yet, a verdict, or input that cannot be judged. */
export type ReadingJudgement =
  | { kind: 'empty' }
  | { kind: 'verdict'; evaluation: Evaluation }
  | { kind: 'invalid'; error: InvalidReadingError };

export function judgeReading(
  checkpoint: Checkpoint,
  entry: ReadingEntry | undefined,
  context: CheckContext,
): ReadingJudgement {
  if (entry === undefined) return { kind: 'empty' };
  try {
    return { kind: 'verdict', evaluation: evaluateReading(checkpoint, { ...entry, context }) };
  } catch (error) {
    if (error instanceof InvalidReadingError) return { kind: 'invalid', error };
    throw error;
  }
}

export interface SubmittedReading {
  code: string;
  entry: ReadingEntry;
}

/** Why a submission cannot be signed; `index` is the reading's place in what was sent. */
export type SubmissionProblem =
  | { kind: 'unknown_checkpoint'; index: number; code: string }
  | { kind: 'duplicate_reading'; index: number; checkpoint: Checkpoint }
  | { kind: 'invalid_reading'; index: number; checkpoint: Checkpoint; error: InvalidReadingError }
  | { kind: 'readings_missing'; missing: Checkpoint[] };

export interface JudgedReading {
  code: string;
  checkpoint: Checkpoint;
  entry: ReadingEntry;
  evaluation: Evaluation;
}

export interface SubmissionJudgement {
  /** Every checkpoint of the card, in the card's order, with its reading as judged. */
  card: { checkpoint: Checkpoint; entry: ReadingEntry | undefined; judgement: ReadingJudgement }[];
  /** The readings that got a verdict, in the order they were sent: what a signature covers. */
  readings: JudgedReading[];
  /** The first problem is the one to answer with: readings in the order sent, then what is missing. */
  problems: SubmissionProblem[];
  /** The worst verdict among the readings judged. */
  verdict: Verdict;
}

/**
 * Judges a whole check against its card, exactly as it will be signed: the kiosk's review screen and the server's
 * signing both call this, so the verdict shown before signing is the verdict stored.
 */
export function judgeSubmission(
  card: readonly Checkpoint[],
  input: { readings: readonly SubmittedReading[]; context: CheckContext },
): SubmissionJudgement {
  const onCard = new Map(card.map((checkpoint) => [checkpoint.code, checkpoint]));
  const entries = new Map<string, ReadingEntry>();
  const judgements = new Map<string, ReadingJudgement>();
  const readings: JudgedReading[] = [];
  const problems: SubmissionProblem[] = [];
  input.readings.forEach(({ code, entry }, index) => {
    const checkpoint = onCard.get(code);
    if (!checkpoint) {
      problems.push({ kind: 'unknown_checkpoint', index, code });
      return;
    }
    if (entries.has(code)) {
      problems.push({ kind: 'duplicate_reading', index, checkpoint });
      return;
    }
    entries.set(code, entry);
    const judgement = judgeReading(checkpoint, entry, input.context);
    judgements.set(code, judgement);
    if (judgement.kind === 'invalid') {
      problems.push({ kind: 'invalid_reading', index, checkpoint, error: judgement.error });
    } else if (judgement.kind === 'verdict') {
      readings.push({ code, checkpoint, entry, evaluation: judgement.evaluation });
    }
  });
  const missing = card.filter((checkpoint) => !entries.has(checkpoint.code));
  if (missing.length > 0) problems.push({ kind: 'readings_missing', missing });
  return {
    card: card.map((checkpoint) => ({
      checkpoint,
      entry: entries.get(checkpoint.code),
      judgement: judgements.get(checkpoint.code) ?? { kind: 'empty' },
    })),
    readings,
    problems,
    verdict: worstVerdict(readings.map((r) => r.evaluation.verdict)),
  };
}
