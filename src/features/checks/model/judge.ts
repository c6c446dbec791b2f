import type { Checkpoint, CheckContext, Evaluation, ReadingEntry } from '@shared/schemas/limits';
import { evaluateReading, InvalidReadingError } from '@shared/domain/limits';

export type Judgement =
  { kind: 'empty' } | { kind: 'verdict'; evaluation: Evaluation } | { kind: 'invalid'; message: string };

/** The instant preview, from the same engine the server signs with. Invalid input gets its message, never a verdict. */
export function judge(
  checkpoint: Checkpoint,
  entry: ReadingEntry | undefined,
  context: CheckContext,
): Judgement {
  if (entry === undefined) return { kind: 'empty' };
  try {
    return { kind: 'verdict', evaluation: evaluateReading(checkpoint, { ...entry, context }) };
  } catch (error) {
    if (error instanceof InvalidReadingError) {
      // The engine names the checkpoint first; the screen already shows it in large type.
      const prefix = `${checkpoint.label} (${checkpoint.code}): `;
      return {
        kind: 'invalid',
        message: error.message.startsWith(prefix) ? error.message.slice(prefix.length) : error.message,
      };
    }
    return {
      kind: 'invalid',
      message: error instanceof Error ? error.message : 'This reading cannot be judged.',
    };
  }
}
