import type { CheckContext, LevelPosition, ReadingEntry, Verdict } from '../schemas/limits';
import { leakReadingWords } from './leak-rate';
import { formatLeakRate, formatValue } from './units';

// Words for what a check records, the same on the kiosk, the desk, the e-mails and the exports.

/** The conditions a check was taken in: "On wheels · System pressure on · 18.0 °C". */
export function describeContext(context: CheckContext, none = 'No configuration needed'): string {
  const parts: string[] = [];
  if (context.attitude)
    parts.push(context.attitude === 'on_wheels' ? 'On wheels' : 'On jacks, gear retracted');
  if (context.systemPressure)
    parts.push(context.systemPressure === 'on' ? 'System pressure on' : 'System pressure relieved');
  if (context.ambientTempC !== undefined) parts.push(`${context.ambientTempC.toFixed(1)} °C`);
  return parts.length > 0 ? parts.join(' · ') : none;
}

/** A type as people name it: "RX-4 medium twin", with its code added only when the name does not carry it. */
export const typeWords = (type: { code: string; name: string }) =>
  type.name.includes(type.code) ? type.name : `${type.name} (${type.code})`;

export const positionLabels: Record<LevelPosition, string> = {
  below_minimum: 'Below minimum',
  at_minimum: 'At minimum',
  between_minimum_normal: 'Between minimum and normal',
  at_normal: 'At normal',
  between_normal_maximum: 'Between normal and maximum',
  at_maximum: 'At maximum',
  above_maximum: 'Above maximum',
};

/** What the mechanic entered, in their unit: for review and result lists, records, e-mails and exports. */
export function describeEntry(entry: ReadingEntry | undefined): string {
  if (entry === undefined) return 'Not read yet';
  if ('answer' in entry) return entry.answer ? 'Yes' : 'No';
  if ('position' in entry) return positionLabels[entry.position];
  if ('dropsPerMinute' in entry) return formatLeakRate(entry.dropsPerMinute, entry.leakState);
  return formatValue(entry.value, entry.unit);
}

/** A judged reading as people read it: a leak says what it means ("No leak — satisfactory"), others as entered. */
export function describeReading(entry: ReadingEntry, verdict: Verdict): string {
  return 'dropsPerMinute' in entry ? leakReadingWords(entry, verdict) : describeEntry(entry);
}

/**
 * A hydraulic system's key in words: the type's own label when it is given, else "sys2" reads "System 2" and any
 * other key its words ("brake" reads "Brake"), so no key reaches a screen, an e-mail or an export.
 */
export function systemWords(
  system: string | null | undefined,
  systems: readonly { code: string; label: string }[] = [],
): string {
  if (!system) return 'No system';
  const named = systems.find((s) => s.code === system)?.label;
  if (named) return named;
  const numbered = /^sys(?:tem)?[ _-]?(\d+)$/i.exec(system);
  if (numbered) return `System ${numbered[1]}`;
  return system.replace(/[._-]+/g, ' ').replace(/^./, (first) => first.toUpperCase());
}
