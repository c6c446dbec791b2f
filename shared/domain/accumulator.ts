import type { Checkpoint, Evaluation, LimitBand, PressureUnit, Reading } from '../schemas/limits';
import { contains } from './bands';
import { assertValueEntry, canonicalValue, InvalidReadingError } from './reading-input';
import { convert, isPressureUnit } from './units';
import { phrase, phraseWords, type Phrase } from '../i18n/phrase';

const standardAtmosphereBar = 1.01325;
const absoluteZeroC = -273.15;

export interface PrechargeCorrectionInput {
  /** Gauge pressure at the reference temperature, in `unit`. */
  referencePressure: number;
  /** Degrees C. */
  referenceTemp: number;
  /** Degrees C. */
  ambientTemp: number;
  unit: PressureUnit;
}

/**
 * Gauge pressure the nitrogen should show at the ambient temperature (constant volume, Gay-Lussac). The gas law
 * holds for absolute pressure and kelvin only, so the gauge reading is lifted by one standard atmosphere first.
 */
export function expectedPrecharge({
  referencePressure,
  referenceTemp,
  ambientTemp,
  unit,
}: PrechargeCorrectionInput): number {
  if (!isPressureUnit(unit)) throw new Error(`A pre-charge is a pressure; '${unit}' is not a pressure unit.`);
  for (const [name, value] of [
    ['referencePressure', referencePressure],
    ['referenceTemp', referenceTemp],
    ['ambientTemp', ambientTemp],
  ] as const) {
    if (!Number.isFinite(value)) throw new Error(`${name} must be a finite number, got ${value}.`);
  }
  if (referenceTemp <= absoluteZeroC || ambientTemp <= absoluteZeroC) {
    throw new Error('Temperatures must be above absolute zero (-273.15 °C).');
  }
  const atmosphere = convert(standardAtmosphereBar, 'bar', unit);
  const referenceAbsolute = referencePressure + atmosphere;
  if (referenceAbsolute <= 0) throw new Error('The reference pre-charge is below a vacuum.');
  // p2 = p1 * T2 / T1 on absolute values, written as a change from the reference so that equal temperatures
  // give back the reference exactly.
  const referenceKelvin = convert(referenceTemp, 'C', 'K');
  return referencePressure + (referenceAbsolute * (ambientTemp - referenceTemp)) / referenceKelvin;
}

/** The checkpoint's pre-charge definition and pressure unit; a checkpoint without both cannot be judged. */
function prechargeOf(checkpoint: Checkpoint) {
  const precharge = checkpoint.precharge;
  const unit = checkpoint.unit;
  if (precharge === undefined || unit === null || !isPressureUnit(unit)) {
    throw new InvalidReadingError('bad_checkpoint', checkpoint, phrase('prechargeUndefined'));
  }
  return { precharge, unit };
}

type PrechargeLimit = Omit<LimitBand, 'message' | 'action'> & { message: Phrase; action: Phrase | null };

/** The bands' limits and the phrases of their words, not yet written. */
function prechargeLimits(checkpoint: Checkpoint, expected: number): PrechargeLimit[] {
  const { precharge, unit } = prechargeOf(checkpoint);
  const low = expected - precharge.tolerance;
  const high = expected + precharge.tolerance;
  const target = { quantity: expected, unit };
  return [
    {
      id: 'precharge_low',
      lower: null,
      upper: { value: low, closed: false },
      verdict: 'service',
      message: phrase('prechargeLow', { target }),
      action: phrase('prechargeRecharge', { target }),
    },
    {
      id: 'precharge_in_limits',
      lower: { value: low, closed: true },
      upper: { value: high, closed: true },
      verdict: 'in_limits',
      message: phrase('prechargeInLimits', { target }),
      action: null,
    },
    {
      id: 'precharge_high',
      lower: { value: high, closed: false },
      upper: null,
      verdict: 'service',
      message: phrase('prechargeHigh', { target }),
      action: phrase('prechargeBleed', { target }),
    },
  ];
}

/** One band with its words written in the process's language. */
const written = (band: PrechargeLimit): LimitBand => ({
  ...band,
  message: phraseWords(band.message),
  action: band.action ? phraseWords(band.action) : 'None.',
});

/**
 * The bands a pre-charge is judged against at one ambient temperature, in the checkpoint's unit. Their words are
 * written in the process's language: English on the server (what a record stores), the screen's on a kiosk.
 */
export function prechargeBands(checkpoint: Checkpoint, expected: number): LimitBand[] {
  return prechargeLimits(checkpoint, expected).map(written);
}

/** Judges a nitrogen pre-charge against its temperature-corrected value. Refuses a reading taken with system pressure on. */
export function evaluatePrecharge(checkpoint: Checkpoint, reading: Reading): Evaluation {
  const { precharge, unit } = prechargeOf(checkpoint);
  assertValueEntry(checkpoint, reading);
  const { systemPressure, ambientTempC } = reading.context;
  if (systemPressure === 'on') {
    // With system pressure on the gauge shows fluid pressure, not the nitrogen pre-charge.
    throw new InvalidReadingError('pressure_on', checkpoint, phrase('prechargePressureOn'));
  }
  if (systemPressure === undefined) {
    throw new InvalidReadingError('missing_context', checkpoint, phrase('prechargeConfirmRelieved'));
  }
  if (ambientTempC === undefined) {
    throw new InvalidReadingError('missing_context', checkpoint, phrase('prechargeNeedsTemperature'));
  }
  if (!Number.isFinite(ambientTempC)) {
    throw new InvalidReadingError('not_a_number', checkpoint, phrase('temperatureNotANumber'));
  }
  const value = canonicalValue(checkpoint, reading.value, reading.unit);
  const expected = expectedPrecharge({
    referencePressure: precharge.referencePressure,
    referenceTemp: precharge.referenceTempC,
    ambientTemp: ambientTempC,
    unit,
  });
  // Only the band the reading falls in is written out: a signed check writes one band's words, not three.
  const limit = prechargeLimits(checkpoint, expected).find((candidate) => contains(candidate, value));
  if (limit === undefined) {
    throw new InvalidReadingError('no_band', checkpoint, phrase('noBandForPrecharge'));
  }
  const band = written(limit);
  return { verdict: band.verdict, band, message: band.message, action: band.action, value, expected };
}
