import type { Checkpoint, LimitBand, Verdict } from '@shared/schemas/limits';
import { InvalidReadingError } from '@shared/domain/reading-input';

/** The refusal a reading gets; the test fails when there is none or another error is thrown. */
export function readingRefusal(run: () => unknown): InvalidReadingError {
  try {
    run();
  } catch (error) {
    if (error instanceof InvalidReadingError) return error;
    throw error;
  }
  throw new Error('expected the reading to be refused');
}

/** An invented 0 to 10 L sight glass with no marks and no bands, for unit tests to extend. */
export const plainGlass: Checkpoint = {
  code: 'sys1.level',
  label: 'System 1 level',
  instruction: 'Read the glass.',
  kind: 'level',
  unit: 'L',
  range: { min: 0, max: 10 },
  requires: [],
  ata: '29',
  reference: 'test',
  bands: [],
};

/** A band from its edges as [value, closed] (null: unbounded); its message is its id. */
export const band = (
  id: string,
  lower: [number, boolean] | null,
  upper: [number, boolean] | null,
  verdict: Verdict = 'in_limits',
  when?: LimitBand['when'],
): LimitBand => ({
  id,
  lower: lower && { value: lower[0], closed: lower[1] },
  upper: upper && { value: upper[0], closed: upper[1] },
  verdict,
  message: id,
  action: `action for ${id}`,
  ...(when ? { when } : {}),
});
