import type { CheckContext, LeakState, LevelPosition, ReadingEntry, Unit, Verdict } from '../schemas/limits';
import { ambientLanguage, ambientTranslate, liveLabels, say, type Translate } from '../i18n/translate';
import { isLanguage, sourceLanguage, type Language } from '../i18n/languages';
import { displayDecimals } from './units';

// Words for what a check records, the same on the kiosk, the desk, the e-mails and the exports. Each helper takes
// an optional translate function: a screen passes none (the screen's language), the server passes
// translatorFor(language). Only display goes through here: what is signed or stored keeps the codes.

/**
 * The language a translate function writes, for numbers and dates next to its words. A fixed one (the server's
 * translatorFor) names it; one that follows the screen (i18next.t, react-i18next's t) names none and writes the
 * process's current language, which on a German screen is German, not the source language.
 */
export function languageOfTranslate(t: Translate): Language {
  const named = (t as { lng?: unknown }).lng;
  if (isLanguage(named)) return named;
  const ambient = (t as { language?: unknown }).language;
  return isLanguage(ambient) ? ambient : ambientLanguage();
}

/** The conditions a check was taken in: "On wheels · System pressure on · 18.0 °C". */
export function describeContext(
  context: CheckContext,
  none?: string,
  t: Translate = ambientTranslate(),
): string {
  const parts: string[] = [];
  if (context.attitude)
    parts.push(say(t, context.attitude === 'on_wheels' ? 'words:context.onWheels' : 'words:context.onJacks'));
  if (context.systemPressure)
    parts.push(
      say(t, context.systemPressure === 'on' ? 'words:context.pressureOn' : 'words:context.pressureRelieved'),
    );
  if (context.ambientTempC !== undefined) parts.push(localNumber(context.ambientTempC, 1, t) + ' °C');
  return parts.length > 0 ? parts.join(' · ') : (none ?? say(t, 'words:context.none'));
}

/** A type as people name it: "RX-4 medium twin", with its code added only when the name does not carry it. */
export const typeWords = (type: { code: string; name: string }) =>
  type.name.includes(type.code) ? type.name : `${type.name} (${type.code})`;

const positionKeys = {
  below_minimum: 'words:position.belowMinimum',
  at_minimum: 'words:position.atMinimum',
  between_minimum_normal: 'words:position.betweenMinimumNormal',
  at_normal: 'words:position.atNormal',
  between_normal_maximum: 'words:position.betweenNormalMaximum',
  at_maximum: 'words:position.atMaximum',
  above_maximum: 'words:position.aboveMaximum',
} as const satisfies Record<LevelPosition, string>;

/** A level position as words, in the screen's language or the one `t` writes. */
export const positionLabel = (position: LevelPosition, t: Translate = ambientTranslate()) =>
  say(t, positionKeys[position]);

/** Each level position in words, in the screen's language when read (server code calls positionLabel with t). */
export const positionLabels: Readonly<Record<LevelPosition, string>> = liveLabels(positionKeys);

/** A number with fixed decimals as the language writes it: "18.0" in English, "18,0" in German. */
export function localNumber(value: number, decimals: number, t: Translate = ambientTranslate()): string {
  const language = languageOfTranslate(t);
  if (language === sourceLanguage) return value.toFixed(decimals);
  return new Intl.NumberFormat(language, {
    minimumFractionDigits: decimals,
    maximumFractionDigits: decimals,
  }).format(value);
}

/** A leak as counted, in words: "No leak", "3 drops/min, dynamic". */
export function leakRateWords(
  dropsPerMinute: number,
  leakState?: LeakState,
  t: Translate = ambientTranslate(),
) {
  if (dropsPerMinute === 0 && leakState === undefined) return say(t, 'words:leak.none');
  const rate = `${dropsPerMinute} ${say(t, 'words:leak.unit')}`;
  if (leakState === undefined) return rate;
  return `${rate}, ${say(t, leakState === 'static' ? 'words:leak.static' : 'words:leak.dynamic')}`;
}

const leakVerdictKeys = {
  in_limits: 'words:leak.inLimits',
  service: 'words:leak.service',
  out_of_limits: 'words:leak.outOfLimits',
} as const satisfies Record<Verdict, string>;

const unitKeys = {
  bar: 'words:unit.bar',
  psi: 'words:unit.psi',
  kPa: 'words:unit.kPa',
  MPa: 'words:unit.MPa',
  L: 'words:unit.L',
  US_qt: 'words:unit.usQt',
  US_gal: 'words:unit.usGal',
  UK_gal: 'words:unit.ukGal',
  C: 'words:unit.celsius',
  F: 'words:unit.fahrenheit',
  K: 'words:unit.kelvin',
} as const satisfies Record<Unit, string>;

/** A unit as the language writes it: "L" in English, "l" in German. */
export const unitWords = (unit: Unit, t: Translate = ambientTranslate()) => say(t, unitKeys[unit]);

/**
 * A figure with its unit, to the unit's display decimals unless told: "2900 psi", "1,5 l". For people to read only:
 * a judgement never goes through it, since a displayed "100.0 bar" may stand for 99.97 bar, below a caution at 100.
 */
export function valueWords(
  value: number,
  unit: Unit,
  decimals: number = displayDecimals[unit],
  t: Translate = ambientTranslate(),
): string {
  return `${localNumber(value, decimals, t)} ${unitWords(unit, t)}`;
}

/** What the mechanic entered, in their unit: for review and result lists, records, e-mails and exports. */
export function describeEntry(entry: ReadingEntry | undefined, t: Translate = ambientTranslate()): string {
  if (entry === undefined) return say(t, 'words:entry.notRead');
  if ('answer' in entry) return say(t, entry.answer ? 'words:entry.yes' : 'words:entry.no');
  if ('position' in entry) return positionLabel(entry.position, t);
  if ('dropsPerMinute' in entry) return leakRateWords(entry.dropsPerMinute, entry.leakState, t);
  return valueWords(entry.value, entry.unit, undefined, t);
}

/** A judged reading as people read it: a leak says what it means ("No leak — satisfactory"), others as entered. */
export function describeReading(
  entry: ReadingEntry,
  verdict: Verdict,
  t: Translate = ambientTranslate(),
): string {
  if (!('dropsPerMinute' in entry)) return describeEntry(entry, t);
  if (entry.dropsPerMinute === 0 && verdict === 'in_limits') return say(t, 'words:leak.noneSatisfactory');
  return `${leakRateWords(entry.dropsPerMinute, entry.leakState, t)} — ${say(t, leakVerdictKeys[verdict])}`;
}

/**
 * A hydraulic system's key in words: the type's own label when it is given, else "sys2" reads "System 2" and any
 * other key its words ("brake" reads "Brake"), so no key reaches a screen, an e-mail or an export.
 */
export function systemWords(
  system: string | null | undefined,
  systems: readonly { code: string; label: string }[] = [],
  t: Translate = ambientTranslate(),
): string {
  if (!system) return say(t, 'words:system.none');
  const named = systems.find((s) => s.code === system)?.label;
  if (named) return named;
  const numbered = /^sys(?:tem)?[ _-]?(\d+)$/i.exec(system);
  if (numbered) return say(t, 'words:system.numbered', { number: numbered[1] });
  return system.replace(/[._-]+/g, ' ').replace(/^./, (first) => first.toUpperCase());
}
