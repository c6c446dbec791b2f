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
import { formatValue } from '@shared/domain/units';

// The check screens' own words for what the shared domain names with codes (units, kinds, positions, leaks). They
// repeat shared/domain/words in the reader's language: those stay English for what is signed, stored and exported.

const unitKeys = {
  bar: 'units.bar',
  psi: 'units.psi',
  kPa: 'units.kPa',
  MPa: 'units.MPa',
  L: 'units.L',
  US_qt: 'units.usQt',
  US_gal: 'units.usGal',
  UK_gal: 'units.ukGal',
  C: 'units.celsius',
  F: 'units.fahrenheit',
  K: 'units.kelvin',
} as const satisfies Record<Unit, string>;

const kindKeys = {
  pre_flight: 'kinds.preFlight',
  ground_run: 'kinds.groundRun',
  after_flight: 'kinds.afterFlight',
  servicing: 'kinds.servicing',
} as const satisfies Record<CheckKind, string>;

const kindCheckKeys = {
  pre_flight: 'kindCheck.preFlight',
  ground_run: 'kindCheck.groundRun',
  after_flight: 'kindCheck.afterFlight',
  servicing: 'kindCheck.servicing',
} as const satisfies Record<CheckKind, string>;

const positionKeys = {
  below_minimum: 'positions.belowMinimum',
  at_minimum: 'positions.atMinimum',
  between_minimum_normal: 'positions.betweenMinimumNormal',
  at_normal: 'positions.atNormal',
  between_normal_maximum: 'positions.betweenNormalMaximum',
  at_maximum: 'positions.atMaximum',
  above_maximum: 'positions.aboveMaximum',
} as const satisfies Record<LevelPosition, string>;

const leakStateKeys = {
  static: 'words.leakStateStatic',
  dynamic: 'words.leakStateDynamic',
} as const satisfies Record<LeakState, string>;

const leakVerdictKeys = {
  in_limits: 'words.leakInLimits',
  service: 'words.leakService',
  out_of_limits: 'words.leakOutOfLimits',
} as const satisfies Record<Verdict, string>;

const toolKindKeys = {
  pressure_gauge: 'tools.kindPressureGauge',
  nitrogen_charging_kit: 'tools.kindNitrogenChargingKit',
  servicing_cart: 'tools.kindServicingCart',
} as const satisfies Record<ToolKind, string>;

const toolKindInSentenceKeys = {
  pressure_gauge: 'tools.kindPressureGaugeInSentence',
  nitrogen_charging_kit: 'tools.kindNitrogenChargingKitInSentence',
  servicing_cart: 'tools.kindServicingCartInSentence',
} as const satisfies Record<ToolKind, string>;

/** A figure in the language: "1,5" and "2.900" in German where English writes "1.5" and "2,900". */
export function formatNumber(language: string, value: number, decimals: number): string {
  return new Intl.NumberFormat(language, {
    minimumFractionDigits: decimals,
    maximumFractionDigits: decimals,
  }).format(value);
}

/** What a keypad has typed so far ("1." included), with the language's decimal sign; the value itself stays a number. */
export function typedInLanguage(language: string, typed: string): string {
  const sign =
    new Intl.NumberFormat(language).formatToParts(1.5).find((part) => part.type === 'decimal')?.value ?? '.';
  return typed.replace('.', sign);
}

function checkWords(t: TFunction<'checks'>, language: string) {
  const unit = (code: Unit) => t(unitKeys[code]);
  const number = (value: number, decimals: number) => formatNumber(language, value, decimals);
  /** shared/domain/units decides the decimals for each unit; only the figure's writing changes with the language. */
  const value = (amount: number, code: Unit, decimals?: number) => {
    const figure = /^-?\d+(?:\.(\d+))?/.exec(formatValue(amount, code, decimals));
    const written = figure ? number(Number(figure[0]), figure[1]?.length ?? 0) : String(amount);
    return t('units.valueWithUnit', { value: written, unit: unit(code) });
  };
  const leakRate = (dropsPerMinute: number, leakState?: LeakState) => {
    if (dropsPerMinute === 0 && leakState === undefined) return t('words.noLeak');
    const rate = { rate: number(dropsPerMinute, 0), unit: t('units.dropsPerMinute') };
    return leakState === undefined
      ? t('words.leakRate', rate)
      : t('words.leakRateWithState', { ...rate, state: t(leakStateKeys[leakState]) });
  };
  const entry = (reading: ReadingEntry | undefined) => {
    if (reading === undefined) return t('words.notReadYet');
    if ('answer' in reading) return reading.answer ? t('words.yes') : t('words.no');
    if ('position' in reading) return t(positionKeys[reading.position]);
    if ('dropsPerMinute' in reading) return leakRate(reading.dropsPerMinute, reading.leakState);
    return value(reading.value, reading.unit);
  };
  return {
    language,
    number,
    value,
    unit,
    typed: (typed: string) => typedInLanguage(language, typed),
    kind: (kind: CheckKind) => t(kindKeys[kind]),
    /** The kind inside a sentence: "pre-flight check" in "Sign the pre-flight check". */
    kindCheck: (kind: CheckKind) => t(kindCheckKeys[kind]),
    position: (position: LevelPosition) => t(positionKeys[position]),
    toolKind: (kind: ToolKind) => t(toolKindKeys[kind]),
    toolKindInSentence: (kind: ToolKind) => t(toolKindInSentenceKeys[kind]),
    leakRate,
    entry,
    /** A judged reading: a leak says what it means ("No leak — satisfactory"), others as entered. */
    reading: (reading: ReadingEntry, verdict: Verdict) => {
      if (!('dropsPerMinute' in reading)) return entry(reading);
      if (reading.dropsPerMinute === 0 && verdict === 'in_limits') return t('words.noLeakSatisfactory');
      return t('words.leakJudged', {
        leak: leakRate(reading.dropsPerMinute, reading.leakState),
        verdict: t(leakVerdictKeys[verdict]),
      });
    },
    /** The conditions a check was taken in: "On wheels · System pressure on · 18.0 °C". */
    context: (context: CheckContext) => {
      const parts: string[] = [];
      if (context.attitude)
        parts.push(t(context.attitude === 'on_wheels' ? 'words.contextOnWheels' : 'words.contextOnJacks'));
      if (context.systemPressure)
        parts.push(
          t(context.systemPressure === 'on' ? 'words.contextPressureOn' : 'words.contextPressureRelieved'),
        );
      if (context.ambientTempC !== undefined)
        parts.push(t('words.contextTemp', { value: number(context.ambientTempC, 1) }));
      return parts.length > 0 ? parts.join(t('words.contextJoin')) : t('words.contextNone');
    },
  };
}

export type CheckWords = ReturnType<typeof checkWords>;

/** The check screens' translator and the words above, in the language on screen. */
export function useCheckWords(): { t: TFunction<'checks'>; words: CheckWords } {
  const { t, i18n } = useTranslation('checks');
  const language = i18n.resolvedLanguage ?? i18n.language;
  const words = useMemo(() => checkWords(t, language), [t, language]);
  return { t, words };
}
