import type { LevelPosition, ReadingEntry, Verdict } from '@shared/schemas/limits';
import { leakReadingWords } from '@shared/domain/leak-rate';
import { formatLeakRate, formatValue } from '@shared/domain/units';

export const positionLabels: Record<LevelPosition, string> = {
  below_minimum: 'Below minimum',
  at_minimum: 'At minimum',
  between_minimum_normal: 'Between minimum and normal',
  at_normal: 'At normal',
  between_normal_maximum: 'Between normal and maximum',
  at_maximum: 'At maximum',
  above_maximum: 'Above maximum',
};

/** What the mechanic entered, in their unit, for review and result lists. */
export function describeEntry(entry: ReadingEntry | undefined): string {
  if (entry === undefined) return 'Not read yet';
  if ('answer' in entry) return entry.answer ? 'Yes' : 'No';
  if ('position' in entry) return positionLabels[entry.position];
  if ('dropsPerMinute' in entry) return formatLeakRate(entry.dropsPerMinute, entry.leakState);
  return formatValue(entry.value, entry.unit);
}

/** A judged reading as the mechanic reads it: a leak says what it means ("No leak — satisfactory"), others as entered. */
export function describeReading(entry: ReadingEntry, verdict: Verdict): string {
  return 'dropsPerMinute' in entry ? leakReadingWords(entry, verdict) : describeEntry(entry);
}
